import { beforeEach, describe, expect, it } from 'vitest';
import { randomUUID } from 'node:crypto';
import { and, eq } from 'drizzle-orm';
import { createTestDb } from '@/db/test-db';
import type { Db } from '@/db/connection';
import type { Actor } from '@/db/gear';
import { gearFigureNotes, gearItems, gearPorts, trials } from '@/db/schema';
import { createUser } from '@/db/users';
import { claimedPortRow } from '@/db/gear-ports';
import { measuredPortsOf } from '@/db/measured-ports';
import { getGearSummary } from '@/db/browse';
import { handleCreateFieldTest, handleTransition, handleTypedTrial } from '@/app/api/v1/field-tests/handlers';

/*
 * Port-output field tests through the API handlers: approval writes a measured gear_ports row beside the
 * claimed one (basis 'measured', field_test_id); a trial naming a port the item lacks, or an input, is a
 * 422 that stores nothing; the public gear answer carries each port's basis and provenance.
 * P = V × I (SI derived unit watt = V·A). USB PD SPR 9 V at 3 A = 27 W (check-values §7).
 */
const ORIGIN = 'http://localhost:3000';
let db: Db;
let author: Actor;
let editor: Actor;
let bankId: string;

const json = (method: string, path: string, body: unknown) =>
  new Request(`${ORIGIN}${path}`, { method, headers: { 'content-type': 'application/json', origin: ORIGIN }, body: JSON.stringify(body) });
// eslint-disable-next-line @typescript-eslint/no-explicit-any
const body = async (r: Response): Promise<any> => r.json();

const record = {
  kind: 'port-output',
  testedAt: '2026-10-04T10:00',
  placeLabel: 'Workshop bench',
  sky: 'indoor',
  ambientC: 19,
  instruments: [{ name: 'USB-C inline power meter', accuracy: '±1 % + 2 digits' }],
  methodNotes: 'Electronic load on the USB-C port, 9 V profile requested by a trigger board.',
  items: ['cell-20'],
};

beforeEach(() => {
  db = createTestDb().db;
  const a = createUser(db, { email: 'a@example.test', name: 'A', passwordHash: null, role: 'reviewer' });
  const e = createUser(db, { email: 'e@example.test', name: 'E', passwordHash: null, role: 'editor' });
  author = { id: a.id, role: 'reviewer' };
  editor = { id: e.id, role: 'editor' };
  bankId = randomUUID();
  const at = new Date('2026-09-01T00:00:00Z');
  db.insert(gearItems).values({ id: bankId, slug: 'cell-20', ownerId: a.id, name: 'Cellhive 20', maker: 'Voltmoth', category: 'power-bank', status: 'approved', approvedAt: at }).run();
  db.insert(gearPorts)
    .values([
      claimedPortRow(bankId, { kind: 'usb-c', direction: 'output', watts: 45, pdProfiles: [{ volts: 5, amps: 3 }, { volts: 9, amps: 3 }] }, 0, { id: randomUUID(), source: 'packaging', at }),
      claimedPortRow(bankId, { kind: 'usb-c', direction: 'input', watts: 45 }, 1, { id: randomUUID(), source: 'packaging', at }),
    ])
    .run();
});

async function newTest(): Promise<string> {
  const r = await handleCreateFieldTest(db, author, json('POST', '/api/v1/field-tests', record));
  expect(r.status).toBe(201);
  return (await body(r)).fieldTest.id as string;
}
const addTrial = (id: string, typedValues: Record<string, number>, label = 'Trial') =>
  handleTypedTrial(db, author, id, json('POST', `/api/v1/field-tests/${id}/trials`, { item: 'cell-20', label, typedValues }));
const act = (who: Actor, id: string, action: string) => handleTransition(db, who, id, json('POST', `/api/v1/field-tests/${id}/transitions`, { action }));
const portRows = () => db.select().from(gearPorts).where(eq(gearPorts.gearItemId, bankId)).all();

