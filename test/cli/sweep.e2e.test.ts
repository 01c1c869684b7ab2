import { mkdtempSync, readdirSync, readFileSync, rmSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { describe, expect, it } from 'vitest';
import { ROOT, runCli } from '../helpers/cli.js';

const dir = mkdtempSync(join(tmpdir(), 'lumenfold-sweep-'));
const sweepFile = join(dir, 'two-temperatures.yaml');
writeFileSync(sweepFile, [
  'format: lumenfold.sweep/1',
  'name: two-temperatures',
  `constraints: ${join(ROOT, 'constraints/demo-helix.yaml')}`,
  `objective: ${join(ROOT, 'objectives/demo-robust.yaml')}`,
  'vary:',
  '  - path: objective.model.temperature',
  '    values: [150, 295]',
  '',
].join('\n'));
const out = join(dir, 'out');

describe('lumenfold sweep', () => {
  it('runs one optimization per point with a summary, and skips finished points when run again', () => {
    const first = runCli(['sweep', sweepFile, '--budget', '120', '--out', out, '--json']);
    expect(first.code, first.stderr).toBe(0);
    const a = JSON.parse(first.stdout);
    expect(a.points.map((p: { status: string }) => p.status)).toEqual(['done', 'done']);
    const summary = readFileSync(join(out, 'summary.csv'), 'utf8').trim().split('\n');
    expect(summary).toHaveLength(3);
    expect(summary[0]).toMatch(/objective\.model\.temperature/);
    // drop one point's result, as if the sweep had been stopped during it
    const pointDirs = readdirSync(out).filter((f) => /^\d{3}-/.test(f)).sort();
    expect(pointDirs).toHaveLength(2);
    rmSync(join(out, pointDirs[1]), { recursive: true });
    const again = JSON.parse(runCli(['sweep', sweepFile, '--budget', '120', '--out', out, '--json']).stdout);
    expect(again.points.map((p: { status: string }) => p.status)).toEqual(['skipped', 'done']);
    // the same job id and seed give the same result when the point is run again
    expect(again.points[1].best_score).toBe(a.points[1].best_score);
    const job = JSON.parse(readFileSync(join(out, pointDirs[0], 'job.json'), 'utf8'));
    expect(job.format).toBe('lumenfold.job/1');
    expect(job.objective.model.temperature).toBe(150);
  });
});
