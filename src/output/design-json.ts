/**
 * lumenfold.design/1 documents <-> DesignRecord. Pure functions: no files. Both directions check the
 * document against the schema and the rules a schema cannot state, so nothing invalid is read or written.
 */
import type { Site, Vec3 } from '../physics/types.js';
import { DesignFileError, pointerToken, type DesignIssue } from './design-error.js';
import { DESIGN_FORMAT, schemaIssues } from './design-schema.js';
import { siteRoles, type DesignRecord, type Provenance, type SiteAnchor } from './record.js';

/** Keys refused anywhere in a design document: they name JavaScript object internals. */
const FORBIDDEN_KEYS = new Set(['__proto__', 'constructor', 'prototype']);

type Doc = Record<string, unknown>;
type XYZ = { x: number; y: number; z: number };

/** A vector as the file writes it; anything that is not a list is passed on for the schema to name. */
const vec = (v: Vec3): unknown => (Array.isArray(v) ? { x: v[0], y: v[1], z: v[2] } : v);
const tuple = (v: XYZ): Vec3 => [v.x, v.y, v.z];

/** Copy the defined entries only, in the given key order. */
function defined(entries: [string, unknown][]): Doc {
  return Object.fromEntries(entries.filter(([, v]) => v !== undefined));
}

/** Walk the whole document (without recursion, so any depth is safe) for forbidden keys. */
function forbiddenKeyIssues(doc: unknown, file: string): DesignIssue[] {
  const out: DesignIssue[] = [];
  const stack: [unknown, string][] = [[doc, '']];
  while (stack.length > 0) {
    const [node, path] = stack.pop()!;
    if (node === null || typeof node !== 'object') continue;
    for (const [k, v] of Object.entries(node)) {
      const here = `${path}/${pointerToken(k)}`;
      if (FORBIDDEN_KEYS.has(k)) out.push({ file, path: here, message: `the key "${k}" is not allowed (it names a JavaScript object internal)` });
      else stack.push([v, here]);
    }
  }
  return out;
}

/** Rules beyond the schema: ids in order, at least one trap, non-zero directions, anchors for all or none, one dye per anchor. */
function ruleIssues(doc: Doc, file: string): DesignIssue[] {
  const sites = doc.sites as Doc[];
  const out: DesignIssue[] = [];
  const issue = (path: string, message: string) => out.push({ file, path, message });
  const byAnchor = new Map<number, number>();
  sites.forEach((s, i) => {
    if (s.id !== i + 1) issue(`/sites/${i}/id`, `is ${String(s.id)}, but sites are numbered 1, 2, 3, ... in file order: this one must be ${i + 1}`);
    const d = s.direction as XYZ;
    if (d.x === 0 && d.y === 0 && d.z === 0) issue(`/sites/${i}/direction`, `is the zero vector; a transition dipole needs a direction (site ${i + 1})`);
    const a = s.anchor as SiteAnchor | undefined;
    if (a === undefined) return;
    const other = byAnchor.get(a.index);
    if (other !== undefined) issue(`/sites/${i}/anchor/index`, `anchor ${a.index} already carries site ${other + 1}; one dye per anchor (site ${i + 1})`);
    else byAnchor.set(a.index, i);
  });
  if (!sites.some((s) => s.role === 'trap')) issue('/sites', 'no site has the role "trap"; a design needs at least one trap (acceptor)');
  const anchored = sites.filter((s) => s.anchor !== undefined).length;
  if (anchored > 0 && anchored < sites.length) {
    const missing = sites.findIndex((s) => s.anchor === undefined);
    issue(`/sites/${missing}/anchor`, `is missing, but other sites have anchors; give an anchor for every site or for none (site ${missing + 1})`);
  }
  return out;
}

/** Every problem of a parsed design document (empty when it is a valid lumenfold.design/1). */
export function designIssues(doc: unknown, file: string): DesignIssue[] {
  const forbidden = forbiddenKeyIssues(doc, file);
  if (forbidden.length > 0) return forbidden;
  const schema = schemaIssues(doc, file);
  return schema.length > 0 ? schema : ruleIssues(doc as Doc, file);
}

