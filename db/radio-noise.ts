/**
 * Radio-noise checks (issue 9): the only module that reads and writes radio_noise_readings.
 *
 * - The author writes (replaces) a test's band readings only while the test is editable
 *   (db/field-tests-access.ts `findEditableFieldTest`: 404 → 403 → 409), and only for a radio-noise test (422).
 * - Readers see a test's readings when they may see the test (`findVisibleFieldTest`).
 * - An item's radio-quiet summary comes from its APPROVED radio-noise tests only.
 * - On approval, db/field-tests.ts `transitionFieldTest` calls `radioNoiseReadinessProblem` and
 *   `applyRadioNoiseSpecs`, which write the measured specs noiseRiseBelow30 / noiseRiseAbove30: the worst
 *   rise per S-meter range over the item's approved radio-noise tests.
 */
import { randomUUID } from 'node:crypto';
import { and, asc, eq } from 'drizzle-orm';
import type { Db } from './connection';
import { fieldTests, gearItems, radioNoiseReadings, users, type FieldTest, type GearItem, type RadioNoiseReading } from './schema';
import { recomputeStoredRatios, type Actor } from './gear';
import { canViewFieldTest, findEditableFieldTest, findVisibleFieldTest, itemsOfTest, type Q, type Tx } from './field-tests-access';
import { currentMeasuredSource, writeMeasuredSpec } from './measured-specs';
import { AppError } from '@/lib/http/errors';
import { zodFieldErrors } from '@/lib/http/api';
import { KINDS, type FieldTestKind } from '@/lib/field-tests/kinds';
import {
  bandFigures,
  noiseRiseSpecs,
  radioNoiseReadingsInputSchema,
  summaryOfRises,
  type BandFigures,
  type MeterReading,
  type RadioMode,
  type RadioNoiseBandInput,
} from '@/lib/field-tests/radio-noise';
import { MeasureError, radioQuietVerdict, type RadioQuietSummary, type RadioQuietVerdict, type SMeterRange, type SpecKey } from '@/lib/measure';

export const RADIO_NOISE_KIND: FieldTestKind = 'radio-noise';

/** One stored band reading as pages and the API show it. */
export interface RadioNoiseReadingView {
  id: string;
  item: { id: string; slug: string; name: string };
  position: number;
  band: string;
  frequencyMHz: number;
  range: SMeterRange;
  mode: RadioMode;
  bandwidthHz: number;
  antenna: string;
  distanceM: number;
  baseline: MeterReading;
  withItem: MeterReading;
  baselineDbm: number;
  withItemDbm: number;
  riseDb: number;
  verdict: RadioQuietVerdict;
}

export interface TestRadioNoise {
  readings: RadioNoiseReadingView[];
  /** Radio-quiet summary per item of the test (items without readings are absent). */
  summaries: { itemId: string; summary: RadioQuietSummary }[];
}

/** What the item page (and browse / side-by-side) shows: approved radio-noise tests only. */
export interface ItemRadioNoise {
  summary: RadioQuietSummary;
  readings: {
    band: string;
    range: SMeterRange;
    frequencyMHz: number;
    mode: RadioMode;
    bandwidthHz: number;
    antenna: string;
    distanceM: number;
    baselineDbm: number;
    withItemDbm: number;
    riseDb: number;
    fieldTestId: string;
    testedAt: Date;
  }[];
}

function entered(scale: 's-meter' | 'dbm', sUnits: number | null, dbOverS9: number | null, dbm: number): MeterReading {
  return scale === 'dbm' ? { scale: 'dbm', dbm } : { scale: 's-meter', sUnits: sUnits ?? 0, dbOverS9: dbOverS9 ?? 0 };
}

/** Rounded to 0.01 dB so a rise such as −112.3 − (−113.1) is stored as 0.8, not 0.7999999999999972. */
const riseOf = (r: Pick<RadioNoiseReading, 'baselineDbm' | 'withItemDbm'>) => Math.round((r.withItemDbm - r.baselineDbm) * 100) / 100;

function rowsOfTest(db: Q, testId: string): RadioNoiseReading[] {
  return db.select().from(radioNoiseReadings).where(eq(radioNoiseReadings.fieldTestId, testId)).orderBy(asc(radioNoiseReadings.position)).all();
}

function toView(row: RadioNoiseReading, items: readonly GearItem[]): RadioNoiseReadingView {
  const item = items.find((i) => i.id === row.gearItemId);
  const riseDb = riseOf(row);
  return {
    id: row.id,
    item: { id: row.gearItemId, slug: item?.slug ?? '', name: item?.name ?? 'Item' },
    position: row.position,
    band: row.band,
    frequencyMHz: row.frequencyMhz,
    range: row.range,
    mode: row.mode,
    bandwidthHz: row.bandwidthHz,
    antenna: row.antenna,
    distanceM: row.distanceM,
    baseline: entered(row.baselineScale, row.baselineSUnits, row.baselineDbOverS9, row.baselineDbm),
    withItem: entered(row.withItemScale, row.withItemSUnits, row.withItemDbOverS9, row.withItemDbm),
    baselineDbm: row.baselineDbm,
    withItemDbm: row.withItemDbm,
    riseDb,
    verdict: radioQuietVerdict(riseDb),
  };
}

