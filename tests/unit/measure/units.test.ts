import { describe, expect, it } from 'vitest';
import fc from 'fast-check';
import { unit as mathUnit } from 'mathjs';
import {
  CANONICAL_UNIT,
  convert,
  quantityOf,
  UNITS_BY_QUANTITY,
  UNIT_SYMBOLS,
  type Quantity,
  type UnitSymbol,
} from '@/lib/measure';
import { expectClose, expectCode, finiteOrMeasureError } from './helpers';


describe('convert: exact defining constants', () => {
  // International yard and pound agreement (1959): 1 yd = 0.9144 m exactly; 1 ft = yd/3, 1 in = ft/12, 1 mi = 1760 yd.
  it('length from the 1959 international yard', () => {
    expect(convert(1, 'yd', 'm')).toBe(0.9144);
    expect(convert(1, 'ft', 'm')).toBe(0.3048);
    expect(convert(1, 'in', 'm')).toBe(0.0254);
    expect(convert(1, 'mi', 'm')).toBe(1609.344);
    expect(convert(1, 'in', 'mm')).toBeCloseTo(25.4, 12);
    expect(convert(3, 'ft', 'yd')).toBeCloseTo(1, 14);
    expect(convert(1, 'mi', 'ft')).toBeCloseTo(5280, 9);
    expect(convert(1, 'km', 'm')).toBe(1000);
    expect(convert(250, 'cm', 'm')).toBe(2.5);
  });

  // IEC 60050-845 ("lux"): 1 lm/ft² = 1 fc = 10.764 lx (rounded). Exact value derived from
  // 1 ft = 0.3048 m: 1/0.09290304 = 10.763910416709722 lx.
  it('foot-candle to lux', () => {
    expect(convert(1, 'fc', 'lx')).toBeCloseTo(10.763910416709722, 12);
    expect(convert(1, 'fc', 'lx')).toBeCloseTo(10.764, 3);
    expect(convert(10, 'fc', 'lx')).toBeCloseTo(107.639104167, 8);
    expect(convert(500, 'lx', 'fc')).toBeCloseTo(46.45152, 10);
  });

  // SI: 1 Wh = 3600 J (1 W × 3600 s); 1 kWh = 1000 Wh.
  it('energy', () => {
    expect(convert(18000, 'J', 'Wh')).toBe(5);
    expect(convert(1, 'kWh', 'J')).toBe(3_600_000);
    expect(convert(1500, 'Wh', 'kWh')).toBe(1.5);
    expect(convert(2.5, 'kW', 'W')).toBe(2500);
  });

  // SI: 1 min = 60 s, 1 h = 3600 s, 1 d = 86 400 s; 1 mA = 10⁻³ A; 1 mAh = 10⁻³ Ah.
  it('duration, current and charge', () => {
    expect(convert(1, 'd', 's')).toBe(86400);
    expect(convert(90, 'min', 'h')).toBe(1.5);
    expect(convert(36000, 's', 'h')).toBe(10);
    expect(convert(2500, 'mA', 'A')).toBe(2.5);
    expect(convert(20000, 'mAh', 'Ah')).toBe(20);
    expect(convert(12.8, 'V', 'V')).toBe(12.8);
  });

  // ITS-90 / SI: T(K) = t(°C) + 273.15; t(°F) = t(°C) × 9/5 + 32 (fixed points by hand).
  it('temperature is affine', () => {
    expect(convert(0, 'degC', 'K')).toBe(273.15);
    expect(convert(32, 'degF', 'degC')).toBe(0);
    expect(convert(212, 'degF', 'degC')).toBe(100);
    expect(convert(-40, 'degC', 'degF')).toBe(-40);
    expect(convert(0, 'K', 'degF')).toBeCloseTo(-459.67, 10);
  });

  it('reports each unit’s quantity and a canonical unit per quantity', () => {
    expect(quantityOf('oz')).toBe('mass');
    expect(quantityOf('fc')).toBe('illuminance');
    for (const [q, units] of Object.entries(UNITS_BY_QUANTITY)) {
      expect(units[0]).toBe(CANONICAL_UNIT[q as Quantity]);
      for (const u of units) expect(quantityOf(u)).toBe(q);
    }
  });
});

