import { describe, expect, it } from 'vitest';
import { findChargingPaths, type KitPowerItem, type PdProfile } from '@/lib/measure';
import { expectClose, expectCode } from './measure/helpers';

// Path efficiency is the product of its steps' efficiencies (identity arithmetic, worked by hand
// beside each case). USB PD levels from check-values §7 (USB PD SPR at 3 A); the radio's supply window
// 13.8 V ± 15 % = 11.73–15.87 V is one radio's specification (check-values §8, [S]).

const SPR_3A: PdProfile[] = [
  { volts: 5, amps: 3 },
  { volts: 9, amps: 3 },
  { volts: 15, amps: 3 },
  { volts: 20, amps: 3 },
];

const panel: KitPowerItem = {
  id: 'panel',
  name: 'Panel',
  role: 'source',
  ports: [{ kind: 'dc-barrel', direction: 'output', volts: 18, watts: 100 }],
};
const battery: KitPowerItem = {
  id: 'battery',
  name: 'Battery',
  role: 'storage',
  ports: [
    { kind: 'solar-input', direction: 'input', voltageWindow: { minVolts: 12, maxVolts: 28 }, efficiency: 0.95 },
    { kind: 'socket-12v', direction: 'output', volts: 12, amps: 10 },
  ],
};
const bankUsbC: KitPowerItem = {
  id: 'bank',
  name: 'Bank',
  role: 'storage',
  ports: [{ kind: 'usb-c', direction: 'both', pdProfiles: SPR_3A, efficiency: 0.9 }],
};
const laptop: KitPowerItem = {
  id: 'laptop',
  name: 'Laptop',
  role: 'device',
  ports: [{ kind: 'usb-c', direction: 'input', pdProfiles: [{ volts: 20, amps: 2.25 }] }],
};
const radio: KitPowerItem = {
  id: 'radio',
  name: 'Radio',
  role: 'device',
  ports: [{ kind: 'genderless-dc', direction: 'input', voltageWindow: { minVolts: 11.73, maxVolts: 15.87 }, amps: 2 }],
};
const carCharger: KitPowerItem = {
  id: 'car-charger',
  name: 'Car charger',
  role: 'adapter',
  from: { kind: 'socket-12v', voltageWindow: { minVolts: 12, maxVolts: 24 }, amps: 6 },
  to: { kind: 'usb-c', pdProfiles: SPR_3A },
  efficiency: 0.9,
};
const radioLead: KitPowerItem = {
  id: 'radio-lead',
  name: 'Radio lead',
  role: 'cable',
  from: { kind: 'socket-12v', amps: 10 },
  to: { kind: 'genderless-dc', amps: 10 },
  efficiency: 0.98,
};

const paths = (items: KitPowerItem[], id: string) => {
  const d = findChargingPaths({ items }).devices.find((x) => x.itemId === id);
  if (!d) throw new Error(`no device ${id}`);
  return d;
};
const route = (p: { steps: { kind: string; itemId: string }[] }) => p.steps.map((s) => `${s.kind}:${s.itemId}`).join(' ');

