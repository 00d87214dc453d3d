import { describe, expect, it } from 'vitest';
import { parseQuantity, QuantityParseError, tryParseQuantity } from '@/lib/gear/parse-quantity';

const value = (text: string, q: Parameters<typeof parseQuantity>[1]) => parseQuantity(text, q).value;
const code = (text: string, q: Parameters<typeof parseQuantity>[1]) => {
  const r = tryParseQuantity(text, q);
  return r.ok ? 'ok' : r.error.code;
};

describe('parseQuantity: mass', () => {
  it('converts ounces and pounds exactly', () => {
    // International yard and pound agreement (1959): 1 lb = 453.592 37 g; 1 oz = lb/16 = 28.349 523 125 g (check-values §3).
    expect(value('12.3 oz', 'mass')).toBeCloseTo(12.3 * 28.349523125, 9);
    expect(value('3.5 oz', 'mass')).toBeCloseTo(99.2233309375, 9); // check-values §3 worked example
    expect(value('16 oz', 'mass')).toBeCloseTo(453.59237, 9); // check-values §3
    expect(value('2.1 lb', 'mass')).toBeCloseTo(2.1 * 453.59237, 9);
    expect(value('2.1 LBS', 'mass')).toBeCloseTo(2.1 * 453.59237, 9);
  });

  it('takes grams, kilograms and a bare number as grams', () => {
    expect(value('450 g', 'mass')).toBe(450);
    expect(value('1.2 kg', 'mass')).toBeCloseTo(1200, 9);
    const bare = parseQuantity('410', 'mass');
    expect(bare).toEqual({ value: 410, unit: 'g', assumedUnit: true });
  });

  it('supports "1 lb 4 oz" as a sum, largest unit first (decided: supported)', () => {
    // 1.25 lb = 566.990 462 5 g (check-values §3 worked example).
    expect(value('1 lb 4 oz', 'mass')).toBeCloseTo(566.9904625, 9);
    expect(value('1lb4oz', 'mass')).toBeCloseTo(566.9904625, 9);
    expect(code('4 oz 1 lb', 'mass')).toBe('bad-compound');
    expect(code('4 oz 4 oz', 'mass')).toBe('bad-compound');
    expect(code('1 lb 4', 'mass')).toBe('bad-compound');
  });
});

describe('parseQuantity: energy and power', () => {
  it('converts charge at a nominal voltage with Wh = Ah × V (49 CFR 171.8)', () => {
    expect(value('10 400 mAh at 3.6 V', 'energy')).toBeCloseTo(37.44, 9); // 10.4 Ah × 3.6 V
    expect(value('10400 mAh @ 3.6 V', 'energy')).toBeCloseTo(37.44, 9);
    expect(value('10,400mAh@3.6V', 'energy')).toBeCloseTo(37.44, 9);
    expect(value('20 000 mAh at 3.6 V', 'energy')).toBeCloseTo(72, 9); // check-values §4
    expect(value('20000 mAh at 3.7 V', 'energy')).toBeCloseTo(74, 9); // check-values §4
    expect(value('100 Ah at 12.8 V', 'energy')).toBeCloseTo(1280, 9); // check-values §4: 12.8 V × 100 Ah
    expect(value('37 Wh', 'energy')).toBe(37);
    expect(value('1.2 kWh', 'energy')).toBeCloseTo(1200, 9);
  });

  it('needs the voltage for a charge', () => {
    expect(code('10400 mAh', 'energy')).toBe('bad-compound');
    expect(code('10400 mAh at', 'energy')).toBe('not-a-number');
    expect(code('10400 mAh at 0 V', 'energy')).toBe('zero');
    expect(code('10400 mAh at 3.6 A', 'energy')).toBe('bad-compound');
  });

  it('converts current at a supply voltage to watts (P = V × I)', () => {
    expect(value('1.5 A at 13.8 V', 'power')).toBeCloseTo(20.7, 9);
    expect(value('450 mA @ 5 V', 'power')).toBeCloseTo(2.25, 9);
    expect(value('65 W', 'power')).toBe(65);
    expect(code('10 Ah at 5 V', 'power')).toBe('wrong-quantity');
  });
});

describe('parseQuantity: durations and light', () => {
  it('reads hours and minutes', () => {
    expect(value('3 h 30 min', 'duration')).toBe(12_600);
    expect(value('3h30min', 'duration')).toBe(12_600);
    expect(value('90 min', 'duration')).toBe(5400);
    expect(value('5 hrs', 'duration')).toBe(18_000);
    expect(code('3 m', 'duration')).toBe('wrong-quantity'); // m is metres; minutes are "min"
  });

  it('reads foot-candles as lux', () => {
    // 1 fc = 1 lm/ft² = 10.763 910 416 7 lx (IEC 60050-845; exact from 1 ft = 0.3048 m; check-values §2).
    expect(value('10 fc', 'illuminance')).toBeCloseTo(107.639104167, 6);
  });
});

describe('parseQuantity: refusals', () => {
  it('refuses bad input with a message a reviewer can act on', () => {
    expect(code('', 'mass')).toBe('empty');
    expect(code('12 furlongs', 'mass')).toBe('unknown-unit');
    expect(code('-5 g', 'mass')).toBe('negative');
    expect(code('0 g', 'mass')).toBe('zero');
    expect(code('12 Wh', 'mass')).toBe('wrong-quantity');
    expect(code('1,5 kg', 'mass')).toBe('not-a-number');
    expect(code('heavy', 'mass')).toBe('not-a-number');
    expect(code('99999999999 kg', 'mass')).toBe('too-large');
    expect(() => parseQuantity('12 furlongs', 'mass')).toThrow(/Unknown unit "furlongs".*g, kg, oz, lb/);
    expect(() => parseQuantity('1,5 kg', 'mass')).toThrow(QuantityParseError);
    expect(parseQuantity('0 g', 'mass', { allowZero: true }).value).toBe(0);
  });
});

describe('parseQuantity: counts, shares and sizes (issue 4 non-power specs)', () => {
  it('reads cycle ratings as whole counts', () => {
    expect(value('2000 cycles', 'count')).toBe(2000);
    expect(value('4 000 cycles', 'count')).toBe(4000);
    expect(value('500', 'count')).toBe(500);
    expect(code('2000.5 cycles', 'count')).toBe('not-a-number');
    expect(code('2000 g', 'count')).toBe('wrong-quantity');
  });

  it('reads efficiencies in per cent, at most 100 %', () => {
    expect(value('92 %', 'fraction')).toBe(92);
    expect(value('87.5%', 'fraction')).toBe(87.5);
    expect(value('90 percent', 'fraction')).toBe(90);
    expect(code('104 %', 'fraction')).toBe('too-large');
    expect(code('-3 %', 'fraction')).toBe('negative');
    expect(code('12 %', 'mass')).toBe('wrong-quantity');
  });

  it('reads a level difference in dB (radio noise rise), refusing other units', () => {
    // dB is the only unit of the `level` quantity (lib/measure units.ts), so the value is kept as typed.
    expect(value('4.5 dB', 'level')).toBe(4.5);
    expect(value('12 db', 'level')).toBe(12);
    expect(code('3 W', 'level')).toBe('wrong-quantity');
  });

  it('reads folded sizes and cable lengths into metres', () => {
    // 1 in = 0.0254 m exactly (international yard and pound agreement, 1959; check-values §3).
    expect(value('21 in', 'length')).toBeCloseTo(0.5334, 12);
    expect(value('53 cm', 'length')).toBeCloseTo(0.53, 12);
    expect(value('1 ft 6 in', 'length')).toBeCloseTo(0.4572, 12);
  });
});
