import { describe, expect, it } from 'vitest';
import fc from 'fast-check';
import { ISO4217_MINOR_UNITS, isCurrencyCode, minorUnitDigits, moneyFromMajor, moneyToMajor } from '@/lib/measure';
import { expectCode } from './helpers';

describe('ISO 4217 minor units', () => {
  // ISO 4217 List One, column "Minor unit" (values from memory of the published list, unconfirmed
  // against the current amendment): USD, EUR, GBP 2; JPY, KRW, ISK, CLP 0; KWD, BHD, OMR, JOD, IQD, TND, LYD 3; CLF, UYW 4.
  it.each([
    ['USD', 2],
    ['EUR', 2],
    ['GBP', 2],
    ['CAD', 2],
    ['JPY', 0],
    ['KRW', 0],
    ['ISK', 0],
    ['CLP', 0],
    ['KWD', 3],
    ['BHD', 3],
    ['OMR', 3],
    ['JOD', 3],
    ['IQD', 3],
    ['TND', 3],
    ['LYD', 3],
    ['CLF', 4],
    ['UYW', 4],
  ] as const)('%s has %d digits', (code, digits) => {
    expect(minorUnitDigits(code)).toBe(digits);
  });

  it('knows only upper-case alphabetic codes with a minor unit', () => {
    for (const code of Object.keys(ISO4217_MINOR_UNITS)) expect(code).toMatch(/^[A-Z]{3}$/);
    expect(Object.keys(ISO4217_MINOR_UNITS).length).toBeGreaterThan(150);
    // ISO 4217 gives "N.A." as the minor unit of gold (XAU) and the SDR (XDR): not prices.
    for (const bad of ['usd', 'XAU', 'XDR', 'XXX', '', 'US', 'toString']) {
      expect(isCurrencyCode(bad)).toBe(false);
      expectCode(() => minorUnitDigits(bad), 'unknown-currency');
    }
  });
});

describe('money in minor and major units', () => {
  it('converts minor units to major', () => {
    expect(moneyToMajor({ amountMinor: 1999, currency: 'USD' })).toBe(19.99);
    expect(moneyToMajor({ amountMinor: 1500, currency: 'JPY' })).toBe(1500);
    expect(moneyToMajor({ amountMinor: 12345, currency: 'KWD' })).toBe(12.345);
  });

  it('converts major units to minor, rounding to the nearest minor unit', () => {
    expect(moneyFromMajor(19.99, 'USD')).toEqual({ amountMinor: 1999, currency: 'USD' });
    expect(moneyFromMajor(0.1 + 0.2, 'EUR')).toEqual({ amountMinor: 30, currency: 'EUR' });
    expect(moneyFromMajor(1.005, 'USD').amountMinor).toBe(100); // 1.005 is 1.00499999… as a double
    expect(moneyFromMajor(-2.5, 'JPY')).toEqual({ amountMinor: -3, currency: 'JPY' });
    expect(moneyFromMajor(1500, 'JPY')).toEqual({ amountMinor: 1500, currency: 'JPY' });
  });

  it('rejects bad money', () => {
    expectCode(() => moneyToMajor({ amountMinor: 1.5, currency: 'USD' }), 'not-integer');
    expectCode(() => moneyToMajor({ amountMinor: Number.NaN, currency: 'USD' }), 'not-finite');
    expectCode(() => moneyToMajor({ amountMinor: 1, currency: 'ABC' }), 'unknown-currency');
    expectCode(() => moneyFromMajor(1e300, 'USD'), 'out-of-range');
    expectCode(() => moneyFromMajor(Infinity, 'USD'), 'not-finite');
  });

  it('round trips minor → major → minor', () => {
    const codes = Object.keys(ISO4217_MINOR_UNITS);
    fc.assert(
      fc.property(fc.integer({ min: -1e12, max: 1e12 }), fc.constantFrom(...codes), (amountMinor, currency) => {
        expect(moneyFromMajor(moneyToMajor({ amountMinor, currency }), currency).amountMinor).toBe(amountMinor);
      }),
      { numRuns: 300 },
    );
  });
});
