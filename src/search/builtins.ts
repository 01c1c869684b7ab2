/** Registers the built-in optimizers. Imported for its effect by index.ts and minimize.ts. */
import { cmaesFamily } from './optimizers/cmaes/cmaes.js';
import { deFamily } from './optimizers/de.js';
import { haltonFamily } from './optimizers/lowDiscrepancy.js';
import { nsga2Family } from './optimizers/nsga2/nsga2.js';
import { onePlusOneFamily } from './optimizers/onePlusOne.js';
import { randomFamily } from './optimizers/random.js';
import { autoFamily } from './optimizers/auto.js';
import { createOptimizer, optimizerNames, registerOptimizer } from './registry.js';

if (!optimizerNames().includes('auto')) {
  registerOptimizer('random', randomFamily);
  registerOptimizer('halton', haltonFamily);
  registerOptimizer('cmaes', cmaesFamily);
  registerOptimizer('de-rand1bin', deFamily, { strategy: 'rand1bin' }, 'differential evolution, rand/1/bin (Storn and Price 1997)');
  registerOptimizer('de-current-to-best1', deFamily, { strategy: 'current-to-best1' }, 'differential evolution, current-to-best/1/bin; converges faster, explores less');
  registerOptimizer('one-plus-one', onePlusOneFamily);
  registerOptimizer('nsga2', nsga2Family);
  registerOptimizer('auto', autoFamily((name, ctx) => createOptimizer(name, ctx)));
}
