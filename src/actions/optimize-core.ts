import type { ConstraintSet } from '../config/constraints-types.js';
import type { Objective } from '../config/objective-types.js';
import { computeMetrics, METRIC_NAMES, type MetricName, type MetricSettings } from '../metrics/evaluate.js';
import { MODELS, transportOptions } from '../physics/transport.js';
import { paretoVector, scoreMetricNames, weightedScore, type ScoreRule } from '../metrics/score.js';
import { minimize, minimizeMulti } from '../search/minimize.js';
import type { Progress } from '../search/core/types.js';
import type { RunState } from '../search/run.js';
import { designSpace, type DesignPoint, type DesignSpace } from '../space/design-space.js';
import type { Feasibility } from '../space/feasibility.js';
import { LumenfoldError } from '../errors.js';
import { makeEvaluator, type Evaluation } from './evaluator.js';
import { naiveDesign } from './naive.js';
import { EvaluationPool } from './pool.js';
import { metricSettingsFrom, scoreRuleFrom } from './settings.js';

/** One scored candidate. */
export interface ScoredDesign {
  design: DesignPoint;
  metrics: Partial<Record<MetricName, number>>;
  /** Weighted-sum score (higher is better), or undefined for a Pareto objective. */
  score?: number;
  /** Objective vector (minimized) of a Pareto objective. */
  objectives?: number[];
  feasibility: Feasibility;
  feasible: boolean;
  warnings: string[];
}

export interface SearchSettings {
  optimizer: string;
  budget: number;
  batch: number;
  seed: number;
  top: number;
  /** Worker threads for evaluation; results are identical for any number. */
  workers: number;
  onProgress?: (p: Progress) => void;
  /** Continue a stopped run from its checkpoint. */
  resume?: ResumePoint;
  /** Polled after every batch; true stops the run (the batch in flight is finished first). */
  shouldStop?: () => boolean;
  /** Called after every evaluated candidate, in order. */
  onEvaluation?: (e: { index: number; score: number | number[]; feasible: boolean; metrics: Partial<Record<MetricName, number>>; error?: string }) => void;
}

/** Where a stopped run left off: the search state and the counters kept outside it. */
export interface ResumePoint {
  state: RunState;
  /** Candidates scored so far (the index of the next history line). */
  scored: number;
  failed: number;
  skippedSamples?: number;
  convergence: { evaluations: number; best: number }[];
}

export interface OptimizationOutcome {
  /** True when shouldStop ended the run before its budget; `resumePoint` continues it. */
  stopped: boolean;
  resumePoint: ResumePoint;
  optimizer: string;
  choice?: string;
  evaluations: number;
  failedEvaluations: number;
  /** Disorder samples left out over the whole run because they pushed two dyes onto each other. */
  skippedDisorderSamples: number;
  /** Archive designs left out of the ranking because their metrics could not be computed. */
  unrankable: number;
  ranked: ScoredDesign[];
  /** The naive evenly spaced design, when it can be scored at all. */
  naive?: ScoredDesign;
  history: { evaluations: number; best: number }[];
  hypervolume?: number;
  seconds: number;
}

/** Metrics reported for every design: the score's own plus efficiency and transfer time. */
export function reportedMetrics(rule: ScoreRule, settings: MetricSettings): MetricName[] {
  const set = new Set<MetricName>(['efficiency', 'transfer_time', ...scoreMetricNames(rule)]);
  if (!MODELS[transportOptions(settings.transport).model].finiteTemperature) set.delete('uphill_efficiency');
  return METRIC_NAMES.filter((m) => set.has(m));
}

/** Score one decoded design under an objective's rule and settings. */
export function scoreDesign(ds: DesignSpace, d: DesignPoint, rule: ScoreRule, settings: MetricSettings, metrics: readonly MetricName[]): ScoredDesign {
  const feas = ds.feasibility(d);
  const feasible = feas.spacing >= 0 && feas.sharedAnchors === 0 && feas.step >= 0 && feas.span >= 0 && feas.trapOffset >= 0;
  const m = computeMetrics({ sites: d.sites, traps: d.traps }, settings, metrics);
  const out: ScoredDesign = { design: d, metrics: m.values, feasibility: feas, feasible, warnings: [...m.warnings] };
  if (rule.kind === 'weighted_sum') out.score = weightedScore(rule, m.values);
  else out.objectives = paretoVector(rule, m.values);
  return out;
}

