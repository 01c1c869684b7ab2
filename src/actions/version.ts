import { createRequire } from 'node:module';

const require = createRequire(import.meta.url);
/** The package version, from package.json. */
export const VERSION: string = (require('../../package.json') as { version: string }).version;
