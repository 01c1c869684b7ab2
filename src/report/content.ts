/** What the report shows, assembled from a run folder and the numbers recomputed for its best design. */
import { stringify } from 'yaml';
import type { Objective } from '../config/objective-types.js';
import type { MetricSettings } from '../metrics/evaluate.js';
import { mean, quantile } from '../metrics/stats.js';
import { dyeAtoms } from '../output/dye-atoms.js';
import { ANGSTROM_PER_NM } from '../output/xyz.js';
import type { DisorderModel } from '../metrics/disorder.js';
import { arraySvg, ARRAY_PICTURE_DEFAULTS } from './array-svg.js';
import { dynamicsData, frontData } from './chart-data.js';
import { convergenceSpec, dynamicsSpec, frontSpec, robustnessSpec } from './charts.js';
import { energyColour } from './colour.js';
import type { ModelDynamics } from './dynamics.js';
import { levelsSvg } from './levels-svg.js';
import type { InlineLibrary } from './libraries.js';
import type { ReportChart, ReportContent, ReportDynamics, ViewerSite } from './page.js';
import type { DisorderSamples } from './robustness.js';
import type { RunFolderData } from './run-folder.js';
import { label } from './svg.js';

export interface ReportInputs {
  readonly run: RunFolderData;
  readonly objective: Objective;
  readonly settings: MetricSettings;
  readonly disorder: DisorderModel;
  readonly robustness: DisorderSamples;
  /** Efficiency of the best design without disorder under the objective's model. */
  readonly nominal: number;
  readonly dynamics: readonly ModelDynamics[];
  /** PDB text of the best design, or why there is none. */
  readonly pdb: string | { readonly missing: string };
  readonly libraries: readonly InlineLibrary[];
  readonly generated: Date;
  /** Version of the lumenfold writing the report. */
  readonly toolVersion: string;
}

/** Charts of the report fill their box. */
const WIDE = { width: 'container' } as const;

const fmt = (x: number | null | undefined, digits = 5) => (x === null || x === undefined || !Number.isFinite(x) ? 'n/a' : label(x, digits));

function summaryRows(r: RunFolderData, o: Objective): [string, string][] {
  const m = r.manifest, s = m.search;
  const used = s.optimizer_used && s.optimizer_used !== s.optimizer ? `${s.optimizer} (ran ${s.optimizer_used})` : s.optimizer;
  const c = m.configs.constraints.resolved as { name?: string };
  return [
    ['run folder', r.folder],
    ['job', `${m.job.label} (id ${m.job.id})`],
    ['tool version', `${m.tool.name ?? 'lumenfold'} ${m.tool.version}`],
    ['constraint set', `${c.name ?? '(unnamed)'}${m.configs.constraints.file ? ` from ${m.configs.constraints.file}` : ''}`],
    ['objective', `${o.name ?? '(unnamed)'}${m.configs.objective.file ? ` from ${m.configs.objective.file}` : ''}: ${o.score.kind === 'pareto' ? 'Pareto front' : 'weighted sum'} under ${o.model.kind}`],
    ['optimizer', used + (s.choice ? ` (automatic choice: ${s.choice})` : '')],
    ['seed', String(s.seed)],
    ['budget', `${s.budget} candidates in batches of ${s.batch}`],
    ['evaluations', `${m.evaluations} (${m.failed_evaluations} failed)`],
    ['time', `${label(m.seconds, 4)} s${m.started ? ` (started ${m.started}${m.finished ? `, finished ${m.finished}` : ''})` : ''}`],
    ...(o.score.kind === 'pareto'
      ? [['hypervolume of the front', fmt(m.hypervolume)] as [string, string]]
      : [['best score', fmt(m.best_score)], ['naive evenly spaced design', fmt(m.naive_score)]] as [string, string][]),
    ['ranked designs', String(r.designs.length)],
  ];
}

function configBlocks(r: RunFolderData): ReportContent['configs'] {
  return (['constraints', 'objective'] as const).map((k) => {
    const e = r.manifest.configs[k];
    const name = (e.resolved as { name?: string }).name ?? '(unnamed)';
    return {
      heading: `${k === 'constraints' ? 'Constraint set' : 'Objective'}: ${name}`,
      detail: `${e.file ?? 'embedded'} · sha256 ${(e.file_sha256 ?? e.resolved_sha256).slice(0, 12)}`,
      text: stringify(e.resolved, { lineWidth: 100 }),
    };
  });
}

