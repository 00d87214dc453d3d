import { beforeAll, describe, expect, it, vi } from 'vitest';
import { dbMock, guardMock, type SessionUser } from '../support/integration-mocks';
import { createTestDb } from '@/db/test-db';
import type { Db } from '@/db/connection';
import { createUser } from '@/db/users';

/*
 * Free-form batteries and panels through the kits API: the stored energy (Wh) and rated power (W) are
 * stored, sent back in the kit JSON, counted in totals and the budget; bad figures are a 422 with the
 * field's message and leave the database as it was. The arithmetic is worked in tests/unit/kits-free-energy.test.ts:
 * 256 Wh LiFePO4 × 0.8 = 204.8 Wh usable (0.8: common practice, no source); 2 × 40 W × 5 h × (1 − 0.14) = 344 Wh
 * a day (losses 0.14: PVWatts v5 default, NREL/TP-6A20-62641, rounded).
 */
const state = vi.hoisted(() => ({ db: null as unknown as Db, user: null as SessionUser | null }));
vi.mock('@/db', () => dbMock(() => state.db));
vi.mock('@/lib/auth/guard', () => guardMock(() => state.user));

const list = await import('@/app/api/v1/kits/route');
const one = await import('@/app/api/v1/kits/[id]/route');
const { kitResponseSchema } = await import('@/lib/openapi/paths/kits');

const BASE = 'http://localhost:3000';
const json = (method: string, path: string, body?: unknown) =>
  new Request(`${BASE}${path}`, { method, headers: { 'content-type': 'application/json', origin: BASE }, body: body === undefined ? undefined : JSON.stringify(body) });
const params = <T extends Record<string, string>>(p: T) => ({ params: Promise.resolve(p) });
// eslint-disable-next-line @typescript-eslint/no-explicit-any
const body = async (r: Response): Promise<any> => r.json();
const stored = () => state.db.$client.prepare('select free_name, free_energy_wh, free_rated_w from kit_entries order by kit_id, position').all();

const kit = (): { name: string; tripDays: number; peakSunHours: number; skyShare: number; entries: Record<string, unknown>[] } => ({
  name: 'Meadow course kit',
  tripDays: 3,
  peakSunHours: 5,
  skyShare: 1,
  entries: [
    { gearItemId: null, quantity: 1, freeName: 'Camp light', freeDrawW: 5, hoursPerDay: 4 },
    { gearItemId: null, quantity: 1, freeName: 'Battery box', freeRole: 'storage', freeEnergyWh: 256, chemistry: 'lifepo4' },
    { gearItemId: null, quantity: 2, freeName: 'Folding panel', freeRole: 'source', freeRatedW: 40 },
  ],
});

let kitId: string;

beforeAll(() => {
  state.db = createTestDb().db;
  const user = createUser(state.db, { email: 'leader@cedar-hollow.example', name: 'Course leader', passwordHash: null, role: 'reader' });
  state.user = { id: user.id, email: 'leader@cedar-hollow.example', name: 'Course leader', role: user.role };
});

describe('free-form stored energy and rated power in the kits API', () => {
  it('POST stores them; the kit JSON shows them and counts them in totals and budget', async () => {
    const created = await list.POST(json('POST', '/api/v1/kits', kit()));
    expect(created.status).toBe(201);
    const b = await body(created);
    kitId = b.kit.id;
    expect(kitResponseSchema.safeParse(b).success).toBe(true);
    expect(b.kit.entries[1]).toMatchObject({ freeRole: 'storage', freeEnergyWh: 256 });
    expect(b.kit.entries[2]).toMatchObject({ freeRole: 'source', freeRatedW: 40 });
    expect(b.totals.storedWh).toBe(256);
    expect(b.budget.storage).toEqual([expect.objectContaining({ capacityWh: 256, capacityBasis: 'typed', usableWh: 204.8 })]);
    expect(b.budget.panels).toEqual([expect.objectContaining({ ratedW: 40, quantity: 2, basis: 'typed' })]);
    expect(b.budget.result.dailySolarWh).toBeCloseTo(344, 10);
    expect(b.budget.result.usableBatteryWh).toBeCloseTo(204.8, 10);
    expect(stored()).toEqual([
      { free_name: 'Camp light', free_energy_wh: null, free_rated_w: null },
      { free_name: 'Battery box', free_energy_wh: 256, free_rated_w: null },
      { free_name: 'Folding panel', free_energy_wh: null, free_rated_w: 40 },
    ]);

    const read = await body(await one.GET(json('GET', `/api/v1/kits/${kitId}`), params({ id: kitId })));
    expect(read.kit.entries[1].freeEnergyWh).toBe(256);
    expect(read.kit.entries[2].freeRatedW).toBe(40);
  });

  it('PATCH changes them; bad figures are a 422 with the field’s message and nothing changes', async () => {
    const entries = kit().entries;
    entries[1] = { ...entries[1], freeEnergyWh: 512 };
    const ok = await one.PATCH(json('PATCH', `/api/v1/kits/${kitId}`, { entries }), params({ id: kitId }));
    expect(ok.status).toBe(200);
    expect((await body(ok)).totals.storedWh).toBe(512);

    const before = stored();
    const bad: [Record<string, unknown>, number, string, RegExp][] = [
      [{ freeEnergyWh: 0 }, 1, 'freeEnergyWh', /more than 0 Wh/],
      [{ freeEnergyWh: 1e9 }, 1, 'freeEnergyWh', /too large for a camp kit/],
      [{ freeEnergyWh: 'lots' }, 1, 'freeEnergyWh', /must be a number/],
      [{ freeRatedW: -40 }, 2, 'freeRatedW', /more than 0 W/],
      [{ freeRatedW: 40 }, 1, 'freeRatedW', /Only a solar panel/],
      [{ freeRole: 'device' }, 1, 'freeEnergyWh', /Only a battery or power bank/],
    ];
    for (const [change, index, field, message] of bad) {
      const e = kit().entries;
      e[index] = { ...e[index], ...change };
      const r = await one.PATCH(json('PATCH', `/api/v1/kits/${kitId}`, { entries: e }), params({ id: kitId }));
      expect(r.status).toBe(422);
      const err = (await body(r)).error;
      expect(err.fields[`entries.${index}.${field}`].join(' ')).toMatch(message);
      expect(stored()).toEqual(before);
    }
    const catalogWithEnergy = await list.POST(json('POST', '/api/v1/kits', { ...kit(), entries: [{ gearItemId: 'some-item', quantity: 1, freeEnergyWh: 50 }] }));
    expect(catalogWithEnergy.status).toBe(422);
    expect(stored()).toEqual(before);
  });
});
