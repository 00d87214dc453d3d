/**
 * Writing one measured spec of an item from an approved field test: upsert into specs (linked to the test),
 * a spec_changes row, and a dated "figures updated" note when a public item's shown figure changes.
 * Used by db/field-tests.ts (trial-based kinds) and db/radio-noise.ts (band readings).
 */
import { randomUUID } from 'node:crypto';
import { and, eq } from 'drizzle-orm';
import { fieldTests, gearFigureNotes, specChanges, specs, type GearItem } from './schema';
import type { Actor } from './gear';
import type { Tx } from './field-tests-access';
import { formatSpec } from '@/lib/gear/format';
import { SPECS, type SpecKey } from '@/lib/measure';

/** The item's current measured figure for `key` and the test that produced it, if any. */
export function currentMeasuredSource(tx: Tx, itemId: string, key: SpecKey) {
  return tx
    .select({ id: specs.id, value: specs.value, fieldTestId: specs.fieldTestId, testedAt: fieldTests.testedAt, approvedAt: fieldTests.approvedAt })
    .from(specs)
    .leftJoin(fieldTests, eq(fieldTests.id, specs.fieldTestId))
    .where(and(eq(specs.gearItemId, itemId), eq(specs.key, key), eq(specs.mode, ''), eq(specs.basis, 'measured')))
    .get();
}

export interface MeasuredFigure {
  itemId: string;
  key: SpecKey;
  value: number;
  sd: number | null;
  n: number;
  /** The approved test the figure comes from, and its date (for the item's "figures updated" note). */
  fieldTestId: string;
  testedAt: Date;
}

/** Upserts one measured spec with its change log and (public item, shown figure changed) a dated note. */
export function writeMeasuredSpec(
  tx: Tx,
  actor: Actor,
  item: Pick<GearItem, 'approvedAt'> | undefined,
  m: MeasuredFigure,
  current: ReturnType<typeof currentMeasuredSource>,
  at: Date,
): void {
  tx.insert(specs)
    .values({ id: randomUUID(), gearItemId: m.itemId, key: m.key, mode: '', basis: 'measured', value: m.value, sd: m.sd, n: m.n, fieldTestId: m.fieldTestId, updatedAt: at })
    .onConflictDoUpdate({ target: [specs.gearItemId, specs.key, specs.mode, specs.basis], set: { value: m.value, sd: m.sd, n: m.n, fieldTestId: m.fieldTestId, updatedAt: at } })
    .run();
  tx.insert(specChanges)
    .values({ gearItemId: m.itemId, key: m.key, mode: '', basis: 'measured', oldValue: current?.value ?? null, newValue: m.value, context: 'approval', changedById: actor.id, createdAt: at })
    .run();
  if (item?.approvedAt && current && formatSpec(m.key, current.value) !== formatSpec(m.key, m.value)) {
    tx.insert(gearFigureNotes)
      .values({
        gearItemId: m.itemId,
        note: `From the field test of ${m.testedAt.toISOString().slice(0, 10)}.`,
        summary: `${SPECS[m.key].label}, measured: ${formatSpec(m.key, current.value)} → ${formatSpec(m.key, m.value)}`,
        approvedById: actor.id,
        createdAt: at,
      })
      .run();
  }
}
