import 'server-only';
import { statSync } from 'node:fs';
import path from 'node:path';
import { unstable_cache } from 'next/cache';
import { getDb } from './index';
import { getReviewPage, listPublicReviewSlugs, listPublishedReviews, type PublishedReviewRow, type ReviewPageData } from './reviews';
import { REVIEWS_TAG, reviewTag } from './reviews-cache-tags';
import { AppError } from '@/lib/http/errors';

/**
 * Cached public reads of reviews (issue 6: "/reviews and /reviews/[slug] rendered on demand and
 * cached, revalidated by tag on publish, retract and correction"). Pages stay dynamic — the header and
 * the author's links depend on the viewer — but the review data every reader sees comes from Next's
 * data cache (`unstable_cache`; the app does not turn on Cache Components, which `'use cache'` needs
 * and which clashes with the `dynamic = 'force-dynamic'` segments used across the app).
 *
 * - Only public data is cached: reads run as an anonymous viewer. Authors and editors of a review get
 *   the uncached read (db/reviews.ts), which adds their drafts and links.
 * - Entries are only made for slugs and revision numbers that exist publicly (a cached list), so
 *   made-up URLs cannot fill the cache.
 * - db/reviews.ts `transitionReview` expires the tags on publish, retract and start of a correction
 *   (db/reviews-cache-tags.ts). Things tags do not cover (an item approved later, an author renamed)
 *   refresh within REVALIDATE_SECONDS.
 * - Next's data cache also lives on disk (.next/cache) across restarts, so keys carry the database
 *   file's identity: a fresh or restored database never meets entries written for another one.
 * - The cache stores JSON: dates are revived below.
 */
export const REVALIDATE_SECONDS = 300;

let databaseKey: string | undefined;
function databaseIdentity(): string {
  if (databaseKey === undefined) {
    const file = path.resolve(process.env.DATABASE_PATH ?? './data/trailbench.db');
    try {
      const st = statSync(file);
      databaseKey = `${file}:${st.ino}:${Math.round(st.birthtimeMs || st.ctimeMs)}`;
    } catch {
      databaseKey = file;
    }
  }
  return databaseKey;
}

const DATE_KEYS = new Set(['createdAt', 'updatedAt', 'publishedAt', 'firstPublishedAt', 'at']);

/** Turns the ISO strings JSON made of Date fields back into Dates (only under known date keys). */
export function reviveDates<T>(value: T): T {
  if (Array.isArray(value)) return value.map(reviveDates) as T;
  // A cache miss hands back the function's own result, Dates and all.
  if (value instanceof Date) return value;
  if (value && typeof value === 'object') {
    const out: Record<string, unknown> = {};
    for (const [k, v] of Object.entries(value)) out[k] = DATE_KEYS.has(k) && typeof v === 'string' ? new Date(v) : reviveDates(v);
    return out as T;
  }
  return value;
}

const publicSlugs = () =>
  unstable_cache(async () => listPublicReviewSlugs(getDb()), ['review-public-slugs', databaseIdentity()], { tags: [REVIEWS_TAG], revalidate: REVALIDATE_SECONDS })();

const publishedList = () => unstable_cache(async () => listPublishedReviews(getDb()), ['review-list', databaseIdentity()], { tags: [REVIEWS_TAG], revalidate: REVALIDATE_SECONDS })();

function publicPage(slug: string, revisionNumber: number | null) {
  return unstable_cache(
    async (s: string, n: number | null) => {
      try {
        return getReviewPage(getDb(), s, null, n ?? undefined);
      } catch (e) {
        if (e instanceof AppError && e.code === 'not_found') return null;
        throw e;
      }
    },
    ['review-page', databaseIdentity()],
    { tags: [REVIEWS_TAG, reviewTag(slug)], revalidate: REVALIDATE_SECONDS },
  )(slug, revisionNumber);
}

/** Published reviews for /reviews (and the feed), newest first. */
export async function cachedPublishedReviews(): Promise<PublishedReviewRow[]> {
  return reviveDates(await publishedList());
}

/**
 * The public page of a review as an anonymous reader sees it, or null when there is no such public
 * review or revision (the caller then does the uncached read, which decides between 404 and a
 * preview for the author and editors).
 */
export async function cachedPublicReviewPage(slug: string, revisionNumber?: number): Promise<ReviewPageData | null> {
  const slugs = await publicSlugs();
  const known = Object.hasOwn(slugs, slug) ? slugs[slug] : undefined;
  if (!Array.isArray(known) || (revisionNumber !== undefined && !known.includes(revisionNumber))) return null;
  const page = await publicPage(slug, revisionNumber ?? null);
  return page ? reviveDates(page) : null;
}
