import { describe, expect, it } from 'vitest';
import { catalogItem } from '../support/kit-catalog-item';
import {
  catalogPowerRole,
  kitBudget,
  kitChargingPaths,
  kitEntrySchema,
  kitInputSchema,
  kitPowerItems,
  pathText,
  type KitCatalog,
  type KitCatalogItem,
  type KitEntryInput,
} from '@/lib/kits';

/*
 * Invented test items (no real products). Figures in V, A, W, Wh.
 * Path efficiency = the product of its steps' efficiencies (lib/measure/README.md "Charging paths");
 * the budget takes each load's Wh a day ÷ its path's efficiency from storage (README "Power budget").
 * USB PD levels: check-values §7 (USB PD Standard Power Range at 3 A: 5, 9, 15, 20 V → 15, 27, 45, 60 W).
 * A 12 V input takes 12.8 V: the ±10 % nominal tolerance is Trailbench's own convention (no source).
 */
const item = catalogItem;

const catalog: KitCatalog = {
  usbaBank: item('usbaBank', {
    name: 'A-Bank',
    category: 'power-bank',
    chemistry: 'li-ion',
    specs: [{ key: 'ratedEnergy', mode: '', basis: 'claimed', value: 99 }],
    ports: [{ kind: 'usb-a', direction: 'output', volts: 5, amps: 2.4, efficiency: 0.9 }],
  }),
  pdBank: item('pdBank', {
    name: 'C-Bank',
    category: 'power-bank',
    chemistry: 'li-ion',
    specs: [{ key: 'ratedEnergy', mode: '', basis: 'claimed', value: 74 }],
    ports: [{ kind: 'usb-c', direction: 'both', pdProfiles: [{ volts: 5, amps: 3 }, { volts: 9, amps: 2 }], efficiency: 0.9 }],
  }),
  battery: item('battery', {
    name: 'Block',
    category: 'battery-12v',
    chemistry: 'lifepo4',
    specs: [{ key: 'ratedEnergy', mode: '', basis: 'claimed', value: 256 }],
    ports: [{ kind: 'socket-12v', direction: 'output', volts: 12.8, amps: 10 }],
  }),
  acCable: item('acCable', {
    name: 'A-to-C lead',
    category: 'cable-adapter',
    ports: [
      { kind: 'usb-a', direction: 'input', amps: 3 },
      { kind: 'usb-c', direction: 'output', amps: 3 },
    ],
  }),
};

const lamp = (watts: number): KitEntryInput => ({
  gearItemId: null,
  quantity: 1,
  freeName: 'Lamp',
  freeDrawW: watts,
  hoursPerDay: 5,
  freeRole: 'device',
  freePorts: [{ kind: 'usb-c', direction: 'input', volts: 5, amps: 1 }],
});
const lossyCable: KitEntryInput = {
  gearItemId: null,
  quantity: 1,
  freeName: 'Long A-to-C cable',
  freeRole: 'cable',
  freeEfficiency: 0.85,
  freePorts: [
    { kind: 'usb-a', direction: 'input', amps: 3 },
    { kind: 'usb-c', direction: 'output', amps: 3 },
  ],
};
const laptop: KitEntryInput = {
  gearItemId: null,
  quantity: 1,
  freeName: 'Laptop',
  freeDrawW: 30,
  hoursPerDay: 4,
  freeRole: 'device',
  freePorts: [{ kind: 'usb-c', direction: 'input', pdProfiles: [{ volts: 20, amps: 2.25 }] }],
};
const radio: KitEntryInput = {
  gearItemId: null,
  quantity: 1,
  freeName: 'Radio',
  freeDrawW: 10,
  hoursPerDay: 5,
  freeRole: 'device',
  freePorts: [{ kind: 'socket-12v', direction: 'input', volts: 12, amps: 2 }],
};
const carCharger: KitEntryInput = {
  gearItemId: null,
  quantity: 1,
  freeName: 'Car charger',
  freeRole: 'adapter',
  freeEfficiency: 0.87,
  freePorts: [
    { kind: 'socket-12v', direction: 'input' },
    { kind: 'usb-c', direction: 'output', pdProfiles: [{ volts: 5, amps: 3 }, { volts: 9, amps: 3 }, { volts: 15, amps: 3 }, { volts: 20, amps: 3 }] },
  ],
};
const kit = (entries: KitEntryInput[]) => ({ tripDays: 1, peakSunHours: null, skyShare: null, lossFraction: null, conversionEfficiency: null, entries });

