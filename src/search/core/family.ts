/** How an optimizer family is described to the registry. */
import type { OptionSpec, ResolvedOptions } from '../options.js';
import type { Optimizer, OptimizerContext } from './types.js';

export interface Family {
  readonly family: string;
  readonly description: string;
  readonly options: OptionSpec;
  /** True when the family handles several objectives. */
  readonly multiObjective: boolean;
  create(name: string, ctx: OptimizerContext, options: ResolvedOptions, given: Record<string, unknown>): Optimizer;
}
