import { InputError } from '../errors.js';
import { readMatrixCsv } from '../io/matrix-csv.js';
import { excitons } from '../physics/excitons.js';
import { systemFromHamiltonian } from '../physics/hamiltonian.js';
import type { Start } from '../physics/models/common.js';
import { evaluateTransport, populationTraces, type ModelName, type TransportOptions } from '../physics/transport.js';

/** A typed simulate request: sites and traps 0-based here. */
export interface SimulateRequest {
  hamiltonianFile: string;
  traps: number[];
  model: ModelName;
  trapRate: number;
  lossRate: number;
  dephasing?: number;
  temperature?: number;
  reorganization?: number;
  cutoff?: number;
  start: Start;
  times?: number[];
}

/** The JSON result of simulate. */
export interface SimulateResult {
  format: 'lumenfold.simulation/1';
  model: ModelName;
  sites: number;
  traps: number[];
  parameters: Record<string, number | string>;
  efficiency: number;
  loss_fraction: number;
  transfer_time_ps: number | null;
  exciton_energies_cm: number[];
  traces?: { times_ps: number[]; site_populations: number[][]; sink: number[]; lost: number[] };
}

/** Run one transport evaluation on a user's Hamiltonian. */
export function simulate(req: SimulateRequest): SimulateResult {
  const H = readMatrixCsv(req.hamiltonianFile);
  const finite = req.model !== 'hsr';
  if (!finite && (req.temperature !== undefined || req.reorganization !== undefined || req.cutoff !== undefined)) {
    throw new InputError('--temperature, --reorganization and --cutoff belong to --model redfield or forster; hsr is an infinite-temperature model');
  }
  if (finite && req.dephasing !== undefined) throw new InputError(`--dephasing belongs to --model hsr; ${req.model} takes its dephasing from the bath`);
  const sys = systemFromHamiltonian(H, { traps: req.traps, lossRate: req.lossRate, reorganization: req.reorganization ?? (finite ? 35 : 0) });
  const opts: Partial<TransportOptions> = { model: req.model, trapRate: req.trapRate, start: req.start };
  const parameters: Record<string, number | string> = { trap_rate_ps: req.trapRate, loss_rate_ps: req.lossRate, start: describeStart(req.start) };
  if (req.model === 'hsr') {
    opts.dephasing = req.dephasing ?? 10;
    parameters.dephasing_ps = opts.dephasing;
  } else {
    opts.temperature = req.temperature ?? 300;
    parameters.temperature_k = opts.temperature;
    parameters.reorganization_cm = sys.reorganization[0];
    if (req.model === 'redfield') {
      opts.cutoff = req.cutoff ?? 100;
      parameters.cutoff_cm = opts.cutoff;
    }
  }
  const r = evaluateTransport(sys, opts);
  const out: SimulateResult = {
    format: 'lumenfold.simulation/1',
    model: req.model,
    sites: sys.n,
    traps: req.traps.map((t) => t + 1),
    parameters,
    efficiency: r.efficiency,
    loss_fraction: r.lossFraction,
    transfer_time_ps: Number.isFinite(r.transferTime) ? r.transferTime : null,
    exciton_energies_cm: Array.from(excitons(sys).energies),
  };
  if (req.times) {
    const tr = populationTraces(sys, req.times, opts);
    out.traces = { times_ps: [...tr.times], site_populations: tr.sites.map((p) => [...p]), sink: [...tr.sink], lost: [...tr.lost] };
  }
  return out;
}

function describeStart(s: Start): string {
  switch (s.kind) {
    case 'site': return `site:${s.site + 1}`;
    case 'exciton': return `exciton:${s.state + 1}`;
    case 'donors': return 'donors';
    case 'light': return `light:${s.temperature ?? 5800}`;
  }
}
