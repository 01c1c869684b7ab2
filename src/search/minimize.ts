/**
 * The two entry points of the search layer:
 *   minimize(objective, space, settings)      one objective, returns the best point
 *   minimizeMulti(objective, space, settings) several objectives, returns the non-dominated front
 * `objective` gets a decoded point and returns a number (an array for several objectives) or a
 * Promise of one; `settings.evaluateBatch` may instead take a whole asked batch at once.
 */
import { InputError } from '../errors.js';
import type { Evaluated, Progress, Score } from './core/types.js';
import type { AutoChoice } from './optimizers/auto.js';
import { SearchRun, type BatchEvaluator, type RunSettings, type RunState } from './run.js';
import type { SearchSpace } from './space/space.js';

export type Objective<P, S> = (point: P) => S | Promise<S>;

export interface MinimizeSettings<P, S> extends RunSettings {
  /** Evaluates a whole batch at once (for example on worker threads); replaces `objective`. */
  evaluateBatch?: (points: P[]) => readonly S[] | Promise<readonly S[]>;
}

export interface Found<P, S> {
  point: P;
  score: S;
  /** 0 when every constraint holds. */
  violation: number;
  feasible: boolean;
}

interface RunReport {
  evaluations: number;
  /** Registry name given (or 'auto'). */
  optimizer: string;
  /** What 'auto' picked and why. */
  choice?: AutoChoice;
  /** True when onProgress returned false before the budget was spent. */
  stopped: boolean;
  /** Saved state: pass it as `resume` (with a larger budget) to continue the run. */
  state: RunState;
}

export interface MinimizeResult<P> extends RunReport {
  best: Found<P, number> | undefined;
  /** The best points seen, best first. */
  archive: Found<P, number>[];
  /** Best value after each improvement. */
  history: { evaluations: number; best: number }[];
}

export interface MinimizeMultiResult<P> extends RunReport {
  /** Non-dominated points seen (feasible ones, once any is known). */
  front: Found<P, number[]>[];
  /** Hypervolume of the feasible front with `reference`; undefined until a reference is fixed. */
  hypervolume: number | undefined;
  reference: number[] | undefined;
  /** Hypervolume after each change. */
  history: { evaluations: number; hypervolume: number }[];
}

function evaluator<P, S>(objective: Objective<P, S> | null, settings: MinimizeSettings<P, S>): BatchEvaluator<P> {
  if (settings.evaluateBatch) return settings.evaluateBatch as BatchEvaluator<P>;
  if (typeof objective !== 'function') throw new InputError('give an objective function or settings.evaluateBatch');
  return (points) => {
    const values = points.map((p) => objective(p));
    return values.some((v) => v instanceof Promise) ? Promise.all(values) as Promise<Score[]> : (values as Score[]);
  };
}

function found<P extends object, S>(space: SearchSpace<P>, e: Evaluated, score: S): Found<P, S> {
  return { point: space.decode(e.x), score, violation: e.violation, feasible: e.violation === 0 };
}

async function drive<P extends object, S>(
  objective: Objective<P, S> | null,
  space: SearchSpace<P>,
  settings: MinimizeSettings<P, S>,
  objectives: 'single' | 'multi',
  watch: (p: Progress) => void,
): Promise<{ run: SearchRun<P>; report: RunReport }> {
  const user = settings.onProgress;
  const run = new SearchRun(space, objectives, {
    ...settings,
    onProgress: (p) => {
      watch(p);
      return user ? user(p) : undefined;
    },
  });
  await run.runUntil(settings.budget ?? 1000, evaluator(objective, settings));
  const report: RunReport = {
    evaluations: run.evaluations,
    optimizer: run.optimizer.name,
    choice: run.choice,
    stopped: run.stopped,
    state: run.dump(),
  };
  return { run, report };
}

/** Minimizes one objective over `space`. */
export async function minimize<P extends object>(
  objective: Objective<P, number> | null,
  space: SearchSpace<P>,
  settings: MinimizeSettings<P, number> = {},
): Promise<MinimizeResult<P>> {
  const history: { evaluations: number; best: number }[] = [];
  const { run, report } = await drive(objective, space, settings, 'single', (p) => {
    if (p.best !== undefined && (history.length === 0 || p.best < history[history.length - 1].best)) {
      history.push({ evaluations: p.evaluations, best: p.best });
    }
  });
  const best = run.optimizer.recommend();
  return {
    ...report,
    best: best ? found(space, best, best.f[0]) : undefined,
    archive: run.optimizer.archive().map((e) => found(space, e, e.f[0])),
    history,
  };
}

/** Minimizes several objectives at once over `space` (all minimized). */
export async function minimizeMulti<P extends object>(
  objective: Objective<P, number[]> | null,
  space: SearchSpace<P>,
  settings: MinimizeSettings<P, number[]> = {},
): Promise<MinimizeMultiResult<P>> {
  const history: { evaluations: number; hypervolume: number }[] = [];
  const { run, report } = await drive(objective, space, settings, 'multi', (p) => {
    if (p.hypervolume !== undefined && (history.length === 0 || p.hypervolume !== history[history.length - 1].hypervolume)) {
      history.push({ evaluations: p.evaluations, hypervolume: p.hypervolume });
    }
  });
  const last = run.optimizer.progress();
  return {
    ...report,
    front: run.optimizer.archive().map((e) => found(space, e, Array.from(e.f))),
    hypervolume: last.hypervolume,
    reference: last.reference,
    history,
  };
}
