import { cpSync, mkdirSync, mkdtempSync, readFileSync, rmSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { beforeAll, describe, expect, it } from 'vitest';
import { optimize } from '../../src/actions/optimize.js';
import { reportCommand } from '../../src/cli/commands/report.js';
import { exitCodeFor } from '../../src/cli/main.js';
import { InputError } from '../../src/errors.js';

const dir = mkdtempSync(join(tmpdir(), 'lumenfold-report-folder-'));
const run = join(dir, 'run');

beforeAll(async () => {
  await optimize({ budget: 64, seed: 2, top: 2, workers: 1, out: run, force: false });
});

/** Run `lumenfold report ARGS` through the command object; returns what it printed, or the error it threw. */
async function report(args: string[]): Promise<{ stdout: string; stderr: string; error?: unknown }> {
  const out = { stdout: '', stderr: '' };
  const cmd = reportCommand({ stdout: (t) => { out.stdout += t; }, stderr: (t) => { out.stderr += t; }, isTTY: false, debug: false }).exitOverride();
  try {
    await cmd.parseAsync(args, { from: 'user' });
    return out;
  } catch (error) {
    return { ...out, error };
  }
}

/** A copy of the run folder, changed by `edit`. */
function broken(name: string, edit: (folder: string) => void): string {
  const f = join(dir, name);
  cpSync(run, f, { recursive: true });
  edit(f);
  return f;
}

/** The command failed with one line naming `what`, and the CLI maps the error to exit code 2. */
function expectRefusal(r: { error?: unknown }, what: RegExp) {
  expect(r.error).toBeInstanceOf(InputError);
  const message = (r.error as Error).message;
  expect(message).toMatch(what);
  expect(message).not.toContain('\n');
  expect(exitCodeFor(r.error)).toBe(2);
}

describe('lumenfold report RUN_FOLDER', () => {
  it('writes RUN_FOLDER/report.html and names it', async () => {
    const r = await report([run]);
    expect(r.error).toBeUndefined();
    expect(r.stdout).toContain(join(run, 'report.html'));
  });

  it('refuses a folder that does not exist, naming it', async () => {
    expectRefusal(await report([join(dir, 'no-such-run')]), /no-such-run: no such run folder/);
  });

  it('refuses a file given as the run folder', async () => {
    writeFileSync(join(dir, 'a-file'), 'x');
    expectRefusal(await report([join(dir, 'a-file')]), /a-file: not a folder/);
  });

  it('names the missing or damaged file of an incomplete run folder', async () => {
    expectRefusal(await report([broken('no-manifest', (f) => rmSync(join(f, 'manifest.json')))]), /no-manifest\/manifest\.json: missing; the run folder is incomplete/);
    expectRefusal(await report([broken('bad-manifest', (f) => writeFileSync(join(f, 'manifest.json'), '{"format": "lumenfold.run/1",'))]), /bad-manifest\/manifest\.json: not valid JSON/);
    expectRefusal(await report([broken('other-json', (f) => writeFileSync(join(f, 'manifest.json'), '{"format": "lumenfold.design/1"}'))]), /other-json\/manifest\.json: not a run manifest/);
    expectRefusal(await report([broken('no-history', (f) => rmSync(join(f, 'history.jsonl')))]), /no-history\/history\.jsonl: missing/);
    expectRefusal(await report([broken('no-designs', (f) => rmSync(join(f, 'designs'), { recursive: true }))]), /no-designs\/designs\/rank01\.design\.json: missing/);
    expectRefusal(await report([broken('no-objective', (f) => {
      const m = JSON.parse(readFileSync(join(f, 'manifest.json'), 'utf8'));
      delete m.configs.objective.resolved;
      writeFileSync(join(f, 'manifest.json'), JSON.stringify(m));
    })]), /no-objective\/manifest\.json: "configs\.objective\.resolved" is missing/);
  });

  it('refuses to replace an existing report without --force, and --out outside the working folder', async () => {
    const again = await report([run]);
    expectRefusal(again, /report\.html: exists; use --force/);
    expect((await report([run, '--force'])).error).toBeUndefined();
    mkdirSync(join(dir, 'elsewhere'), { recursive: true });
    expectRefusal(await report([run, '--out', join(dir, 'elsewhere', 'r.html')]), /outside the working folder/);
    expect((await report([run, '--out', join(dir, 'elsewhere', 'r.html'), '--allow-outside', '--json'])).stdout).toContain('"format": "lumenfold.report-summary/1"');
  });
});
