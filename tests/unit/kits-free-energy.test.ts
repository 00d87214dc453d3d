import { describe, expect, it } from 'vitest';
import { kitBudget, kitEntrySchema, kitTotals, type KitCatalog, type KitCatalogItem, type KitEntryInput } from '@/lib/kits';

/*
 * Free-form batteries and panels in the budget: a typed stored energy (Wh) and rated power (W) count exactly
 * as a catalog item's ratedEnergy / ratedPower do. Formulas: lib/measure/README.md "Power budget" —
 * usable = capacity × depth of discharge (LiFePO4 0.8: common practice, no source; lead-acid 0.5 for an
 * unknown chemistry); solar = rated W × qty × peak sun hours × sky share × (1 − losses), losses 0.14
 * (PVWatts v5 default, NREL/TP-6A20-62641, rounded); draw = load ÷ 0.9 (common practice, no source).
 * Airline bands: over 160 Wh no passenger baggage (IATA passenger lithium battery rules, DGR 2.3).
 */
const settings = { tripDays: 3, peakSunHours: 5, skyShare: 1, lossFraction: null, conversionEfficiency: null };

const light: KitEntryInput = { gearItemId: null, quantity: 1, freeName: 'Camp light', freeDrawW: 5, hoursPerDay: 4 };
const freeBattery: KitEntryInput = { gearItemId: null, quantity: 1, freeName: 'Northcairn Home-built battery box', freeRole: 'storage', freeEnergyWh: 256, chemistry: 'lifepo4' };
const freePanel: KitEntryInput = { gearItemId: null, quantity: 2, freeName: 'Northcairn Folding panel', freeRole: 'source', freeRatedW: 40 };

const catalogItem = (id: string, partial: Partial<KitCatalogItem>): KitCatalogItem => ({ id, slug: id, name: id, maker: 'Northcairn', category: 'other', chemistry: null, priceMinor: null, priceCurrency: null, specs: [], pairedSkyShares: [], ...partial });
const catalog: KitCatalog = {
  box: catalogItem('box', { name: 'Home-built battery box', category: 'battery-12v', chemistry: 'lifepo4', specs: [{ key: 'ratedEnergy', mode: '', basis: 'claimed', value: 256 }] }),
  panel: catalogItem('panel', { name: 'Folding panel', category: 'solar-panel', specs: [{ key: 'ratedPower', mode: '', basis: 'claimed', value: 40 }] }),
};

describe('free-form storage and panels in the power budget', () => {
  it('hand-worked: 256 Wh LiFePO4 box, 2 × 40 W panels, a 5 W light for 4 h over 3 days', () => {
    const budget = kitBudget({ ...settings, entries: [light, freeBattery, freePanel] }, {});
    const r = budget.result!;
    expect(budget.problem).toBeNull();
    // load = 5 W × 4 h × 1 × 1 = 20 Wh/day; draw = 20 ÷ 0.9 = 22.222… Wh/day.
    expect(r.dailyLoadWh).toBeCloseTo(20, 10);
    expect(r.dailyDrawWh).toBeCloseTo(22.2222222, 6);
    // capacity 256 Wh; usable = 256 × 0.8 = 204.8 Wh; autonomy = 204.8 ÷ 22.222… = 9.216 days.
    expect(r.capacityWh).toBe(256);
    expect(r.usableBatteryWh).toBeCloseTo(204.8, 10);
    expect(r.autonomyDays).toBeCloseTo(9.216, 6);
    // solar = 40 W × 2 × 5 h × 1 × (1 − 0.14) = 344 Wh/day; net = 344 − 22.222… = 321.78 Wh/day.
    expect(r.dailySolarWh).toBeCloseTo(344, 10);
    expect(r.netDailyWh).toBeCloseTo(321.7777778, 6);
    // Starting full at 256 Wh, each day min(256, 256 − 22.22 + 344) = 256: the budget closes.
    expect(r.stateOfChargeByDay).toEqual([256, 256, 256]);
    expect(r.closes).toBe(true);
    expect(budget.storage[0]).toMatchObject({ name: 'Northcairn Home-built battery box', capacityWh: 256, capacityBasis: 'typed', depthOfDischarge: 0.8, usableWh: 204.8, airline: 'cargo-only' });
    expect(budget.panels).toEqual([{ index: 2, name: 'Northcairn Folding panel', ratedW: 40, basis: 'typed', quantity: 2 }]);
    // 256 Wh > 160 Wh: passenger baggage refused, as for a catalog battery (IATA DGR 2.3).
    expect(budget.warnings.map((w) => w.code)).toContain('airline-cargo-only');
    // Totals: stored energy 256 Wh × 1.
    expect(kitTotals([light, freeBattery, freePanel], {}).storedWh).toBe(256);
  });

  it('counts exactly as the same figures on catalog items do', () => {
    const free = kitBudget({ ...settings, entries: [light, freeBattery, freePanel] }, {});
    const fromCatalog = kitBudget({ ...settings, entries: [light, { gearItemId: 'box', quantity: 1 }, { gearItemId: 'panel', quantity: 2 }] }, catalog);
    expect(free.input).toEqual(fromCatalog.input);
    expect(free.result).toEqual(fromCatalog.result);
    expect(kitTotals([freeBattery], {}).storedWh).toBe(kitTotals([{ gearItemId: 'box', quantity: 1 }], catalog).storedWh);
  });

  it('quantity multiplies, an unknown chemistry uses the cautious 50 %, and without a figure the entry stays out with a warning', () => {
    // 3 × 100 Wh, chemistry not stated: usable = 100 × 0.5 × 3 = 150 Wh.
    const three = kitBudget({ ...settings, peakSunHours: null, entries: [light, { gearItemId: null, quantity: 3, freeName: 'Spare pack', freeRole: 'storage', freeEnergyWh: 100 }] }, {});
    expect(three.result!.capacityWh).toBe(300);
    expect(three.result!.usableBatteryWh).toBeCloseTo(150, 10);
    expect(three.warnings.map((w) => w.code)).toContain('chemistry-unknown');
    expect(kitTotals([{ gearItemId: null, quantity: 3, freeName: 'Spare pack', freeRole: 'storage', freeEnergyWh: 100 }], {}).storedWh).toBe(300);

    const unknown = kitBudget({ ...settings, entries: [light, { gearItemId: null, quantity: 1, freeName: 'Old pack', freeRole: 'storage' }] }, {});
    expect(unknown.storage).toEqual([]);
    expect(unknown.problem).toMatch(/Add a battery or power bank/);
    expect(unknown.warnings).toContainEqual({ code: 'no-capacity', message: 'Old pack: type its stored energy (Wh) to count it in the budget.' });
    expect(kitBudget({ ...settings, entries: [light, freeBattery, { ...freePanel, freeRatedW: null }] }, {}).panels).toEqual([]);
  });
});

