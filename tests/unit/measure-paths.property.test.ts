import { describe, expect, it } from 'vitest';
import fc from 'fast-check';
import { findChargingPaths, type ChargingPath, type KitPowerItem, type PdProfile } from '@/lib/measure';
import { finiteOrMeasureError } from './measure/helpers';

// Properties of the path search (identity arithmetic and graph facts, no outside source needed):
// a path's efficiency is the product of its steps, so it is ≤ every step; no item is entered twice;
// a cable or adapter is used at most once per path; adding a cable never takes a path away.

const SPR_3A: PdProfile[] = [
  { volts: 5, amps: 3 },
  { volts: 9, amps: 3 },
  { volts: 15, amps: 3 },
  { volts: 20, amps: 3 },
];
const eff = fc.integer({ min: 50, max: 100 }).map((n) => n / 100);

// Templates from the demo world: a panel, batteries and banks, devices, cables and adapters.
const templates = {
  panel: (e: number): Omit<KitPowerItem, 'id'> => ({
    name: 'Panel',
    role: 'source',
    ports: [{ kind: 'dc-barrel', direction: 'output', volts: 18, watts: 100, efficiency: e }],
  }),
  battery: (e: number): Omit<KitPowerItem, 'id'> => ({
    name: 'Battery',
    role: 'storage',
    ports: [
      { kind: 'solar-input', direction: 'input', voltageWindow: { minVolts: 12, maxVolts: 28 }, efficiency: e },
      { kind: 'socket-12v', direction: 'output', amps: 10 },
      { kind: 'binding-posts', direction: 'output', volts: 12.8, amps: 50 },
    ],
  }),
  bank: (e: number): Omit<KitPowerItem, 'id'> => ({
    name: 'Bank',
    role: 'storage',
    ports: [
      { kind: 'usb-c', direction: 'both', pdProfiles: SPR_3A, efficiency: e },
      { kind: 'usb-a', direction: 'output', amps: 2.4, efficiency: e },
    ],
  }),
  laptop: (): Omit<KitPowerItem, 'id'> => ({
    name: 'Laptop',
    role: 'device',
    ports: [{ kind: 'usb-c', direction: 'input', pdProfiles: [{ volts: 20, amps: 2.25 }] }],
  }),
  phone: (e: number): Omit<KitPowerItem, 'id'> => ({
    name: 'Phone',
    role: 'device',
    ports: [{ kind: 'usb-c', direction: 'input', amps: 2, efficiency: e }],
  }),
  radio: (): Omit<KitPowerItem, 'id'> => ({
    name: 'Radio',
    role: 'device',
    ports: [{ kind: 'genderless-dc', direction: 'input', voltageWindow: { minVolts: 11.73, maxVolts: 15.87 }, amps: 2 }],
  }),
  aToC: (e: number): Omit<KitPowerItem, 'id'> => ({
    name: 'A-to-C cable',
    role: 'cable',
    from: { kind: 'usb-a' },
    to: { kind: 'usb-c', amps: 3 },
    efficiency: e,
  }),
  radioLead: (e: number): Omit<KitPowerItem, 'id'> => ({
    name: 'Radio lead',
    role: 'cable',
    from: { kind: 'socket-12v' },
    to: { kind: 'genderless-dc', amps: 10 },
    efficiency: e,
  }),
  postsLead: (e: number): Omit<KitPowerItem, 'id'> => ({
    name: 'Posts to genderless lead',
    role: 'cable',
    from: { kind: 'binding-posts' },
    to: { kind: 'genderless-dc', amps: 30 },
    efficiency: e,
  }),
  carCharger: (e: number): Omit<KitPowerItem, 'id'> => ({
    name: 'Car charger',
    role: 'adapter',
    from: { kind: 'socket-12v', voltageWindow: { minVolts: 12, maxVolts: 24 }, amps: 6 },
    to: { kind: 'usb-c', pdProfiles: SPR_3A },
    efficiency: e,
  }),
};
type TemplateName = keyof typeof templates;
const names = Object.keys(templates) as TemplateName[];
const cableNames: TemplateName[] = ['aToC', 'radioLead', 'postsLead', 'carCharger'];

const itemArb = (kinds: TemplateName[]) =>
  fc.tuple(fc.constantFrom(...kinds), eff).map(([t, e]) => ({ t, e }));
const kitArb = fc.array(itemArb(names), { minLength: 1, maxLength: 8 });
const build = (spec: { t: TemplateName; e: number }[]): KitPowerItem[] =>
  spec.map((s, i) => ({ id: `${s.t}-${i}`, ...templates[s.t](s.e) }));

const key = (p: ChargingPath) => p.steps.map((s) => `${s.kind}:${s.itemId}:${s.portIndex ?? ''}`).join('|');

