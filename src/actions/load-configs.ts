import { InputError } from '../errors.js';
import type { ConstraintSet } from '../config/constraints-types.js';
import { loadConfigFile } from '../config/load.js';
import type { Objective } from '../config/objective-types.js';
import { precheck } from '../config/precheck/precheck.js';
import { DEMO } from './demo.js';

/** Load a constraint set and an objective (the demo's when none given) and run the pre-checks. */
export function loadDesignProblem(constraintsFile?: string, objectiveFile?: string): { constraints: ConstraintSet; objective: Objective; files: { constraints: string; objective: string } } {
  const files = { constraints: constraintsFile ?? DEMO.constraints, objective: objectiveFile ?? DEMO.objective };
  const constraints = loadConfigFile(files.constraints, 'constraints');
  const objective = loadConfigFile(files.objective, 'objective');
  checkSatisfiable(constraints, objective, files);
  return { constraints, objective, files };
}

/** Throw an InputError listing every reason why no design can satisfy the configs. */
export function checkSatisfiable(c: ConstraintSet, o: Objective, files: { constraints: string; objective: string }): void {
  const reasons = precheck(c, o);
  if (reasons.length === 0) return;
  const lines = reasons.map((r) => `  ${r.in === 'objective' ? files.objective : files.constraints}: ${r.path}: ${r.message}`);
  throw new InputError([`no design can satisfy these configs (${reasons.length} reason${reasons.length > 1 ? 's' : ''}):`, ...lines].join('\n'), 'unsatisfiable');
}
