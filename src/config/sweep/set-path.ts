import { pointerToken } from '../config-error.js';
import { FORBIDDEN_KEYS } from '../limits.js';

/** JSON pointer of a dotted sweep path inside its document: objective.model.temperature becomes /model/temperature. */
export function pathPointer(path: string): string {
  return path
    .split('.')
    .slice(1)
    .map((key) => `/${pointerToken(key)}`)
    .join('');
}

/**
 * Sets the value at a dotted path (its first key, constraints or objective, names the document) in
 * place. The parent of the last key must exist; list items are named by index. Returns a problem, or
 * undefined when the value was set.
 */
export function setPath(doc: Record<string, unknown>, path: string, value: unknown): string | undefined {
  const keys = path.split('.').slice(1);
  let node: unknown = doc;
  for (const [i, key] of keys.entries()) {
    const last = i === keys.length - 1;
    const where = keys.slice(0, i).join('.') || 'the top level';
    if (FORBIDDEN_KEYS.has(key)) return `"${key}" is a reserved name (a JavaScript object internal), not a field.`;
    if (Array.isArray(node)) {
      const index = /^\d+$/.test(key) ? Number(key) : -1;
      if (index < 0 || index >= node.length) return `${where} is a list of ${node.length} items; "${key}" is not one of its indices.`;
      if (last) node[index] = value;
      else node = node[index];
    } else if (node !== null && typeof node === 'object') {
      const map = node as Record<string, unknown>;
      if (last) map[key] = value;
      else if (!Object.hasOwn(map, key)) return `${keys.slice(0, i + 1).join('.')} does not exist in the base document.`;
      else node = map[key];
    } else {
      return `${where} is a single value, so it has no "${key}".`;
    }
  }
  return undefined;
}
