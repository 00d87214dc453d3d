import { describe, expect, it } from 'vitest';
import { gramsTo, massToGrams } from '@/lib/measure/mass';
import { MeasureError } from '@/lib/measure/errors';

describe('mass conversion', () => {
  // International yard and pound agreement (1 July 1959): 1 lb = 0.45359237 kg exactly.
  it('converts pounds with the exact 1959 definition', () => {
    expect(massToGrams(1, 'lb')).toBe(453.59237);
    expect(massToGrams(1.25, 'lb')).toBeCloseTo(566.9904625, 9);
  });

  // 1 oz = 1/16 lb = 28.349523125 g exactly (derived from the 1959 pound).
  it('converts ounces and back', () => {
    expect(massToGrams(3.5, 'oz')).toBeCloseTo(99.2233309375, 9);
    expect(massToGrams(16, 'oz')).toBeCloseTo(453.59237, 9);
    expect(gramsTo(200, 'oz')).toBeCloseTo(7.05479239, 7);
  });

  it('refuses non-finite input with a MeasureError', () => {
    expect(() => massToGrams(Number.NaN, 'g')).toThrow(MeasureError);
    expect(() => massToGrams(Infinity, 'kg')).toThrow(/finite/);
  });
});
