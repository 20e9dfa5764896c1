/**
 * Small helpers to write SVG text safely: every attribute value and every
 * text node goes through {@link escapeXml}, numbers are printed with at most
 * two decimals so output is stable (golden files).
 */

/** Escapes the five XML special characters (& < > " ') for text and attribute values. */
export function escapeXml(text: string): string {
  return text.replace(/[&<>"']/g, (c) => ({ '&': '&amp;', '<': '&lt;', '>': '&gt;', '"': '&quot;', "'": '&apos;' })[c]!)
    // Characters XML 1.0 forbids (C0 controls other than tab, LF, CR) are dropped.
    // eslint-disable-next-line no-control-regex
    .replace(/[\u0000-\u0008\u000b\u000c\u000e-\u001f\ufffe\uffff]/g, '');
}

/** A number for SVG output: at most 2 decimals, no trailing zeros. */
export function num(n: number): string {
  const r = Math.round(n * 100) / 100;
  return Object.is(r, -0) ? '0' : String(r);
}

/** Attribute values: strings are escaped, numbers formatted, null/undefined/false left out. */
export type Attrs = Record<string, string | number | null | undefined | false>;

function attrText(attrs: Attrs): string {
  let s = '';
  for (const [k, v] of Object.entries(attrs)) {
    if (v === null || v === undefined || v === false) continue;
    s += ` ${k}="${typeof v === 'number' ? num(v) : escapeXml(v)}"`;
  }
  return s;
}

/** An element: self-closing without children. `children` are already-serialised SVG. */
export function el(name: string, attrs: Attrs, children?: string | readonly string[]): string {
  const inner = children === undefined ? '' : typeof children === 'string' ? children : children.join('');
  return inner === '' && children === undefined ? `<${name}${attrText(attrs)}/>` : `<${name}${attrText(attrs)}>${inner}</${name}>`;
}

/** A text element with escaped content. */
export function text(attrs: Attrs, content: string): string {
  return el('text', attrs, escapeXml(content));
}

/** The outer <svg> element with the SVG namespace. */
export function svgDocument(width: number, height: number, title: string, body: readonly string[]): string {
  return `<svg xmlns="http://www.w3.org/2000/svg" width="${num(width)}" height="${num(height)}" viewBox="0 0 ${num(width)} ${num(height)}" font-family="Inter, Helvetica, Arial, sans-serif">\n`
    + `<title>${escapeXml(title)}</title>\n${body.join('\n')}\n</svg>\n`;
}
