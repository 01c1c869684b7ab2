import { Command } from 'commander';
import { addCommonOptions, parseSeed, parseWorkers, type CommonFlags } from '../common.js';
import type { CliContext } from '../context.js';
import { parseCount } from '../parse.js';
import { withStopSignals } from '../signals.js';
import { outputPath } from '../paths.js';
import { startWorkers } from '../../actions/threads.js';

export function sweepCommand(ctx: CliContext): Command {
  const cmd = new Command('sweep')
    .description('one optimization per point of a sweep file, with a summary table; finished points are skipped when run again')
    .argument('<sweep-file>', 'sweep file (lumenfold.sweep/1)')
    .option('--budget <n>', 'candidate designs per point (default: each objective\'s)')
    .option('--plan', 'only write each point\'s job.json (run one elsewhere with: lumenfold optimize --job FILE --out ITS_FOLDER --force)');
  addCommonOptions(cmd, { out: 'sweep folder (default designs/sweeps/<name>)' });
  return cmd.action(async (file: string, f: CommonFlags & { budget?: string; plan?: boolean }) => {
    // start the worker threads first: they load their modules on the other core while this one loads the action's
    const workers = parseWorkers(f.workers);
    if (workers > 1) startWorkers(workers - 1);
    const { sweep } = await import('../../actions/sweep.js');
    const r = await withStopSignals(ctx, (shouldStop) => sweep({
      shouldStop,
      planOnly: Boolean(f.plan),
      sweepFile: file,
      out: f.out === undefined ? undefined : outputPath('--out', f.out, Boolean(f.allowOutside)),
      seed: parseSeed(f.seed),
      budget: f.budget === undefined ? undefined : parseCount('--budget', f.budget),
      workers,
      onPoint: (i, n, label, status) => { if (!f.quiet) ctx.stderr(`sweep point ${i + 1}/${n} ${label}: ${status}\n`); },
    }));
    if (f.json) ctx.stdout(JSON.stringify(r, null, 2) + '\n');
    else {
      ctx.stdout(`sweep folder ${r.folder}\n`);
      for (const p of r.points) ctx.stdout(`${p.label}\tbest ${p.best_score?.toFixed(4) ?? 'n/a'}\tefficiency ${p.metrics.efficiency?.toFixed(4) ?? 'n/a'}\t${p.status}\n`);
    }
  });
}
