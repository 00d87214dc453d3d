/**
 * Roles and feature checklists of gear items: the only module that queries gear_features (the
 * also-serves list is the `gear_items.also_serves_as` column). Both follow the item's workflow like
 * claimed ports (db/gear-ports.ts): before the first approval they are written live; after it the
 * stored values are the approved (public) ones and an edit waits in the pending change until approved.
 */
import { and, asc, eq, inArray, isNotNull } from 'drizzle-orm';
import type { Db } from './connection';
import { gearFeatures, gearItems, type GearItem } from './schema';
import type { Category } from '@/lib/measure';
import { checklistLines, isFeatureName, type ChecklistLine, type FeatureClaim } from '@/lib/gear/features';
import { cleanAlsoServes, rolesOf } from '@/lib/gear/roles';

type Tx = Parameters<Parameters<Db['transaction']>[0]>[0];
type Q = Db | Tx;

/** The stored (approved, once public) categories an item also serves as, never its primary one. */
export function alsoServesAsOf(item: Pick<GearItem, 'category' | 'alsoServesAs'>): Category[] {
  return cleanAlsoServes(item.category, item.alsoServesAs);
}

/** The stored roles of an item: its primary category first, then what it also serves as. */
export function rolesOfItem(item: Pick<GearItem, 'category' | 'alsoServesAs'>): Category[] {
  return rolesOf(item.category as Category, alsoServesAsOf(item));
}

/** True when the item's primary category or one of its also-serves categories is `category`. */
export function itemServesAs(item: Pick<GearItem, 'category' | 'alsoServesAs'>, category: Category): boolean {
  return rolesOfItem(item).includes(category);
}

function rowToClaim(r: typeof gearFeatures.$inferSelect): FeatureClaim | null {
  if (!isFeatureName(r.name)) return null;
  return r.present && r.detail ? { name: r.name, present: true, detail: r.detail } : { name: r.name, present: r.present };
}

/** The stored feature answers of one item (the approved ones once it is public). */
export function liveFeatures(db: Q, itemId: string): FeatureClaim[] {
  return db
    .select()
    .from(gearFeatures)
    .where(eq(gearFeatures.gearItemId, itemId))
    .orderBy(asc(gearFeatures.name))
    .all()
    .map(rowToClaim)
    .filter((c): c is FeatureClaim => c !== null);
}

/** Replaces an item's stored feature answers (inside the caller's transaction). */
export function writeLiveFeatures(tx: Tx, itemId: string, claims: readonly FeatureClaim[]): void {
  tx.delete(gearFeatures).where(eq(gearFeatures.gearItemId, itemId)).run();
  if (claims.length === 0) return;
  tx.insert(gearFeatures)
    .values(claims.map((c) => ({ gearItemId: itemId, name: c.name, present: c.present, detail: c.present ? (c.detail ?? null) : null })))
    .run();
}

/** Sets an item's also-serves list (inside the caller's transaction). */
export function writeLiveAlsoServes(tx: Tx, itemId: string, alsoServesAs: readonly Category[]): void {
  tx.update(gearItems).set({ alsoServesAs: [...alsoServesAs] }).where(eq(gearItems.id, itemId)).run();
}

/**
 * The approved (public) feature answers of each item, keyed by gear item id. Items that are not public,
 * unknown ids and items without answers get an empty list.
 */
export function featuresOfGear(db: Q, gearItemIds: readonly string[]): Record<string, FeatureClaim[]> {
  const out: Record<string, FeatureClaim[]> = {};
  const ids = [...new Set(gearItemIds.filter((id) => typeof id === 'string'))];
  for (const id of ids) out[id] = [];
  for (let i = 0; i < ids.length; i += 500) {
    const batch = ids.slice(i, i + 500);
    const rows = db
      .select({ feature: gearFeatures })
      .from(gearFeatures)
      .innerJoin(gearItems, eq(gearItems.id, gearFeatures.gearItemId))
      .where(and(inArray(gearFeatures.gearItemId, batch), isNotNull(gearItems.approvedAt)))
      .orderBy(asc(gearFeatures.gearItemId), asc(gearFeatures.name))
      .all();
    for (const { feature } of rows) {
      const claim = rowToClaim(feature);
      if (claim) out[feature.gearItemId]!.push(claim);
    }
  }
  return out;
}

/** An item's roles and checklist as the public API gives them (lib/browse/contract.ts GearSummary). */
export interface RolesAndFeaturesView {
  alsoServesAs: Category[];
  features: ChecklistLine[];
}

/**
 * Also-serves lists and checklist lines of the given items from their stored rows (the approved ones of a
 * public item; a caller's own never-approved item shows its live answers), keyed by item id.
 */
export function rolesAndFeaturesOf(db: Q, items: readonly Pick<GearItem, 'id' | 'category' | 'alsoServesAs' | 'waterRating'>[]): Map<string, RolesAndFeaturesView> {
  const claims = new Map<string, FeatureClaim[]>(items.map((i) => [i.id, []]));
  const ids = [...claims.keys()];
  for (let i = 0; i < ids.length; i += 500) {
    const rows = db.select().from(gearFeatures).where(inArray(gearFeatures.gearItemId, ids.slice(i, i + 500))).orderBy(asc(gearFeatures.name)).all();
    for (const r of rows) {
      const claim = rowToClaim(r);
      if (claim) claims.get(r.gearItemId)!.push(claim);
    }
  }
  return new Map(
    items.map((item) => [item.id, { alsoServesAs: alsoServesAsOf(item), features: checklistLines(rolesOfItem(item), claims.get(item.id) ?? [], item.waterRating) }]),
  );
}
