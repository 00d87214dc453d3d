import { beforeAll, describe, expect, it, vi } from 'vitest';
import { dbMock, guardMock, type SessionUser } from '../support/integration-mocks';
import { createTestDb } from '@/db/test-db';
import type { Db } from '@/db/connection';
import type { Role } from '@/db/schema';

/*
 * Charging paths in the kits API (issue 9): GET /api/v1/kits/{id} and the shared view carry
 * `budget.charging` — every path per device with its steps and efficiency, or each reason none exists.
 * The arithmetic is worked in tests/unit/measure-paths*.test.ts; here the wiring and the response shape.
 */
const state = vi.hoisted(() => ({ db: null as unknown as Db, user: null as SessionUser | null }));
vi.mock('@/db', () => dbMock(() => state.db));
vi.mock('@/lib/auth/guard', () => guardMock(() => state.user));

const { seedDemo } = await import('@/db/seed');
const { kitChargingSchema } = await import('@/lib/openapi/paths/kits');
const one = await import('@/app/api/v1/kits/[id]/route');
const share = await import('@/app/api/v1/kits/[id]/share/route');
const shared = await import('@/app/api/v1/kits/shared/[token]/route');
const list = await import('@/app/api/v1/kits/route');

const BASE = 'http://localhost:3000';
const req = (method: string, path: string, body?: unknown) =>
  new Request(`${BASE}${path}`, { method, headers: { 'content-type': 'application/json', origin: BASE }, body: body === undefined ? undefined : JSON.stringify(body) });
const params = <T extends Record<string, string>>(p: T) => ({ params: Promise.resolve(p) });
const reviewer = { id: 'demo-user-reviewer', email: 'reviewer@x.example', name: 'reviewer', role: 'reviewer' as Role };
// eslint-disable-next-line @typescript-eslint/no-explicit-any
const body = async (r: Response): Promise<any> => r.json();
type Device = { name: string; paths: { nodes: { itemName: string; efficiency: number }[]; efficiency: number }[]; reasons: string[] };

beforeAll(async () => {
  state.db = createTestDb().db;
  await seedDemo(state.db);
}, 120_000);

describe('budget.charging in the kit JSON', () => {
  it('the owner’s base camp: lanterns have a path with its steps, the radio has each reason; the shape matches the OpenAPI schema', async () => {
    state.user = reviewer;
    const r = await one.GET(req('GET', '/api/v1/kits/demo-kit-base-camp'), params({ id: 'demo-kit-base-camp' }));
    expect(r.status).toBe(200);
    const b = await body(r);
    expect(kitChargingSchema.safeParse(b.budget.charging).success).toBe(true);
    const devices = b.budget.charging.devices as Device[];
    const lanterns = devices.find((d) => d.name.includes('Hearthglow'))!;
    expect(lanterns.paths.length).toBeGreaterThan(0);
    const best = lanterns.paths[0]!;
    // The overall efficiency is the product of the steps' efficiencies.
    expect(best.efficiency).toBeCloseTo(best.nodes.reduce((a, n) => a * n.efficiency, 1), 12);
    // Panel → battery's solar input (0.95) → 12 V socket → socket-to-USB-C adapter (0.9) → lantern: 0.95 × 0.9 = 0.855.
    expect(best.nodes.map((n) => n.itemName).join(' → ')).toMatch(/Heathray 60.*Campcore 20.*socket to USB-C.*Hearthglow/);
    expect(best.efficiency).toBeCloseTo(0.855, 12);
    const radio = devices.find((d) => d.name.includes('Valecaster'))!;
    expect(radio.paths).toEqual([]);
    // Both problems, not only the first: the panel's 18 V and the missing genderless DC lead from the battery.
    expect(radio.reasons.some((x) => /gives 18 V/.test(x))).toBe(true);
    expect(radio.reasons.some((x) => /no cable or adapter in the kit joins .*Campcore.* to .*Valecaster.*genderless DC connector/.test(x))).toBe(true);
  });

  it('the shared view carries the same paths to a guest', async () => {
    state.user = reviewer;
    const s = await share.POST(req('POST', '/api/v1/kits/demo-kit-base-camp/share'), params({ id: 'demo-kit-base-camp' }));
    const { token } = await body(s);
    const own = await body(await one.GET(req('GET', '/api/v1/kits/demo-kit-base-camp'), params({ id: 'demo-kit-base-camp' })));
    state.user = null;
    const g = await shared.GET(req('GET', `/api/v1/kits/shared/${token}`), params({ token }));
    expect(g.status).toBe(200);
    const guest = await body(g);
    expect(guest.budget.charging).toEqual(own.budget.charging);
  });

  it('a free-form kit: the laptop without a 20 V source gets its reason, and with a car charger its path (0.87)', async () => {
    state.user = reviewer;
    const battery = { gearItemId: null, quantity: 1, freeName: 'Camp battery', freeRole: 'storage', freePorts: [{ kind: 'socket-12v', direction: 'output', volts: 12.8, amps: 10 }] };
    const laptop = { gearItemId: null, quantity: 1, freeName: 'Laptop', freeRole: 'device', freePorts: [{ kind: 'usb-c', direction: 'input', pdProfiles: [{ volts: 20, amps: 2.25 }] }] };
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
    const without = await body(await list.POST(req('POST', '/api/v1/kits', { name: 'Laptop kit', tripDays: 1, entries: [battery, laptop] })));
    expect(without.budget.charging.devices[0].reasons).toEqual([
      "Camp battery's 12 V socket gives 12.8 V; Laptop needs 20 V at 2.25 A over USB-C: that takes an adapter that converts the voltage, not just a cable",
    ]);
    const id = without.kit.id as string;
    const patched = await one.PATCH(req('PATCH', `/api/v1/kits/${id}`, { entries: [battery, laptop, charger] }), params({ id }));
    expect(patched.status).toBe(200);
    const dev = (await body(patched)).budget.charging.devices[0] as Device;
    expect(dev.reasons).toEqual([]);
    // battery socket 1 × car charger 0.87 × laptop 1 = 0.87
    expect(dev.paths[0]!.efficiency).toBeCloseTo(0.87, 12);
    expect(dev.paths[0]!.nodes.map((n) => n.itemName)).toEqual(['Camp battery', 'Car charger', 'Laptop']);
  });
});