describe('kit → findChargingPaths input', () => {
  it('gives catalog items their role by category and free-form entries theirs', () => {
    expect(catalogPowerRole(catalog.battery as KitCatalogItem)).toBe('storage');
    // Both ends state no voltage: a cable that passes power through, not an adapter.
    expect(catalogPowerRole(catalog.acCable as KitCatalogItem)).toBe('cable');
    const items = kitPowerItems(
      [{ gearItemId: 'battery', quantity: 2 }, { gearItemId: 'acCable', quantity: 1 }, carCharger, { gearItemId: 'hidden-one', quantity: 1 }, { gearItemId: null, quantity: 1, freeName: 'Old lamp', freeDrawW: 3 }, { gearItemId: null, quantity: 1, freeName: 'Tarp' }],
      catalog,
    );
    expect(items.map((i) => [i.id, i.role, i.quantity])).toEqual([
      ['entry-0', 'storage', 2],
      ['entry-1', 'cable', 1],
      ['entry-2', 'adapter', 1],
      // entry 3 is a catalog item the viewer may not read: left out; entry 5 neither draws nor has ports.
      ['entry-4', 'device', 1],
    ]);
    expect(items[1]).toMatchObject({ from: { kind: 'usb-a', amps: 3 }, to: { kind: 'usb-c', amps: 3 }, efficiency: 1 });
    expect(items[2]).toMatchObject({ from: { kind: 'socket-12v' }, efficiency: 0.87 });
  });

  it('writes a bank → lossy cable → lamp path with its overall efficiency 0.9 × 0.85 = 0.765', () => {
    const charging = kitChargingPaths({ entries: [{ gearItemId: 'usbaBank', quantity: 1 }, lossyCable, lamp(10)] }, catalog);
    const [device] = charging.devices;
    expect(device?.name).toBe('Lamp');
    expect(device?.paths).toHaveLength(1);
    const path = device!.paths[0]!;
    expect(path.efficiency).toBeCloseTo(0.9 * 0.85, 12);
    expect(path.fromStorageEfficiency).toBeCloseTo(0.765, 12);
    // Weakest step: the bank's USB-A port, 5 V × 2.4 A = 12 W (the cable's 3 A at 5 V would be 15 W).
    expect(path.maxWatts).toBeCloseTo(12, 12);
    expect(pathText(path)).toBe('Testmaker A-Bank (USB-A output, 90 %) → Long A-to-C cable (USB-A → USB-C, 85 %) → Lamp (USB-C input)');
  });

  it('says why a USB-C laptop has no path from a 9 V bank, and finds one once a 12 V car charger joins the battery to it', () => {
    const without = kitChargingPaths({ entries: [{ gearItemId: 'pdBank', quantity: 1 }, { gearItemId: 'battery', quantity: 1 }, laptop, radio] }, catalog);
    const lap = without.devices.find((d) => d.name === 'Laptop');
    expect(lap?.paths).toEqual([]);
    expect(lap?.listsPorts).toBe(true);
    // The laptop asks for 20 V at 2.25 A; the bank's highest PD profile is 9 V at 2 A (18 W < 45 W).
    expect(lap?.reasons.join(' ')).toContain('Laptop needs 20 V at 2.25 A over USB-C; Testmaker C-Bank offers at most 9 V at 2 A');
    // Beside the reason, what the laptop takes and what the kit's storage offers, side by side.
    expect(lap?.takes).toEqual(['USB-C, USB PD 20 V 2.25 A']);
    expect(lap?.offers).toEqual(['Testmaker C-Bank: USB-C, USB PD 5 V 3 A / 9 V 2 A', 'Testmaker Block: 12 V socket, 12.8 V 10 A']);
    const rad = without.devices.find((d) => d.name === 'Radio');
    expect(rad?.takes).toEqual([]);
    // 12.8 V is within 12 V ± 10 % (10.8–13.2 V); 10 A ≥ 2 A. Straight from the battery: efficiency 1.
    expect(rad?.paths[0]?.efficiency).toBe(1);
    expect(rad?.paths[0]?.maxWatts).toBeCloseTo(12.8 * 10, 9);

    const withCharger = kitChargingPaths({ entries: [{ gearItemId: 'pdBank', quantity: 1 }, { gearItemId: 'battery', quantity: 1 }, laptop, radio, carCharger] }, catalog);
    const lap2 = withCharger.devices.find((d) => d.name === 'Laptop');
    expect(lap2?.reasons).toEqual([]);
    expect(lap2?.paths[0]?.nodes.map((n) => n.itemName)).toEqual(['Testmaker Block', 'Car charger', 'Laptop']);
    expect(lap2?.paths[0]?.efficiency).toBeCloseTo(0.87, 12);
    // The charger's best profile, 20 V × 3 A = 60 W (check-values §7), is the weakest stated step (the battery gives 128 W).
    expect(lap2?.paths[0]?.maxWatts).toBeCloseTo(60, 9);
  });

  it('leaves a device without ports unchecked rather than calling it unreachable', () => {
    const charging = kitChargingPaths({ entries: [{ gearItemId: 'battery', quantity: 1 }, { gearItemId: null, quantity: 1, freeName: 'Old lamp', freeDrawW: 3, hoursPerDay: 2 }] }, catalog);
    expect(charging.devices[0]).toMatchObject({ name: 'Old lamp', listsPorts: false, paths: [] });
    const budget = kitBudget(kit([{ gearItemId: 'battery', quantity: 1 }, { gearItemId: null, quantity: 1, freeName: 'Old lamp', freeDrawW: 3, hoursPerDay: 2 }]), catalog);
    expect(budget.warnings.map((w) => w.code)).not.toContain('no-path');
  });
});

