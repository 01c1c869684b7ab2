/**
 * A cheap scan, before parsing, for the nesting depth of flow collections ([...] and {...}). YAML and
 * JSON parsers recurse per level, so a file of a million brackets would be slow or overflow the stack;
 * this scan finds it in one pass. Quoted strings and YAML comments are skipped. Returns the offset of
 * the first bracket deeper than maxDepth, or -1.
 */
export function findDeepFlow(text: string, maxDepth: number): number {
  let depth = 0;
  let quote = '';
  for (let i = 0; i < text.length; i++) {
    const c = text[i];
    if (quote !== '') {
      if (quote === '"' && c === '\\') i++;
      else if (c === quote) quote = '';
      continue;
    }
    if (c === '"' || c === "'") {
      quote = c;
    } else if (c === '#' && (i === 0 || /\s/.test(text[i - 1]))) {
      const end = text.indexOf('\n', i);
      if (end < 0) break;
      i = end;
    } else if (c === '[' || c === '{') {
      depth++;
      if (depth > maxDepth) return i;
    } else if (c === ']' || c === '}') {
      depth = Math.max(0, depth - 1);
    }
  }
  return -1;
}
