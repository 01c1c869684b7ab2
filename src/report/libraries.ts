/**
 * The browser libraries the report inlines, read from the installed packages at report time (no network,
 * no CDN): Vega, Vega-Lite and vega-embed for the charts, 3Dmol.js for the 3-D view. Each script is
 * preceded by its package's licence text (all four are BSD-3-Clause).
 */
import { existsSync, readFileSync } from 'node:fs';
import { createRequire } from 'node:module';
import { dirname, join } from 'node:path';

export interface InlineLibrary {
  readonly name: string;
  readonly version: string;
  readonly license: string;
  /** The script text, safe inside a <script> element. */
  readonly code: string;
}

/** Packages and their browser builds (UMD: they define the globals vega, vegaLite, vegaEmbed, $3Dmol). */
export const REPORT_LIBRARIES: readonly { readonly name: string; readonly file: string }[] = [
  { name: 'vega', file: 'build/vega.min.js' },
  { name: 'vega-lite', file: 'build/vega-lite.min.js' },
  { name: 'vega-embed', file: 'build/vega-embed.min.js' },
  { name: '3dmol', file: 'build/3Dmol-min.js' },
];

/** The folder of an installed package: up from its resolved entry point to the package.json that names it. */
export function packageFolder(name: string): string {
  let dir = dirname(createRequire(import.meta.url).resolve(name));
  for (;;) {
    const pj = join(dir, 'package.json');
    if (existsSync(pj) && (JSON.parse(readFileSync(pj, 'utf8')) as { name?: string }).name === name) return dir;
    const up = dirname(dir);
    if (up === dir) throw new Error(`cannot find the folder of the installed package ${name}; reinstall lumenfold's dependencies (npm ci)`);
    dir = up;
  }
}

/** Text made safe inside a <script> element: no "</script" and no "<!--" can end or confuse it. */
export function scriptSafe(code: string): string {
  return code.replace(/<\/(script)/gi, '<\\/$1').replace(/<!--/g, '<\\!--');
}

let cache: InlineLibrary[] | undefined;

/** The inlined libraries, read once per process. */
export function reportLibraries(): InlineLibrary[] {
  cache ??= REPORT_LIBRARIES.map(({ name, file }) => {
    const dir = packageFolder(name);
    const pkg = JSON.parse(readFileSync(join(dir, 'package.json'), 'utf8')) as { version: string; license: string };
    const licence = existsSync(join(dir, 'LICENSE')) ? readFileSync(join(dir, 'LICENSE'), 'utf8') : `${pkg.license} licence`;
    const header = `/* ${name} ${pkg.version}, inlined by lumenfold.\n${licence.replace(/\*\//g, '* /')}\n*/\n`;
    return { name, version: pkg.version, license: pkg.license, code: scriptSafe(header + readFileSync(join(dir, file), 'utf8')) };
  });
  return cache;
}
