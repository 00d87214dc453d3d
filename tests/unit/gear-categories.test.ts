import { describe, expect, it } from 'vitest';
import { CATEGORIES, SPECS, valueRatios, type Specs } from '@/lib/measure';
import { CATEGORY_DEFS, claimableSpecs, isLithium } from '@/lib/gear/categories';
import { formatDuration, formatForInput, formatSignedPercent } from '@/lib/gear/format';
import { parseQuantity } from '@/lib/gear/parse-quantity';
import { claimRows, gearInputSchema } from '@/lib/gear/schemas';

describe('gear categories', () => {
  it('define every lib/measure category once, with known spec keys and parseable examples', () => {
    expect(Object.keys(CATEGORY_DEFS).sort()).toEqual([...CATEGORIES].sort());
    for (const def of Object.values(CATEGORY_DEFS)) {
      for (const spec of def.specs) {
        expect(SPECS[spec.key].quantity).toBe(spec.quantity);
        if (spec.required) expect(spec.basis).toBe('claimed-and-measured');
        if (spec.example) expect(parseQuantity(spec.example, spec.quantity).value).toBeGreaterThan(0);
      }
    }
  });

  it('list only ratios that lib/measure valueRatios produces for the category', () => {
    for (const def of Object.values(CATEGORY_DEFS)) {
      const specs: Specs = {};
      for (const s of def.specs) specs[s.key] = { claimed: s.basis === 'measured-only' ? null : 10, measured: 9 };
      const ids = valueRatios(def.id, specs, { amountMinor: 4000, currency: 'USD' }).map((r) => r.id);
      for (const ratio of def.ratios) expect(ids).toContain(ratio);
    }
  });

  it('keep measured-only specs out of the claim form', () => {
    expect(claimableSpecs('power-bank').map((s) => s.key)).not.toContain('deliveredEnergy');
    expect(isLithium('li-ion')).toBe(true);
    expect(isLithium('agm')).toBe(false);
  });
});

describe('gear input schema', () => {
  const lantern = {
    category: 'light',
    name: 'Test lantern',
    maker: 'Northcairn',
    kind: 'lantern',
    price: { amount: '40.00', currency: 'USD' },
    specs: { mass: { value: '12.3 oz' }, luminousFlux: { value: '300 lm' }, ratedEnergy: { value: '10 400 mAh at 3.6 V', source: 'manual' } },
    modes: [{ name: 'low', luminousFlux: '40 lm', runtime: '30 h' }],
  };

  it('parses typed units into canonical claim rows', () => {
    const data = gearInputSchema.parse(lantern);
    expect(data.price).toEqual({ amountMinor: 4000, currency: 'USD' });
    const rows = claimRows(data);
    // 1 oz = 28.349 523 125 g (1959 agreement); Wh = Ah × V (49 CFR 171.8).
    expect(rows.find((r) => r.key === 'mass')!.value).toBeCloseTo(348.6991344375, 9);
    expect(rows.find((r) => r.key === 'ratedEnergy')).toMatchObject({ value: expect.closeTo(37.44, 9), source: 'manual' });
    expect(rows.find((r) => r.key === 'runtime' && r.mode === 'low')!.value).toBe(108_000);
  });

  it('refuses extra keys, a missing required claim, a negative mass and bad currency decimals', () => {
    const fields = (input: unknown) => {
      const r = gearInputSchema.safeParse(input);
      expect(r.success).toBe(false);
      return r.error!.issues.map((i) => i.path.join('.'));
    };
    expect(fields({ ...lantern, ownerId: 'x', status: 'approved' })).toEqual(['']);
    expect(fields({ ...lantern, specs: { mass: { value: '300 g' } } })).toContain('specs.luminousFlux.value');
    expect(fields({ ...lantern, specs: { ...lantern.specs, mass: { value: '-3 oz' } } })).toContain('specs.mass.value');
    expect(fields({ ...lantern, specs: { ...lantern.specs, mass: { value: '3 stone' } } })).toContain('specs.mass.value');
    expect(fields({ ...lantern, price: { amount: '1500.5', currency: 'JPY' } })).toContain('price.amount'); // ISO 4217: JPY has 0 minor digits
    expect(fields({ ...lantern, kind: 'station' })).toContain('kind');
    expect(fields({ ...lantern, specs: { ...lantern.specs, ratedPower: { value: '10 W' } } })).toContain('specs.ratedPower.value');
  });
});

describe('gear formatting', () => {
  it('formats durations, signed percentages and form text that parses back', () => {
    expect(formatDuration(12_600)).toBe('3 h 30 min');
    expect(formatSignedPercent(0.82)).toBe('−18 %');
    expect(formatSignedPercent(1.05)).toBe('+5 %');
    const g = 12.3 * 28.349523125;
    expect(parseQuantity(formatForInput(g, 'mass'), 'mass').value).toBeCloseTo(g, 9);
    expect(parseQuantity(formatForInput(12_600, 'duration'), 'duration').value).toBeCloseTo(12_600, 9);
  });
});
