/**
 * JSON text as people read it: two-space indentation, with any list or object that fits on one line of
 * `width` characters written on one line (vectors, anchors, short metric tables).
 */
export function prettyJson(value: unknown, width = 100): string {
  return print(value, '', width) + '\n';
}

function inline(value: unknown): string {
  if (Array.isArray(value)) return `[${value.map(inline).join(', ')}]`;
  if (value !== null && typeof value === 'object') {
    if (Object.keys(value).length === 0) return '{}';
    return `{ ${Object.entries(value).map(([k, v]) => `${JSON.stringify(k)}: ${inline(v)}`).join(', ')} }`;
  }
  return JSON.stringify(value);
}

function print(value: unknown, indent: string, width: number): string {
  if (value === null || typeof value !== 'object') return JSON.stringify(value);
  const one = inline(value);
  if (indent.length + one.length <= width) return one;
  const inner = indent + '  ';
  if (Array.isArray(value)) {
    return `[\n${value.map((v) => inner + print(v, inner, width)).join(',\n')}\n${indent}]`;
  }
  const members = Object.entries(value).map(([k, v]) => `${inner}${JSON.stringify(k)}: ${print(v, inner, width)}`);
  return `{\n${members.join(',\n')}\n${indent}}`;
}