function searchCharts(i: ReportInputs): ReportChart[] {
  const { run, objective: o } = i;
  const out: ReportChart[] = [];
  if (o.score.kind === 'pareto') {
    const [a, b] = o.score.metrics;
    out.push(b
      ? { id: 'chart-front', heading: 'Trade-off front', caption: `Every scored candidate (grey) and the ${run.designs.length} ranked designs (red) in the plane of the first two objectives, ${a.metric} and ${b.metric}.`, spec: frontSpec(frontData([a, b], run.history, run.designs.map((d) => d.record)), WIDE) }
      : { id: 'chart-front', heading: 'Trade-off front', caption: '', missing: 'The objective has a single Pareto metric: there is no front to draw.' });
  } else {
    const caption = `Best objective so far against the number of candidates evaluated (${run.manifest.evaluations} in all; ${run.history.length} met the cheap constraints and were scored by the transport model). Points mark improvements.`;
    const improved = run.manifest.convergence.some((c) => c.best !== null && Number.isFinite(c.best));
    out.push(improved
      ? { id: 'chart-convergence', heading: 'Convergence', caption, spec: convergenceSpec({ convergence: run.manifest.convergence, evaluations: run.manifest.evaluations }, WIDE) }
      : { id: 'chart-convergence', heading: 'Convergence', caption: '', missing: `No convergence curve: none of the ${run.manifest.evaluations} candidates met the constraints during the search, so the run recorded no best objective.` });
  }
  const { efficiencies, skipped, samples } = i.robustness;
  const d = i.disorder;
  const recorded = run.designs[0].record.metrics?.robust_p10;
  const p10 = quantile(efficiencies, 0.1);
  const share = efficiencies.filter((e) => e >= o.disorder.share_threshold).length / Math.max(1, efficiencies.length);
  out.push(efficiencies.length === 0
    ? { id: 'chart-robustness', heading: 'Robustness', caption: '', missing: `No disorder sample could be scored (${skipped} of ${samples} put two dyes on top of each other).` }
    : {
      id: 'chart-robustness',
      heading: 'Robustness of the best design',
      caption: `Trapping efficiency of ${efficiencies.length} disorder samples (site-energy sigma ${d.energySigma} cm^-1, position jitter ${d.positionJitter} nm, dipole tilt ${d.orientationJitter} degrees, seed ${d.seed}) under the objective's ${o.model.kind} model`
        + `${skipped ? `, ${skipped} samples left out (dyes on top of each other)` : ''}: mean ${fmt(mean(efficiencies), 4)}, 10th percentile ${fmt(p10, 4)}, ${label(100 * share, 3)}% at or above ${o.disorder.share_threshold}`
        + `.${recorded === undefined ? '' : Math.abs(recorded - p10) <= 1e-9 * Math.max(1, Math.abs(p10)) ? ` The run recorded the same robust_p10.` : ` The run recorded robust_p10 = ${fmt(recorded, 6)}, recomputed here ${fmt(p10, 6)}: the disorder draws or the model changed between the lumenfold that made the run (version ${run.manifest.tool.version}) and this one (version ${i.toolVersion}).`}`,
      spec: robustnessSpec({ efficiencies, nominal: i.nominal, p10 }, WIDE),
    });
  return out;
}

function dynamicsCharts(i: ReportInputs): ReportDynamics[] {
  const best = i.run.designs[0].record;
  return i.dynamics.map((m) => {
    const base = { id: `chart-dynamics-${m.model}`, heading: `${m.model}: ${m.summary}${m.model === i.objective.model.kind ? ' (the objective’s model)' : ''}`, parameters: m.parameters };
    if (!m.traces) return { ...base, caption: '', missing: `No population dynamics under ${m.model}: ${m.error ?? 'not computed'}` };
    const caption = `Site populations and the sink against time; efficiency ${fmt(m.efficiency, 4)}, mean transfer time ${fmt(m.transferTime, 4)} ps.`;
    return { ...base, caption, spec: dynamicsSpec(dynamicsData(m.traces, best), WIDE) };
  });
}

function viewer(i: ReportInputs): ReportContent['viewer'] {
  if (typeof i.pdb !== 'string') return i.pdb;
  const best = i.run.designs[0].record;
  const es = best.sites.map((s) => s.energy);
  const [lo, hi] = [Math.min(...es), Math.max(...es)];
  const sites: ViewerSite[] = dyeAtoms(best).map((d) => {
    const c = d.atoms[0];
    return {
      id: d.site + 1, centre: `${c.element}C`, colour: energyColour(best.sites[d.site].energy, lo, hi), trap: d.role === 'trap',
      label: `${d.site + 1}${d.role === 'trap' ? ' trap' : ''}`,
      at: { x: c.position[0] * ANGSTROM_PER_NM, y: c.position[1] * ANGSTROM_PER_NM, z: c.position[2] * ANGSTROM_PER_NM },
    };
  });
  return { pdb: i.pdb, sites, caption: 'Drag to rotate, scroll to zoom. Spheres: dye centres coloured by site energy (scale of the array picture), the larger one the trap; sticks: transition dipole axes (the CONECT bonds of the PDB export). Coordinates in Å.' };
}

export function reportContent(i: ReportInputs): ReportContent {
  const best = i.run.designs[0].record;
  const system = i.settings.system;
  const score = i.objective.score;
  return {
    title: `lumenfold run report: ${i.run.manifest.job.label}`,
    subtitle: `Run ${i.run.manifest.job.id}, ${i.run.manifest.evaluations} evaluations, best design ${best.name} (${best.sites.length} dyes)`,
    summary: summaryRows(i.run, i.objective),
    configs: configBlocks(i.run),
    ranked: i.run.designs.map((d) => d.record),
    scoreMetrics: score.kind === 'pareto' ? score.metrics.map((m) => m.metric) : score.terms.map((t) => t.metric),
    pictures: [
      { id: 'picture-array', heading: 'Array on its best-fit plane', caption: `Dyes as arrows along their transition dipoles, coloured by site energy; couplings with |J| ≥ ${ARRAY_PICTURE_DEFAULTS.threshold} cm^-1 (the objective's dipole model) as lines.`, svg: arraySvg(best, { system }) },
      { id: 'picture-levels', heading: 'Site and exciton energies', caption: 'Site energies beside the exciton states of the coupled array; bar length by oscillator strength.', svg: levelsSvg(best, { system }) },
    ],
    searchCharts: searchCharts(i),
    dynamics: dynamicsCharts(i),
    viewer: viewer(i),
    libraries: i.libraries,
    generated: i.generated.toISOString(),
  };
}
