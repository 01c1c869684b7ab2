import { mkdtempSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { fileURLToPath } from 'node:url';
import { expect } from 'vitest';
import { ConfigError } from '../../src/config/config-error.js';
import { InputError } from '../../src/errors.js';

/** Path of a file in the repository. */
export const repoFile = (path: string) => fileURLToPath(new URL(`../../${path}`, import.meta.url));

/** A fresh folder for test files. */
export function scratch(): (name: string, content: string | Uint8Array) => string {
  const dir = mkdtempSync(join(tmpdir(), 'lumenfold-config-'));
  return (name, content) => {
    const path = join(dir, name);
    writeFileSync(path, content);
    return path;
  };
}

/** Runs fn, expects a ConfigError (an InputError) and returns it. */
export function configError(fn: () => unknown): ConfigError {
  try {
    fn();
  } catch (err) {
    expect(err).toBeInstanceOf(InputError);
    expect(err).toBeInstanceOf(ConfigError);
    return err as ConfigError;
  }
  throw new Error('expected a ConfigError, nothing was thrown');
}

/** A minimal valid constraint set (YAML) with an inline palette; extra lines are appended. */
export const MINIMAL_CONSTRAINTS = `format: lumenfold.constraints/1
palette:
  - {name: DyeA, energy: 18000, dipole: 10, reorganization: 200, lifetime: 1000, length: 1.2}
  - {name: DyeB, energy: 17000, dipole: 12, reorganization: 200, lifetime: 1000, length: 1.2}
dyes:
  count: 3
  traps: [2]
scaffold:
  kind: box
  size: {x: 4, y: 4, z: 4}
`;

/** A minimal valid objective (YAML). */
export const MINIMAL_OBJECTIVE = `format: lumenfold.objective/1
score:
  kind: weighted_sum
  terms:
    - {metric: efficiency, sense: maximize}
model:
  kind: redfield
`;

type Doc = Record<string, unknown>;
const isDoc = (v: unknown): v is Doc => v !== null && typeof v === 'object' && !Array.isArray(v);

/** A copy of base with override merged in: mappings key by key, everything else replaced; undefined deletes. */
export function merged(base: Doc, override: Doc): Doc {
  const out: Doc = { ...base };
  for (const [key, value] of Object.entries(override)) {
    if (value === undefined) delete out[key];
    else out[key] = isDoc(value) && isDoc(base[key]) ? merged(base[key] as Doc, value) : value;
  }
  return out;
}
