import { describe, expect, it } from 'vitest';
import { catalogItem } from '../support/kit-catalog-item';
import {
  COMMON_PRACTICE_SKY_SHARE,
  kitBudget,
  kitCsv,
  kitInputSchema,
  kitPatchSchema,
  kitTotals,
  suggestSkyShare,
  UNPUBLISHED_ITEM,
  type KitCatalog,
  type KitEntryInput,
} from '@/lib/kits';

/*
 * Invented test items (no real products). Values are canonical units: W, Wh, g, lm.
 * Formulas: lib/measure/README.md "Power budget" — daily load Σ W × h × duty × qty; draw = load ÷ 0.9
 * (default conversion efficiency, common practice, no source); usable = capacity × depth of discharge;
 * solar = rated W × qty × peak sun hours × sky share × (1 − losses), losses 0.14 (PVWatts v5 default,
 * NREL/TP-6A20-62641, rounded); each day min(capacity, max(0, previous − draw + solar)).
 */
const item = catalogItem;

const catalog: KitCatalog = {
  lantern: item('lantern', {
    name: 'Lantern',
    category: 'light',
    priceMinor: 5999,
    priceCurrency: 'USD',
    specs: [
      { key: 'mass', mode: '', basis: 'claimed', value: 410 },
      { key: 'mass', mode: '', basis: 'measured', value: 428 },
      { key: 'luminousFlux', mode: '', basis: 'claimed', value: 400 },
      { key: 'ratedEnergy', mode: '', basis: 'claimed', value: 19.24 },
      { key: 'powerDraw', mode: 'high', basis: 'claimed', value: 3.8 },
      { key: 'powerDraw', mode: 'high', basis: 'measured', value: 4 },
      { key: 'powerDraw', mode: 'low', basis: 'claimed', value: 0.6 },
    ],
  }),
  radio: item('radio', {
    name: 'Radio',
    category: 'radio',
    priceMinor: 8900,
    priceCurrency: 'USD',
    specs: [
      { key: 'mass', mode: '', basis: 'claimed', value: 245 },
      { key: 'powerDraw', mode: 'receive', basis: 'claimed', value: 0.518 },
      { key: 'powerDraw', mode: 'transmit', basis: 'claimed', value: 11.84 },
    ],
  }),
  battery: item('battery', {
    name: 'Battery',
    category: 'battery-12v',
    priceMinor: 18900,
    priceCurrency: 'USD',
    specs: [
      { key: 'mass', mode: '', basis: 'claimed', value: 2500 },
      { key: 'ratedEnergy', mode: '', basis: 'claimed', value: 256 },
      { key: 'continuousPower', mode: '', basis: 'claimed', value: 256 },
    ],
  }),
  panel: item('panel', {
    name: 'Panel',
    category: 'solar-panel',
    priceMinor: 23900,
    priceCurrency: 'EUR',
    specs: [
      { key: 'mass', mode: '', basis: 'claimed', value: 1800 },
      { key: 'ratedPower', mode: '', basis: 'claimed', value: 60 },
    ],
  }),
};

const camp = (panels: number): KitEntryInput[] => [
  { gearItemId: 'lantern', quantity: 1, hoursPerDay: 4 },
  { gearItemId: 'radio', quantity: 1, loadMode: 'transmit', hoursPerDay: 8, dutyCycle: 0.1 },
  { gearItemId: null, freeName: 'Laptop (charged daily)', quantity: 1, freeDrawW: 60, hoursPerDay: 1.5, freeMassG: 1400 },
  { gearItemId: 'battery', quantity: 1, chemistry: 'lifepo4' },
  { gearItemId: 'panel', quantity: panels },
];
const settings = { tripDays: 3, peakSunHours: 4, skyShare: 0.25, lossFraction: null, conversionEfficiency: null };

