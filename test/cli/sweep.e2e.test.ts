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
  it('with --workers 2 writes the same files as with one thread', () => {
    const one = join(dir, 'one-thread'), two = join(dir, 'two-threads');
    const a = runCli(['sweep', sweepFile, '--budget', '120', '--out', one, '--json']);
    const b = runCli(['sweep', sweepFile, '--budget', '120', '--out', two, '--workers', '2', '--json']);
    expect(a.code, a.stderr).toBe(0);
    expect(b.code, b.stderr).toBe(0);
    expect(JSON.parse(b.stdout).points.map((p: { status: string }) => p.status)).toEqual(['done', 'done']);
    expect(readFileSync(join(two, 'summary.csv'), 'utf8')).toBe(readFileSync(join(one, 'summary.csv'), 'utf8'));
    const points = readdirSync(one).filter((f) => /^\d{3}-/.test(f)).sort();
    expect(readdirSync(two).filter((f) => /^\d{3}-/.test(f)).sort()).toEqual(points);
    for (const p of points) {
      for (const f of ['history.jsonl', 'ranking.csv', 'best.xyz', 'best.pdb', 'designs/rank01.design.json', 'job.json']) {
        expect(readFileSync(join(two, p, f), 'utf8'), `${p}/${f}`).toBe(readFileSync(join(one, p, f), 'utf8'));
      }
    }
  });
  it('--plan writes self-contained jobs that another runner executes with optimize --job, and the sweep collects them', () => {
    const planned = join(dir, 'planned');
    const plan = runCli(['sweep', sweepFile, '--budget', '120', '--out', planned, '--plan', '--json']);
    expect(plan.code, plan.stderr).toBe(0);
    const folders = readdirSync(planned).filter((f) => /^\d{3}-/.test(f)).sort();
    expect(folders).toHaveLength(2);
    // "the cluster": run the first job on its own
    const job = join(planned, folders[0], 'job.json');
    const ran = runCli(['optimize', '--job', job, '--out', join(planned, folders[0]), '--force', '--json']);
    expect(ran.code, ran.stderr).toBe(0);
    const collected = JSON.parse(runCli(['sweep', sweepFile, '--budget', '120', '--out', planned, '--json']).stdout);
    expect(collected.points.map((p: { status: string }) => p.status)).toEqual(['skipped', 'done']);
    // the same job gives the same result wherever it runs
    const direct = JSON.parse(readFileSync(join(out, readdirSync(out).filter((f) => f.startsWith('000-'))[0], 'result.json'), 'utf8'));
    expect(collected.points[0].best_score).toBe(direct.best_score);
    // an edited job is refused
    const edited = JSON.parse(readFileSync(job, 'utf8'));
    edited.search.budget = 7;
    writeFileSync(join(dir, 'edited.job.json'), JSON.stringify(edited));
    const r = runCli(['optimize', '--job', join(dir, 'edited.job.json'), '--out', join(dir, 'edited-run')]);
    expect(r.code).toBe(2);
    expect(r.stderr).toMatch(/\/id: the job was changed/);
  });
});