describe('kitEntrySchema: stored energy and rated power', () => {
  const issues = (entry: Record<string, unknown>) => {
    const r = kitEntrySchema.safeParse({ gearItemId: null, quantity: 1, freeName: 'Pack', ...entry });
    return r.success ? [] : r.error.issues.map((i) => `${i.path.join('.')}: ${i.message}`);
  };
  it('accepts them on the role they belong to', () => {
    expect(issues({ freeRole: 'storage', freeEnergyWh: 99.9 })).toEqual([]);
    expect(issues({ freeRole: 'source', freeRatedW: 100 })).toEqual([]);
    expect(issues({ freeRole: 'storage', freeEnergyWh: null })).toEqual([]);
  });
  it('refuses bad figures and the wrong role with clear messages', () => {
    expect(issues({ freeRole: 'storage', freeEnergyWh: 0 })).toEqual(['freeEnergyWh: Stored energy must be more than 0 Wh (leave it empty when not known).']);
    expect(issues({ freeRole: 'storage', freeEnergyWh: -5 })).toEqual(['freeEnergyWh: Stored energy must be more than 0 Wh (leave it empty when not known).']);
    expect(issues({ freeRole: 'storage', freeEnergyWh: 250_000 })).toEqual(['freeEnergyWh: Stored energy is too large for a camp kit (over 100 kWh).']);
    expect(issues({ freeRole: 'storage', freeEnergyWh: '256' })).toEqual(['freeEnergyWh: Stored energy must be a number.']);
    expect(issues({ freeRole: 'source', freeRatedW: 0 })).toEqual(['freeRatedW: Rated power must be more than 0 W (leave it empty when not known).']);
    expect(issues({ freeRole: 'source', freeRatedW: 1e6 })).toEqual(['freeRatedW: Rated power is too large for a camp kit (over 100 kW).']);
    expect(issues({ freeRole: 'device', freeEnergyWh: 50 })).toEqual(['freeEnergyWh: Only a battery or power bank stores energy: choose that role, or leave the stored energy empty.']);
    expect(issues({ freeEnergyWh: 50 })).toEqual(['freeEnergyWh: Only a battery or power bank stores energy: choose that role, or leave the stored energy empty.']);
    expect(issues({ freeRole: 'storage', freeRatedW: 40 })).toEqual(['freeRatedW: Only a solar panel has a rated power here: choose that role, or leave the rated power empty.']);
    expect(kitEntrySchema.safeParse({ gearItemId: 'box', quantity: 1, freeEnergyWh: 50 }).error!.issues[0]!.message).toBe('A catalog entry takes its rated energy and rated power from the catalog.');
  });
});