describe('port-output tests', () => {
  it('approval writes a measured row beside the claimed USB-C output: mean of 9.02 × 2.95 and 8.98 × 3.01 = 26.8194 W', async () => {
    const id = await newTest();
    expect((await addTrial(id, { portNumber: 1, portVolts: 9.02, portAmps: 2.95, loadAmps: 3 }, 'Trial 1')).status).toBe(201);
    expect((await addTrial(id, { portNumber: 1, portVolts: 8.98, portAmps: 3.01, loadAmps: 3 }, 'Trial 2')).status).toBe(201);
    expect((await act(author, id, 'submit')).status).toBe(200);
    expect(portRows().filter((r) => r.basis === 'measured')).toEqual([]);
    const approved = await act(editor, id, 'approve');
    expect(approved.status).toBe(200);
    expect((await body(approved)).fieldTest.measured).toBe(1);

    const rows = portRows();
    const claimed = rows.find((r) => r.basis === 'claimed' && r.position === 0)!;
    const measured = rows.find((r) => r.basis === 'measured')!;
    expect(claimed.watts).toBe(45); // the claim is untouched
    expect(measured).toMatchObject({ position: 0, kind: 'usb-c', direction: 'output', fieldTestId: id });
    expect(measured.volts).toBeCloseTo(9.0, 12); // (9.02 + 8.98) / 2
    expect(measured.amps).toBeCloseTo(2.98, 12); // (2.95 + 3.01) / 2
    expect(measured.watts).toBeCloseTo(26.8194, 12); // (26.609 + 27.0298) / 2

    expect(measuredPortsOf(db, bankId).map((m) => [m.position, m.fieldTest?.id])).toEqual([[0, id]]);
    const summary = getGearSummary(db, 'cell-20', null);
    expect(summary.ports?.map((p) => [p.number, p.kind, p.direction, p.basis, p.provenance])).toEqual([
      [1, 'usb-c', 'output', 'claimed', null],
      [1, 'usb-c', 'output', 'measured', `/field-tests/${id}`],
      [2, 'usb-c', 'input', 'claimed', null],
    ]);
    expect(summary.ports?.[1]?.watts).toBeCloseTo(26.8194, 12);
  });

  it('an earlier test approved later does not replace a later test’s figure', async () => {
    const later = await newTest();
    await addTrial(later, { portNumber: 1, portVolts: 9, portAmps: 3 }); // 27 W
    await act(author, later, 'submit');
    await act(editor, later, 'approve');
    const earlier = (await body(await handleCreateFieldTest(db, author, json('POST', '/api/v1/field-tests', { ...record, testedAt: '2026-09-20T10:00' })))).fieldTest.id as string;
    await addTrial(earlier, { portNumber: 1, portVolts: 5, portAmps: 2 }); // 10 W
    await act(author, earlier, 'submit');
    await act(editor, earlier, 'approve');
    const measured = portRows().filter((r) => r.basis === 'measured');
    expect(measured).toHaveLength(1);
    expect(measured[0]).toMatchObject({ watts: 27, fieldTestId: later });
    expect(db.select().from(gearFigureNotes).all()).toEqual([]); // nothing changed on the public item
  });

  it('a later test that changes a public item’s measured watts leaves a dated "figures updated" note', async () => {
    const first = await newTest();
    await addTrial(first, { portNumber: 1, portVolts: 9, portAmps: 3 }); // 27 W
    await act(author, first, 'submit');
    await act(editor, first, 'approve');
    const second = (await body(await handleCreateFieldTest(db, author, json('POST', '/api/v1/field-tests', { ...record, testedAt: '2026-11-20T10:00' })))).fieldTest.id as string;
    await addTrial(second, { portNumber: 1, portVolts: 8.9, portAmps: 2.8 }); // 24.92 W
    await act(author, second, 'submit');
    await act(editor, second, 'approve');
    expect(db.select().from(gearFigureNotes).all().map((n) => [n.summary, n.note])).toEqual([
      ['USB-C output (port 1), measured: 27 W → 24.92 W', 'From the field test of 2026-11-20.'],
    ]);
  });

  it('a port the item lacks, or an input, is a 422 naming the typed values; nothing is stored', async () => {
    const id = await newTest();
    const before = JSON.stringify(portRows());
    const missing = await addTrial(id, { portNumber: 3, portVolts: 5, portAmps: 1 });
    expect(missing.status).toBe(422);
    const m = await body(missing);
    expect(m.error.message).toBe('“Voltmoth Cellhive 20” lists 2 ports; there is no port 3. Use the number in the Ports table on its page.');
    expect(m.error.fields.typedValues).toHaveLength(1);
    const input = await addTrial(id, { portNumber: 2, portVolts: 5, portAmps: 1 });
    expect(input.status).toBe(422);
    expect((await body(input)).error.message).toContain('is an input');
    const noAmps = await addTrial(id, { portNumber: 1, portVolts: 5 });
    expect(noAmps.status).toBe(422);
    const typo = await addTrial(id, { portNumber: 1, portVolts: 5, portAmps: 1, mass: 12 });
    expect(typo.status).toBe(422);
    expect(db.select().from(trials).where(eq(trials.fieldTestId, id)).all()).toEqual([]);
    expect(JSON.stringify(portRows())).toBe(before);
  });

  it('a port removed after the trial blocks submission with the reason; no measured row appears', async () => {
    const id = await newTest();
    expect((await addTrial(id, { portNumber: 1, portVolts: 9, portAmps: 3 }, 'Trial 1')).status).toBe(201);
    db.delete(gearPorts).where(and(eq(gearPorts.gearItemId, bankId), eq(gearPorts.position, 0))).run();
    db.update(gearPorts).set({ position: 0 }).where(eq(gearPorts.gearItemId, bankId)).run(); // the input moves up to port 1
    const r = await act(author, id, 'submit');
    expect(r.status).toBe(422);
    expect((await body(r)).error.message).toBe('Trial 1: Port 1 of “Voltmoth Cellhive 20” is an input (USB-C input); a port output test measures an output.');
    expect(portRows().filter((x) => x.basis === 'measured')).toEqual([]);
  });
});