describe('power budget with per-path efficiency', () => {
  it('uses the path from storage: 10 W × 5 h ÷ 0.765 = 65.36 Wh taken from the bank', () => {
    const budget = kitBudget(kit([{ gearItemId: 'usbaBank', quantity: 1 }, lossyCable, lamp(10)]), catalog);
    const line = budget.loads[0]!;
    expect(line).toMatchObject({ efficiencyFrom: 'path', dailyWh: 50 });
    expect(line.efficiency).toBeCloseTo(0.765, 12);
    expect(line.pathText).toContain('Long A-to-C cable');
    // 50 Wh ÷ 0.765 = 65.359 Wh (by hand: 50 / 0.765 = 65.3594…).
    expect(budget.result?.dailyDrawWh).toBeCloseTo(65.3595, 3);
    expect(budget.warnings.map((w) => w.code)).not.toContain('load-exceeds-path');
  });

  it('mixes path and kit efficiencies: radio 10 W × 5 h ÷ 1 + laptop 30 W × 4 h ÷ 0.87 = 50 + 137.93 = 187.93 Wh', () => {
    const budget = kitBudget(kit([{ gearItemId: 'battery', quantity: 1 }, laptop, radio, carCharger]), catalog);
    expect(budget.loads.map((l) => [l.name, l.efficiencyFrom])).toEqual([
      ['Laptop', 'path'],
      ['Radio', 'path'],
    ]);
    expect(budget.loads[0]?.efficiency).toBeCloseTo(0.87, 12);
    expect(budget.loads[1]?.efficiency).toBe(1);
    expect(budget.result?.dailyDrawWh).toBeCloseTo(50 + 120 / 0.87, 9);
    expect(budget.result?.dailyDrawWh).toBeCloseTo(187.931, 3);
  });

  it('falls back to the kit figure and warns when a device that lists ports has no path: 30 W × 4 h ÷ 0.8 = 150 Wh', () => {
    const budget = kitBudget({ ...kit([{ gearItemId: 'pdBank', quantity: 1 }, laptop]), conversionEfficiency: 0.8 }, catalog);
    expect(budget.loads[0]).toMatchObject({ efficiencyFrom: 'kit', efficiency: 0.8, pathText: null });
    expect(budget.result?.dailyDrawWh).toBeCloseTo(150, 9);
    const warning = budget.warnings.find((w) => w.code === 'no-path');
    expect(warning?.message).toContain('Laptop: nothing in the kit can run or charge it');
    expect(warning?.message).toContain('9 V at 2 A');
  });

  it('warns when a load draws more than its path delivers: 15 W > 5 V × 2.4 A = 12 W', () => {
    const budget = kitBudget(kit([{ gearItemId: 'usbaBank', quantity: 1 }, lossyCable, lamp(15)]), catalog);
    const warning = budget.warnings.find((w) => w.code === 'load-exceeds-path');
    expect(warning?.message).toBe('Lamp draws 15 W, more than its charging path delivers (at most 12 W at its weakest step).');
  });
});

