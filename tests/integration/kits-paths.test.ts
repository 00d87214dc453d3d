import { beforeAll, describe, expect, it, vi } from 'vitest';
import { dbMock, guardMock, type SessionUser } from '../support/integration-mocks';
import { eq } from 'drizzle-orm';
import { createTestDb } from '@/db/test-db';
import type { Db } from '@/db/connection';
import { kitEntries, kits, type Role } from '@/db/schema';

/*
 * Free-form entries with a role and ports (issue 9) through the kits API and the data layer: the
 * round trip, bad ports → 422 with nothing stored, stored ports checked again on the way out.
 * The path and budget arithmetic is worked in tests/unit/kits-paths.test.ts; here the wiring is checked.
 */
const state = vi.hoisted(() => ({ db: null as unknown as Db, user: null as SessionUser | null }));
vi.mock('@/db', () => dbMock(() => state.db));
vi.mock('@/lib/auth/guard', () => guardMock(() => state.user));

const { seedDemo } = await import('@/db/seed');
const { getOwnKit } = await import('@/db/kits');
const { kitBudget } = await import('@/lib/kits');
const list = await import('@/app/api/v1/kits/route');
const one = await import('@/app/api/v1/kits/[id]/route');
const duplicate = await import('@/app/api/v1/kits/[id]/duplicate/route');

const BASE = 'http://localhost:3000';
const json = (method: string, path: string, body?: unknown) =>
  new Request(`${BASE}${path}`, {
    method,
    headers: { 'content-type': 'application/json', origin: BASE },
    body: body === undefined ? undefined : JSON.stringify(body),
  });
const params = <T extends Record<string, string>>(p: T) => ({ params: Promise.resolve(p) });
const reviewer = { id: 'demo-user-reviewer', email: 'reviewer@x.example', name: 'reviewer', role: 'reviewer' as Role };
const counts = () => ['kits', 'kit_entries'].map((t) => (state.db.$client.prepare(`select count(*) as n from ${t}`).get() as { n: number }).n);
// eslint-disable-next-line @typescript-eslint/no-explicit-any
const body = async (r: Response): Promise<any> => r.json();

/** Invented free-form gear: a 12 V battery, a USB-C laptop (20 V 2.25 A), a 12 V radio and a 12 V → USB-C car charger. */
const battery = { gearItemId: null, quantity: 1, freeName: 'Camp battery', freeRole: 'storage', freePorts: [{ kind: 'socket-12v', direction: 'output', volts: 12.8, amps: 10 }] };
const laptop = { gearItemId: null, quantity: 1, freeName: 'Laptop', freeDrawW: 30, hoursPerDay: 2, freeRole: 'device', freePorts: [{ kind: 'usb-c', direction: 'input', pdProfiles: [{ volts: 20, amps: 2.25 }] }] };
const radio = { gearItemId: null, quantity: 1, freeName: 'Radio', freeDrawW: 8, hoursPerDay: 6, freeRole: 'device', freePorts: [{ kind: 'socket-12v', direction: 'input', volts: 12, amps: 1.5 }] };
const charger = {
  gearItemId: null,
  quantity: 1,
  freeName: 'Car charger',
  freeRole: 'adapter',
  freeEfficiency: 0.87,
  freePorts: [
    { kind: 'socket-12v', direction: 'input' },
    { kind: 'usb-c', direction: 'output', pdProfiles: [{ volts: 5, amps: 3 }, { volts: 20, amps: 3 }] },
  ],
};
const kitWith = (entries: unknown[]) => ({ name: 'Paths kit', tripDays: 2, entries });

beforeAll(async () => {
  state.db = createTestDb().db;
  await seedDemo(state.db);
  state.user = reviewer;
}, 120_000);

