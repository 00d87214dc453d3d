import { describe, expect, it } from 'vitest';
import fc from 'fast-check';
import { CATEGORIES, SPEC_KEYS, valueRatios, type Category, type Money, type Specs, type ValueRatio } from '@/lib/measure';
import { expectClose, expectCode, finiteOrMeasureError } from './helpers';

const byId = (rs: ValueRatio[]) => Object.fromEntries(rs.map((r) => [r.id, r]));
const usd = (amountMinor: number): Money => ({ amountMinor, currency: 'USD' });

describe('valueRatios: light', () => {
  // Plain arithmetic (check-values §3): 1000 lm / 150 g = 6.667 lm/g.
  it('lm per g, lm per money, runtime per 100 g', () => {
    const r = byId(
      valueRatios('light', { luminousFlux: { claimed: 1000 }, mass: { measured: 150 }, runtime: { measured: 36000 } }, usd(4000)),
    );
    expect(r['lm-per-g']).toMatchObject({ unit: 'lm/g', higherIsBetter: true, basis: 'mixed' });
    expectClose(r['lm-per-g']!.value, 1000 / 150);
    expect(r['lm-per-money']).toEqual({ id: 'lm-per-money', value: 25, unit: 'lm/USD', higherIsBetter: true, basis: 'claimed' });
    // 10 h over 150 g → 10 / 1.5 h per 100 g.
    expect(r['runtime-h-per-100g']).toMatchObject({ unit: 'h/100 g', basis: 'measured' });
    expectClose(r['runtime-h-per-100g']!.value, 10 / 1.5);
    expect(r['wh-per-kg']).toBeUndefined();
  });

  // 1959 international pound (oz = 28.349523125 g): 500 lm for a 1 oz light = 17.637 lm/g.
  it('500 lm per ounce', () => {
    const r = byId(valueRatios('light', { luminousFlux: { claimed: 500 }, mass: { claimed: 28.349523125 } }));
    expect(r['lm-per-g']!.value).toBeCloseTo(17.637, 3);
    expect(r['lm-per-g']!.basis).toBe('claimed');
  });

  it('Wh/kg for a light that states its rated energy', () => {
    const r = byId(valueRatios('light', { ratedEnergy: { claimed: 10 }, mass: { claimed: 250 } }));
    expect(r['wh-per-kg']).toEqual({ id: 'wh-per-kg', value: 40, unit: 'Wh/kg', higherIsBetter: true, basis: 'claimed' });
  });
});

describe('valueRatios: power banks and batteries', () => {
  // Plain arithmetic (check-values §3): a 72 Wh pack for $40 = 1.8 Wh/$; $40 / 72 Wh = 0.5556 $/Wh.
  it('72 Wh for 40 USD', () => {
    const r = byId(
      valueRatios(
        'power-bank',
        { ratedEnergy: { claimed: 72 }, mass: { measured: 400 }, deliveredEnergy: { measured: 57.6 } },
        usd(4000),
      ),
    );
    expect(r['wh-per-money']).toEqual({ id: 'wh-per-money', value: 1.8, unit: 'Wh/USD', higherIsBetter: true, basis: 'claimed' });
    expect(r['money-per-wh']!.unit).toBe('USD/Wh');
    expect(r['money-per-wh']!.higherIsBetter).toBe(false);
    expectClose(r['money-per-wh']!.value, 40 / 72);
    expect(r['wh-per-kg']).toMatchObject({ value: 180, basis: 'mixed' });
    expectClose(r['delivered-wh-per-money']!.value, 1.44);
    expect(r['delivered-wh-per-money']!.basis).toBe('measured');
    expectClose(r['delivered-vs-rated']!.value, 0.8);
    expect(r['delivered-vs-rated']).toMatchObject({ unit: '', higherIsBetter: true, basis: 'mixed' });
  });

  // ISO 4217 minor units: JPY has 0 digits, KWD 3; "per money" is per major unit.
  it('per major unit of the price currency', () => {
    const yen = byId(valueRatios('battery-12v', { ratedEnergy: { measured: 1280 } }, { amountMinor: 64000, currency: 'JPY' }));
    expect(yen['wh-per-money']).toMatchObject({ value: 0.02, unit: 'Wh/JPY', basis: 'measured' });
    const kwd = byId(valueRatios('battery-12v', { ratedEnergy: { claimed: 1200 } }, { amountMinor: 120000, currency: 'KWD' }));
    expect(kwd['wh-per-money']!.value).toBe(10);
    expect(kwd['money-per-wh']).toMatchObject({ value: 0.1, unit: 'KWD/Wh' });
  });

  it('a measured value wins over a claimed one', () => {
    const r = byId(valueRatios('power-bank', { ratedEnergy: { claimed: 100, measured: 90 }, mass: { claimed: 500, measured: 450 } }));
    expect(r['wh-per-kg']).toMatchObject({ value: 200, basis: 'measured' });
    expect(r['measured-vs-claimed:ratedEnergy']).toMatchObject({ value: 0.9, higherIsBetter: true, basis: 'mixed' });
    expect(r['measured-vs-claimed:mass']).toMatchObject({ value: 0.9, higherIsBetter: false });
  });
});

