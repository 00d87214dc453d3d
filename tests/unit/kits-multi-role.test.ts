import { describe, expect, it } from 'vitest';
import { catalogItem } from '../support/kit-catalog-item';
import { findChargingPaths } from '@/lib/measure';
import { gathersSolar, kitBudget, kitChargingPaths, kitPowerItems, kitRoles, kitTotals, storesEnergy, storesEnergyAsSecondRole, type KitCatalog, type KitEntryInput } from '@/lib/kits';

/*
 * Multi-role gear in kits (issue 9): an item that also serves as a power bank or 12 V battery counts its
 * stored energy in the budget and is a battery or bank in charging paths, through its output ports.
 * Invented items. Rated energy = capacity × nominal voltage (49 CFR 171.8): 5 Ah × 3.7 V = 18.5 Wh.
 * Li-ion default depth of discharge 0.8: common practice, no source (check-values §5).
 * Path efficiency = product of the steps' efficiencies (lib/measure/README.md "Charging paths").
 */
const item = catalogItem;

const lantern = item('lantern', {
  name: 'Lantern',
  category: 'light',
  alsoServesAs: ['power-bank'],
  chemistry: 'li-ion',
  specs: [
    { key: 'ratedEnergy', mode: '', basis: 'claimed', value: 18.5 },
    { key: 'powerDraw', mode: 'high', basis: 'claimed', value: 3.8 },
  ],
  ports: [
    { kind: 'usb-c', direction: 'input', volts: 5, amps: 1 },
    { kind: 'usb-a', direction: 'output', volts: 5, amps: 1, efficiency: 0.85 },
  ],
});
const aToC = item('aToC', {
  name: 'A-to-C lead',
  category: 'cable-adapter',
  ports: [
    { kind: 'usb-a', direction: 'input', amps: 3 },
    { kind: 'usb-c', direction: 'output', amps: 3 },
  ],
});
const plainLantern = item('plain', { name: 'Plain lantern', category: 'light', chemistry: 'li-ion', specs: lantern.specs, ports: lantern.ports });
const catalog: KitCatalog = { lantern, aToC, plain: plainLantern };

const entry = (gearItemId: string, extra: Partial<KitEntryInput> = {}): KitEntryInput => ({ gearItemId, quantity: 1, ...extra });
const phone: KitEntryInput = { gearItemId: null, quantity: 1, freeName: 'Phone', freeRole: 'device', freeDrawW: 2, hoursPerDay: 1, freePorts: [{ kind: 'usb-c', direction: 'input', volts: 5, amps: 1 }] };
const settings = { tripDays: 1, conversionEfficiency: 0.9 };

describe('roles of a catalog item in a kit', () => {
  it('primary category first, then what it also serves as', () => {
    expect(kitRoles(lantern)).toEqual(['light', 'power-bank']);
    expect(storesEnergy(lantern)).toBe(true);
    expect(storesEnergyAsSecondRole(lantern)).toBe(true);
    expect(storesEnergy(plainLantern)).toBe(false);
    expect(storesEnergy(item('b', { category: 'battery-12v' }))).toBe(true);
    expect(storesEnergyAsSecondRole(item('b', { category: 'battery-12v' }))).toBe(false);
    expect(storesEnergy(item('r', { category: 'radio', alsoServesAs: ['battery-12v'] }))).toBe(true);
    expect(gathersSolar(item('l', { category: 'light', alsoServesAs: ['solar-panel'] }))).toBe(true);
    expect(gathersSolar(lantern)).toBe(false);
  });
});

