import type { ConstraintSet, Dye, Vector3 } from './constraints-types.js';
import { scoreMetrics, UPHILL_METRICS, type Objective } from './objective-types.js';

/** A problem in a document that its schema cannot express; path is a JSON pointer. */
export interface DocumentProblem {
  path: string;
  message: string;
}

const isZero = (v: Vector3) => v.x === 0 && v.y === 0 && v.z === 0;

/** Dye names must be unique within a palette. */
export function paletteProblems(dyes: readonly Dye[], at: string): DocumentProblem[] {
  const first = new Map<string, number>();
  const problems: DocumentProblem[] = [];
  dyes.forEach((dye, i) => {
    const earlier = first.get(dye.name);
    if (earlier === undefined) first.set(dye.name, i);
    else problems.push({ path: `${at}/${i}/name`, message: `repeats the dye name "${dye.name}" of entry ${earlier}; dye names must be unique.` });
  });
  return problems;
}

/** Checks of a constraint set that JSON Schema cannot state (before its palette file is read). */
export function constraintProblems(doc: ConstraintSet | (Omit<ConstraintSet, 'dyes'> & { dyes: { count: unknown } })): DocumentProblem[] {
  const problems: DocumentProblem[] = [];
  const count = doc.dyes.count;
  if (typeof count === 'object' && count !== null) {
    const { min, max } = count as { min: number; max: number };
    if (min > max) problems.push({ path: '/dyes/count', message: `has min ${min} above max ${max}.` });
  }
  const dipole = doc.scaffold.dipole;
  if (dipole.kind === 'cone' && typeof dipole.axis === 'object' && isZero(dipole.axis)) {
    problems.push({ path: '/scaffold/dipole/axis', message: 'is the zero vector; a cone axis needs a direction.' });
  }
  doc.fixed.forEach((site, i) => {
    if (site.direction !== undefined && isZero(site.direction)) {
      problems.push({ path: `/fixed/${i}/direction`, message: 'is the zero vector; a dipole direction needs a non-zero length.' });
    }
  });
  const pinned = new Map<number, number>();
  doc.fixed.forEach((site, i) => {
    const earlier = pinned.get(site.site);
    if (earlier === undefined) pinned.set(site.site, i);
    else problems.push({ path: `/fixed/${i}/site`, message: `pins site ${site.site} again (already pinned by fixed entry ${earlier}); merge the two entries.` });
  });
  doc.energetics.rules.forEach((rule, i) => {
    if ('range' in rule && rule.range.min > rule.range.max) {
      problems.push({ path: `/energetics/rules/${i}/range`, message: `has min ${rule.range.min} above max ${rule.range.max} cm^-1.` });
    }
  });
  const offset = doc.energetics.trap_offset;
  if (offset?.min !== undefined && offset.max !== undefined && offset.min > offset.max) {
    problems.push({ path: '/energetics/trap_offset', message: `has min ${offset.min} above max ${offset.max} cm^-1.` });
  }
  if (Array.isArray((doc as { palette?: Dye[] }).palette)) problems.push(...paletteProblems(doc.palette, '/palette'));
  return problems;
}

/** Checks of an objective that JSON Schema cannot state. */
export function objectiveProblems(doc: Objective): DocumentProblem[] {
  const problems: DocumentProblem[] = [];
  const metrics = scoreMetrics(doc.score);
  const listKey = doc.score.kind === 'weighted_sum' ? 'terms' : 'metrics';
  metrics.forEach((metric, i) => {
    const earlier = metrics.indexOf(metric);
    if (earlier < i) {
      problems.push({ path: `/score/${listKey}/${i}/metric`, message: `repeats the metric ${metric} of entry ${earlier}; list each metric once.` });
    }
  });
  const uphill = metrics.filter((m) => UPHILL_METRICS.includes(m));
  if (doc.model.kind === 'hsr' && uphill.length > 0) {
    problems.push({
      path: '/model/kind',
      message:
        `is hsr, but the score uses ${uphill.join(' and ')}. hsr (Haken-Strobl-Reineker) is an infinite-temperature ` +
        'model: it treats uphill and downhill steps alike, so it cannot score uphill transfer. Use redfield or forster.',
    });
  }
  if (doc.model.kind === 'forster' && metrics.includes('coherence_gain')) {
    problems.push({
      path: '/model/kind',
      message: 'is forster, but the score uses coherence_gain, which compares the model with Förster hopping and is zero by definition here. Use hsr or redfield.',
    });
  }
  return problems;
}
