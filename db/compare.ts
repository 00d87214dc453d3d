/**
 * Data for the side-by-side (`GET /api/v1/compare`): the items a caller may read (db/browse.ts rule:
 * approved ones and their own; 404 naming the first other slug), their headline figures and stored
 * ratios, and the conditions of the latest public field test behind their measured figures.
 * The rows, directions and best cells are lib/compare's.
 */
import { and, desc, eq, inArray, isNotNull } from 'drizzle-orm';
import type { Db } from './connection';
import { fieldTests, specs } from './schema';
import { findReadableGear, gearSummaries, type Caller } from './browse';
import { isPublicFieldTest, itemsOfTest } from './field-tests-access';
import type { CompareResponse } from '@/lib/browse/contract';
import { buildComparison, type CompareConditions, type CompareItemInput } from '@/lib/compare';
import { withRadioNoise } from '@/lib/compare/radio-noise';
import { withFeatures } from '@/lib/compare/features';
import { withPorts } from '@/lib/compare/ports';
import { publicPortsOf } from './measured-ports';

function latestPublicConditions(db: Db, itemId: string): CompareConditions | null {
  const testIds = db
    .selectDistinct({ id: specs.fieldTestId })
    .from(specs)
    .where(and(eq(specs.gearItemId, itemId), eq(specs.basis, 'measured'), isNotNull(specs.fieldTestId)))
    .all()
    .map((r) => r.id!);
  if (testIds.length === 0) return null;
  const tests = db
    .select()
    .from(fieldTests)
    .where(and(inArray(fieldTests.id, testIds), isNotNull(fieldTests.approvedAt)))
    .orderBy(desc(fieldTests.testedAt))
    .all();
  const test = tests.find((t) => isPublicFieldTest(t, itemsOfTest(db, t.id)));
  if (!test) return null;
  return {
    provenance: `/field-tests/${test.id}`,
    testedOn: test.testedAt.toISOString().slice(0, 10),
    ambientC: test.ambientC,
    sky: test.sky,
    place: test.placeLabel,
  };
}

/** The side-by-side of the given slugs, in that order (404 when one is unknown or hidden from the caller). */
export function compareGear(db: Db, slugs: readonly string[], caller: Caller, options: { imperial?: boolean } = {}): CompareResponse {
  const items = findReadableGear(db, slugs, caller);
  const summaries = gearSummaries(db, items, { caller, imperial: false });
  const inputs: CompareItemInput[] = summaries.map((s, i) => ({
    item: { slug: s.slug, name: s.name, maker: s.maker, category: s.category, kind: s.kind, path: s.path, photo: s.photo, price: s.price },
    specs: s.specs,
    ratios: s.ratios,
    conditions: latestPublicConditions(db, items[i]!.id),
  }));
  return withPorts(withFeatures(withRadioNoise(buildComparison(inputs, options), inputs), summaries), items.map((i) => publicPortsOf(db, i.id)));
}
