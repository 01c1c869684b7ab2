import { loadConfigFile } from '../config/load.js';
import type { Objective } from '../config/objective-types.js';
import { computeMetrics, type EnsembleEfficiencies } from '../metrics/evaluate.js';
import type { DesignRecord } from '../output/record.js';
import { EnsemblePool } from './ensemble-pool.js';
import { paretoVector, weightedScore } from '../metrics/score.js';
import { readDesignFile } from '../output/design-file.js';
import { DEMO } from './demo.js';
import { reportedMetrics } from './optimize-core.js';
import { metricSettingsFrom, scoreRuleFrom } from './settings.js';

export interface ScoredFile {
  file: string;
  name: string;
  sites: number;
  score?: number;
  objectives?: number[];
  metrics: Record<string, number>;
  warnings: string[];
  /** 1-based rank (rank only). */
  rank?: number;
  /** Pareto front index, 0 = non-dominated (rank with a Pareto objective only). */
  front?: number;
}

/**
 * Metrics and score of design files under an objective recipe (the demo's when none given). With workers > 1
 * each design's disorder samples are shared out over worker threads (same results for any number).
 */
export async function scoreDesignFiles(files: readonly string[], objectiveFile?: string, workers = 1): Promise<{ objective: Objective; results: ScoredFile[] }> {
  const objective = loadConfigFile(objectiveFile ?? DEMO.objective, 'objective');
  const records = files.map((f) => ({ file: f, rec: readDesignFile(f) }));
  const maxSites = Math.max(...records.map((r) => r.rec.sites.length));
  const settings = metricSettingsFrom(objective, maxSites);
  const rule = scoreRuleFrom(objective);
  const wanted = reportedMetrics(rule, settings);
  const pool = workers > 1 && settings.disorder && wanted.some((m) => m.startsWith('robust_'))
    ? new EnsemblePool(workers, objective, maxSites, settings.disorder.draws.length) : undefined;
  const results: ScoredFile[] = [];
  try {
    for (const { file, rec } of records) results.push(scoreOne(file, rec, pool ? await pool.efficiencies(rec) : undefined));
  } finally {
    await pool?.close();
  }
  return { objective, results };

  function scoreOne(file: string, rec: DesignRecord, ensemble?: EnsembleEfficiencies): ScoredFile {
    const m = computeMetrics({ sites: rec.sites, traps: rec.traps }, settings, wanted, ensemble);
    const metrics: Record<string, number> = {};
    for (const [k, v] of Object.entries(m.values)) if (v !== undefined) metrics[k] = v;
    return {
      file, name: rec.name, sites: rec.sites.length, metrics, warnings: [...m.warnings],
      ...(rule.kind === 'weighted_sum' ? { score: weightedScore(rule, m.values) } : { objectives: paretoVector(rule, m.values) }),
    };
  }
}

/** Order design files under an objective: by score, or by non-dominated fronts for a Pareto recipe. */
export async function rankDesignFiles(files: readonly string[], objectiveFile?: string, workers = 1): Promise<ScoredFile[]> {
  const { results } = await scoreDesignFiles(files, objectiveFile, workers);
  if (results.every((r) => r.score !== undefined)) {
    return [...results].sort((a, b) => b.score! - a.score!).map((r, i) => ({ ...r, rank: i + 1 }));
  }
  // successive non-dominated fronts (all objectives minimized), ties inside a front by file order
  const left = [...results];
  const out: ScoredFile[] = [];
  let front = 0;
  const dominates = (a: number[], b: number[]) => a.every((x, i) => x <= b[i]) && a.some((x, i) => x < b[i]);
  while (left.length) {
    const nd = left.filter((r) => !left.some((q) => q !== r && dominates(q.objectives!, r.objectives!)));
    for (const r of nd) { out.push({ ...r, front, rank: out.length + 1 }); left.splice(left.indexOf(r), 1); }
    front++;
  }
  return out;
}
