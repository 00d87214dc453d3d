/**
 * Full-text search over public text: published reviews (their latest public revision, while it is
 * published) and gear items with an approved version. The FTS5 table `search_index` and the triggers
 * that keep it right live in drizzle/0007_search_index.sql; this is the only module that reads it.
 * Everything indexed is public, so results are the same for every viewer.
 */
import { sql } from 'drizzle-orm';
import type { Db } from './connection';
import { toMatchQuery } from '@/lib/search/query';
import { HIT_CLOSE, HIT_OPEN } from '@/lib/search/snippet';

export type SearchKind = 'review' | 'gear';

export interface SearchHit {
  kind: SearchKind;
  slug: string;
  /** Title with hits between HIT_OPEN and HIT_CLOSE (lib/search/snippet.ts). */
  title: string;
  /** A few words around the best hits, marked the same way. */
  snippet: string;
  /** Gear: the category id; reviews: null. */
  category: string | null;
}

export interface SearchResult {
  /** The MATCH expression used, or null when the query had no words (no search ran). */
  match: string | null;
  hits: SearchHit[];
}

export const SEARCH_LIMIT = 50;

interface Row {
  kind: SearchKind;
  slug: string | null;
  title: string;
  body: string;
  summary: string;
  category: string | null;
}

/** The body's words around a hit, else the summary's, else the body's opening (reviews) or nothing (gear: its summary is only category words). */
function chooseSnippet(row: Row): string {
  if (row.body.includes(HIT_OPEN)) return row.body;
  if (row.kind === 'review' && row.summary.includes(HIT_OPEN)) return row.summary;
  return row.body || (row.kind === 'review' ? row.summary : '');
}

/**
 * Ranked hits for what a reader typed. Any text is accepted: it is reduced to quoted words
 * (lib/search/query.ts), so hostile input finds nothing or finds words, never an FTS5 syntax error.
 * Titles weigh most (bm25 weights 10 : 4 : 1 for title, summary, body).
 */
export function searchPublic(db: Db, raw: unknown, limit = SEARCH_LIMIT): SearchResult {
  const match = toMatchQuery(raw);
  if (!match) return { match: null, hits: [] };
  const rows = db.all<Row>(sql`
    SELECT search_index.kind AS kind,
           coalesce(r.slug, g.slug) AS slug,
           highlight(search_index, 2, ${HIT_OPEN}, ${HIT_CLOSE}) AS title,
           snippet(search_index, 4, ${HIT_OPEN}, ${HIT_CLOSE}, '…', 24) AS body,
           snippet(search_index, 3, ${HIT_OPEN}, ${HIT_CLOSE}, '…', 24) AS summary,
           g.category AS category
    FROM search_index
    LEFT JOIN reviews r ON search_index.kind = 'review' AND r.id = search_index.ref_id
    LEFT JOIN gear_items g ON search_index.kind = 'gear' AND g.id = search_index.ref_id
    WHERE search_index MATCH ${match}
    ORDER BY bm25(search_index, 0.0, 0.0, 10.0, 4.0, 1.0)
    LIMIT ${Math.max(1, Math.min(limit, SEARCH_LIMIT))}
  `);
  return {
    match,
    hits: rows.flatMap((r) => (r.slug === null ? [] : [{ kind: r.kind, slug: r.slug, title: r.title, snippet: chooseSnippet(r), category: r.category }])),
  };
}