describe('kitBudget: a three-day camp kit, worked by hand', () => {
  it('runs short on day 3 with one 60 W panel under overcast', () => {
    const b = kitBudget({ ...settings, entries: camp(1) }, catalog);
    // Lantern: measured 4.0 W beats the claimed 3.8 W → 4 W × 4 h × 1 = 16 Wh.
    expect(b.loads[0]).toMatchObject({ mode: 'high', watts: 4, basis: 'measured', dailyWh: 16 });
    // Radio transmits 10 % of 8 h: 11.84 × 8 × 0.1 = 9.472 Wh; listens the other 90 %: 0.518 × 8 × 0.9 = 3.7296 Wh.
    expect(b.loads[1]).toMatchObject({ mode: 'transmit', basis: 'claimed', dutyCycle: 0.1 });
    expect(b.loads[1]?.dailyWh).toBeCloseTo(9.472, 9);
    expect(b.loads[2]).toMatchObject({ mode: 'receive' });
    expect(b.loads[2]?.dutyCycle).toBeCloseTo(0.9, 12);
    expect(b.loads[2]?.dailyWh).toBeCloseTo(3.7296, 9);
    // Laptop, typed: 60 W × 1.5 h = 90 Wh.
    expect(b.loads[3]).toMatchObject({ basis: 'typed', dailyWh: 90 });
    const r = b.result!;
    // Load 16 + 9.472 + 3.7296 + 90 = 119.2016 Wh; draw 119.2016 ÷ 0.9 = 132.446222… Wh.
    expect(r.dailyLoadWh).toBeCloseTo(119.2016, 9);
    expect(r.dailyDrawWh).toBeCloseTo(132.446222, 5);
    // LiFePO4 default depth 0.8 (common practice, no source): 256 × 0.8 = 204.8 Wh usable; floor 256 − 204.8 = 51.2 Wh.
    expect(r.usableBatteryWh).toBeCloseTo(204.8, 9);
    // Solar 60 W × 4 h × 0.25 × 0.86 = 51.6 Wh a day.
    expect(r.dailySolarWh).toBeCloseTo(51.6, 9);
    // Net 51.6 − 132.446222 = −80.846222 Wh a day.
    // Day 1: 256 − 80.846222 = 175.153778; day 2: 94.307556; day 3: 13.461333 < 51.2 → fails on day 3.
    expect(r.stateOfChargeByDay[0]).toBeCloseTo(175.153778, 5);
    expect(r.stateOfChargeByDay[1]).toBeCloseTo(94.307556, 5);
    expect(r.stateOfChargeByDay[2]).toBeCloseTo(13.461333, 5);
    expect(r.closes).toBe(false);
    expect(b.warnings.find((w) => w.code === 'does-not-close')?.day).toBe(3);
    // Autonomy 204.8 ÷ 132.446222 = 1.546287 days; refill 204.8 ÷ 51.6 = 3.968992 days.
    expect(r.autonomyDays).toBeCloseTo(1.546287, 5);
    expect(r.daysToRefill).toBeCloseTo(3.968992, 5);
    // 256 Wh lithium: over 160 Wh → cargo only (IATA passenger lithium battery table).
    expect(b.warnings.map((w) => w.code)).toContain('airline-cargo-only');
    // All loads at once 4 + 11.84 + 0.518 + 60 = 76.358 W < the battery's 256 W: no overload warning.
    expect(b.warnings.map((w) => w.code)).not.toContain('load-exceeds-battery');
  });

  it('closes with a second panel', () => {
    const r = kitBudget({ ...settings, entries: camp(2) }, catalog).result!;
    // Solar 2 × 51.6 = 103.2 Wh; net 103.2 − 132.446222 = −29.246222.
    // Day 3: 256 − 3 × 29.246222 = 168.261333 ≥ 51.2 → closes.
    expect(r.dailySolarWh).toBeCloseTo(103.2, 9);
    expect(r.stateOfChargeByDay[2]).toBeCloseTo(168.261333, 5);
    expect(r.closes).toBe(true);
  });

  it('holds the state of charge at capacity when the panels gather more than the loads draw', () => {
    // Only the lantern on low: 0.6 W × 5 h = 3 Wh; draw 3 ÷ 0.9 = 3.333 Wh; solar 60 × 5 × 1 × 0.86 = 258 Wh.
    const r = kitBudget(
      { tripDays: 2, peakSunHours: 5, skyShare: null, lossFraction: null, conversionEfficiency: null, entries: [
        { gearItemId: 'lantern', quantity: 1, loadMode: 'low', hoursPerDay: 5 },
        { gearItemId: 'battery', quantity: 1, chemistry: 'lifepo4' },
        { gearItemId: 'panel', quantity: 1 },
      ] },
      catalog,
    ).result!;
    expect(r.dailyDrawWh).toBeCloseTo(3.333333, 5);
    expect(r.dailySolarWh).toBeCloseTo(258, 9);
    expect(r.stateOfChargeByDay).toEqual([256, 256]);
  });

  it('uses the cautious 50 % depth until a chemistry is chosen, and the lead-acid default 50 %', () => {
    const unknown = kitBudget({ ...settings, entries: [{ gearItemId: 'battery', quantity: 1 }] }, catalog);
    // 256 × 0.5 = 128 Wh usable.
    expect(unknown.result?.usableBatteryWh).toBe(128);
    expect(unknown.storage[0]).toMatchObject({ depthFrom: 'cautious', chemistry: null, airline: null });
    expect(unknown.warnings.map((w) => w.code)).toContain('chemistry-unknown');
    // A typed depth wins: 256 × 0.9 = 230.4 Wh (lead-acid "about 50 %" is the default: check-values §5).
    const typed = kitBudget({ ...settings, entries: [{ gearItemId: 'battery', quantity: 2, chemistry: 'agm', depthOfDischarge: 0.9 }] }, catalog);
    expect(typed.result?.usableBatteryWh).toBeCloseTo(460.8, 9);
    expect(typed.storage[0]?.depthFrom).toBe('yours');
  });

  it('says what is missing instead of failing', () => {
    expect(kitBudget({ ...settings, entries: [{ gearItemId: 'lantern', quantity: 1, hoursPerDay: 2 }] }, catalog).problem).toMatch(/battery or power bank/);
    const noSun = kitBudget({ ...settings, peakSunHours: null, entries: camp(1) }, catalog);
    expect(noSun.result).toBeNull();
    expect(noSun.problem).toMatch(/peak sun hours/);
    const noHours = kitBudget({ ...settings, entries: [{ gearItemId: 'lantern', quantity: 1 }, { gearItemId: 'battery', quantity: 1, chemistry: 'lifepo4' }] }, catalog);
    expect(noHours.result?.dailyLoadWh).toBe(0);
    expect(noHours.warnings.map((w) => w.code)).toContain('hours-missing');
  });

  it('leaves unpublished items out and names them only as "unpublished item"', () => {
    const entries: KitEntryInput[] = [{ gearItemId: 'someone-elses-draft', quantity: 1, hoursPerDay: 3 }, ...camp(1)];
    const b = kitBudget({ ...settings, entries }, catalog);
    expect(b.loads.map((l) => l.name)).not.toContain(UNPUBLISHED_ITEM);
    const t = kitTotals(entries, catalog);
    expect(t.hiddenCount).toBe(1);
    expect(kitCsv(entries, catalog)).toContain('Unpublished item,unpublished');
  });
});

