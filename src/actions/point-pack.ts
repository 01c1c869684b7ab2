/**
 * Decoded design points in a form that crosses to a worker thread cheaply. Structured cloning of plain records
 * costs about 11 us per point of the demo (a record of some thirty keys): 0.2 ms per batch of 16 on each side,
 * against about 10 us for the same values in one Float64Array and a short list of strings. A batch's points
 * share their keys (one design space), so the keys are sent once per batch and each point's values are laid
 * out in key order: numbers and number arrays in `numbers` (bit for bit: -0 and NaN survive), strings in
 * `strings`, shapes (which key holds what, array lengths) in `shape`. Points of another form (other keys, or
 * values that are neither numbers, strings nor arrays of numbers) are sent as records.
 */
export type PackedPoints =
  | { keys: string[]; shape: Int32Array; numbers: Float64Array; strings: string[]; count: number }
  | { records: Record<string, unknown>[] };

/** shape code of a key: a number, a string, or an array of numbers (code ARRAY + length) */
const NUMBER = -1, STRING = -2, ARRAY = 0;

function shapeOf(v: unknown): number | undefined {
  if (typeof v === 'number') return NUMBER;
  if (typeof v === 'string') return STRING;
  if (Array.isArray(v) && v.every((x) => typeof x === 'number')) return ARRAY + v.length;
  return undefined;
}

export function packPoints(points: Record<string, unknown>[]): PackedPoints {
  if (points.length === 0) return { records: points };
  const keys = Object.keys(points[0]);
  const shape = new Int32Array(keys.length);
  let width = 0;
  for (let k = 0; k < keys.length; k++) {
    const s = shapeOf(points[0][keys[k]]);
    if (s === undefined) return { records: points };
    shape[k] = s;
    if (s >= ARRAY) width += s - ARRAY;
    else if (s === NUMBER) width++;
  }
  const numbers = new Float64Array(width * points.length);
  const strings: string[] = [];
  let at = 0;
  for (const p of points) {
    const own = Object.keys(p);
    if (own.length !== keys.length) return { records: points };
    for (let k = 0; k < keys.length; k++) {
      if (own[k] !== keys[k]) return { records: points };
      const v = p[keys[k]], s = shape[k];
      if (s === NUMBER) {
        if (typeof v !== 'number') return { records: points };
        numbers[at++] = v;
      } else if (s === STRING) {
        if (typeof v !== 'string') return { records: points };
        strings.push(v);
      } else {
        if (shapeOf(v) !== s) return { records: points };
        for (const x of v as number[]) numbers[at++] = x;
      }
    }
  }
  return { keys, shape, numbers, strings, count: points.length };
}

export function unpackPoints(m: PackedPoints): Record<string, unknown>[] {
  if ('records' in m) return m.records;
  const { keys, shape, numbers, strings, count } = m;
  const out: Record<string, unknown>[] = new Array(count);
  let at = 0, si = 0;
  for (let j = 0; j < count; j++) {
    const p: Record<string, unknown> = {};
    for (let k = 0; k < keys.length; k++) {
      const s = shape[k];
      if (s === NUMBER) p[keys[k]] = numbers[at++];
      else if (s === STRING) p[keys[k]] = strings[si++];
      else {
        const a = new Array<number>(s - ARRAY);
        for (let i = 0; i < a.length; i++) a[i] = numbers[at++];
        p[keys[k]] = a;
      }
    }
    out[j] = p;
  }
  return out;
}
