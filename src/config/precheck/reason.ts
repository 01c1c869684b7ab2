/** One reason why a constraint set and objective cannot be satisfied by any design. */
export interface PrecheckReason {
  /** Which document the reason is about. */
  in: 'constraints' | 'objective';
  /** JSON pointer of the main field involved. */
  path: string;
  /** A plain sentence naming the fields involved. */
  message: string;
}

/** A field as a sentence names it: /fixed/0/anchor becomes fixed[0].anchor. */
export function fieldName(pointer: string): string {
  return pointer
    .slice(1)
    .split('/')
    .map((key, i) => (/^\d+$/.test(key) ? `[${key}]` : i === 0 ? key : `.${key}`))
    .join('');
}
