import { createHash } from 'node:crypto';
import { createRequire } from 'node:module';

const require = createRequire(import.meta.url);

/**
 * sha256 of ajv's version, the options and the [name, schema] pairs in the order given (each schema as
 * parsed JSON, so white space does not count): the hash that tools/build-validators.mjs stores in each
 * precompiled validator module, which is used only while the hash of the shipped schemas is the same.
 */
export function validatorHash(options: object, schemas: readonly (readonly [string, unknown])[]): string {
  const hash = createHash('sha256');
  hash.update(`ajv ${(require('ajv/package.json') as { version: string }).version}\n${JSON.stringify(options)}\n`);
  for (const [name, schema] of schemas) hash.update(`${name}\n${JSON.stringify(schema)}\n`);
  return hash.digest('hex');
}
