import { describe, expect, it } from 'vitest';
import { convert, MeasureError } from '@/lib/measure';

describe('mass conversion', () => {
  // International yard and pound agreement (1 July 1959): 1 lb = 0.45359237 kg exactly.
  it('converts pounds with the exact 1959 definition', () => {
    expect(convert(1, 'lb', 'g')).toBe(453.59237);
    expect(convert(1, 'lb', 'kg')).toBe(0.45359237);
    expect(convert(1.25, 'lb', 'g')).toBeCloseTo(566.9904625, 9);
  });

  // 1 oz = 1/16 lb = 28.349523125 g exactly (derived from the 1959 pound).
  it('converts ounces and back', () => {
    expect(convert(1, 'oz', 'g')).toBe(28.349523125);
    expect(convert(3.5, 'oz', 'g')).toBeCloseTo(99.2233309375, 9);
    expect(convert(16, 'oz', 'g')).toBeCloseTo(453.59237, 9);
    expect(convert(16, 'oz', 'lb')).toBeCloseTo(1, 14);
    expect(convert(200, 'g', 'oz')).toBeCloseTo(7.05479239, 7);
  });

  // 16 CFR 500.19 labelling factors are rounded to six significant digits (1 oz = 28.3495 g,
  // 1 lb = 453.592 g); the exact values agree with them to that precision.
  it('agrees with the rounded labelling factors of 16 CFR 500.19', () => {
    expect(convert(1, 'oz', 'g')).toBeCloseTo(28.3495, 4);
    expect(convert(1, 'lb', 'g')).toBeCloseTo(453.592, 3);
  });

  it('refuses non-finite input with a MeasureError', () => {
    expect(() => convert(Number.NaN, 'g', 'kg')).toThrow(MeasureError);
    expect(() => convert(Infinity, 'kg', 'g')).toThrow(/finite/);
  });
});