describe('a lantern that also serves as a power bank', () => {
  it('counts its stored energy in the totals and the budget, and stays a load', () => {
    const entries = [entry('lantern', { hoursPerDay: 4 })];
    expect(kitTotals(entries, catalog).storedWh).toBe(18.5);
    expect(kitTotals(entries, catalog).deviceCellsWh).toBe(0);
    // Without the second role the same cells are device cells, not kit storage.
    expect(kitTotals([entry('plain', { hoursPerDay: 4 })], catalog)).toMatchObject({ storedWh: 0, deviceCellsWh: 18.5 });

    const b = kitBudget({ ...settings, entries }, catalog);
    expect(b.storage).toHaveLength(1);
    // 18.5 Wh × 0.8 (li-ion default) = 14.8 Wh usable.
    expect(b.storage[0]).toMatchObject({ name: 'Testmaker Lantern', capacityWh: 18.5, depthOfDischarge: 0.8 });
    expect(b.storage[0]!.usableWh).toBeCloseTo(14.8, 12);
    // Its light is still a load: 3.8 W × 4 h = 15.2 Wh a day.
    expect(b.loads.map((l) => [l.name, l.dailyWh])).toEqual([['Testmaker Lantern', 15.2]]);
    expect(b.problem).toBeNull();
    expect(b.result).not.toBeNull();
  });

  it('is a bank in charging paths through its USB-A output: lantern 0.85 × lead 1 × phone 1 = 0.85', () => {
    const entries = [entry('lantern'), entry('aToC'), phone];
    const charging = kitChargingPaths({ entries }, catalog);
    const ph = charging.devices.find((d) => d.name === 'Phone')!;
    expect(ph.reasons).toEqual([]);
    expect(ph.paths).toHaveLength(1);
    expect(ph.paths[0]!.nodes.map((n) => `${n.itemName}: ${n.detail}`)).toEqual(['Testmaker Lantern: USB-A output', 'Testmaker A-to-C lead: USB-A → USB-C', 'Phone: USB-C input']);
    expect(ph.paths[0]!.efficiency).toBeCloseTo(0.85, 12);
    expect(ph.paths[0]!.fromStorageEfficiency).toBeCloseTo(0.85, 12);
    // The phone's 2 W × 1 h now draws through that path's efficiency from storage, not the kit's 0.9.
    const b = kitBudget({ ...settings, entries }, catalog);
    expect(b.loads.find((l) => l.name === 'Phone')).toMatchObject({ efficiencyFrom: 'path', efficiency: 0.85 });
  });

  it('the lantern as a device cannot charge from itself: its own reason is that nothing else is there', () => {
    const charging = kitChargingPaths({ entries: [entry('lantern'), entry('aToC')] }, catalog);
    const own = charging.devices.find((d) => d.name === 'Testmaker Lantern')!;
    expect(own.paths).toEqual([]);
    expect(own.reasons).toEqual(['the kit has no battery, bank or panel to draw from']);
  });

  it('both roles are one unit for the path finder: no path leaves it and comes back in', () => {
    const items = kitPowerItems([entry('lantern'), entry('aToC')], catalog);
    expect(items.map((i) => [i.id, i.role, i.unit])).toEqual([
      ['entry-0', 'device', 'entry-0'],
      ['entry-0:storage', 'storage', 'entry-0'],
      ['entry-1', 'cable', undefined],
    ]);
    // Same kit without the shared unit: the lantern would "charge itself" through the lead (5 V 1 A out meets its 5 V 1 A input).
    const apart = items.map((i) => ({ ...i, unit: undefined }));
    expect(findChargingPaths({ items: apart }).devices[0]!.paths).toHaveLength(1);
    expect(findChargingPaths({ items }).devices[0]!.paths).toHaveLength(0);
  });

  it('a plain lantern is only a device: nothing in the kit to draw from, no storage in the budget', () => {
    const charging = kitChargingPaths({ entries: [entry('plain'), entry('aToC'), phone] }, catalog);
    expect(charging.devices.find((d) => d.name === 'Phone')!.reasons).toEqual(['the kit has no battery, bank or panel to draw from']);
    expect(kitBudget({ ...settings, entries: [entry('plain', { hoursPerDay: 4 })] }, catalog).storage).toEqual([]);
  });
});
