import { describe, expect, it } from 'vitest';
import { displayValue, hasImperialDisplay, imperialValue, withImperial } from '@/lib/units/display';

describe('imperial display values', () => {
  it('shows masses under a pound in ounces and from a pound in pounds', () => {
    // 1 oz = 28.349 523 125 g exactly; 200 g = 7.054 792 39 oz (international yard and pound agreement, 1959; check-values.md §3).
    expect(imperialValue(200, 'g')).toEqual({ value: expect.closeTo(7.05479239, 8), unit: 'oz' });
    // 3.5 oz = 99.223 330 937 5 g (check-values.md §3 worked example), read back.
    expect(imperialValue(99.2233309375, 'g')!.value).toBeCloseTo(3.5, 12);
    // 1 lb = 453.592 37 g exactly (1959 agreement): exactly one pound is shown as 1 lb, just under as 16 oz.
    expect(imperialValue(453.59237, 'g')).toEqual({ value: 1, unit: 'lb' });
    expect(imperialValue(453.59, 'g')).toEqual({ value: expect.closeTo(453.59 / 28.349523125, 12), unit: 'oz' });
    // 1.25 lb = 566.990 462 5 g (check-values.md §3).
    expect(imperialValue(566.9904625, 'g')).toEqual({ value: expect.closeTo(1.25, 12), unit: 'lb' });
    expect(imperialValue(2, 'kg')).toEqual({ value: expect.closeTo(2000 / 453.59237, 12), unit: 'lb' });
  });

  it('shows lengths under a foot in inches and from a foot in feet', () => {
    // 1 in = 0.0254 m, 1 ft = 0.3048 m exactly (1959 agreement; check-values.md §3).
    expect(imperialValue(0.0254, 'm')).toEqual({ value: expect.closeTo(1, 12), unit: 'in' });
    expect(imperialValue(0.3048, 'm')).toEqual({ value: 1, unit: 'ft' });
    expect(imperialValue(100, 'm')).toEqual({ value: expect.closeTo(100 / 0.3048, 10), unit: 'ft' }); // 328.084 ft
    expect(imperialValue(254, 'mm')).toEqual({ value: expect.closeTo(10, 12), unit: 'in' });
  });

  it('shows temperatures in °F', () => {
    // t/°F = 1.8 · t/°C + 32 (NIST SP 811 B.9; quoted from memory): 0 °C = 32 °F, 100 °C = 212 °F, −40 °C = −40 °F.
    expect(imperialValue(0, 'degC')).toEqual({ value: 32, unit: '°F' });
    expect(imperialValue(100, '°C')).toEqual({ value: 212, unit: '°F' });
    expect(imperialValue(-40, '°C')!.value).toBeCloseTo(-40, 12);
  });

  it('leaves other units alone and metric display unchanged', () => {
    for (const unit of ['lm', 'Wh', 'W', 'V', 's', 'lm/g', 'Wh/USD', '']) {
      expect(hasImperialDisplay(unit)).toBe(false);
      expect(imperialValue(3, unit)).toBeNull();
    }
    expect(imperialValue(Number.NaN, 'g')).toBeNull();
    expect(displayValue(250, 'g', 'metric')).toEqual({ value: 250, unit: 'g' });
    expect(displayValue(400, 'lm', 'imperial')).toEqual({ value: 400, unit: 'lm' });
    expect(displayValue(0.3048, 'm', 'imperial')).toEqual({ value: 1, unit: 'ft' });
  });

  it('adds imperial to a figure without changing its fields', () => {
    const figure = { value: 250, unit: 'g', basis: 'claimed' as const, provenance: null };
    expect(withImperial(figure)).toEqual({ ...figure, imperial: { value: expect.closeTo(250 / 28.349523125, 12), unit: 'oz' } });
    const lumens = { value: 400, unit: 'lm' };
    expect(withImperial(lumens)).toBe(lumens);
  });
});