describe('free-form ports in the kit schema', () => {
  const base = { gearItemId: null, quantity: 1, freeName: 'Thing' };
  const issues = (entry: unknown) => {
    const r = kitEntrySchema.safeParse(entry);
    return r.success ? [] : r.error.issues.map((i) => `${i.path.join('.')}: ${i.message}`);
  };

  it('accepts the entries above and a guest kit holding them', () => {
    for (const e of [lamp(10), lossyCable, laptop, radio, carCharger]) expect(issues(e)).toEqual([]);
    expect(kitInputSchema.safeParse({ name: 'K', tripDays: 2, entries: [laptop, carCharger] }).success).toBe(true);
  });

  it('refuses bad ports with a message naming the problem', () => {
    expect(issues({ ...base, freeRole: 'device', freePorts: [{ kind: 'usb-a', direction: 'output', pdProfiles: [{ volts: 9, amps: 2 }] }] }).join()).toContain('only USB-C ports have USB Power Delivery profiles');
    expect(issues({ ...base, freeRole: 'device', freePorts: [{ kind: 'usb-c', direction: 'input', pdProfiles: [{ volts: 60, amps: 2 }] }] }).join()).toContain('up to 48 V');
    expect(issues({ ...base, freeRole: 'device', freePorts: [{ kind: 'warp-plug', direction: 'input' }] }).join()).toContain('Connector must be one of');
    expect(issues({ ...base, freeRole: 'device', freePorts: [{ kind: 'other', direction: 'input', volts: 12 }] }).join()).toContain('needs a label');
    expect(issues({ ...base, freeRole: 'device', freePorts: [{ kind: 'usb-c', direction: 'input', volts: -5 }] }).join()).toContain('Volts must be more than 0');
    expect(issues({ ...base, freeRole: 'storage', freePorts: [{ kind: 'solar-input', direction: 'output' }] }).join()).toContain('always an input');
  });

  it('checks a cable or adapter has its two ends and an adapter its efficiency', () => {
    expect(issues({ ...base, freeRole: 'cable', freePorts: [{ kind: 'usb-a', direction: 'input' }] }).join()).toContain('two ends');
    expect(issues({ ...carCharger, freeEfficiency: null }).join()).toContain('freeEfficiency: an adapter needs its conversion efficiency');
    expect(issues({ ...lossyCable, freePorts: [{ kind: 'usb-a', direction: 'input', volts: 5 }, { kind: 'usb-c', direction: 'output' }] }).join()).toContain('a cable passes its input through');
    expect(issues({ ...radio, freeEfficiency: 0.9 }).join()).toContain('Only a cable or adapter has an efficiency');
  });

  it('keeps catalog entries to the catalog’s ports', () => {
    expect(issues({ gearItemId: 'battery', quantity: 1, freePorts: [] }).join()).toContain('takes its ports from the catalog');
  });
});
