import { revalidateTag } from 'next/cache';

/**
 * Cache tags of the public review pages (db/reviews-cache.ts). Every cached read carries REVIEWS_TAG
 * and, for one review, its own tag; a publish, retraction or correction expires both.
 */
export const REVIEWS_TAG = 'reviews';
export const reviewTag = (slug: string) => `review:${slug}`;

/**
 * Expires the tags at once (`{ expire: 0 }`: the next request reads the database; the `'max'` profile
 * would serve the old page once more while refreshing in the background — wrong for a retraction).
 * Works from server actions and route handlers. Outside a Next request (tests, scripts, the seed)
 * there is no Next cache to expire, so the "store missing" invariant is expected and ignored.
 */
export function expireReviewTags(slug: string): void {
  for (const tag of [REVIEWS_TAG, reviewTag(slug)]) {
    try {
      revalidateTag(tag, { expire: 0 });
    } catch (error) {
      if (error instanceof Error && error.message.includes('static generation store missing')) continue;
      throw error;
    }
  }
}