describe('kitTotals', () => {
  it('adds mass by category (measured before claimed) and keeps currencies apart', () => {
    const t = kitTotals(camp(2), catalog);
    // Lantern measured 428 + radio 245 + laptop 1400 (typed) + battery 2500 + 2 × 1800 panels = 8173 g.
    expect(t.massG).toBe(8173);
    expect(t.massBasis).toBe('mixed');
    expect(t.massByGroup).toEqual([
      { group: 'light', label: 'Lights', massG: 428 },
      { group: 'battery-12v', label: '12 V batteries', massG: 2500 },
      { group: 'solar-panel', label: 'Solar panels', massG: 3600 },
      { group: 'radio', label: 'Radios', massG: 245 },
      { group: 'free-form', label: 'Your own entries', massG: 1400 },
    ]);
    // EUR 2 × 239.00 = 478.00; USD 59.99 + 89.00 + 189.00 = 337.99 — never added together.
    expect(t.prices).toEqual([
      { currency: 'EUR', amountMinor: 47800 },
      { currency: 'USD', amountMinor: 33799 },
    ]);
    expect(t.priceMissing).toEqual(['Laptop (charged daily)']);
    expect(t.lightLm).toBe(400);
    expect(t.storedWh).toBe(256);
    expect(t.deviceCellsWh).toBe(19.24);
  });
});

