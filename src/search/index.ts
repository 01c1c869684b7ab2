/** Public surface of the search layer (re-exported by the package entry point). */
import './builtins.js';

export { Rng, type RngState } from './rng.js';
export { SearchSpace, type Constraint } from './space/space.js';
export type { Vec3 as UnitVector3 } from './space/unitVector.js';
export type { VariableCodec, VariableKind } from './space/codec.js';
export type {
  Candidate,
  Evaluated,
  Optimizer,
  OptimizerContext,
  OptimizerState,
  Progress,
  ProgressCallback,
  Score,
  StandardSpace,
} from './core/types.js';
export { createOptimizer, describeOptimizer, optimizerNames, registerOptimizer, restoreOptimizer, type OptimizerInfo } from './registry.js';
export type { Family } from './core/family.js';
export { BaseOptimizer, type Proposal, type Told } from './core/base.js';
export { Generation } from './core/generation.js';
export { describeOptions, resolveOptions, type OptionField, type OptionSpec } from './options.js';
export { chooseOptimizer, type AutoChoice } from './optimizers/auto.js';
export { SearchRun, type RunSettings, type RunState } from './run.js';
export { minimize, minimizeMulti, type Found, type MinimizeMultiResult, type MinimizeResult, type MinimizeSettings, type Objective } from './minimize.js';
export { hypervolume } from './multi/hypervolume.js';
export { Halton } from './sampling/halton.js';
export { bbob, type BbobFunction, type BbobName } from './problems/bbob.js';
export { zdt, ZDT_FRONT_HYPERVOLUME, type ZdtName } from './problems/zdt.js';
