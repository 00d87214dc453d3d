/**
 * Field tests: who may see and change them (the rules every read and write of db/field-tests*.ts goes through).
 *
 * - A field test is public when it is approved and every item it covers is public.
 * - Otherwise only its author, the owners of its items, and editors/admins see it; everyone else gets
 *   404 (the same answer as an unknown id, so a draft's existence does not leak).
 * - Only its author changes it, and only while it is a draft or returned (lib/workflow `canEditText`).
 */
import { eq, inArray } from 'drizzle-orm';
import type { Db } from './connection';
import { fieldTestItems, fieldTests, gearItems, type FieldTest, type GearItem } from './schema';
import { isPublicGear, type Actor } from './gear';
import { hasRole } from '@/lib/auth/roles';
import { AppError } from '@/lib/http/errors';
import { canEditText } from '@/lib/workflow/transitions';

export type Tx = Parameters<Parameters<Db['transaction']>[0]>[0];
export type Q = Db | Tx;

const notFound = () => new AppError('not_found', 'No field test here, or you may not see it.');

/** Field test ids are server-made UUIDs (or stable demo ids); anything else cannot exist. */
export function isFieldTestId(id: unknown): id is string {
  return typeof id === 'string' && /^[A-Za-z0-9-]{1,100}$/.test(id);
}

export function itemsOfTest(db: Q, testId: string): GearItem[] {
  const ids = db.select({ id: fieldTestItems.gearItemId }).from(fieldTestItems).where(eq(fieldTestItems.fieldTestId, testId)).all().map((r) => r.id);
  if (ids.length === 0) return [];
  return db.select().from(gearItems).where(inArray(gearItems.id, ids)).all();
}

export function isPublicFieldTest(test: Pick<FieldTest, 'status' | 'approvedAt'>, items: readonly Pick<GearItem, 'approvedAt'>[]): boolean {
  return test.status === 'approved' && test.approvedAt !== null && items.every(isPublicGear);
}

/** The author, the owners of the test's items, editors and admins: they see it before it is public (marked pending). */
export function isFieldTestInsider(viewer: Actor | null | undefined, test: Pick<FieldTest, 'ownerId'>, items: readonly Pick<GearItem, 'ownerId'>[]): boolean {
  return !!viewer && (viewer.id === test.ownerId || hasRole(viewer, 'editor') || items.some((i) => i.ownerId === viewer.id));
}

export function canViewFieldTest(viewer: Actor | null | undefined, test: FieldTest, items: readonly GearItem[]): boolean {
  return isPublicFieldTest(test, items) || isFieldTestInsider(viewer, test, items);
}

/** The test and its items if the viewer may see it, else AppError 404. */
export function findVisibleFieldTest(db: Q, id: string, viewer: Actor | null | undefined): { test: FieldTest; items: GearItem[] } {
  if (!isFieldTestId(id)) throw notFound();
  const test = db.select().from(fieldTests).where(eq(fieldTests.id, id)).get();
  if (!test) throw notFound();
  const items = itemsOfTest(db, test.id);
  if (!canViewFieldTest(viewer, test, items)) {
    console.warn(`field test ${id}: denied to ${viewer ? viewer.id : 'anonymous'} (not visible)`);
    throw notFound();
  }
  return { test, items };
}

/** A test its author may change now: 404 when not visible, 403 when not theirs, 409 when submitted or approved. */
export function findEditableFieldTest(db: Q, id: string, actor: Actor): { test: FieldTest; items: GearItem[] } {
  const found = findVisibleFieldTest(db, id, actor);
  if (found.test.ownerId !== actor.id || !hasRole(actor, 'reviewer')) {
    console.warn(`field test ${id}: change refused to ${actor.id} (not the author)`);
    throw new AppError('forbidden', 'Only the author may change this field test.');
  }
  if (!canEditText(found.test.status, actor, found.test.ownerId)) {
    throw new AppError(
      'conflict',
      found.test.status === 'in-review'
        ? 'This field test is in review and locked: withdraw it first, or wait for the editor.'
        : 'This field test is approved and public: it can no longer be changed.',
    );
  }
  return found;
}