function viewOf(rows: readonly RadioNoiseReading[], items: readonly GearItem[]): TestRadioNoise {
  const readings = rows.map((r) => toView(r, items));
  const itemIds = [...new Set(readings.map((r) => r.item.id))];
  const summaries = itemIds.map((itemId) => ({ itemId, summary: summaryOfRises(readings.filter((r) => r.item.id === itemId))! }));
  return { readings, summaries };
}

/** The stored row of one band reading (its figures from `bandFigures`). */
export function readingRow(fieldTestId: string, gearItemId: string, position: number, band: RadioNoiseBandInput, figures: BandFigures): typeof radioNoiseReadings.$inferInsert {
  return {
    id: randomUUID(),
    fieldTestId,
    gearItemId,
    position,
    band: band.band,
    frequencyMhz: band.frequencyMHz,
    range: figures.range,
    mode: band.mode,
    bandwidthHz: band.bandwidthHz,
    antenna: band.antenna,
    distanceM: band.distanceM,
    baselineScale: band.baseline.scale,
    baselineSUnits: band.baseline.scale === 's-meter' ? band.baseline.sUnits : null,
    baselineDbOverS9: band.baseline.scale === 's-meter' ? band.baseline.dbOverS9 : null,
    baselineDbm: figures.baselineDbm,
    withItemScale: band.withItem.scale,
    withItemSUnits: band.withItem.scale === 's-meter' ? band.withItem.sUnits : null,
    withItemDbOverS9: band.withItem.scale === 's-meter' ? band.withItem.dbOverS9 : null,
    withItemDbm: figures.withItemDbm,
  };
}

/** A test's band readings and per-item summaries, for anyone who may see the test (else 404). */
export function getTestRadioNoise(db: Q, testId: string, viewer: Actor | null): TestRadioNoise {
  const { test, items } = findVisibleFieldTest(db, testId, viewer);
  return viewOf(rowsOfTest(db, test.id), items);
}

/**
 * Replaces every band reading of the author's editable radio-noise test with `raw`
 * (`radioNoiseReadingsInputSchema`). 422 with field paths for bad input; nothing is written then.
 */
export function saveRadioNoiseReadings(db: Db, actor: Actor, testId: string, raw: unknown, now = new Date()): TestRadioNoise {
  const parsed = radioNoiseReadingsInputSchema.safeParse(raw);
  return db.transaction(
    (tx) => {
      // Access first (404 / 403 / 409), so a stranger learns nothing from validation messages.
      const { test, items } = findEditableFieldTest(tx, testId, actor);
      if (test.kind !== RADIO_NOISE_KIND) {
        throw new AppError('invalid', `This is a ${KINDS[test.kind as FieldTestKind]?.label.toLowerCase() ?? test.kind} test: band readings belong to a radio-noise check.`);
      }
      if (!parsed.success) throw new AppError('invalid', 'Some band readings are not valid.', { fields: zodFieldErrors(parsed.error) });
      const fields: Record<string, string[]> = {};
      const rows = parsed.data.readings.map((band, index) => {
        const item = items.find((i) => i.slug === band.item);
        if (!item) fields[`readings.${index}.item`] = ['Choose one of the items of this test.'];
        let figures: ReturnType<typeof bandFigures> | null = null;
        try {
          figures = bandFigures(band);
        } catch (e) {
          if (!(e instanceof MeasureError)) throw e;
          fields[`readings.${index}`] = [e.message];
        }
        return { band, item, figures };
      });
      if (Object.keys(fields).length) throw new AppError('invalid', 'Some band readings are not valid.', { fields });
      tx.delete(radioNoiseReadings).where(eq(radioNoiseReadings.fieldTestId, test.id)).run();
      tx.insert(radioNoiseReadings)
        .values(rows.map(({ band, item, figures }, position) => readingRow(test.id, item!.id, position, band, figures!)))
        .run();
      tx.update(fieldTests).set({ updatedAt: now }).where(eq(fieldTests.id, test.id)).run();
      return viewOf(rowsOfTest(tx, test.id), items);
    },
    { behavior: 'immediate' },
  );
}

/** Why a radio-noise test cannot go to review or be approved yet (an item without band readings), or null. */
export function radioNoiseReadinessProblem(tx: Q, test: Pick<FieldTest, 'id'>, items: readonly GearItem[]): string | null {
  const rows = rowsOfTest(tx, test.id);
  if (rows.length === 0) return 'Add at least one band reading before submitting.';
  const without = items.filter((i) => !rows.some((r) => r.gearItemId === i.id));
  return without.length ? `Add band readings for ${without.map((i) => i.name).join(', ')}, or remove it from the test.` : null;
}

