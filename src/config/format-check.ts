import { FORMATS, type ConfigKind } from './schemas.js';

const KIND_OF_FORMAT = new Map<string, ConfigKind>(
  (Object.entries(FORMATS) as [ConfigKind, string][]).map(([kind, format]) => [format, kind]),
);

const WORDS: Record<ConfigKind, string> = {
  constraints: 'a constraint set',
  objective: 'an objective recipe',
  sweep: 'a sweep',
  palette: 'a dye palette',
};

/**
 * Reads the `format` key: which kind of file this is. With `expected`, a file of another kind or
 * version is an error. Returns the kind, or a problem at /format (or at the top level).
 */
export function checkFormat(
  value: unknown,
  expected?: ConfigKind,
): { kind: ConfigKind } | { path: string; message: string } {
  const wanted = expected === undefined ? 'one of ' + Object.values(FORMATS).join(', ') : `"${FORMATS[expected]}"`;
  if (value === null || typeof value !== 'object' || Array.isArray(value)) {
    return { path: '', message: `must be a mapping with a format key (${wanted}).` };
  }
  const format = (value as Record<string, unknown>).format;
  if (format === undefined) return { path: '/format', message: `is required: the file's format, ${wanted}.` };
  if (typeof format !== 'string') return { path: '/format', message: `must be a string, ${wanted}.` };
  const kind = KIND_OF_FORMAT.get(format);
  if (kind !== undefined && (expected === undefined || kind === expected)) return { kind };
  if (kind !== undefined && expected !== undefined) {
    return { path: '/format', message: `says this is ${WORDS[kind]} (${format}), but ${WORDS[expected]} (${FORMATS[expected]}) is expected here.` };
  }
  const family = /^(lumenfold\.[a-z]+)\/(.+)$/.exec(format);
  const known = family && Object.values(FORMATS).find((f) => f.startsWith(`${family[1]}/`));
  if (family && known) {
    return { path: '/format', message: `is ${format}: version ${family[2]} is not supported; this lumenfold reads ${known}.` };
  }
  return { path: '/format', message: `is "${format}", which is not a lumenfold format; expected ${wanted}.` };
}
