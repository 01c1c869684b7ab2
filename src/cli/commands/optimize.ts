import { Command } from 'commander';
import { addCommonOptions, parseSeed, parseWorkers, type CommonFlags } from '../common.js';
import type { CliContext } from '../context.js';
import { parseCount } from '../parse.js';
import { progressBar } from '../progress.js';
import { withStopSignals } from '../signals.js';
import { InputError } from '../../errors.js';
import { outputPath } from '../paths.js';
import { startWorkers } from '../../actions/threads.js';

interface OptimizeFlags extends CommonFlags {
  constraints?: string;
  objective?: string;
  optimizer?: string;
  budget?: string;
  batch?: string;
  top?: string;
  resume?: string;
  job?: string;
}

export function optimizeCommand(ctx: CliContext): Command {
  const cmd = new Command('optimize')
    .description('search dye positions, dipole orientations and site energies; with no files, runs the embedded demo')
    .option('--constraints <file>', 'constraint set (YAML or JSON); default: the demo two-helix scaffold')
    .option('--objective <file>', 'objective recipe; default: the demo robust-efficiency recipe')
    .option('--optimizer <name>', 'search method (default: the objective\'s, else automatic choice)')
    .option('--budget <n>', 'number of candidate designs to evaluate')
    .option('--batch <n>', 'candidates asked and evaluated together')
    .option('--top <n>', 'number of ranked designs to keep', '5')
    .option('--resume <run-folder>', 'continue an interrupted run from its checkpoint (same job and seed)')
    .option('--job <file>', 'run one job file (configs and search settings, e.g. from sweep --plan) instead of --constraints/--objective');
  addCommonOptions(cmd, { out: 'run folder (default designs/runs/<name>-<id>)', force: true });
  return cmd.action(async (f: OptimizeFlags) => {
    const sources = [f.resume && '--resume', f.job && '--job', (f.constraints || f.objective) && '--constraints/--objective'].filter(Boolean);
    if (sources.length > 1) throw new InputError(`give one of ${sources.join(', ')}, not several`);
    if ((f.resume || f.job) && (f.optimizer || f.budget || f.batch || f.seed)) {
      throw new InputError('--optimizer, --budget, --batch and --seed come from the job when --resume or --job is given');
    }
    // start the worker threads first: they load their modules on the other core while this one loads the action's
    const workers = parseWorkers(f.workers);
    if (workers > 1) startWorkers(workers - 1);
    const { optimize } = await import('../../actions/optimize.js');
    let bar: ReturnType<typeof progressBar> | undefined;
    const s = await withStopSignals(ctx, (shouldStop) => optimize({
      resume: f.resume,
      jobFile: f.job,
      shouldStop,
      constraintsFile: f.constraints,
      objectiveFile: f.objective,
      optimizer: f.optimizer,
      budget: f.budget === undefined ? undefined : parseCount('--budget', f.budget),
      batch: f.batch === undefined ? undefined : parseCount('--batch', f.batch),
      top: parseCount('--top', f.top ?? '5'),
      seed: parseSeed(f.seed),
      workers,
      out: f.out === undefined ? undefined : outputPath('--out', f.out, Boolean(f.allowOutside)),
      force: Boolean(f.force),
      onProgress: (p, budget) => { bar ??= progressBar(ctx, budget, 'optimize', Boolean(f.quiet)); bar.update(p); },
    })).finally(() => bar?.done());
    if (f.json) ctx.stdout(JSON.stringify(s, null, 2) + '\n');
    else {
      const m = s.best?.metrics ?? {};
      ctx.stdout([
        `run folder   ${s.run_folder}`,
        `optimizer    ${s.optimizer}${s.choice ? ` (${s.choice})` : ''}, ${s.evaluations} designs in ${s.seconds.toFixed(1)} s`,
        `best score   ${s.best?.score?.toFixed(4) ?? 'n/a'} (naive evenly spaced design: ${s.naive_score?.toFixed(4) ?? 'n/a'})`,
        ...Object.entries(m).map(([k, v]) => `  ${k.padEnd(22)} ${Number(v.toPrecision(6))}`),
      ].join('\n') + '\n');
    }
    if (!f.quiet && s.failed_evaluations > 0) ctx.stderr(`note: ${s.failed_evaluations} candidates could not be scored (see history.jsonl)\n`);
    if (!f.quiet && s.disorder_samples_skipped > 0) ctx.stderr(`note: ${s.disorder_samples_skipped} disorder samples were left out because they pushed two dyes onto each other\n`);
  });
}
