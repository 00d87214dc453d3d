import { describe, expect, it } from 'vitest';
import { unit as mathUnit } from 'mathjs';
import { canonicalToTyped, filterUnit, typedToCanonical } from '@/lib/units/filter';

/*
 * Imperial range filters. Factors: 1 oz = 28.349 523 125 g and 1 lb = 453.592 37 g exactly, 1 ft = 0.3048 m
 * exactly (international yard and pound agreement, 1959; NIST SP 811 Appendix B.8 lists them rounded as
 * 2.834 952 E−02 kg and 4.535 924 E−01 kg; check-values.md §3). mathjs (its ounce is 28.349523125e-3 kg,
 * exact, check-values.md §11) is the independent cross-check.
 */
describe('filter units', () => {
  it('types masses in oz (lb for 12 V batteries) and lengths in ft for an imperial reader; metric unchanged', () => {
    expect(filterUnit('g', 'imperial', null)).toBe('oz');
    expect(filterUnit('g', 'imperial', 'light')).toBe('oz');
    expect(filterUnit('g', 'imperial', 'battery-12v')).toBe('lb');
    expect(filterUnit('m', 'imperial', 'light')).toBe('ft');
    expect(filterUnit('lm/g', 'imperial', 'light')).toBe('lm/g');
    expect(filterUnit('g', 'metric', 'battery-12v')).toBe('g');
  });

  it('converts a typed figure to canonical grams / metres for the API', () => {
    // 10 oz × 28.349 523 125 g/oz = 283.495 231 25 g (exact, 1959 agreement)
    expect(Number(typedToCanonical('10', 'oz', 'g'))).toBeCloseTo(283.49523125, 9);
    // 1.25 lb × 453.592 37 g/lb = 566.990 462 5 g (check-values.md §3 worked example)
    expect(Number(typedToCanonical('1.25', 'lb', 'g'))).toBeCloseTo(566.9904625, 9);
    // 3.5 oz = 99.223 330 937 5 g (check-values.md §3 worked example)
    expect(Number(typedToCanonical('3.5', 'oz', 'g'))).toBeCloseTo(99.2233309375, 9);
    // 100 ft × 0.3048 m/ft = 30.48 m (exact)
    expect(typedToCanonical('100', 'ft', 'm')).toBe('30.48');
    // mathjs cross-check on the same inputs
    expect(Number(typedToCanonical('10', 'oz', 'g'))).toBeCloseTo(mathUnit(10, 'oz').toNumber('g'), 9);
    expect(Number(typedToCanonical('1.25', 'lb', 'g'))).toBeCloseTo(mathUnit(1.25, 'lb').toNumber('g'), 9);
  });

  it('leaves blanks as no filter, canonical input untouched, and non-numbers for the API to refuse', () => {
    expect(typedToCanonical('', 'oz', 'g')).toBeNull();
    expect(typedToCanonical('   ', 'oz', 'g')).toBeNull();
    expect(typedToCanonical('300', 'g', 'g')).toBe('300');
    expect(typedToCanonical('1e3', 'oz', 'g')).toBe('1e3'); // not a plain decimal: the API's 400 names min/max.mass
    // A negative figure converts like any other (the API then keeps nothing below it): −2 oz = −56.699 046 25 g.
    expect(Number(typedToCanonical('-2', 'oz', 'g'))).toBeCloseTo(-56.69904625, 9);
  });

  it('shows a stored canonical value back in the typed unit, as typed', () => {
    expect(canonicalToTyped(typedToCanonical('10', 'oz', 'g'), 'oz', 'g')).toBe('10');
    expect(canonicalToTyped(typedToCanonical('0.7', 'oz', 'g'), 'oz', 'g')).toBe('0.7');
    expect(canonicalToTyped('453.59237', 'lb', 'g')).toBe('1'); // 1 lb exactly
    expect(canonicalToTyped('300', 'g', 'g')).toBe('300');
    expect(canonicalToTyped(null, 'oz', 'g')).toBe('');
    // 300 g ÷ 28.349 523 125 g/oz = 10.582 2 oz (six significant digits)
    expect(canonicalToTyped('300', 'oz', 'g')).toBe('10.5822');
  });
});
