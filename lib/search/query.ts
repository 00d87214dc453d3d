/**
 * Turns what a reader typed into an FTS5 MATCH expression that can never be read as FTS5 syntax.
 * Only runs of letters and digits survive, each becomes a double-quoted string (so AND, OR, NOT,
 * NEAR, parentheses, column filters, `^` and stray quotes are plain words or gone), all must match,
 * and the last one also matches as a prefix — the reader may still be typing it ("lant" finds
 * "lantern"). The porter tokenizer stems each word, so "lanterns" finds "lantern" too.
 */
export const MAX_QUERY_CHARS = 200;
export const MAX_QUERY_TERMS = 8;
const MAX_TERM_CHARS = 40;

/** The words of a query, lower-cased, at most MAX_QUERY_TERMS, each at most 40 characters. */
export function queryTerms(raw: unknown): string[] {
  if (typeof raw !== 'string') return [];
  const words = raw.slice(0, MAX_QUERY_CHARS).normalize('NFKC').toLowerCase().match(/[\p{L}\p{N}]+/gu) ?? [];
  return words.slice(0, MAX_QUERY_TERMS).map((w) => w.slice(0, MAX_TERM_CHARS));
}

/** The MATCH expression, or null when nothing searchable is left (the page then shows no results). */
export function toMatchQuery(raw: unknown): string | null {
  const terms = queryTerms(raw);
  if (terms.length === 0) return null;
  return terms.map((t, i) => (i === terms.length - 1 ? `"${t}"*` : `"${t}"`)).join(' ');
}
