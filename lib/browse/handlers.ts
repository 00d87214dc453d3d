import 'server-only';
import { getDb } from '@/db';
import { findReadableGear, getGearSummary, listGear, type Caller } from '@/db/browse';
import { compareGear } from '@/db/compare';
import { getReviewPage, listPublishedReviews } from '@/db/reviews';
import { optionalApiCaller } from '@/lib/auth/api-caller';
import { apiHandler } from '@/lib/http/api';
import { cachedJson } from '@/lib/http/cache';
import { parseCompareQuery, parseGearItemQuery, parseGearListQuery, parseReviewItemQuery, parseReviewListQuery } from './query';
import { pageReviews, reviewDetail } from './reviews';

/*
 * The GET handlers of the public read API, re-exported by the route files (app/api/v1/gear/route.ts,
 * app/api/v1/gear/[slug]/route.ts, app/api/v1/compare/route.ts, app/api/v1/reviews/…). Each reads as
 * the optional caller (401 for a bad token), checks the target exists for them (404), parses its query
 * (400 naming the parameter) — the status table order — and answers with lib/http/cache.ts headers.
 */

type SlugContext = { params: Promise<{ slug: string }> };

/** A session or `Authorization: Bearer` token (a bad token is a 401, never a silent guest). */
async function optionalCaller(request: Request): Promise<Caller> {
  const caller = await optionalApiCaller(request);
  return caller ? { id: caller.id, role: caller.role } : null;
}

/** `GET /api/v1/gear`: a GearListResponse. */
export const handleGearList = apiHandler(async (request: Request) => {
  const caller = await optionalCaller(request);
  const query = parseGearListQuery(new URL(request.url).searchParams);
  return cachedJson(request, listGear(getDb(), query, caller), caller !== null);
});

/** `GET /api/v1/gear/{slug}`: a GearSummary; 404 when unknown or not visible to the caller. */
export const handleGearItem = apiHandler(async (request: Request, context: SlugContext) => {
  const { slug } = await context.params;
  const caller = await optionalCaller(request);
  findReadableGear(getDb(), [slug], caller); // 404 before 400 (status table order)
  const { imperial } = parseGearItemQuery(new URL(request.url).searchParams);
  return cachedJson(request, getGearSummary(getDb(), slug, caller, { imperial }), caller !== null);
});

/** `GET /api/v1/compare?items=a,b,c`: a CompareResponse; 404 when an item is unknown or not visible. */
export const handleCompare = apiHandler(async (request: Request) => {
  const caller = await optionalCaller(request);
  const query = parseCompareQuery(new URL(request.url).searchParams);
  return cachedJson(request, compareGear(getDb(), query.items, caller, { imperial: query.imperial }), caller !== null);
});

/** `GET /api/v1/reviews`: published reviews, newest first (ReviewListResponse). */
export const handleReviewList = apiHandler(async (request: Request) => {
  const caller = await optionalCaller(request);
  const query = parseReviewListQuery(new URL(request.url).searchParams);
  return cachedJson(request, pageReviews(listPublishedReviews(getDb(), Number.MAX_SAFE_INTEGER), query), caller !== null);
});

/** `GET /api/v1/reviews/{slug}`: the public revision of a review (drafts never, whoever asks); 404 otherwise. */
export const handleReview = apiHandler(async (request: Request, context: SlugContext) => {
  const { slug } = await context.params;
  const caller = await optionalCaller(request);
  const review = reviewDetail(getReviewPage(getDb(), slug, null)); // 404 before 400 (status table order)
  parseReviewItemQuery(new URL(request.url).searchParams);
  return cachedJson(request, review, caller !== null);
});
