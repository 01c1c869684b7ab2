import { Command, Option } from 'commander';
import type { SimulateRequest } from '../../actions/simulate.js';
import { InputError } from '../../errors.js';
import type { ModelName } from '../../physics/transport.js';
import { parseNumber, parseSiteList, parseStart, parseTimes } from '../parse.js';
import type { CliContext } from '../context.js';

interface SimulateFlags {
  hamiltonian: string;
  trap: string;
  model: ModelName;
  dephasing?: string;
  trapRate: string;
  lossRate: string;
  start: string;
  temperature?: string;
  reorganization?: string;
  cutoff?: string;
  times?: string;
  json?: boolean;
}

export function simulateCommand(ctx: CliContext): Command {
  return new Command('simulate')
    .description('trapping efficiency, mean transfer time and population traces of your own Hamiltonian')
    .requiredOption('--hamiltonian <file>', 'square Hamiltonian in cm^-1, comma separated, no header')
    .requiredOption('--trap <sites>', 'trap site(s), numbered from 1, comma separated')
    .addOption(new Option('--model <name>', 'transport model').choices(['hsr', 'redfield', 'forster']).default('hsr'))
    .option('--dephasing <rate>', 'hsr: pure dephasing rate gamma_phi, ps^-1 (default 10)')
    .option('--trap-rate <rate>', 'trap rate k_trap, ps^-1', '1')
    .option('--loss-rate <rate>', 'loss rate of every site, ps^-1 (1/lifetime)', '0.001')
    .option('--start <state>', 'initial excitation: site:N, exciton:K, donors or light[:T]', 'site:1')
    .option('--temperature <K>', 'redfield, forster: bath temperature, K (default 300)')
    .option('--reorganization <cm>', 'redfield, forster: reorganization energy of every site, cm^-1 (default 35)')
    .option('--cutoff <cm>', 'redfield: Drude-Lorentz cutoff frequency, cm^-1 (default 100)')
    .option('--times <spec>', 'add population traces: END:COUNT (ps) or a comma list of times in ps')
    .option('--json', 'print the result as JSON')
    .action(async (flags: SimulateFlags) => {
      const req: SimulateRequest = {
        hamiltonianFile: flags.hamiltonian,
        traps: parseSiteList('--trap', flags.trap),
        model: flags.model,
        trapRate: parseNumber('--trap-rate', flags.trapRate, 'nonnegative'),
        lossRate: parseNumber('--loss-rate', flags.lossRate, 'nonnegative'),
        start: parseStart(flags.start),
      };
      if (flags.dephasing !== undefined) req.dephasing = parseNumber('--dephasing', flags.dephasing, 'nonnegative');
      if (flags.temperature !== undefined) req.temperature = parseNumber('--temperature', flags.temperature, 'positive');
      if (flags.reorganization !== undefined) req.reorganization = parseNumber('--reorganization', flags.reorganization, 'nonnegative');
      if (flags.cutoff !== undefined) {
        if (flags.model !== 'redfield') throw new InputError('--cutoff belongs to --model redfield');
        req.cutoff = parseNumber('--cutoff', flags.cutoff, 'positive');
      }
      if (flags.times !== undefined) req.times = parseTimes(flags.times);
      const { simulate } = await import('../../actions/simulate.js');
      const r = simulate(req);
      if (flags.json) {
        ctx.stdout(JSON.stringify(r, null, 2) + '\n');
        return;
      }
      const lines = [
        `model            ${r.model} (${Object.entries(r.parameters).map(([k, v]) => `${k}=${v}`).join(', ')})`,
        `sites            ${r.sites}, trap ${r.traps.join(', ')}`,
        `efficiency       ${r.efficiency.toFixed(6)}`,
        `loss fraction    ${r.loss_fraction.toFixed(6)}`,
        `transfer time    ${r.transfer_time_ps === null ? 'never' : `${r.transfer_time_ps.toPrecision(6)} ps`}`,
      ];
      if (r.traces) {
        lines.push('', ['t_ps', ...Array.from({ length: r.sites }, (_, m) => `site${m + 1}`), 'sink', 'lost'].join('\t'));
        r.traces.times_ps.forEach((t, i) => lines.push([t, ...r.traces!.site_populations[i], r.traces!.sink[i], r.traces!.lost[i]].map((v) => Number(v.toPrecision(6))).join('\t')));
      }
      ctx.stdout(lines.join('\n') + '\n');
    });
}
