/**
 * Splits sanitized review HTML at the spec-table placeholders (`<div data-spec-table="a,b"></div>`,
 * made by lib/markdown/plugins.ts and allowed by its schema) so a page can render each table as a React
 * component between the HTML chunks. Only placeholders at the top level of the document are used:
 * one nested in a list or quote would cut an element in two, so it stays an empty div.
 * Pure and browser-safe (the live preview uses it too).
 */
export type HtmlPart = { type: 'html'; html: string } | { type: 'spec-table'; slugs: string[] };

const PLACEHOLDER = /<div data-spec-table="([a-z0-9,-]+)"><\/div>/g;
const TAG = /<(\/?)([a-zA-Z][a-zA-Z0-9]*)\b[^>]*?(\/?)>/g;
const VOID = new Set(['area', 'base', 'br', 'col', 'embed', 'hr', 'img', 'input', 'link', 'meta', 'source', 'track', 'wbr']);

function depthChange(html: string): number {
  let depth = 0;
  for (const m of html.matchAll(TAG)) {
    const [, closing, name, selfClosing] = m;
    if (VOID.has(name!.toLowerCase()) || selfClosing) continue;
    depth += closing ? -1 : 1;
  }
  return depth;
}

export function splitAtSpecTables(html: string): HtmlPart[] {
  const parts: HtmlPart[] = [];
  let last = 0;
  let depth = 0;
  for (const m of html.matchAll(PLACEHOLDER)) {
    const start = m.index;
    depth += depthChange(html.slice(last, start));
    if (depth !== 0) {
      // Nested: keep it inside the surrounding chunk.
      depth -= depthChange(html.slice(last, start));
      continue;
    }
    if (start > last) parts.push({ type: 'html', html: html.slice(last, start) });
    parts.push({ type: 'spec-table', slugs: m[1]!.split(',').filter(Boolean) });
    last = start + m[0].length;
  }
  if (last < html.length) parts.push({ type: 'html', html: html.slice(last) });
  return parts;
}
