/**
 * The public review reads of the API: rows of db/reviews.ts mapped to the API shapes, and keyset
 * paging over the list (newest update first, ties by slug). Pure apart from cursor decoding.
 */
import type { PublishedReviewRow, ReviewPageData } from '@/db/reviews';
import { gearPath } from '@/lib/gear/paths';
import { AppError } from '@/lib/http/errors';
import type { ReviewDetail, ReviewListResponse, ReviewSummary } from './contract';
import { decodeCursor, encodeCursor, reviewCursorSchema } from './cursor';
import type { ReviewListQuery } from './query';

export function reviewPath(slug: string): string {
  return `/reviews/${encodeURIComponent(slug)}`;
}

const iso = (date: Date | null) => (date ? date.toISOString() : null);

export function reviewSummary(row: PublishedReviewRow): ReviewSummary {
  return {
    slug: row.slug,
    title: row.title,
    summary: row.summary,
    verdict: row.verdict,
    author: row.authorName,
    disclosure: row.disclosure,
    firstPublishedAt: iso(row.firstPublishedAt),
    updatedAt: iso(row.updatedAt),
    revision: row.revisionNumber,
    path: reviewPath(row.slug),
    items: row.items.map((i) => ({ ...i, path: gearPath(i.slug) })),
  };
}

const timeOf = (row: PublishedReviewRow) => row.updatedAt?.getTime() ?? 0;

/** Newest update first, then slug: a total order, so the cursor (time, slug) is exact. */
function compareRows(a: PublishedReviewRow, b: PublishedReviewRow): number {
  return timeOf(b) - timeOf(a) || (a.slug < b.slug ? -1 : a.slug > b.slug ? 1 : 0);
}

/** One page of published reviews (optionally those covering one gear item). */
export function pageReviews(rows: readonly PublishedReviewRow[], query: ReviewListQuery): ReviewListResponse {
  const matching = rows.filter((r) => !query.gear || r.items.some((i) => i.slug === query.gear)).sort(compareRows);
  let start = 0;
  if (query.cursor) {
    const { t, s } = decodeCursor(query.cursor, reviewCursorSchema);
    start = matching.findIndex((r) => timeOf(r) < t || (timeOf(r) === t && r.slug > s));
    if (start === -1) start = matching.length;
  }
  const page = matching.slice(start, start + query.limit);
  const last = page.at(-1);
  const more = start + query.limit < matching.length;
  return {
    items: page.map(reviewSummary),
    nextCursor: more && last ? encodeCursor({ t: timeOf(last), s: last.slug }) : null,
    total: matching.length,
  };
}

/** The public revision of a review page (db/reviews.ts getReviewPage read as a guest). */
export function reviewDetail(page: ReviewPageData): ReviewDetail {
  const rev = page.revision;
  if (rev.state !== 'published' && rev.state !== 'retracted') throw new AppError('not_found', 'No review here, or you may not see it.');
  return {
    slug: page.review.slug,
    title: rev.title,
    summary: rev.summary,
    verdict: rev.verdict,
    author: page.authorName,
    disclosure: rev.disclosure,
    firstPublishedAt: iso(page.firstPublishedAt),
    updatedAt: iso(rev.publishedAt),
    revision: rev.number,
    path: reviewPath(page.review.slug),
    items: page.items.filter((i) => i.isPublic).map((i) => ({ slug: i.slug, name: i.name, path: gearPath(i.slug) })),
    state: rev.state,
    body: rev.body,
    disclosureNote: rev.disclosureNote,
    correctionNote: rev.correctionNote,
    retraction: page.retraction ? { note: page.retraction.note, at: page.retraction.at.toISOString() } : null,
    history: page.history.map((h) => ({ number: h.number, state: h.state, publishedAt: iso(h.publishedAt), correctionNote: h.correctionNote })),
  };
}