describe('findChargingPaths properties', () => {
  it('efficiency is the product of the steps and ≤ every step; no item entered twice; each link once', () => {
    fc.assert(
      fc.property(kitArb, (spec) => {
        const result = findChargingPaths({ items: build(spec) });
        expect(result.truncated).toBe(false);
        for (const d of result.devices) {
          expect(d.paths.length === 0).toBe(d.reasons.length > 0);
          for (const p of d.paths) {
            const product = p.steps.reduce((a, s) => a * s.efficiency, 1);
            expect(Math.abs(p.efficiency - product)).toBeLessThanOrEqual(1e-12);
            for (const s of p.steps) expect(p.efficiency).toBeLessThanOrEqual(s.efficiency + 1e-12);
            expect(p.efficiency).toBeGreaterThan(0);
            if (p.fromStorageEfficiency !== null) expect(p.fromStorageEfficiency).toBeGreaterThanOrEqual(p.efficiency - 1e-12);
            const entered = p.steps.filter((s) => s.kind === 'input').map((s) => s.itemId);
            expect(new Set(entered).size).toBe(entered.length);
            const linksUsed = p.steps.filter((s) => s.kind === 'link').map((s) => s.itemId);
            expect(new Set(linksUsed).size).toBe(linksUsed.length);
            expect(p.steps.at(-1)).toMatchObject({ kind: 'input', itemId: d.itemId });
            expect(p.steps[0]!.kind).toBe('output');
          }
        }
      }),
      { numRuns: 200 },
    );
  });

  it('adding a cable or adapter never removes a path (it stays listed, or becomes the tail of a panel path)', () => {
    fc.assert(
      fc.property(kitArb, itemArb(cableNames), (spec, extra) => {
        const before = findChargingPaths({ items: build(spec) });
        const after = findChargingPaths({ items: build([...spec, extra]) });
        for (const d of before.devices) {
          const a = after.devices.find((x) => x.itemId === d.itemId)!;
          const listed = a.paths.map(key);
          for (const p of d.paths) {
            const k = key(p);
            expect(listed.some((l) => l === k || l.endsWith(`|${k}`)), k).toBe(true);
          }
          if (d.paths.length > 0) expect(a.paths.length).toBeGreaterThan(0);
        }
      }),
      { numRuns: 200 },
    );
  });

  it('any JSON, or a valid kit with one field replaced by any JSON, gives a MeasureError or finite figures', () => {
    fc.assert(fc.property(fc.jsonValue(), (v) => finiteOrMeasureError(() => findChargingPaths(v as never))), { numRuns: 200 });
    fc.assert(
      fc.property(fc.array(fc.jsonValue(), { maxLength: 4 }), (items) => finiteOrMeasureError(() => findChargingPaths({ items } as never))),
      { numRuns: 200 },
    );
    const field = fc.constantFrom('id', 'name', 'role', 'quantity', 'ports', 'from', 'to', 'efficiency');
    fc.assert(
      fc.property(kitArb, fc.nat(), field, fc.jsonValue(), (spec, at, key, value) => {
        const items = build(spec) as unknown as Record<string, unknown>[];
        const target = items[at % items.length] as Record<string, unknown>;
        target[key] = value;
        finiteOrMeasureError(() => findChargingPaths({ items } as never));
      }),
      { numRuns: 300 },
    );
  });

  it('prototype-polluting keys in a kit are ignored', () => {
    const kit = JSON.parse(
      '{"items":[{"id":"b","name":"Bank","role":"storage","__proto__":{"polluted":1},"ports":[{"kind":"usb-a","direction":"output","constructor":{"prototype":{"polluted":1}}}]},' +
        '{"id":"l","name":"Lantern","role":"device","ports":[{"kind":"usb-a","direction":"input","amps":1}]}]}',
    );
    const r = findChargingPaths(kit);
    expect(r.devices[0]!.paths).toHaveLength(1);
    expect(({} as Record<string, unknown>).polluted).toBeUndefined();
  });

  it('a dense kit stays within the search bounds and says so', () => {
    const items: KitPowerItem[] = [];
    for (let i = 0; i < 12; i++) items.push({ id: `bank-${i}`, ...templates.bank(0.9) });
    for (let i = 0; i < 12; i++) items.push({ id: `cable-${i}`, ...templates.aToC(0.95) });
    items.push({ id: 'phone', ...templates.phone(1) });
    const result = findChargingPaths({ items });
    const phone = result.devices[0]!;
    expect(phone.paths.length).toBeGreaterThan(0);
    expect(phone.paths.length).toBeLessThanOrEqual(50);
    expect(result.truncated).toBe(true);
    // Cut short, it still lists the best route first: a bank's USB-C port (0.9) straight to the phone
    // (1) = 0.9, ahead of USB-A (0.9) × A-to-C cable (0.95) = 0.855.
    expect(phone.paths[0]!.efficiency).toBeCloseTo(0.9, 12);
    expect(phone.paths[0]!.steps).toHaveLength(2);
    expect(phone.paths.filter((p) => p.steps.length === 2)).toHaveLength(12); // every bank directly
  });
});