describe('free-form roles and ports through /api/v1/kits', () => {
  it('stores and returns roles, ports and efficiencies as sent; the budget uses the paths', async () => {
    const r = await list.POST(json('POST', '/api/v1/kits', kitWith([battery, laptop, radio, charger])));
    expect(r.status).toBe(201);
    const b = await body(r);
    expect(b.kit.entries[3]).toMatchObject({ freeRole: 'adapter', freeEfficiency: 0.87, freePorts: charger.freePorts });
    expect(b.kit.entries[1].freePorts).toEqual(laptop.freePorts);
    // Laptop: battery → car charger → laptop, efficiency 0.87; radio straight from the battery, 1.
    expect(b.budget.loads.map((l: { name: string; efficiencyFrom: string; efficiency: number }) => [l.name, l.efficiencyFrom, l.efficiency])).toEqual([
      ['Laptop', 'path', 0.87],
      ['Radio', 'path', 1],
    ]);
    const got = await body(await one.GET(json('GET', `/api/v1/kits/${b.kit.id}`), params({ id: b.kit.id })));
    expect(got.kit.entries).toEqual(b.kit.entries);
    const copy = await body(await duplicate.POST(json('POST', `/api/v1/kits/${b.kit.id}/duplicate`), params({ id: b.kit.id })));
    expect(getOwnKit(state.db, reviewer, copy.kit.id).kit.entries[3]).toMatchObject({ freeRole: 'adapter', freePorts: charger.freePorts });
  });

  const bad: [string, unknown, string][] = [
    ['PD profiles on USB-A', { ...laptop, freePorts: [{ kind: 'usb-a', direction: 'input', pdProfiles: [{ volts: 20, amps: 2 }] }] }, 'entries.0.freePorts.0'],
    ['an unknown connector', { ...radio, freePorts: [{ kind: 'anderson-ish', direction: 'input' }] }, 'entries.0.freePorts.0.kind'],
    ['a negative current', { ...radio, freePorts: [{ kind: 'socket-12v', direction: 'input', amps: -2 }] }, 'entries.0.freePorts.0.amps'],
    ['an adapter without efficiency', { ...charger, freeEfficiency: null }, 'entries.0.freeEfficiency'],
    ['a cable with one end', { ...charger, freeRole: 'cable', freeEfficiency: null, freePorts: [{ kind: 'usb-a', direction: 'input' }] }, 'entries.0.freePorts'],
    ['an unknown role', { ...radio, freeRole: 'generator' }, 'entries.0.freeRole'],
    ['ports on a catalog entry', { gearItemId: 'demo-gear-dunlow-ridgecall-h5', quantity: 1, freePorts: [] }, 'entries.0.gearItemId'],
    ['extra keys in a port', { ...radio, freePorts: [{ kind: 'socket-12v', direction: 'input', fuse: 'none' }] }, 'entries.0.freePorts.0'],
  ];

  it.each(bad)('POST with %s → 422 naming the field, nothing stored', async (_what, entry, field) => {
    const before = counts();
    const r = await list.POST(json('POST', '/api/v1/kits', kitWith([entry])));
    expect(r.status).toBe(422);
    const b = await body(r);
    expect(Object.keys(b.error.fields ?? {})).toContain(field);
    expect(counts()).toEqual(before);
  });

  it('PATCH with bad ports is 422 and leaves the entries as they were', async () => {
    const created = await body(await list.POST(json('POST', '/api/v1/kits', kitWith([battery, radio]))));
    const id = created.kit.id as string;
    const r = await one.PATCH(json('PATCH', `/api/v1/kits/${id}`, { entries: [battery, { ...radio, freePorts: [{ kind: 'usb-c', direction: 'input', pdProfiles: [{ volts: 99, amps: 1 }] }] }] }), params({ id }));
    expect(r.status).toBe(422);
    expect((await body(r)).error.message).toBeTruthy();
    expect(getOwnKit(state.db, reviewer, id).kit.entries).toEqual(created.kit.entries);
  });

  it('reads a stored port that no longer passes the schema as "no ports" rather than failing', async () => {
    const created = await body(await list.POST(json('POST', '/api/v1/kits', kitWith([battery, radio]))));
    const id = created.kit.id as string;
    // A row written around the API (an old or hand-edited database) with a port lib/measure refuses.
    state.db.update(kitEntries).set({ freePorts: [{ kind: 'usb-a', direction: 'output', pdProfiles: [{ volts: 9, amps: 2 }] }] }).where(eq(kitEntries.freeName, 'Radio')).run();
    const r = await one.GET(json('GET', `/api/v1/kits/${id}`), params({ id }));
    expect(r.status).toBe(200);
    const b = await body(r);
    expect(b.kit.entries[1]).toMatchObject({ freeName: 'Radio', freePorts: null });
    expect(b.budget.loads[0]).toMatchObject({ name: 'Radio', efficiencyFrom: 'kit' });
  });
});

describe('demo kits', () => {
  it('the base camp kit shows a device with a charging path and one with the reason it has none', () => {
    const row = state.db.select().from(kits).where(eq(kits.id, 'demo-kit-base-camp')).get();
    expect(row).toBeDefined();
    const { kit, catalog } = getOwnKit(state.db, { id: row!.ownerId }, row!.id);
    const { charging, loads, warnings } = kitBudget(kit, catalog);
    const withPath = charging.devices.filter((d) => d.paths.length > 0);
    const withReason = charging.devices.filter((d) => d.listsPorts && d.paths.length === 0 && d.reasons.length > 0);
    expect(withPath.length).toBeGreaterThanOrEqual(1);
    expect(withReason.length).toBeGreaterThanOrEqual(1);
    // Loads on a path from storage take its efficiency; the one without a path keeps the kit's figure and is warned about.
    expect(loads.some((l) => l.efficiencyFrom === 'path')).toBe(true);
    expect(warnings.some((w) => w.code === 'no-path')).toBe(true);
  });
});