/** Problems of a record that its document cannot show (array lengths, trap indices). */
function recordIssues(r: DesignRecord, file: string): DesignIssue[] {
  if (r === null || typeof r !== 'object' || !Array.isArray(r.sites)) return [{ file, path: '/sites', message: 'a design record needs a list of sites' }];
  const out: DesignIssue[] = [];
  const n = r.sites.length;
  if (!Array.isArray(r.dyes) || r.dyes.length !== n) out.push({ file, path: '/dyes', message: `must give one dye name per site (${n})` });
  if (r.anchors !== undefined && (!Array.isArray(r.anchors) || r.anchors.length !== n)) out.push({ file, path: '/anchors', message: `must give one anchor per site (${n}) or be left out` });
  const seen = new Set<number>();
  (Array.isArray(r.traps) ? r.traps : []).forEach((t, k) => {
    if (!Number.isInteger(t) || t < 0 || t >= n) out.push({ file, path: `/traps/${k}`, message: `is ${t}; trap indices are 0-based site indices below ${n}` });
    else if (seen.has(t)) out.push({ file, path: `/traps/${k}`, message: `lists site index ${t} twice` });
    seen.add(t);
  });
  if (!Array.isArray(r.traps)) out.push({ file, path: '/traps', message: 'must be a list of 0-based site indices' });
  return out;
}

function provenanceDoc(p: Provenance | undefined): Doc | undefined {
  if (p === undefined) return undefined;
  return defined([['run_id', p.runId], ['rank', p.rank], ['seed', p.seed], ['tool_version', p.toolVersion]]);
}

/**
 * A record as a lumenfold.design/1 document (sites numbered from 1). Throws DesignFileError when the record
 * is not valid (for example a NaN coordinate), naming `label` (default: the record's name) and the pointer.
 */
export function designToJson(record: DesignRecord, options: { schemaRef?: string; label?: string } = {}): Doc {
  const file = options.label ?? `design record "${String(record?.name)}"`;
  const bad = recordIssues(record, file);
  if (bad.length > 0) throw new DesignFileError(bad);
  const roles = siteRoles(record);
  const sites = record.sites.map((s, i) => {
    const a = record.anchors?.[i];
    return defined([
      ['id', i + 1], ['dye', record.dyes[i]], ['role', roles[i]],
      ['position', vec(s.position)], ['direction', vec(s.direction)],
      ['dipole', s.dipole], ['energy', s.energy], ['reorganization', s.reorganization], ['lifetime', s.lifetime], ['length', s.length],
      ['label', s.label], ['anchor', a === undefined ? undefined : defined([['index', a.index], ['helix', a.helix], ['step', a.step]])],
    ]);
  });
  const doc = defined([
    ['$schema', options.schemaRef], ['format', DESIGN_FORMAT], ['name', record.name], ['sites', sites],
    ['metrics', record.metrics === undefined ? undefined : { ...record.metrics }], ['score', record.score], ['provenance', provenanceDoc(record.provenance)],
  ]);
  const issues = designIssues(doc, file);
  if (issues.length > 0) throw new DesignFileError(issues);
  return doc;
}

function siteFromDoc(s: Doc): Site {
  return defined([
    ['position', tuple(s.position as XYZ)], ['direction', tuple(s.direction as XYZ)], ['dipole', s.dipole], ['energy', s.energy],
    ['reorganization', s.reorganization], ['lifetime', s.lifetime], ['length', s.length], ['label', s.label],
  ]) as unknown as Site;
}

/** A parsed lumenfold.design/1 document as a record (0-based traps). Throws DesignFileError naming `file`. */
export function designFromJson(obj: unknown, file: string): DesignRecord {
  const issues = designIssues(obj, file);
  if (issues.length > 0) throw new DesignFileError(issues);
  const doc = obj as Doc;
  const sites = doc.sites as Doc[];
  const p = doc.provenance as Doc | undefined;
  return defined([
    ['name', doc.name],
    ['sites', sites.map(siteFromDoc)],
    ['traps', sites.flatMap((s, i) => (s.role === 'trap' ? [i] : []))],
    ['dyes', sites.map((s) => s.dye as string)],
    ['anchors', sites[0].anchor === undefined ? undefined : sites.map((s) => ({ ...(s.anchor as SiteAnchor) }))],
    ['metrics', doc.metrics === undefined ? undefined : { ...(doc.metrics as Record<string, number>) }],
    ['score', doc.score],
    ['provenance', p === undefined ? undefined : defined([['runId', p.run_id], ['rank', p.rank], ['seed', p.seed], ['toolVersion', p.tool_version]])],
  ]) as unknown as DesignRecord;
}
