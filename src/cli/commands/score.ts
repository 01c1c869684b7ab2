import { Command } from 'commander';
import type { ScoredFile } from '../../actions/score.js';
import type { CliContext } from '../context.js';
import { parseWorkers } from '../common.js';

function table(rows: ScoredFile[], withRank: boolean): string {
  const metricNames = [...new Set(rows.flatMap((r) => Object.keys(r.metrics)))];
  const head = [...(withRank ? ['rank'] : []), 'design', 'score', ...metricNames];
  const lines = [head.join('\t')];
  for (const r of rows) {
    const score = r.score !== undefined ? r.score.toPrecision(6) : `front ${r.front ?? '-'}`;
    lines.push([...(withRank ? [String(r.rank)] : []), r.name, score, ...metricNames.map((m) => (r.metrics[m] === undefined ? '' : String(Number(r.metrics[m].toPrecision(6)))))].join('\t'));
  }
  return lines.join('\n') + '\n';
}

export function scoreCommand(ctx: CliContext): Command {
  return new Command('score')
    .description('metrics of one or many design files under an objective recipe')
    .argument('<designs...>', 'design files (lumenfold.design/1)')
    .option('--objective <file>', 'objective recipe (default: the demo recipe)')
    .option('--workers <n>', 'worker threads sharing out each design\'s disorder samples (default: 1)')
    .option('--json', 'print the result as JSON')
    .action(async (files: string[], f: { objective?: string; json?: boolean; workers?: string }) => {
      const { scoreDesignFiles } = await import('../../actions/score.js');
      const { results } = await scoreDesignFiles(files, f.objective, parseWorkers(f.workers));
      ctx.stdout(f.json ? JSON.stringify(results, null, 2) + '\n' : table(results, false));
    });
}

export function rankCommand(ctx: CliContext): Command {
  return new Command('rank')
    .description('order design files under an objective recipe (best first; Pareto recipes by non-dominated fronts)')
    .argument('<designs...>', 'design files (lumenfold.design/1)')
    .option('--objective <file>', 'objective recipe (default: the demo recipe)')
    .option('--workers <n>', 'worker threads sharing out each design\'s disorder samples (default: 1)')
    .option('--json', 'print the result as JSON')
    .action(async (files: string[], f: { objective?: string; json?: boolean; workers?: string }) => {
      const { rankDesignFiles } = await import('../../actions/score.js');
      const ranked = await rankDesignFiles(files, f.objective, parseWorkers(f.workers));
      ctx.stdout(f.json ? JSON.stringify(ranked, null, 2) + '\n' : table(ranked, true));
    });
}
