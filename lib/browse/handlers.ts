import 'server-only';
import { getDb } from '@/db';
import { getGearSummary, listGear, type Caller } from '@/db/browse';
import { getCurrentUser } from '@/lib/auth/guard';
import { apiHandler } from '@/lib/http/api';
import { cachedJson } from '@/lib/http/cache';
import { parseGearItemQuery, parseGearListQuery } from './query';

/*
 * The GET handlers of the public read API, re-exported by the route files (app/api/v1/gear/route.ts,
 * app/api/v1/gear/[slug]/route.ts, app/api/v1/compare/route.ts, app/api/v1/reviews/…). Each parses
 * its query first (400 naming the parameter), reads as the optional caller and answers with the
 * cache headers of lib/http/cache.ts.
 */

type SlugContext = { params: Promise<{ slug: string }> };

async function optionalCaller(): Promise<Caller> {
  const user = await getCurrentUser();
  return user ? { id: user.id, role: user.role } : null;
}

/** `GET /api/v1/gear`: a GearListResponse. */
export const handleGearList = apiHandler(async (request: Request) => {
  const query = parseGearListQuery(new URL(request.url).searchParams);
  const caller = await optionalCaller();
  return cachedJson(request, listGear(getDb(), query, caller), caller !== null);
});

/** `GET /api/v1/gear/{slug}`: a GearSummary; 404 when unknown or not visible to the caller. */
export const handleGearItem = apiHandler(async (request: Request, context: SlugContext) => {
  const { slug } = await context.params;
  const { imperial } = parseGearItemQuery(new URL(request.url).searchParams);
  const caller = await optionalCaller();
  return cachedJson(request, getGearSummary(getDb(), slug, caller, { imperial }), caller !== null);
});
