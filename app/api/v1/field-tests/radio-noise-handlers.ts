import 'server-only';
import { NextResponse } from 'next/server';
import type { Db } from '@/db/connection';
import type { Actor } from '@/db/gear';
import { findEditableFieldTest, findVisibleFieldTest, isPublicFieldTest } from '@/db/field-tests-access';
import { getTestRadioNoise, saveRadioNoiseReadings, type TestRadioNoise } from '@/db/radio-noise';
import { apiHandler, readJson } from '@/lib/http/api';
import { AppError } from '@/lib/http/errors';
import { RADIO_QUIET_WORDING } from '@/lib/measure';

/*
 * Band readings of a radio-noise check (db/radio-noise.ts) without Next's request context: the route file
 * resolves the caller and calls these; integration tests call them with a user and a Request.
 */

const NO_STORE = { 'Cache-Control': 'no-store' };

/** The readings and summaries as the API sends them (items by slug, dates as ISO text). */
export function radioNoiseBody(data: TestRadioNoise) {
  const slugOf = (itemId: string) => data.readings.find((r) => r.item.id === itemId)?.item.slug ?? '';
  return {
    readings: data.readings.map((r) => ({
      item: r.item.slug,
      band: r.band,
      frequencyMHz: r.frequencyMHz,
      range: r.range,
      mode: r.mode,
      bandwidthHz: r.bandwidthHz,
      antenna: r.antenna,
      distanceM: r.distanceM,
      baseline: r.baseline,
      withItem: r.withItem,
      baselineDbm: r.baselineDbm,
      withItemDbm: r.withItemDbm,
      riseDb: r.riseDb,
      verdict: r.verdict,
    })),
    summaries: data.summaries.map((s) => ({ item: slugOf(s.itemId), ...s.summary })),
    verdictWording: RADIO_QUIET_WORDING,
  };
}

/** GET /api/v1/field-tests/{id}/radio-noise — band readings, dBm, rise and verdict, and the radio-quiet summary per item. */
export const handleGetRadioNoise = apiHandler(async (db: Db, user: Actor | null, id: string) => {
  const { test, items } = findVisibleFieldTest(db, id, user);
  const body = radioNoiseBody(getTestRadioNoise(db, test.id, user));
  return NextResponse.json({ radioNoise: body }, { headers: isPublicFieldTest(test, items) && !user ? { 'Cache-Control': 'no-cache' } : { 'Cache-Control': 'private, no-store' } });
});

/** PUT /api/v1/field-tests/{id}/radio-noise — JSON `radioNoiseReadingsInputSchema`: replaces every band reading of the author's draft. */
export const handlePutRadioNoise = apiHandler(async (db: Db, user: Actor | null, id: string, request: Request) => {
  if (!user) throw new AppError('unauthenticated', 'Sign in to do this.');
  findEditableFieldTest(db, id, user); // 404 / 403 / 409 before reading the body
  const body = await readJson(request);
  const saved = saveRadioNoiseReadings(db, user, id, body);
  return NextResponse.json({ radioNoise: radioNoiseBody(saved) }, { headers: NO_STORE });
});
