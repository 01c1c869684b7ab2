import { cpSync, mkdtempSync, readFileSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { basename, join } from 'node:path';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { optimize } from '../../src/actions/optimize.js';
import { writeRunReport } from '../../src/actions/report.js';
import { readDesignFile } from '../../src/output/design-file.js';
import { openFile, pngStatistics, type LoadedPage } from './browser.js';
import { parseSvg, svgMarks } from './helpers.js';

const dir = mkdtempSync(join(tmpdir(), 'lumenfold-report-test-'));
const single = join(dir, 'run-robust');
const front = join(dir, 'run-front');

const FRONT_OBJECTIVE = `format: lumenfold.objective/1
name: test-front
score:
  kind: pareto
  metrics:
    - { metric: efficiency, sense: maximize }
    - { metric: transfer_time, sense: minimize }
model: { kind: hsr, dephasing: 10, trap_rate: 1.0, loss: { kind: lifetimes } }
excitation: { kind: donors }
`;

/** Everything drawn: every chart box has data-drawn, and the 3-D view too when the page has one. */
const READY = `document.querySelectorAll('.chart').length > 0 && document.querySelectorAll('.chart:not([data-drawn]), .chart.error').length === 0 && (!document.getElementById('viewer') || document.getElementById('viewer').hasAttribute('data-drawn'))`;

const opened: LoadedPage[] = [];

beforeAll(async () => {
  await optimize({ budget: 600, seed: 1, workers: 1, out: single, force: false });
  writeFileSync(join(dir, 'front.yaml'), FRONT_OBJECTIVE);
  await optimize({ objectiveFile: join(dir, 'front.yaml'), budget: 200, seed: 4, top: 6, workers: 1, out: front, force: false });
});

afterAll(async () => {
  for (const o of opened) await o.context.close();
});

async function open(file: string): Promise<LoadedPage> {
  const o = await openFile(file, dir, READY);
  opened.push(o);
  return o;
}

describe('the HTML run report in a real browser (Debian chromium)', () => {
  it('a single-objective run: loads offline without errors, draws every chart and the 3-D view; the screenshot is not blank', async () => {
    const summary = await writeRunReport({ runFolder: single, force: false });
    expect(summary.report).toBe(join(single, 'report.html'));
    const html = readFileSync(summary.report, 'utf8');
    // one file: no external scripts, styles or images
    expect(html).not.toMatch(/<script[^>]+src=|<link[^>]+href=|<img[^>]+src="http/i);
    const o = await open(summary.report);
    expect(o.errors).toEqual([]);
    expect(o.network).toEqual([]);
    expect(o.warnings).toEqual([]);
    const page = o.page;
    const best = readDesignFile(join(single, 'designs', 'rank01.design.json'));
    const ranked = JSON.parse(readFileSync(join(single, 'manifest.json'), 'utf8')).search.top as number;
    expect(await page.locator('table.ranking tbody tr').count()).toBe(Math.min(ranked, summary.designs));
    expect(await page.locator('#picture-array svg g.dye').count()).toBe(best.sites.length);
    expect(await page.locator('#picture-levels svg g.exciton-level').count()).toBe(best.sites.length);
    for (const id of ['chart-convergence', 'chart-robustness', 'chart-dynamics-hsr', 'chart-dynamics-redfield', 'chart-dynamics-forster']) {
      expect(await page.locator(`#${id} svg`).count(), id).toBeGreaterThan(0);
    }
    expect(await page.locator('details pre').count()).toBe(2);
    // the 3-D view drew: its canvas exists and a pixel sample of it is not one colour
    const canvas = page.locator('#viewer canvas').first();
    expect(await canvas.count()).toBe(1);
    const view = await pngStatistics(o.context, await canvas.screenshot());
    expect(view.width).toBeGreaterThan(100);
    expect(view.colours).toBeGreaterThan(20);
    expect(view.variance).toBeGreaterThan(20);
    // the whole page: a screenshot kept beside the test's run folders, not blank
    const shot = join(dir, 'report-screenshot.png');
    const full = await pngStatistics(o.context, await page.screenshot({ path: shot, fullPage: true }));
    console.info(`report screenshot: ${shot}`);
    expect(full.height).toBeGreaterThan(2000);
    expect(full.variance).toBeGreaterThan(50);
  });

  it('a multi-objective run shows the trade-off front instead of a convergence curve', async () => {
    const out = join(dir, 'front-report.html');
    await writeRunReport({ runFolder: front, out, force: false });
    const o = await open(out);
    expect(o.errors).toEqual([]);
    expect(o.network).toEqual([]);
    expect(await o.page.locator('#chart-front svg').count()).toBeGreaterThan(0);
    expect(await o.page.locator('#chart-convergence').count()).toBe(0);
    // every ranked design is one point of the front
    const ranked = await o.page.locator('table.ranking tbody tr').count();
    expect(ranked).toBeGreaterThan(0);
    expect(await o.page.locator('#chart-front [aria-roledescription="point"]').count()).toBe(ranked);
  });

  it('says so instead of drawing an empty curve when no candidate met the constraints during the search', async () => {
    const copy = join(dir, 'run-none-feasible');
    cpSync(single, copy, { recursive: true });
    const m = JSON.parse(readFileSync(join(copy, 'manifest.json'), 'utf8'));
    writeFileSync(join(copy, 'manifest.json'), JSON.stringify({ ...m, convergence: [{ evaluations: 16, best: null }] }));
    const html = readFileSync((await writeRunReport({ runFolder: copy, force: true })).report, 'utf8');
    expect(html).toMatch(/<p class="note" id="chart-convergence">No convergence curve: none of the \d+ candidates met the constraints/);
  });

  it('refuses to overwrite a report without --force, and overwrites with it', async () => {
    await expect(writeRunReport({ runFolder: single, force: false })).rejects.toThrow(/report\.html: exists; use --force/);
    expect((await writeRunReport({ runFolder: single, force: true })).bytes).toBeGreaterThan(100_000);
  });

  it('writes every picture and chart as standalone, well-formed SVG without a browser', async () => {
    const folder = join(dir, 'svg');
    const s = await writeRunReport({ runFolder: single, out: join(dir, 'with-svg.html'), svgFolder: folder, force: false });
    const names = s.svgFiles.map((f) => basename(f)).sort();
    expect(names).toEqual(['chart-convergence.svg', 'chart-dynamics-forster.svg', 'chart-dynamics-hsr.svg', 'chart-dynamics-redfield.svg', 'chart-robustness.svg', 'picture-array.svg', 'picture-levels.svg']);
    for (const f of s.svgFiles) expect(parseSvg(readFileSync(f, 'utf8')).root, f).toBe('svg');
    // the histogram holds every disorder sample of the objective
    const samples = JSON.parse(readFileSync(join(single, 'manifest.json'), 'utf8')).configs.objective.resolved.disorder.samples as number;
    const bars = svgMarks(readFileSync(join(folder, 'chart-robustness.svg'), 'utf8')).filter((m) => m.role === 'bar');
    expect(bars.reduce((n, b) => n + Number(/disorder samples: (\d+)/.exec(b.label)![1]), 0)).toBe(samples);
    await expect(writeRunReport({ runFolder: single, out: join(dir, 'with-svg-2.html'), svgFolder: folder, force: false })).rejects.toThrow(/picture-array\.svg: exists; use --force/);
  });
});
