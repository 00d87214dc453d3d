/*
 * The demo port-output field test (issue 9: a measured USB output wattage comes from a field test):
 * the Voltmoth Cellhive 20 bank's USB-C output (port 1) on its 20 V profile and one USB-A output
 * (port 3), read with a USB meter into an electronic load on the Lakeshore test bench. Invented,
 * plausible readings: a little under the claimed 45 W and 12 W, as meters and cables usually show.
 *
 * Approved; its measured port rows are written by the same code as an approval (db/measured-ports.ts
 * `applyMeasuredPorts`) when the test is first inserted, so running the seed again changes nothing.
 */
import { inArray } from 'drizzle-orm';
import type { Db } from '../connection';
import { fieldTestItems, fieldTests, gearItems, trials } from '../schema';
import { applyMeasuredPorts } from '../measured-ports';
import { analyzeFieldTest } from '../../lib/field-tests/analysis';
import { DEMO_PLACES, type DemoUserKey } from './demo-data';

type Tx = Parameters<Parameters<Db['transaction']>[0]>[0];

const ITEM = 'voltmoth-cellhive-20';
const GEAR_ID = `demo-gear-${ITEM}`;
export const DEMO_PORT_OUTPUT_TEST_ID = 'demo-ft-cellhive-port-output';

/** Typed readings per trial: port number as in the item's Ports table, meter volts and amps, load setting. */
export const DEMO_PORT_OUTPUT_TRIALS = [
  // 19.84 V × 2.21 A = 43.85 W; 19.8 V × 2.24 A = 44.35 W → mean 44.10 W against the claimed 45 W.
  { id: 'demo-trial-cellhive-usbc-1', label: 'USB-C, 20 V profile, run 1', values: { portNumber: 1, portVolts: 19.84, portAmps: 2.21, loadAmps: 2.25 } },
  { id: 'demo-trial-cellhive-usbc-2', label: 'USB-C, 20 V profile, run 2', values: { portNumber: 1, portVolts: 19.8, portAmps: 2.24, loadAmps: 2.25 } },
  // 5.08 V × 2.31 A = 11.73 W against the claimed 12 W.
  { id: 'demo-trial-cellhive-usba-1', label: 'USB-A, 5 V', values: { portNumber: 3, portVolts: 5.08, portAmps: 2.31, loadAmps: 2.4 } },
] as const;

const TESTED_AT = new Date('2026-10-02T14:00:00Z');
const APPROVED_AT = new Date('2026-10-03T09:00:00Z');

/** Inserts the demo port-output test once (when the bank exists) and writes its measured ports; returns trials inserted. */
export function seedDemoPortOutput(tx: Tx, userId: (key: DemoUserKey) => string): number {
  const item = tx.select({ id: gearItems.id }).from(gearItems).where(inArray(gearItems.id, [GEAR_ID])).get();
  if (!item) return 0;
  const test = {
    id: DEMO_PORT_OUTPUT_TEST_ID,
    ownerId: userId('reviewer'),
    kind: 'port-output',
    testedAt: TESTED_AT,
    placeLabel: DEMO_PLACES.bench,
    sky: 'indoor' as const,
    ambientC: 19,
    instruments: [
      { name: 'USB-C inline power meter with PD trigger', accuracy: '±(0.5 % + 2 digits) V, ±(1 % + 2 digits) A' },
      { name: 'Adjustable constant-current electronic load' },
    ],
    methodNotes:
      'Bank charged to full and rested for an hour. Meter and a 5 A-rated USB-C cable between the port and the load; the trigger asked for the 20 V profile on the USB-C port. Each reading taken after two minutes at the set current. Port numbers as in the item’s Ports table.',
    status: 'approved' as const,
    approvedAt: APPROVED_AT,
    createdAt: TESTED_AT,
    updatedAt: APPROVED_AT,
  };
  const added = tx.insert(fieldTests).values(test).onConflictDoNothing().run().changes;
  if (added === 0) return 0;
  tx.insert(fieldTestItems).values({ fieldTestId: test.id, gearItemId: GEAR_ID }).onConflictDoNothing().run();
  const rows = DEMO_PORT_OUTPUT_TRIALS.map((t, position) => ({
    id: t.id,
    fieldTestId: test.id,
    gearItemId: GEAR_ID,
    label: t.label,
    typedValues: { ...t.values },
    position,
    createdAt: TESTED_AT,
  }));
  const inserted = tx.insert(trials).values(rows).onConflictDoNothing().run().changes;
  const analysis = analyzeFieldTest(
    'port-output',
    rows.map((r) => ({ itemId: r.gearItemId, id: r.id, label: r.label, typed: r.typedValues })),
  );
  const stored = tx.select().from(fieldTests).where(inArray(fieldTests.id, [test.id])).get();
  if (stored) applyMeasuredPorts(tx, stored, analysis, APPROVED_AT);
  return inserted;
}
