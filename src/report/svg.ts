/** Small helpers for writing SVG and HTML text by hand: escaping, number formatting, elements. */

/** Text safe inside XML/HTML element content and attribute values. */
export function esc(text: string | number): string {
  return String(text).replace(/[&<>"']/g, (c) => ({ '&': '&amp;', '<': '&lt;', '>': '&gt;', '"': '&quot;', "'": '&#39;' })[c]!);
}

/** A coordinate in px with at most two decimals (no "-0"). */
export function px(x: number): string {
  const r = Math.round(x * 100) / 100;
  return String(Object.is(r, -0) ? 0 : r);
}

export type Attrs = Record<string, string | number | undefined>;

function attrText(attrs: Attrs): string {
  return Object.entries(attrs)
    .filter(([, v]) => v !== undefined)
    .map(([k, v]) => ` ${k}="${esc(typeof v === 'number' ? px(v) : v!)}"`)
    .join('');
}

/** An element; children are already-written markup (use esc() for text). */
export function el(tag: string, attrs: Attrs, children?: string | readonly string[]): string {
  const inner = Array.isArray(children) ? children.join('') : (children ?? '');
  return inner === '' && children === undefined ? `<${tag}${attrText(attrs)}/>` : `<${tag}${attrText(attrs)}>${inner}</${tag}>`;
}

/** A text element. */
export function text(x: number, y: number, content: string, attrs: Attrs = {}): string {
  return el('text', { x, y, ...attrs }, esc(content));
}

/** A whole standalone SVG document with a title and a description (read by screen readers and viewers). */
export function svgDocument(width: number, height: number, title: string, description: string, body: readonly string[]): string {
  return [
    `<svg xmlns="http://www.w3.org/2000/svg" width="${width}" height="${height}" viewBox="0 0 ${width} ${height}" font-family="Helvetica, Arial, sans-serif" font-size="12">`,
    `<title>${esc(title)}</title>`,
    `<desc>${esc(description)}</desc>`,
    el('rect', { x: 0, y: 0, width, height, fill: '#ffffff' }),
    ...body,
    '</svg>',
    '',
  ].join('\n');
}

/** A number for a label: an integer when it is one, else `digits` significant figures. */
export function label(x: number, digits = 4): string {
  if (Number.isInteger(x)) return String(x);
  return String(Number(x.toPrecision(digits)));
}
