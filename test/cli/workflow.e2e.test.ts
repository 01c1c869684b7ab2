import { existsSync, mkdtempSync, readdirSync, readFileSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { describe, expect, it } from 'vitest';
import { ROOT, runCli } from '../helpers/cli.js';

const dir = mkdtempSync(join(tmpdir(), 'lumenfold-flow-'));
const run = join(dir, 'run');

describe('the design workflow through the built binary', () => {
  it('optimize runs the embedded demo and beats a naive evenly spaced design', () => {
    const r = runCli(['optimize', '--budget', '1500', '--seed', '3', '--workers', '2', '--out', run, '--json']);
    expect(r.code, r.stderr).toBe(0);
    const s = JSON.parse(r.stdout);
    expect(s.best.score).toBeGreaterThan(s.naive_score);
    expect(s.best.metrics.efficiency).toBeGreaterThan(0.5);
    for (const f of ['manifest.json', 'history.jsonl', 'ranking.csv', 'best.xyz', 'best.pdb', 'run.log', 'job.json', 'designs/rank01.design.json']) {
      expect(existsSync(join(run, f)), f).toBe(true);
    }
    const manifest = JSON.parse(readFileSync(join(run, 'manifest.json'), 'utf8'));
    expect(manifest.search.seed).toBe(3);
    expect(manifest.configs.constraints.file_sha256).toMatch(/^[0-9a-f]{64}$/);
    // the history holds every candidate that met the cheap constraints and was scored
    const lines = readFileSync(join(run, 'history.jsonl'), 'utf8').trim().split('\n');
    expect(lines.length).toBeGreaterThan(100);
    expect(manifest.evaluations).toBe(1500);
    expect(JSON.parse(lines[0])).toHaveProperty('efficiency');
  });
  it('a run of one batch, with no feasible design yet, still writes its files (designs with two dyes on one anchor are left out)', () => {
    // seed 1: none of the demo's first 16 candidates meets the cheap constraints, and some put two dyes on one anchor
    const short = join(dir, 'one-batch');
    const r = runCli(['optimize', '--budget', '16', '--seed', '1', '--out', short, '--json']);
    expect(r.code, r.stderr).toBe(0);
    const designs = readdirSync(join(short, 'designs'));
    expect(designs.length).toBeGreaterThan(0);
    const checked = runCli(['score', ...designs.map((f) => join(short, 'designs', f)), '--json']);
    expect(checked.code, checked.stderr).toBe(0);
  });
  it.each([['--budget', '0'], ['--top', 'x'], ['--batch', '-2'], ['--workers', '0']])('refuses %s %s as a count, in words that name it', (option, value) => {
    const r = runCli(['optimize', option, value, '--out', join(dir, 'refused')]);
    expect(r.code).toBe(2);
    expect(r.stderr).toMatch(new RegExp(`${option}: '${value}' is not a positive whole number`));
    expect(existsSync(join(dir, 'refused'))).toBe(false);
  });
  it('never overwrites a run folder without --force', () => {
    const r = runCli(['optimize', '--budget', '50', '--out', run]);
    expect(r.code).toBe(2);
    expect(r.stderr).toMatch(/the folder is not empty/);
  });
  it('gives the same result for 1 and 2 workers with the same seed', () => {
    const a = JSON.parse(runCli(['optimize', '--budget', '300', '--seed', '5', '--workers', '1', '--out', join(dir, 'w1'), '--json']).stdout);
    const b = JSON.parse(runCli(['optimize', '--budget', '300', '--seed', '5', '--workers', '2', '--out', join(dir, 'w2'), '--json']).stdout);
    expect(b.best).toEqual(a.best);
  });
  it('scores, ranks and exports the designs it wrote', () => {
    const designs = readdirSync(join(run, 'designs')).map((f) => join(run, 'designs', f));
    const ranked = JSON.parse(runCli(['rank', ...designs, '--json']).stdout);
    expect(ranked).toHaveLength(designs.length);
    for (let i = 1; i < ranked.length; i++) expect(ranked[i - 1].score).toBeGreaterThanOrEqual(ranked[i].score);
    const scored = JSON.parse(runCli(['score', designs[0], '--json']).stdout);
    expect(scored[0].metrics.efficiency).toBeGreaterThan(0);
    // the disorder ensemble shared out over worker threads gives the same numbers
    expect(JSON.parse(runCli(['score', designs[0], '--json', '--workers', '3']).stdout)).toEqual(scored);
    const pdb = runCli(['export', designs[0], '--format', 'pdb']);
    expect(pdb.code).toBe(0);
    expect(pdb.stdout).toMatch(/^HETATM/m);
    const h = runCli(['export', designs[0], '--format', 'hamiltonian']);
    const rows = h.stdout.trim().split('\n');
    expect(rows.length).toBe(7);
    const sim = runCli(['simulate', '--hamiltonian', writeTmp('h.csv', h.stdout), '--trap', '1', '--model', 'hsr', '--json']);
    expect(sim.code, sim.stderr).toBe(0);
  });
  it('check reports every error with its path in the file and exits 2', () => {
    const bad = writeTmp('bad.yaml', 'format: lumenfold.objective/1\nscore:\n  kind: weighted_sum\n  terms: []\nmodel:\n  kind: hsr\n  dephasing: -1\n  colour: red\n');
    const r = runCli(['check', bad]);
    expect(r.code).toBe(2);
    expect(r.stdout).toMatch(/bad\.yaml:\d+:\d+: \/model/);
    const ok = runCli(['check', join(ROOT, 'constraints/demo-helix.yaml'), join(ROOT, 'objectives/demo-robust.yaml')]);
    expect(ok.code, ok.stdout + ok.stderr).toBe(0);
  });
});

function writeTmp(name: string, text: string): string {
  const p = join(dir, name);
  writeFileSync(p, text);
  return p;
}