describe('kitCsv', () => {
  it('writes one row per entry and defuses formula-looking cells', () => {
    const csv = kitCsv([{ gearItemId: null, freeName: '=HYPERLINK("x")', quantity: 2, freeMassG: 92, freePrice: { amountMinor: 599, currency: 'USD' } }, ...camp(1)], catalog);
    const lines = csv.split('\r\n');
    expect(lines[0]).toMatch(/^entry,source,category,quantity,mass_g_each/);
    expect(lines[1]).toContain(`"'=HYPERLINK(""x"")"`);
    expect(lines[1]).toContain('5.99,USD');
    expect(lines[2]).toContain('Testmaker Lantern,catalog,light,1,428,measured,59.99,USD,4,high,measured,4');
    expect(lines).toHaveLength(7);
  });
});

describe('suggestSkyShare', () => {
  it('prefers paired field tests, else the common-practice default', () => {
    expect(suggestSkyShare('overcast', [{ sky: 'overcast', share: 0.2, note: 'A' }, { sky: 'overcast', share: 0.3, note: 'B' }])).toMatchObject({ share: 0.25, source: 'paired-test' });
    expect(suggestSkyShare('broken-cloud', [{ sky: 'overcast', share: 0.2, note: 'A' }])).toMatchObject({ share: COMMON_PRACTICE_SKY_SHARE['broken-cloud'], source: 'common-practice' });
    expect(suggestSkyShare('clear', []).share).toBe(1);
  });
});

describe('kit schemas', () => {
  const valid = { name: 'Camp', purpose: '', tripDays: 3, entries: camp(1) };
  const fieldsOf = (input: unknown) => {
    const r = kitInputSchema.safeParse(input);
    return r.success ? [] : r.error.issues.map((i) => i.path.join('.'));
  };
  it('accepts a valid kit', () => expect(kitInputSchema.safeParse(valid).success).toBe(true));
  it.each([
    ['negative hours', { ...valid, entries: [{ gearItemId: 'lantern', quantity: 1, hoursPerDay: -1 }] }, 'entries.0.hoursPerDay'],
    ['duty above 1', { ...valid, entries: [{ gearItemId: 'radio', quantity: 1, dutyCycle: 1.5 }] }, 'entries.0.dutyCycle'],
    ['depth of discharge 0', { ...valid, entries: [{ gearItemId: 'battery', quantity: 1, depthOfDischarge: 0 }] }, 'entries.0.depthOfDischarge'],
    ['trip of 0 days', { ...valid, tripDays: 0 }, 'tripDays'],
    ['trip of 10 000 days', { ...valid, tripDays: 10000 }, 'tripDays'],
    ['an unknown key', { ...valid, ownerId: 'x' }, ''],
    ['a nameless free entry', { ...valid, entries: [{ gearItemId: null, quantity: 1 }] }, 'entries.0.freeName'],
    ['a catalog entry with a typed draw', { ...valid, entries: [{ gearItemId: 'lantern', quantity: 1, freeDrawW: 5 }] }, 'entries.0.gearItemId'],
    ['NaN hours', { ...valid, entries: [{ gearItemId: 'lantern', quantity: 1, hoursPerDay: Number.NaN }] }, 'entries.0.hoursPerDay'],
  ])('refuses %s', (_what, input, path) => expect(fieldsOf(input)).toContain(path));
  it('PATCH accepts a subset and refuses unknown keys', () => {
    expect(kitPatchSchema.safeParse({ tripDays: 5 }).success).toBe(true);
    expect(kitPatchSchema.safeParse({ shareToken: 'x' }).success).toBe(false);
  });
});
