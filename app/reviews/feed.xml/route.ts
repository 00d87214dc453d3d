import { getDb } from '@/db';
import { listPublishedReviews } from '@/db/reviews';
import { atomFeed } from '@/lib/reviews/atom';
import { siteUrl } from '@/lib/reviews/notify';

export const dynamic = 'force-dynamic';

/** Atom feed of published reviews. */
export function GET(): Response {
  const body = atomFeed(listPublishedReviews(getDb(), 50), siteUrl());
  return new Response(body, { headers: { 'Content-Type': 'application/atom+xml; charset=utf-8', 'Cache-Control': 'public, max-age=300' } });
}