describe('valueRatios: solar panels and other categories', () => {
  it('W/kg and W per money from the measured rating', () => {
    const r = byId(valueRatios('solar-panel', { ratedPower: { claimed: 100, measured: 85 }, mass: { claimed: 2500 } }, { amountMinor: 17000, currency: 'EUR' }));
    expect(r['w-per-kg']).toMatchObject({ value: 34, unit: 'W/kg', basis: 'mixed' });
    expect(r['w-per-money']).toMatchObject({ value: 0.5, unit: 'W/EUR', basis: 'measured' });
    expect(r['measured-vs-claimed:ratedPower']!.value).toBe(0.85);
  });

  it('radio: only measured ÷ claimed; supply voltage has no better direction', () => {
    const rs = valueRatios('radio', { transmitPower: { claimed: 5, measured: 4 }, supplyVoltage: { claimed: 13.8, measured: 13.8 }, mass: { claimed: 300 } }, usd(9900));
    expect(rs.map((r) => r.id).sort()).toEqual(['measured-vs-claimed:supplyVoltage', 'measured-vs-claimed:transmitPower']);
    expect(byId(rs)['measured-vs-claimed:supplyVoltage']).toMatchObject({ value: 1, higherIsBetter: null });
    expect(byId(rs)['measured-vs-claimed:transmitPower']).toMatchObject({ value: 0.8, higherIsBetter: true });
  });

  it('category ratios stay in their category', () => {
    const specs: Specs = { luminousFlux: { claimed: 100 }, ratedEnergy: { claimed: 10 }, ratedPower: { claimed: 20 }, mass: { claimed: 100 } };
    expect(valueRatios('cable-adapter', specs, usd(100))).toEqual([]);
    expect(valueRatios('other', specs, usd(100))).toEqual([]);
    expect(valueRatios('solar-panel', specs, usd(100)).map((r) => r.id)).toEqual(['w-per-kg', 'w-per-money']);
  });
});

describe('valueRatios: missing, zero and bad inputs', () => {
  it('a ratio with a missing or zero input is absent', () => {
    expect(valueRatios('light', { luminousFlux: { claimed: 1000 }, mass: { measured: 0 } }, usd(0))).toEqual([]);
    expect(valueRatios('light', { luminousFlux: { claimed: 1000 } })).toEqual([]);
    expect(valueRatios('power-bank', { ratedEnergy: { claimed: 0, measured: 0 } }, usd(100))).toEqual([]);
    expect(valueRatios('light', {}, null)).toEqual([]);
    // A zero measured value is used (it is the measured value) and makes its ratios absent.
    expect(valueRatios('light', { luminousFlux: { claimed: 1000, measured: 0 }, mass: { claimed: 100 } })).toEqual([]);
  });

  it('the price never affects basis', () => {
    const r = byId(valueRatios('light', { luminousFlux: { measured: 100 } }, usd(1000)));
    expect(r['lm-per-money']!.basis).toBe('measured');
  });

  it('delivered energy is measured only: a claimed delivered figure is ignored', () => {
    const rs = valueRatios('power-bank', { deliveredEnergy: { claimed: 80, measured: 60 }, ratedEnergy: { claimed: 80 } }, usd(2000));
    expect(rs.map((r) => r.id)).not.toContain('measured-vs-claimed:deliveredEnergy');
    expect(byId(rs)['delivered-wh-per-money']!.value).toBe(3);
    expect(valueRatios('power-bank', { deliveredEnergy: { claimed: 80 } }, usd(2000))).toEqual([]);
  });

  it('throws for unknown categories and specs, negative or non-finite figures, bad money', () => {
    expectCode(() => valueRatios('lamp' as Category, {}), 'unknown-category');
    expectCode(() => valueRatios('light', { weight: { claimed: 1 } } as unknown as Specs), 'unknown-spec');
    expectCode(() => valueRatios('light', { mass: { claimed: -1 } }), 'out-of-range');
    expectCode(() => valueRatios('light', { mass: { measured: Number.NaN } }), 'not-finite');
    expectCode(() => valueRatios('light', {}, { amountMinor: 10.5, currency: 'USD' }), 'not-integer');
    expectCode(() => valueRatios('light', {}, { amountMinor: 1000, currency: 'usd' }), 'unknown-currency');
    expectCode(() => valueRatios('light', {}, { amountMinor: -1, currency: 'USD' }), 'out-of-range');
  });
});

describe('valueRatios properties', () => {
  // Realistic figures on a 0.001 grid (no subnormal doubles, whose ratios overflow and throw not-finite).
  const amount = fc.integer({ min: 0, max: 1e9 }).map((k) => k / 1000);
  const figure = fc.record(
    { claimed: fc.option(amount), measured: fc.option(amount) },
    { requiredKeys: [] },
  );
  const specsArb = fc.dictionary(fc.constantFrom(...SPEC_KEYS), figure) as fc.Arbitrary<Specs>;
  const priceArb = fc.option(fc.record({ amountMinor: fc.integer({ min: 0, max: 10_000_000 }), currency: fc.constantFrom('USD', 'EUR', 'JPY', 'KWD') }));

  it('values are finite and positive; ids are unique; units name the price currency', () => {
    fc.assert(
      fc.property(fc.constantFrom(...CATEGORIES), specsArb, priceArb, (cat, specs, price) => {
        const rs = valueRatios(cat, specs, price);
        expect(new Set(rs.map((r) => r.id)).size).toBe(rs.length);
        for (const r of rs) {
          expect(Number.isFinite(r.value) && r.value > 0).toBe(true);
          if (r.id.includes('money')) expect(r.unit).toContain(price!.currency);
        }
      }),
      { numRuns: 300 },
    );
  });

  it('never returns NaN or ±Infinity from wild input', () => {
    const wild = fc.dictionary(
      fc.constantFrom(...SPEC_KEYS),
      fc.record({ claimed: fc.double(), measured: fc.double() }, { requiredKeys: [] }),
    ) as fc.Arbitrary<Specs>;
    fc.assert(
      fc.property(fc.constantFrom(...CATEGORIES), wild, fc.record({ amountMinor: fc.double(), currency: fc.constantFrom('USD', 'XXX') }), (c, s, p) =>
        finiteOrMeasureError(() => valueRatios(c, s, p)),
      ),
      { numRuns: 300 },
    );
  });
});
