import { describe, expect, it } from 'vitest';
import { createTestDb } from '@/db/test-db';
import { seedDemo } from '@/db/seed';
import { DEMO_PORT_OUTPUT_TEST_ID } from '@/db/seed/port-output';
import { measuredPortsOf } from '@/db/measured-ports';
import { gearPorts } from '@/db/schema';
import { compareGear } from '@/db/compare';

/* The demo port-output test: approved, with measured rows beside the Cellhive 20's claimed ports. P = V × I. */
describe('demo port-output test', () => {
  it('writes the measured USB-C and USB-A figures once', async () => {
    const { db } = createTestDb();
    await seedDemo(db);
    const measured = measuredPortsOf(db, 'demo-gear-voltmoth-cellhive-20');
    expect(measured.map((m) => [m.position, m.kind, m.direction, m.fieldTest?.id])).toEqual([
      [0, 'usb-c', 'output', DEMO_PORT_OUTPUT_TEST_ID],
      [2, 'usb-a', 'output', DEMO_PORT_OUTPUT_TEST_ID],
    ]);
    // (19.84 × 2.21 + 19.8 × 2.24) / 2 = (43.8464 + 44.352) / 2 = 44.0992 W, under the claimed 45 W.
    expect(measured[0]!.watts).toBeCloseTo(44.0992, 10);
    // 5.08 × 2.31 = 11.7348 W, under the claimed 12 W.
    expect(measured[1]!.watts).toBeCloseTo(11.7348, 10);
    // The side-by-side's Ports group: claimed 45 W vs 20 W (Northcairn Pocketcell 10), measured 44.1 W linked to the test.
    const ports = compareGear(db, ['voltmoth-cellhive-20', 'northcairn-pocketcell-10'], null).groups.find((g) => g.id === 'ports')!;
    const claimedRow = ports.rows.find((r) => r.key === 'ports:out:usb-c:watts')!;
    expect(claimedRow.cells.map((c) => [c.value, c.best])).toEqual([[45, true], [20, false]]);
    const measuredRow = ports.rows.find((r) => r.key === 'ports:out:usb-c:measured-watts')!;
    expect(measuredRow.cells[0]).toMatchObject({ basis: 'measured', provenance: `/field-tests/${DEMO_PORT_OUTPUT_TEST_ID}` });
    expect(measuredRow.cells[1]!.value).toBeNull();
    const rows = db.select().from(gearPorts).all().length;
    const again = await seedDemo(db);
    expect(again.inserted.trials).toBe(0);
    expect(db.select().from(gearPorts).all().length).toBe(rows);
  }, 60_000);
});
