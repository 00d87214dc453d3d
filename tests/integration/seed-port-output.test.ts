import { describe, expect, it } from 'vitest';
import { createTestDb } from '@/db/test-db';
import { seedDemo } from '@/db/seed';
import { DEMO_PORT_OUTPUT_TEST_ID } from '@/db/seed/port-output';
import { measuredPortsOf } from '@/db/measured-ports';
import { gearPorts } from '@/db/schema';

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
    const rows = db.select().from(gearPorts).all().length;
    const again = await seedDemo(db);
    expect(again.inserted.trials).toBe(0);
    expect(db.select().from(gearPorts).all().length).toBe(rows);
  }, 60_000);
});
