/**
 * Snippets come from FTS5 `snippet()`/`highlight()` with two control characters around each hit
 * (db/search.ts). This splits them into plain text parts the page renders as text nodes and <mark>
 * elements — no HTML from the database is ever inserted. Review bodies are Markdown, so the usual
 * Markdown punctuation is dropped from the text first.
 */
export const HIT_OPEN = '\u0002';
export const HIT_CLOSE = '\u0003';

export interface SnippetPart {
  text: string;
  hit: boolean;
}

/** Markdown punctuation a snippet should not show: directives, link targets, emphasis, headings, code fences. */
export function plainSnippetText(text: string): string {
  return text
    .replace(/::spec-table\[[^\]]*\]?/g, ' ')
    .replace(/!?\[([^\]]*)\]\([^)]*\)?/g, '$1')
    .replace(/\]\([^)\s]*\)?/g, ' ')
    .replace(/(\*\*|__|~~|`+)/g, '')
    .replace(/(^|\n)\s{0,3}(#{1,6}|>|[-*+]|\d+\.)\s+/g, '$1')
    .replace(/\|/g, ' ')
    .replace(/\s+/g, ' ')
    .trim();
}

/** Text and hits in order; unbalanced markers (a stray control character in a text) are treated as text boundaries. */
export function snippetParts(marked: string): SnippetPart[] {
  const parts: SnippetPart[] = [];
  let hit = false;
  for (const piece of plainSnippetText(marked).split(/([\u0002\u0003])/)) {
    if (piece === HIT_OPEN) hit = true;
    else if (piece === HIT_CLOSE) hit = false;
    else if (piece) {
      const last = parts.at(-1);
      if (last && last.hit === hit) last.text += piece;
      else parts.push({ text: piece, hit });
    }
  }
  return parts;
}