/** Band readings of an item from approved radio-noise tests (plus `includeTestId`, being approved now), with each test's date. */
function approvedRowsOfItem(db: Q, itemId: string, includeTestId?: string) {
  const rows = db
    .select({ reading: radioNoiseReadings, test: fieldTests })
    .from(radioNoiseReadings)
    .innerJoin(fieldTests, eq(fieldTests.id, radioNoiseReadings.fieldTestId))
    .where(and(eq(radioNoiseReadings.gearItemId, itemId), eq(fieldTests.kind, RADIO_NOISE_KIND)))
    .orderBy(asc(fieldTests.testedAt), asc(radioNoiseReadings.position))
    .all();
  return rows.filter((r) => (r.test.status === 'approved' && r.test.approvedAt !== null) || r.test.id === includeTestId);
}

const RANGE_SPEC: Record<SMeterRange, SpecKey> = { 'below-30mhz': 'noiseRiseBelow30', 'above-30mhz': 'noiseRiseAbove30' };

/**
 * On approval: the items' measured noise-rise specs, the worst rise per range over each item's approved
 * radio-noise tests (this one included), linked to the test that gave the worst band; n = band readings in the range.
 * Recomputes the stored ratios of public items. Returns the figures written.
 */
export function applyRadioNoiseSpecs(tx: Tx, actor: Actor, test: FieldTest, items: readonly GearItem[], at: Date): number {
  let written = 0;
  for (const item of items) {
    const rows = approvedRowsOfItem(tx, item.id, test.id);
    const summary = summaryOfRises(rows.map(({ reading }) => ({ band: reading.band, range: reading.range, riseDb: riseOf(reading) })));
    if (!summary) continue;
    const specsOfItem = noiseRiseSpecs(summary);
    for (const range of ['below-30mhz', 'above-30mhz'] as const) {
      const key = RANGE_SPEC[range];
      const value = specsOfItem[key as keyof typeof specsOfItem];
      if (value === undefined) continue;
      const inRange = rows.filter(({ reading }) => reading.range === range);
      const worst = inRange.reduce((a, b) => (riseOf(b.reading) > riseOf(a.reading) ? b : a));
      writeMeasuredSpec(
        tx,
        actor,
        item,
        { itemId: item.id, key, value, sd: null, n: inRange.length, fieldTestId: worst.test.id, testedAt: worst.test.testedAt },
        currentMeasuredSource(tx, item.id, key),
        at,
      );
      written += 1;
    }
    const fresh = tx.select().from(gearItems).where(eq(gearItems.id, item.id)).get();
    if (fresh?.approvedAt) recomputeStoredRatios(tx, fresh, at);
  }
  return written;
}

/**
 * An item's radio-quiet summary and band readings from its APPROVED radio-noise tests, or null when it has none.
 * Anonymous readers get public tests only (approved, every item public); a signed-in viewer who may see an
 * approved test that is not public yet (its author, an item's owner, an editor) gets it too.
 * Sync form for server components and tests; `radioNoiseOfItem` is the async one.
 */
export function itemRadioNoise(db: Q, gearItemId: string, viewer: Actor | null = null): ItemRadioNoise | null {
  const rows = approvedRowsOfItem(db, gearItemId);
  if (rows.length === 0) return null;
  const testIds = [...new Set(rows.map((r) => r.test.id))];
  const visible = new Set(testIds.filter((id) => canViewFieldTest(viewer, rows.find((r) => r.test.id === id)!.test, itemsOfTest(db, id))));
  const shown = rows.filter((r) => visible.has(r.test.id));
  const summary = summaryOfRises(shown.map(({ reading }) => ({ band: reading.band, range: reading.range, riseDb: riseOf(reading) })));
  if (!summary) return null;
  return {
    summary,
    readings: shown.map(({ reading, test }) => ({
      band: reading.band,
      range: reading.range,
      frequencyMHz: reading.frequencyMhz,
      mode: reading.mode,
      bandwidthHz: reading.bandwidthHz,
      antenna: reading.antenna,
      distanceM: reading.distanceM,
      baselineDbm: reading.baselineDbm,
      withItemDbm: reading.withItemDbm,
      riseDb: riseOf(reading),
      fieldTestId: test.id,
      testedAt: test.testedAt,
    })),
  };
}

/** `itemRadioNoise` for callers that have only ids (the item page, browse, side-by-side). */
export async function radioNoiseOfItem(gearItemId: string, opts: { viewerId?: string; db?: Db } = {}): Promise<ItemRadioNoise | null> {
  // Loaded lazily: db/index.ts is server-only, and this module is also reached from scripts through db/field-tests.ts.
  const db = opts.db ?? (await import('./index')).getDb();
  const viewer = opts.viewerId ? (db.select({ id: users.id, role: users.role }).from(users).where(eq(users.id, opts.viewerId)).get() ?? null) : null;
  return itemRadioNoise(db, gearItemId, viewer);
}
