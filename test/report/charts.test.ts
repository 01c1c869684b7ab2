import { fileURLToPath } from 'node:url';
import { describe, expect, it } from 'vitest';
import { loadConfigFile } from '../../src/config/load.js';
import { metricSettingsFrom } from '../../src/actions/settings.js';
import { computeMetrics } from '../../src/metrics/evaluate.js';
import { mean, quantile } from '../../src/metrics/stats.js';
import { readDesignFile } from '../../src/output/design-file.js';
import { TRANSPORT_DEFAULTS } from '../../src/physics/transport.js';
import { dynamicsData } from '../../src/report/chart-data.js';
import { chartSvg } from '../../src/report/chart-svg.js';
import { convergenceSpec, dynamicsSpec, frontSpec, robustnessSpec } from '../../src/report/charts.js';
import { modelDynamics } from '../../src/report/dynamics.js';
import { disorderEfficiencies } from '../../src/report/robustness.js';
import { Rng } from '../../src/search/rng.js';
import { parseSvg, svgMarks } from './helpers.js';

const ROOT = new URL('../../', import.meta.url);
const design = readDesignFile(fileURLToPath(new URL('designs/examples/demo-helix-7.design.json', ROOT)));
const objective = loadConfigFile(fileURLToPath(new URL('objectives/demo-robust.yaml', ROOT)), 'objective');
const settings = metricSettingsFrom(objective, design.sites.length);

describe('run charts rendered to SVG by Vega in Node', () => {
  it('the robustness histogram puts every disorder sample in its bin', async () => {
    const rng = Rng.fromSeed(5);
    const efficiencies = Array.from({ length: 40 }, () => 0.6 + 0.35 * rng.uniform());
    const svg = await chartSvg(robustnessSpec({ efficiencies, nominal: 0.93, p10: quantile(efficiencies, 0.1) }));
    expect(parseSvg(svg).root).toBe('svg');
    const bars = svgMarks(svg).filter((m) => m.role === 'bar').map((m) => {
      const [, lo, hi, count] = /trapping efficiency: ([\d.]+) – ([\d.]+); disorder samples: (\d+)/.exec(m.label)!;
      return { lo: Number(lo), hi: Number(hi), count: Number(count) };
    });
    // the bins are Vega's; each bar's count is checked by counting the samples in its interval directly
    expect(bars.reduce((s, b) => s + b.count, 0)).toBe(efficiencies.length);
    for (const b of bars) expect(b.count).toBe(efficiencies.filter((e) => e >= b.lo && e < b.hi).length);
    const rules = svgMarks(svg).filter((m) => m.role === 'rule mark').map((m) => m.label);
    expect(rules.some((l) => l.includes('without disorder') && l.includes('0.93'))).toBe(true);
    expect(rules.some((l) => l.includes('10th percentile'))).toBe(true);
  });

  it('the convergence curve marks each improvement and runs to the last evaluation', async () => {
    const convergence = [{ evaluations: 16, best: null }, { evaluations: 48, best: 1.2 }, { evaluations: 96, best: 1.5 }, { evaluations: 160, best: 1.75 }];
    const svg = await chartSvg(convergenceSpec({ convergence, evaluations: 400 }));
    const marks = svgMarks(svg);
    // read back from the marks Vega drew (their accessible labels), not from our spec
    expect(marks.filter((m) => m.role === 'point').map((m) => /evaluations: (\d+)/.exec(m.label)![1])).toEqual(['48', '96', '160']);
    expect(marks.find((m) => m.role === 'axis' && m.label.includes("'evaluations'"))!.label).toMatch(/from 0 to 400/);
  });

  it('the front shows every candidate and every ranked design', async () => {
    const svg = await chartSvg(frontSpec({
      axes: [{ metric: 'efficiency', sense: 'maximize' }, { metric: 'transfer_time', sense: 'minimize' }],
      candidates: [{ a: 0.2, b: 100 }, { a: 0.5, b: 300 }, { a: 0.7, b: 90 }],
      ranked: [{ rank: 1, name: 'r1', a: 0.9, b: 20 }, { rank: 2, name: 'r2', a: 0.95, b: 35 }],
    }));
    const marks = svgMarks(svg);
    expect(marks.filter((m) => m.role === 'circle')).toHaveLength(3);
    expect(marks.filter((m) => m.role === 'point').map((m) => /name: (\w+)/.exec(m.label)![1])).toEqual(['r1', 'r2']);
  });
});

describe('numbers recomputed for the report', () => {
  it('the disorder efficiencies give the robust metrics the metrics layer computes with the same draws', () => {
    const d = disorderEfficiencies(design, settings, settings.disorder!);
    const m = computeMetrics(design, settings, ['robust_mean', 'robust_p10']).values;
    // identity with the metrics layer: same draws (common random numbers), same type-7 quantile (Hyndman and Fan 1996)
    expect(d.efficiencies.length + d.skipped).toBe(objective.disorder.samples);
    expect(quantile(d.efficiencies, 0.1)).toBe(m.robust_p10);
    expect(mean(d.efficiencies)).toBe(m.robust_mean);
  });

  it('population dynamics under each model: parameters from the objective or stated defaults, populations conserved', async () => {
    for (const model of ['hsr', 'redfield', 'forster'] as const) {
      const md = modelDynamics(design, settings, model);
      expect(md.error).toBeUndefined();
      const source = Object.fromEntries(md.parameters.map((p) => [p.name, p]));
      expect(source['trap rate k_trap'].source).toBe('objective');
      if (model === 'hsr') expect(source['pure dephasing rate']).toMatchObject({ source: 'default', value: `${TRANSPORT_DEFAULTS.dephasing} ps^-1` });
      if (model !== 'hsr') expect(source.temperature).toMatchObject({ source: 'objective', value: `${objective.model.kind === 'redfield' ? objective.model.temperature : ''} K` });
      const t = md.traces!;
      // what leaves the excitonic block goes to the sink or is lost: sites + sink + lost = 1 at every time (CONVENTIONS.md, eta + loss = 1)
      t.times.forEach((_, k) => expect(t.sites[k].reduce((s, p) => s + p, 0) + t.sink[k] + t.lost[k]).toBeCloseTo(1, 9));
      // the sink only fills, and never above the efficiency, its limit at long times (eta = k_trap * integral of rho_tt, CONVENTIONS.md)
      t.sink.forEach((s, k) => { if (k) expect(s).toBeGreaterThanOrEqual(t.sink[k - 1] - 1e-12); });
      expect(t.sink[t.sink.length - 1]).toBeLessThanOrEqual(md.efficiency! + 1e-9);
      const data = dynamicsData(t, design);
      expect(data.series).toHaveLength(design.sites.length + 1);
      expect(data.rows).toHaveLength(data.series.length * t.times.length);
      const legend = svgMarks(await chartSvg(dynamicsSpec(data))).find((m) => m.role === 'legend')!;
      expect(legend.label).toContain(`with ${data.series.length} values`);
    }
  });
});