describe('convert: errors', () => {
  it('throws unknown-unit for symbols outside the table (case-sensitive)', () => {
    for (const bad of ['G', 'lbs', 'pound', '', 'wh', 'degR', 'toString', '__proto__']) {
      expectCode(() => convert(1, bad, 'g'), 'unknown-unit');
      expectCode(() => convert(1, 'g', bad), 'unknown-unit');
    }
  });

  it('throws incompatible-units across quantities', () => {
    expect(() => convert(1, 'g', 'Wh')).toThrow(/different quantities/);
    expectCode(() => convert(1, 'mAh', 'Wh'), 'incompatible-units');
    expectCode(() => convert(1, 'degC', 'V'), 'incompatible-units');
  });

  it('throws not-finite for non-finite input and overflowing results', () => {
    expectCode(() => convert(Number.NaN, 'm', 'ft'), 'not-finite');
    expectCode(() => convert(-Infinity, 'm', 'ft'), 'not-finite');
    expectCode(() => convert(1e308, 'kWh', 'J'), 'not-finite');
    // A value near the top of the double range that converts to a finite result still works.
    expect(convert(1e306, 'lb', 'kg')).toBeCloseTo(4.5359237e305, -295);
  });
});

/**
 * Cross-check with an independent general-purpose unit library (mathjs, a test-only dev
 * dependency) over every pair of units it shares with lib/measure. mathjs has no lumen,
 * lux or foot-candle, so lm, lx and fc are not cross-checked; it spells the day `day`. Counts (cycles)
 * and per cent are dimensionless and have no conversion to check; dB (a level) has a single unit.
 */
const MATHJS_NAME: Partial<Record<UnitSymbol, string>> = {};
for (const u of UNIT_SYMBOLS) {
  if (u === 'lm' || u === 'lx' || u === 'fc' || u === 'cycles' || u === '%' || u === 'dB') continue;
  MATHJS_NAME[u] = u === 'd' ? 'day' : u;
}

describe('convert: cross-check with mathjs over every shared pair', () => {
  const pairs: [UnitSymbol, UnitSymbol][] = [];
  for (const units of Object.values(UNITS_BY_QUANTITY)) {
    for (const a of units) for (const b of units) if (MATHJS_NAME[a] && MATHJS_NAME[b]) pairs.push([a, b]);
  }

  it('covers every quantity mathjs knows', () => {
    const quantities = new Set(pairs.map(([a]) => quantityOf(a)));
    expect([...quantities].sort()).toEqual(
      ['charge', 'current', 'duration', 'energy', 'length', 'luminousIntensity', 'mass', 'power', 'temperature', 'voltage'].sort(),
    );
    expect(pairs.length).toBeGreaterThan(60);
  });

  it.each(pairs)('%s → %s', (a, b) => {
    for (const value of [0, 1, -3.5, 0.001, 1234.5678, 7e9]) {
      const expected = mathUnit(value, MATHJS_NAME[a]!).toNumber(MATHJS_NAME[b]!);
      expectClose(convert(value, a, b), expected, 1e-12, 1e-9);
    }
  });
});

describe('convert: properties', () => {
  const symbolsOf = (q: Quantity) => UNITS_BY_QUANTITY[q];
  const quantityArb = fc.constantFrom(...(Object.keys(UNITS_BY_QUANTITY) as Quantity[]));
  const pairArb = quantityArb.chain((q) => fc.tuple(fc.constantFrom(...symbolsOf(q)), fc.constantFrom(...symbolsOf(q))));

  it('round trips a → b → a', () => {
    fc.assert(
      fc.property(pairArb, fc.double({ min: -1e9, max: 1e9, noNaN: true }), ([a, b], x) => {
        const back = convert(convert(x, a, b), b, a);
        expectClose(back, x, 1e-12, 1e-9);
      }),
      { numRuns: 300 },
    );
  });

  it('is linear through zero for every quantity but temperature', () => {
    fc.assert(
      fc.property(pairArb, fc.double({ min: 1e-6, max: 1e6, noNaN: true }), ([a, b], x) => {
        if (quantityOf(a) === 'temperature') return;
        expect(convert(0, a, b)).toBe(0);
        expectClose(convert(2 * x, a, b), 2 * convert(x, a, b), 1e-14, 0);
      }),
      { numRuns: 200 },
    );
  });

  it('never returns NaN or ±Infinity: it returns a finite number or throws MeasureError', () => {
    const anyUnit = fc.oneof(fc.constantFrom(...UNIT_SYMBOLS), fc.string({ maxLength: 4 }));
    fc.assert(
      fc.property(fc.double(), anyUnit, anyUnit, (x, a, b) => finiteOrMeasureError(() => convert(x, a, b))),
      { numRuns: 500 },
    );
  });
});