describe('findChargingPaths: hand-worked kits', () => {
  it('storage → port → cable → device: 0.9 × 0.85 = 0.765', () => {
    const d = paths(
      [
        { id: 'bank', name: 'Bank', role: 'storage', ports: [{ kind: 'usb-a', direction: 'output', amps: 2.4, efficiency: 0.9 }] },
        { id: 'a-to-c', name: 'A-to-C cable', role: 'cable', from: { kind: 'usb-a' }, to: { kind: 'usb-c', amps: 3 }, efficiency: 0.85 },
        { id: 'phone', name: 'Phone', role: 'device', ports: [{ kind: 'usb-c', direction: 'input', amps: 2 }] },
      ],
      'phone',
    );
    expect(d.reasons).toEqual([]);
    expect(d.paths).toHaveLength(1);
    const [p] = d.paths;
    expect(route(p!)).toBe('output:bank link:a-to-c input:phone');
    expectClose(p!.efficiency, 0.765); // 0.9 (bank's USB-A converter) × 0.85 (cable) × 1 (phone)
    expectClose(p!.fromStorageEfficiency!, 0.765);
    expect(p!.startsAt).toBe('storage');
    expect(p!.steps.map((s) => s.description)).toEqual(['USB-A output', 'A-to-C cable (USB-A → USB-C)', 'USB-C input']);
  });

  it('the cable limits the current: a 2 A phone through a 1 A cable has no path, and says why', () => {
    const d = paths(
      [
        { id: 'bank', name: 'Bank', role: 'storage', ports: [{ kind: 'usb-a', direction: 'output', amps: 2.4 }] },
        { id: 'a-to-c', name: 'thin cable', role: 'cable', from: { kind: 'usb-a' }, to: { kind: 'usb-c', amps: 1 } },
        { id: 'phone', name: 'Phone', role: 'device', ports: [{ kind: 'usb-c', direction: 'input', amps: 2 }] },
      ],
      'phone',
    );
    expect(d.paths).toEqual([]);
    expect(d.reasons).toEqual(['Phone needs 5 V at 2 A; Bank through thin cable delivers at most 1 A']);
  });

  it('the radio with no lead: the reason names the connectors; adding the lead gives 1 × 0.98 = 0.98', () => {
    const battery12: KitPowerItem = { ...battery, ports: [battery.ports![1]!] };
    const without = paths([battery12, radio], 'radio');
    expect(without.paths).toEqual([]);
    expect(without.reasons).toEqual(["no cable or adapter in the kit joins Battery's 12 V socket to Radio's genderless DC connector"]);

    const withLead = paths([battery12, radio, radioLead], 'radio');
    expect(withLead.reasons).toEqual([]);
    expect(withLead.paths.map(route)).toEqual(['output:battery link:radio-lead input:radio']);
    expectClose(withLead.paths[0]!.efficiency, 0.98); // socket 1 × lead 0.98 × radio 1
  });

  it("the laptop on a bank that offers at most 9 V gets the issue's reason", () => {
    const d = paths(
      [
        {
          id: 'bank',
          name: 'the bank',
          role: 'storage',
          ports: [
            {
              kind: 'usb-c',
              direction: 'output',
              pdProfiles: [
                { volts: 5, amps: 3 },
                { volts: 9, amps: 2 },
              ],
            },
          ],
        },
        { ...laptop, name: 'the laptop' },
      ],
      'laptop',
    );
    expect(d.paths).toEqual([]);
    expect(d.reasons).toEqual(['the laptop needs 20 V at 2.25 A over USB-C; the bank offers at most 9 V at 2 A']);
  });

  it('panel → battery → car charger → laptop, and on through the bank; storage-only tails are not listed', () => {
    const result = findChargingPaths({ items: [panel, battery, bankUsbC, carCharger, laptop, radio, radioLead] });
    const lap = result.devices.find((d) => d.itemId === 'laptop')!;
    expect(lap.paths.map(route)).toEqual([
      // panel 1 × battery solar input 0.95 × socket 1 × car charger 0.9 × laptop 1 = 0.855
      'output:panel input:battery output:battery link:car-charger input:laptop',
      // … × bank in 0.9 × bank out 0.9 = 0.95 × 0.9 × 0.9 × 0.9 = 0.69255
      'output:panel input:battery output:battery link:car-charger input:bank output:bank input:laptop',
    ]);
    expectClose(lap.paths[0]!.efficiency, 0.855);
    expectClose(lap.paths[0]!.fromStorageEfficiency!, 0.9); // from the battery's socket: 1 × 0.9 × 1
    expectClose(lap.paths[1]!.efficiency, 0.69255);
    expectClose(lap.paths[1]!.fromStorageEfficiency!, 0.9); // from the bank's port: 0.9 × 1
    expect(lap.paths.every((p) => p.startsAt === 'source')).toBe(true);
    // The panel's barrel plug into the solar input is a join to check by hand.
    expect(lap.paths[0]!.cautions.join(' ')).toMatch(/plug fits Battery's solar input/);

    const rad = result.devices.find((d) => d.itemId === 'radio')!;
    // panel 1 × solar input 0.95 × socket 1 × radio lead 0.98 × radio 1 = 0.931
    expect(rad.paths.map(route)).toEqual(['output:panel input:battery output:battery link:radio-lead input:radio']);
    expectClose(rad.paths[0]!.efficiency, 0.931);
    expect(result.truncated).toBe(false);
  });

  it('a panel straight to a device through an adapter has no storage efficiency', () => {
    const regulator: KitPowerItem = {
      id: 'reg',
      name: 'Solar USB regulator',
      role: 'adapter',
      from: { kind: 'dc-barrel', voltageWindow: { minVolts: 6, maxVolts: 24 } },
      to: { kind: 'usb-a', volts: 5, amps: 2.4 },
      efficiency: 0.8,
    };
    const lantern: KitPowerItem = { id: 'lantern', name: 'Lantern', role: 'device', ports: [{ kind: 'usb-a', direction: 'input', amps: 1 }] };
    const d = paths([panel, regulator, lantern], 'lantern');
    expect(d.paths.map(route)).toEqual(['output:panel link:reg input:lantern']);
    expectClose(d.paths[0]!.efficiency, 0.8); // 1 × 0.8 × 1
    expect(d.paths[0]!.fromStorageEfficiency).toBeNull();
  });

  it('a PD source through a plain cable to a barrel keeps only 5 V', () => {
    const trigger: KitPowerItem = { id: 'c-to-barrel', name: 'C-to-barrel cable', role: 'cable', from: { kind: 'usb-c' }, to: { kind: 'dc-barrel' } };
    const fan: KitPowerItem = { id: 'fan', name: 'Fan', role: 'device', ports: [{ kind: 'dc-barrel', direction: 'input', volts: 12, amps: 0.5 }] };
    const d = paths([bankUsbC, trigger, fan], 'fan');
    expect(d.paths).toEqual([]);
    expect(d.reasons).toEqual(['Fan needs 12 V at its DC barrel; Bank through C-to-barrel cable gives 5 V']);
  });

  it("an adapter's output is named after the adapter in reasons", () => {
    const weakCharger: KitPowerItem = { ...carCharger, to: { kind: 'usb-c', pdProfiles: SPR_3A.slice(0, 3) } };
    const battery12: KitPowerItem = { ...battery, ports: [battery.ports![1]!] };
    const d = paths([battery12, weakCharger, laptop], 'laptop');
    expect(d.reasons).toEqual(['Laptop needs 20 V at 2.25 A over USB-C; Car charger offers at most 15 V at 3 A']);
  });

  it('plain reasons when there is nothing to draw from or nothing to plug in', () => {
    expect(paths([radio], 'radio').reasons).toEqual(['the kit has no battery, bank or panel to draw from']);
    expect(paths([battery, { id: 'x', name: 'Stove', role: 'device', ports: [] }], 'x').reasons).toEqual([
      'Stove lists no power input; add its charging or supply port',
    ]);
    expect(
      paths([battery, { id: 'x', name: 'Shaver', role: 'device', ports: [{ kind: 'mains-input', direction: 'input' }] }], 'x').reasons,
    ).toEqual(['Shaver charges only from mains; the kit has no mains outlet']);
  });

  it('a path never visits an item twice and uses each cable once (two storages that could feed each other)', () => {
    const twin = (id: string): KitPowerItem => ({
      id,
      name: id,
      role: 'storage',
      ports: [{ kind: 'usb-c', direction: 'both', pdProfiles: SPR_3A }],
    });
    const d = paths([twin('a'), twin('b'), laptop], 'laptop');
    // a → laptop, a → b → laptop, b → laptop, b → a → laptop; none is the tail of another (no panel).
    expect(d.paths.map(route).sort()).toEqual([
      'output:a input:b output:b input:laptop',
      'output:a input:laptop',
      'output:b input:a output:a input:laptop',
      'output:b input:laptop',
    ]);
  });

  it('rejects malformed kits with clear codes', () => {
    expectCode(() => findChargingPaths(null as never), 'out-of-range');
    expectCode(() => findChargingPaths({ items: [laptop, laptop] }), 'out-of-range'); // id used twice
    expectCode(() => findChargingPaths({ items: [{ ...laptop, role: 'gadget' as never }] }), 'out-of-range');
    expectCode(() => findChargingPaths({ items: [{ ...laptop, quantity: 0 }] }), 'out-of-range');
    expectCode(() => findChargingPaths({ items: [{ ...laptop, quantity: 1.5 }] }), 'not-integer');
    expectCode(() => findChargingPaths({ items: [{ ...carCharger, efficiency: undefined }] }), 'out-of-range');
    expectCode(() => findChargingPaths({ items: [{ ...radioLead, to: { kind: 'genderless-dc', volts: 12 } }] }), 'out-of-range');
    expectCode(() => findChargingPaths({ items: [{ ...radioLead, efficiency: 0 }] }), 'out-of-range');
    expectCode(() => findChargingPaths({ items: [{ ...laptop, from: { kind: 'usb-c' } }] }), 'out-of-range');
    const many = Array.from({ length: 101 }, (_, i) => ({ ...laptop, id: `d${i}` }));
    expectCode(() => findChargingPaths({ items: many }), 'out-of-range');
  });
});
