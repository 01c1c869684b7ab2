/**
 * The trapping efficiency of every disorder sample of one design (the distribution behind robust_mean,
 * robust_p10 and robust_share), with the same settings and shared draws as the run that scored it.
 */
import { InputError } from '../errors.js';
import { applyDisorder, type DisorderEnsemble } from '../metrics/disorder.js';
import { designSystem, type Design, type MetricSettings } from '../metrics/evaluate.js';
import { evaluateTransport, transportOptions } from '../physics/transport.js';

export interface DisorderSamples {
  /** Efficiency of each sample that could be scored, in sample order. */
  readonly efficiencies: number[];
  /** Samples left out because the jitter put two dyes on top of each other. */
  readonly skipped: number;
  readonly samples: number;
}

export function disorderEfficiencies(d: Design, settings: MetricSettings, ensemble: DisorderEnsemble): DisorderSamples {
  const t = transportOptions(settings.transport);
  const efficiencies: number[] = [];
  let skipped = 0;
  for (let k = 0; k < ensemble.draws.length; k++) {
    try {
      efficiencies.push(evaluateTransport(designSystem(d, settings, applyDisorder(d.sites, ensemble, k)), t).efficiency);
    } catch (e) {
      if (!(e instanceof InputError)) throw e;
      skipped++;
    }
  }
  return { efficiencies, skipped, samples: ensemble.draws.length };
}
