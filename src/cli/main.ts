import { Command, CommanderError } from 'commander';
import { InputError, InterruptedError, LumenfoldError, ModelError, NumericalError } from '../errors.js';
import { checkCommand } from './commands/check.js';
import { exportCommand } from './commands/export.js';
import { optimizeCommand } from './commands/optimize.js';
import { rankCommand, scoreCommand } from './commands/score.js';
import { reportCommand } from './commands/report.js';
import { simulateCommand } from './commands/simulate.js';
import { sweepCommand } from './commands/sweep.js';
import type { CliContext } from './context.js';

import { VERSION } from '../actions/version.js';

/**
 * Exit codes: 0 success, 1 internal failure, 2 bad input (file, option, model without an answer), 3 numerical
 * failure, 130 interrupted (checkpoint written).
 */
export function exitCodeFor(err: unknown): number {
  if (err instanceof InterruptedError) return 130;
  if (err instanceof InputError || err instanceof ModelError) return 2;
  if (err instanceof NumericalError) return 3;
  return 1;
}

export function buildProgram(ctx: CliContext): Command {
  const program = new Command('lumenfold')
    .description('design artificial light-harvesting dye arrays and score them with an exciton transport model')
    .version(VERSION)
    .option('--debug', 'show stack traces of errors')
    .showHelpAfterError(false)
    .exitOverride()
    .configureOutput({ writeOut: ctx.stdout, writeErr: ctx.stderr });
  // Each command loads its action (and the libraries behind it) only when it runs, so that --help, --version
  // and a command's own start-up do not load the others'.
  for (const make of [optimizeCommand, scoreCommand, rankCommand, sweepCommand, exportCommand, checkCommand, simulateCommand, reportCommand]) program.addCommand(make(ctx).exitOverride().configureOutput({ writeOut: ctx.stdout, writeErr: ctx.stderr }));
  return program;
}

/** Run the command line; returns the exit code. Never calls process.exit. */
export async function main(argv: string[], ctx?: Partial<CliContext>): Promise<number> {
  const debug = argv.includes('--debug');
  const c: CliContext = {
    stdout: (t) => process.stdout.write(t),
    stderr: (t) => process.stderr.write(t),
    isTTY: Boolean(process.stderr.isTTY),
    debug,
    ...ctx,
  };
  try {
    await buildProgram(c).parseAsync(argv);
    return 0;
  } catch (err) {
    if (err instanceof CommanderError) {
      if (err.code === 'commander.helpDisplayed' || err.code === 'commander.version' || err.code === 'commander.help') return 0;
      return 2; // commander already printed its one-line message
    }
    const msg = err instanceof Error ? err.message : String(err);
    if (err instanceof LumenfoldError) c.stderr(`lumenfold: ${msg}\n`);
    else c.stderr(`lumenfold: internal error: ${msg}\n`);
    if (c.debug && err instanceof Error && err.stack) c.stderr(err.stack + '\n');
    return exitCodeFor(err);
  }
}
