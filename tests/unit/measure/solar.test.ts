import { describe, expect, it } from 'vitest';
import fc from 'fast-check';
import { combinedLossFraction, expectedDailyWh, PVWATTS_DEFAULT_LOSSES, solarOutput } from '@/lib/measure';
import { expectClose, expectCode, finiteOrMeasureError } from './helpers';

describe('combinedLossFraction (PVWatts Version 5 Manual, NREL/TP-6A20-62641)', () => {
  // NREL/TP-6A20-62641 default system losses in %: soiling 2, shading 3, snow 0, mismatch 2,
  // wiring 2, connections 0.5, light-induced degradation 1.5, nameplate 1, age 0, availability 3.
  // L = 1 − Π(1 − Lᵢ) = 14.0757 % (14.07566068826446 % by exact decimal arithmetic); the plain sum is 15 %.
  const defaults = [0.02, 0.03, 0, 0.02, 0.02, 0.005, 0.015, 0.01, 0, 0.03];

  it('default list → 14.0757 %', () => {
    expectClose(combinedLossFraction(defaults), 0.1407566068826446, 1e-13);
    expect(combinedLossFraction(defaults) * 100).toBeCloseTo(14.0757, 4);
    expect(defaults.reduce((a, b) => a + b, 0)).toBeCloseTo(0.15, 12);
  });

  it('the exported default table holds the same values', () => {
    expect(Object.values(PVWATTS_DEFAULT_LOSSES).sort()).toEqual([...defaults].sort());
  });

  // Closed form: 1 − (1 − 0.5)(1 − 0.5) = 0.75; an empty list loses nothing; one total loss loses everything.
  it('closed forms', () => {
    expect(combinedLossFraction([0.5, 0.5])).toBe(0.75);
    expect(combinedLossFraction([])).toBe(0);
    expect(combinedLossFraction([0.2, 1])).toBe(1);
  });

  it('rejects fractions outside 0–1', () => {
    expectCode(() => combinedLossFraction([0.1, 1.5]), 'out-of-range');
    expectCode(() => combinedLossFraction([-0.1]), 'out-of-range');
    expectCode(() => combinedLossFraction([Number.NaN]), 'not-finite');
  });

  it('stays within 0–1 and never exceeds the plain sum', () => {
    fc.assert(
      fc.property(fc.array(fc.double({ min: 0, max: 1, noNaN: true }), { maxLength: 12 }), (ls) => {
        const l = combinedLossFraction(ls);
        expect(l).toBeGreaterThanOrEqual(0);
        expect(l).toBeLessThanOrEqual(1);
        expect(l).toBeLessThanOrEqual(ls.reduce((a, b) => a + b, 0) + 1e-12);
      }),
      { numRuns: 200 },
    );
  });
});

describe('expectedDailyWh (rated W × peak sun hours × (1 − losses))', () => {
  // Identity arithmetic on the PVWatts losses (NREL/TP-6A20-62641) and peak sun hours (daily kWh/m²
  // ÷ 1 kW/m²): 100 W × 5 h × 0.86 = 430 Wh; with the exact 14.0757 % losses, 429.62 Wh.
  it('100 W at 5 peak sun hours', () => {
    expect(expectedDailyWh(100, 5, 0.14)).toBeCloseTo(430, 10);
    expect(expectedDailyWh(100, 5, 0.1407566068826446)).toBeCloseTo(429.62, 2);
  });

  // NREL TMY3 723650 (as bundled in pvlib test data): mean daily GHI 5.43 kWh/m²/day → 100 W × 5.43 × 0.86 ≈ 467 Wh.
  it('100 W at 5.43 peak sun hours', () => {
    expect(expectedDailyWh(100, 5.43, 0.14)).toBeCloseTo(466.98, 10);
  });

  it('rejects values out of range', () => {
    expectCode(() => expectedDailyWh(-1, 5, 0.14), 'out-of-range');
    expectCode(() => expectedDailyWh(100, 25, 0.14), 'out-of-range');
    expectCode(() => expectedDailyWh(100, 5, 1), 'out-of-range');
    expectCode(() => expectedDailyWh(100, 5, Number.NaN), 'not-finite');
    expectCode(() => expectedDailyWh(1e308, 24, 0), 'not-finite');
  });
});

describe('solarOutput', () => {
  // Closed form: 0 W → 60 W → 0 W over 2 h, linear: area = 60 Wh over 2 h → mean 30 W, peak 60 W; 30/100 = 0.3.
  it('triangle profile', () => {
    const log = [
      { t: 0, watts: 0 },
      { t: 3600, watts: 60 },
      { t: 7200, watts: 0 },
    ];
    expect(solarOutput(log, 100)).toEqual({ meanW: 30, peakW: 60, shareOfRating: 0.3 });
  });

  // Closed form: the mean is time-weighted (trapezoid ÷ duration), not the average of the samples.
  it('weights by time, not by sample count', () => {
    const flat = [
      { t: 0, watts: 40 },
      { t: 10800, watts: 40 },
      { t: 10860, watts: 40 },
    ];
    expect(solarOutput(flat, 50)).toEqual({ meanW: 40, peakW: 40, shareOfRating: 0.8 });
    // 40 W for 3 h, then a 1-minute spike to 100 W: (40 × 10800 + 70 × 30 + 70 × 30) / 10860 W,
    // while the plain average of the four samples would be 55 W.
    const spike = [
      { t: 0, watts: 40 },
      { t: 10800, watts: 40 },
      { t: 10830, watts: 100 },
      { t: 10860, watts: 40 },
    ];
    expectClose(solarOutput(spike, 50).meanW, 436200 / 10860);
    expect(solarOutput(spike, 50).peakW).toBe(100);
    const uneven = [
      { t: 0, watts: 10 },
      { t: 3000, watts: 10 },
      { t: 3600, watts: 20 },
    ];
    // (10 × 3000 + 15 × 600) / 3600 = 39000 / 3600 = 10.8333… W.
    expectClose(solarOutput(uneven, 20).meanW, 39000 / 3600);
  });

  it('rejects bad input', () => {
    expectCode(() => solarOutput([{ t: 0, watts: 1 }, { t: 1, watts: 1 }], 0), 'out-of-range');
    expectCode(() => solarOutput([{ t: 0, watts: 1 }], 10), 'too-few-samples');
    expectCode(() => solarOutput([{ t: 0, watts: 1 }, { t: 0, watts: 1 }], 10), 'unsorted-times');
    fc.assert(
      fc.property(fc.array(fc.record({ t: fc.double(), watts: fc.double() }), { maxLength: 6 }), fc.double(), (log, w) =>
        finiteOrMeasureError(() => solarOutput(log, w)),
      ),
      { numRuns: 300 },
    );
  });
});
