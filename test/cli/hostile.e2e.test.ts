import { existsSync, mkdtempSync, readFileSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { describe, expect, it } from 'vitest';
import { ROOT, runCli } from '../helpers/cli.js';

/**
 * Hostile and careless input through the built binary: each case exits 2 with a message that names the file
 * and the place in it, prints no stack trace (unless --debug) and writes nothing. Limits: config files 1 MiB,
 * nesting 32 levels (src/config/limits.ts), YAML aliases refused.
 */
const dir = mkdtempSync(join(tmpdir(), 'lumenfold-hostile-'));
const base = readFileSync(join(ROOT, 'constraints/demo-helix.yaml'), 'utf8').replace('palette_file: palettes/demo-dyes.yaml', `palette_file: ${join(ROOT, 'constraints/palettes/demo-dyes.yaml')}`);
const put = (name: string, text: string | Buffer) => { const p = join(dir, name); writeFileSync(p, text); return p; };

const cases: [string, string | Buffer, RegExp][] = [
  ['unknown-key.yaml', base + 'colour: red\n', /unknown-key\.yaml.*colour/],
  ['wrong-type.yaml', base.replace('min: 1.0 ', 'min: [1] '), /wrong-type\.yaml.*\/spacing\/min/],
  ['nan.yaml', base.replace('min: 1.0 ', 'min: .nan '), /nan\.yaml.*\/spacing\/min/],
  ['infinity.yaml', base.replace('min: 1.0 ', 'min: .inf '), /infinity\.yaml.*\/spacing\/min/],
  ['string-number.yaml', base.replace('min: 1.0 ', 'min: "1.0" '), /string-number\.yaml.*\/spacing\/min/],
  ['empty.yaml', '', /empty\.yaml.*empty/i],
  ['binary.yaml', Buffer.from([0x00, 0xff, 0x13, 0x37, 0x00, 0x42]), /binary\.yaml/],
  ['huge.yaml', base + '# ' + 'x'.repeat(1_100_000) + '\n', /huge\.yaml.*(MiB|bytes|large|limit)/i],
  ['deep.json', '['.repeat(200) + ']'.repeat(200), /deep\.json.*(deep|nest)/i],
  ['proto.yaml', base + '__proto__:\n  polluted: 1\n', /proto\.yaml.*__proto__/],
  ['constructor.json', JSON.stringify({ format: 'lumenfold.constraints/1', constructor: { prototype: 1 } }), /constructor\.json.*constructor/],
  ['bomb.yaml', 'a: &a ["x","x","x","x","x","x","x","x","x"]\nb: &b [*a,*a,*a,*a,*a,*a,*a,*a,*a]\nc: &c [*b,*b,*b,*b,*b,*b,*b,*b,*b]\nd: [*c,*c,*c,*c,*c,*c,*c,*c,*c]\n', /bomb\.yaml.*alias/i],
  ['duplicate.yaml', base + 'name: again\n', /duplicate\.yaml:\d+:\d+: \/name: repeats the key/],
];

describe('hostile config files', () => {
  it.each(cases)('%s: exit 2, file and place named, no stack trace, nothing written', (name, text, msg) => {
    const file = put(name, text);
    const out = join(dir, `run-${name}`);
    const r = runCli(['optimize', '--constraints', file, '--out', out]);
    expect(r.code).toBe(2);
    expect(r.stderr).toMatch(msg);
    expect(r.stderr).not.toMatch(/\n\s+at /);
    expect(existsSync(out)).toBe(false);
  });
  it('shows the stack trace with --debug', () => {
    const r = runCli(['--debug', 'optimize', '--constraints', put('unknown-key2.yaml', base + 'colour: red\n'), '--out', join(dir, 'run-debug')]);
    expect(r.code).toBe(2);
    expect(r.stderr).toMatch(/\n\s+at /);
  });
  it('refuses output paths that escape the working folder, unless allowed', () => {
    const r = runCli(['optimize', '--budget', '10', '--out', '../../escaped-run'], { cwd: dir });
    expect(r.code).toBe(2);
    expect(r.stderr).toMatch(/outside the working folder/);
    expect(existsSync(join(dir, '../../escaped-run'))).toBe(false);
    const e = runCli(['export', join(ROOT, 'designs/examples/demo-helix-7.design.json'), '--format', 'xyz', '--out', '/etc/lumenfold-test.xyz'], { cwd: dir });
    expect(e.code).toBe(2);
    expect(existsSync('/etc/lumenfold-test.xyz')).toBe(false);
  });
  it('refuses a hostile design file in score with its path named', () => {
    const d = JSON.parse(readFileSync(join(ROOT, 'designs/examples/demo-helix-7.design.json'), 'utf8'));
    d.sites[2].energy = 'NaN';
    const r = runCli(['score', put('bad.design.json', JSON.stringify(d))]);
    expect(r.code).toBe(2);
    expect(r.stderr).toMatch(/bad\.design\.json.*\/sites\/2\/energy/);
  });
});