/** Run one optimization of a constraint set under an objective: pure computation, no files. */
export async function optimizeDesign(c: ConstraintSet, o: Objective, s: SearchSettings): Promise<OptimizationOutcome> {
  const t0 = Date.now();
  const ds = designSpace(c);
  const settings = metricSettingsFrom(o, ds.maxSites);
  const rule = scoreRuleFrom(o);
  const metrics = reportedMetrics(rule, settings);
  const pool = s.workers > 1 ? new EvaluationPool(s.workers, c, o) : undefined;
  const evaluateOne = pool ? undefined : makeEvaluator(c, o);
  let index = s.resume?.scored ?? 0;
  let failed = s.resume?.failed ?? 0;
  let skippedSamples = s.resume?.skippedSamples ?? 0;
  const record = (e: Evaluation) => {
    if (e.error) failed++;
    skippedSamples += e.skippedSamples ?? 0;
    s.onEvaluation?.({ index: index++, score: e.score, feasible: !e.error, metrics: e.metrics, error: e.error });
    return e.score;
  };
  // yield to the event loop once per batch so that signals (stop requests) and timers are seen: with threads too,
  // since the pool reads its workers' replies without the event loop (pool.ts), its batches alone never let it run
  const yieldToLoop = () => new Promise<void>((r) => setImmediate(r));
  const evaluateBatch = async (ps: Record<string, unknown>[]) => {
    const results = pool ? await pool.evaluate(ps) : ps.map(evaluateOne!);
    await yieldToLoop();
    return results.map(record);
  };
  const common = {
    optimizer: s.resume ? undefined : s.optimizer,
    budget: s.budget,
    batch: s.batch,
    seed: s.seed,
    resume: s.resume?.state,
    onProgress: (p: Progress) => {
      s.onProgress?.(p);
      return s.shouldStop?.() ? false : undefined;
    },
  };
  let points: Record<string, unknown>[];
  let history: { evaluations: number; best: number }[] = [];
  let stopped = false;
  let state: RunState | undefined;
  let optimizer: string, choice: string | undefined, evaluations: number, hypervolume: number | undefined;
  try {
    if (rule.kind === 'weighted_sum') {
      const r = await minimize(null, ds.space, { ...common, evaluateBatch: evaluateBatch as (ps: Record<string, unknown>[]) => Promise<number[]> });
      points = r.archive.filter((f) => f.feasible).map((f) => f.point);
      if (points.length === 0) points = r.archive.map((f) => f.point);
      history = [...(s.resume?.convergence ?? []), ...r.history.map((h) => ({ evaluations: h.evaluations, best: -h.best }))];
      ({ optimizer, evaluations, stopped, state } = r);
      choice = r.choice ? `${r.choice.name}: ${r.choice.reason}` : undefined;
    } else {
      const r = await minimizeMulti(null, ds.space, { ...common, evaluateBatch: evaluateBatch as (ps: Record<string, unknown>[]) => Promise<number[][]> });
      points = r.front.map((f) => f.point);
      ({ optimizer, evaluations, hypervolume, stopped, state } = r);
      choice = r.choice ? `${r.choice.name}: ${r.choice.reason}` : undefined;
    }
  } finally {
    await pool?.close();
  }
  // a design file cannot hold two dyes on one anchor: such designs (infeasible, ranked only while no feasible
  // design is known, as in a very short or early-stopped run) are left out rather than failing the run's files
  if (ds.anchors) points = points.filter((p) => ds.feasibility(ds.decode(p)).sharedAnchors === 0);
  // never a NaN in a ranking: designs whose metrics cannot be computed are left out and counted
  const tryScore = (d: DesignPoint): ScoredDesign | undefined => {
    try {
      const r = scoreDesign(ds, d, rule, settings, metrics);
      const ok = r.score !== undefined ? Number.isFinite(r.score) : r.objectives!.every((x) => Number.isFinite(x));
      return ok ? r : undefined;
    } catch (e) {
      if (!(e instanceof LumenfoldError)) throw e;
      return undefined;
    }
  };
  const candidates = points.slice(0, Math.max(s.top * 3, s.top)).map((p) => tryScore(ds.decode(p)));
  const ranked = candidates.filter((r): r is ScoredDesign => r !== undefined);
  const unrankable = candidates.length - ranked.length;
  if (rule.kind === 'weighted_sum') ranked.sort((a, b) => Number(b.feasible) - Number(a.feasible) || b.score! - a.score!);
  const naive = tryScore(naiveDesign(ds));
  return {
    stopped,
    resumePoint: { state: state!, scored: index, failed, skippedSamples, convergence: history },
    optimizer, choice, evaluations, failedEvaluations: failed, skippedDisorderSamples: skippedSamples, unrankable,
    ranked: ranked.slice(0, s.top), naive, history, hypervolume,
    seconds: (Date.now() - t0) / 1000,
  };
}
