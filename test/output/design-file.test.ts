import { mkdtempSync, readdirSync, readFileSync, rmSync, truncateSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { fileURLToPath } from 'node:url';
import { Ajv2020 } from 'ajv/dist/2020.js';
import { afterAll, describe, expect, it } from 'vitest';
import { InputError } from '../../src/errors.js';
import { DesignFileError } from '../../src/output/design-error.js';
import { formatDesignFile, MAX_DESIGN_FILE_BYTES, readDesignFile, writeDesignFile } from '../../src/output/design-file.js';
import { designFromJson, designToJson } from '../../src/output/design-json.js';
import type { DesignRecord } from '../../src/output/record.js';
import { randomRecord, smallRecord } from './records.js';

const dir = mkdtempSync(join(tmpdir(), 'lumenfold-design-'));
afterAll(() => rmSync(dir, { recursive: true, force: true }));

const schemaText = readFileSync(new URL('../../designs/design.schema.json', import.meta.url), 'utf8');
const EXAMPLES = ['demo-helix-7.design.json', 'demo-wire-4.design.json'];
const example = (f: string) => fileURLToPath(new URL(`../../designs/examples/${f}`, import.meta.url));

describe('designs/design.schema.json', () => {
  // A fresh ajv in strict mode, no lumenfold code in between (ajv 8 documents strict mode: unknown keywords,
  // ignored keywords and type mismatches are compile errors).
  const strict = () => new Ajv2020({ strict: true, strictNumbers: true, allErrors: true });

  it('is a valid draft 2020-12 schema and compiles in strict mode', () => {
    const ajv = strict();
    expect(ajv.validateSchema(JSON.parse(schemaText)), JSON.stringify(ajv.errors)).toBe(true);
    expect(() => ajv.compile(JSON.parse(schemaText))).not.toThrow();
  });

  it('closes every object: additionalProperties is false except in the free-keyed metrics table', () => {
    const open: string[] = [];
    const visit = (node: unknown, where: string): void => {
      if (node === null || typeof node !== 'object') return;
      const n = node as Record<string, unknown>;
      if (n.type === 'object' && n.additionalProperties !== false && where !== '/properties/metrics') open.push(where);
      for (const [k, v] of Object.entries(n)) visit(v, `${where}/${k}`);
    };
    visit(JSON.parse(schemaText), '');
    expect(open).toEqual([]);
  });

  it.each(EXAMPLES)('example %s validates with a fresh strict ajv and reads as a design', (f) => {
    const validate = strict().compile(JSON.parse(schemaText));
    const doc = JSON.parse(readFileSync(example(f), 'utf8'));
    expect(validate(doc), JSON.stringify(validate.errors)).toBe(true);
    const r = readDesignFile(example(f));
    expect(r.sites.length).toBe(doc.sites.length);
    expect(r.traps.length).toBeGreaterThan(0);
  });
});

describe('design file round trip', () => {
  // JSON.stringify writes each number as the shortest decimal that reads back to the same double
  // (ECMA-262, Number::toString), so a written design reads back exactly.
  const cases: [string, DesignRecord][] = [['small', smallRecord()], ...[1, 2, 3].map((s): [string, DesignRecord] => [`random ${s}`, randomRecord(s, 12)])];

  it.each(cases)('%s record reads back equal', (_, record) => {
    const file = join(dir, `${record.name.replace(/\W/g, '_')}.design.json`);
    writeDesignFile(file, record);
    expect(readDesignFile(file)).toEqual(record);
  });

  it('numbers sites from 1 and marks trap roles in the file; traps are 0-based in memory', () => {
    const doc = designToJson(smallRecord()) as { sites: { id: number; role: string }[] };
    expect(doc.sites.map((s) => s.id)).toEqual([1, 2, 3]);
    expect(doc.sites.map((s) => s.role)).toEqual(['donor', 'donor', 'trap']);
    expect(designFromJson(doc, 'mem').traps).toEqual([2]);
  });

  it('refuses to write a record with a NaN coordinate, naming the pointer', () => {
    const r = smallRecord();
    const bad = { ...r, sites: [{ ...r.sites[0], position: [Number.NaN, 0, 0] as const }, ...r.sites.slice(1)] };
    expect(() => designToJson(bad)).toThrow(/\/sites\/0\/position\/x: must be number, not NaN/);
    expect(() => writeDesignFile(join(dir, 'nan.json'), bad)).toThrow(DesignFileError);
    expect(readdirSync(dir).some((f) => f.startsWith('.nan'))).toBe(false);
  });

  it('refuses trap indices outside the sites', () => {
    expect(() => designToJson({ ...smallRecord(), traps: [3] })).toThrow(/\/traps\/0: is 3; trap indices are 0-based/);
  });
});

describe('bad design files are InputErrors naming the file, the JSON pointer and the problem', () => {
  const good = () => JSON.parse(formatDesignFile(smallRecord())) as Record<string, any>;
  const edits: [string, (d: Record<string, any>) => void, string, RegExp][] = [
    ['number as a string', (d) => { d.sites[0].energy = '18000'; }, '/sites/0/energy', /must be number, not "18000" \(write numbers without quotes\) \(site 1\)/],
    ['unknown key', (d) => { d.sites[1].colour = 'red'; }, '/sites/1/colour', /is not a known key/],
    ['missing key', (d) => { delete d.sites[1].dipole; }, '/sites/1/dipole', /is required but missing/],
    ['wrong format', (d) => { d.format = 'lumenfold.design/2'; }, '/format', /must be "lumenfold.design\/1"/],
    ['bad role', (d) => { d.sites[0].role = 'acceptor'; }, '/sites/0/role', /must be one of donor, trap/],
    ['ids out of order', (d) => { d.sites[1].id = 5; }, '/sites/1/id', /must be 2/],
    ['no trap', (d) => { d.sites[2].role = 'donor'; }, '/sites', /at least one trap/],
    ['zero direction', (d) => { d.sites[0].direction = { x: 0, y: 0, z: 0 }; }, '/sites/0/direction', /zero vector/],
    ['two dyes on one anchor', (d) => { d.sites[1].anchor.index = 3; }, '/sites/1/anchor/index', /one dye per anchor/],
    ['anchors for some sites only', (d) => { delete d.sites[1].anchor; }, '/sites/1/anchor', /every site or for none/],
    ['negative dipole', (d) => { d.sites[0].dipole = -1; }, '/sites/0/dipole', /must be > 0/],
    ['bad metric name', (d) => { d.metrics['Not Snake'] = 1; }, '/metrics/Not Snake', /not an allowed name/],
    ['line break in the name', (d) => { d.name = 'two\nlines'; }, '/name', /no control characters/],
  ];

  it.each(edits)('%s', (_, edit, path, message) => {
    const doc = good();
    edit(doc);
    const file = join(dir, 'edited.design.json');
    writeFileSync(file, JSON.stringify(doc));
    const err = (() => { try { readDesignFile(file); } catch (e) { return e; } })();
    expect(err).toBeInstanceOf(InputError);
    const issue = (err as DesignFileError).issues.find((i) => i.path === path);
    expect(issue, (err as Error).message).toBeDefined();
    expect(issue!.file).toBe(file);
    expect(issue!.message).toMatch(message);
    expect((err as Error).message).toContain(`${file}: ${path}: `);
  });

  const texts: [string, string | Buffer, RegExp][] = [
    ['__proto__ key', formatDesignFile(smallRecord()).replace('"dipole": 12', '"__proto__": {}, "dipole": 12'), /\/sites\/2\/__proto__: the key "__proto__" is not allowed/],
    ['NaN (not JSON)', '{\n  "energy": NaN\n}', /is not valid JSON: expected a value .* at line 2, column 13, found 'N'/],
    ['a trailing comma', '{ "format": "x", }', /expected a key in double quotes at line 1, column 18, found '}'/],
    ['a key given twice', formatDesignFile(smallRecord()).replace('"dipole": 12', '"dipole": 12, "dipole": 13'), /\/sites\/2\/dipole: the key "dipole" is given twice/],
    ['nesting beyond the limit', `{"metrics": ${'['.repeat(40)}${']'.repeat(40)}}`, /nested more than 32 levels deep/],
    ['a number too large for a double', formatDesignFile(smallRecord()).replace('"energy": 16000', '"energy": 1e999'), /\/sites\/2\/energy: must be number, not Infinity/],
    ['empty file', '', /is empty \(0 bytes\)/],
    ['only white space', '  \n\t\n', /holds only white space/],
    ['binary file', Buffer.from([0x7b, 0x00, 0x01, 0x02, 0x7d]), /is a binary file.*0x00 at offset 1/],
    ['not UTF-8', Buffer.from([0x7b, 0x22, 0xff, 0xfe, 0x22, 0x7d]), /is not UTF-8 text/],
    ['a list, not an object', '[1, 2]', /\(whole file\): must be object, not a list/],
  ];

  it.each(texts)('%s', (_, text, message) => {
    const file = join(dir, 'bad.design.json');
    writeFileSync(file, text);
    expect(() => readDesignFile(file)).toThrow(InputError);
    expect(() => readDesignFile(file)).toThrow(message);
    expect(() => readDesignFile(file)).toThrow(file);
  });

  it('a file above the size limit is refused before it is read', () => {
    const file = join(dir, 'huge.design.json');
    writeFileSync(file, '{');
    truncateSync(file, MAX_DESIGN_FILE_BYTES + 1); // sparse: no real 16 MiB written
    expect(() => readDesignFile(file)).toThrow(new RegExp(`is ${MAX_DESIGN_FILE_BYTES + 1} bytes; design files are limited to ${MAX_DESIGN_FILE_BYTES}`));
  });

  it('a folder or a missing file is an InputError', () => {
    expect(() => readDesignFile(dir)).toThrow(/is not a regular file/);
    expect(() => readDesignFile(join(dir, 'missing.json'))).toThrow(/cannot be read \(ENOENT\)/);
  });

  it('reports every problem of a file at once', () => {
    const doc = good();
    doc.sites[0].energy = '1';
    doc.sites[1].colour = 'red';
    try {
      designFromJson(doc, 'several.json');
      expect.unreachable();
    } catch (e) {
      expect((e as DesignFileError).issues.map((i) => i.path).sort()).toEqual(['/sites/0/energy', '/sites/1/colour']);
    }
  });
});
