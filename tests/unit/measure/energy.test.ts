import { describe, expect, it } from 'vitest';
import fc from 'fast-check';
import { airlineBand, chargeTimeS, chargeToWh, energyWh, type PowerReading } from '@/lib/measure';
import { expectClose, expectCode, finiteOrMeasureError } from './helpers';

/** Independent trapezoid written for the tests (three lines), checked against the numpy examples below. */
function referenceTrapezoid(x: number[], y: number[]): number {
  let s = 0;
  for (let i = 1; i < x.length; i++) s += ((y[i]! + y[i - 1]!) / 2) * (x[i]! - x[i - 1]!);
  return s;
}

describe('chargeToWh (49 CFR 171.8: watt-hour rating = Ah × nominal V)', () => {
  // 49 CFR 171.8 definition, worked: 20 000 mAh × 3.6 V = 72 Wh; × 3.7 V = 74 Wh.
  it('20 000 mAh at 3.6 V and 3.7 V', () => {
    expect(chargeToWh(20000, 'mAh', 3.6)).toBeCloseTo(72, 12);
    expect(chargeToWh(20000, 'mAh', 3.7)).toBeCloseTo(74, 12);
  });

  // 49 CFR 171.8, worked: 26 800 mAh → 96.48 / 99.16 Wh; 27 000 mAh → 97.2 / 99.9 Wh.
  it('other power-bank sizes', () => {
    expect(chargeToWh(26800, 'mAh', 3.6)).toBeCloseTo(96.48, 10);
    expect(chargeToWh(26800, 'mAh', 3.7)).toBeCloseTo(99.16, 10);
    expect(chargeToWh(27000, 'mAh', 3.6)).toBeCloseTo(97.2, 10);
    expect(chargeToWh(27000, 'mAh', 3.7)).toBeCloseTo(99.9, 10);
  });

  // 49 CFR 171.8 with 4 × 3.2 V LiFePO4 = 12.8 V and 6 × 2.0 V lead-acid = 12 V (cell voltages per check-values §4).
  it('12 V batteries in Ah', () => {
    expect(chargeToWh(100, 'Ah', 12.8)).toBe(1280);
    expect(chargeToWh(100, 'Ah', 12)).toBe(1200);
  });

  it('rejects bad input', () => {
    expectCode(() => chargeToWh(-1, 'mAh', 3.7), 'out-of-range');
    expectCode(() => chargeToWh(1000, 'mAh', 0), 'out-of-range');
    expectCode(() => chargeToWh(Number.NaN, 'Ah', 12), 'not-finite');
    expectCode(() => chargeToWh(1000, 'Wh' as 'Ah', 12), 'unknown-unit');
    expectCode(() => chargeToWh(1e300, 'Ah', 1e300), 'not-finite');
  });
});

// IATA, "Passengers travelling with lithium batteries" (2018 passenger table).
describe('airlineBand (IATA passenger lithium battery table)', () => {
  // IATA "Passengers travelling with lithium batteries": ≤ 100 Wh no approval; > 100 to ≤ 160 Wh with
  // operator approval; > 160 Wh cargo only. The boundaries 100 and 160 fall in the lower band.
  it.each([
    [0, 'no-approval'],
    [72, 'no-approval'],
    [99.9, 'no-approval'],
    [100, 'no-approval'],
    [100.000001, 'approval'],
    [160, 'approval'],
    [160.01, 'cargo-only'],
    [1280, 'cargo-only'],
  ] as const)('%d Wh → %s', (wh, band) => {
    expect(airlineBand(wh)).toBe(band);
  });

  it('rejects negative and non-finite energy', () => {
    expectCode(() => airlineBand(-1), 'out-of-range');
    expectCode(() => airlineBand(Number.NaN), 'not-finite');
    expectCode(() => airlineBand(Infinity), 'not-finite');
  });
});

describe('energyWh (composite trapezoidal rule, as numpy.trapezoid / scipy.integrate.trapezoid)', () => {
  // numpy.trapz documentation examples: trapz([1,2,3]) = 4; trapz([1,2,3], x=[4,6,8]) = 8.
  it('the test’s own trapezoid matches the documented numpy examples', () => {
    expect(referenceTrapezoid([0, 1, 2], [1, 2, 3])).toBe(4);
    expect(referenceTrapezoid([4, 6, 8], [1, 2, 3])).toBe(8);
  });

  // Worked example (check-values §9, checked with numpy/scipy): t = 0…2.5 h in 0.5 h steps,
  // P = 10, 9.8, 9.6, 9.5, 9.0, 0 W → 21.45 Wh.
  it('half-hourly log → 21.45 Wh', () => {
    const P = [10, 9.8, 9.6, 9.5, 9.0, 0];
    const log = P.map((watts, i) => ({ t: i * 1800, watts }));
    expect(energyWh(log)).toBeCloseTo(21.45, 10);
  });

  // Worked example: uneven log t = 0, 10, 30, 60 min, P = 12, 11, 10, 8 W → 595 W·min = 9.9167 Wh.
  it('uneven log → 595 W·min', () => {
    const log = [
      { t: 0, watts: 12 },
      { t: 600, watts: 11 },
      { t: 1800, watts: 10 },
      { t: 3600, watts: 8 },
    ];
    expect(energyWh(log)).toBeCloseTo(595 / 60, 12);
    expect(energyWh(log)).toBeCloseTo(9.9167, 4);
  });

  // Closed form: constant 5 W logged every 60 s for 3600 s = 18 000 J = 5 Wh exactly.
  it('constant 5 W for an hour → 5 Wh', () => {
    const log = Array.from({ length: 61 }, (_, i) => ({ t: i * 60, watts: 5 }));
    expect(energyWh(log)).toBe(5);
  });

  // Closed form: P = V × I; 5 V × 2 A for 1 h = 10 Wh; a linear ramp 0 → 20 W over 1 h = 10 Wh.
  it('volts × amps and ramps', () => {
    expect(energyWh([{ t: 0, volts: 5, amps: 2 }, { t: 3600, volts: 5, amps: 2 }])).toBe(10);
    expect(energyWh([{ t: 0, watts: 0 }, { t: 3600, watts: 20 }])).toBe(10);
    expect(energyWh([{ t: 0, volts: 12, amps: 1 }, { t: 1800, watts: 12 }])).toBe(6);
  });

  it('rejects bad logs', () => {
    expectCode(() => energyWh([{ t: 0, watts: 5 }]), 'too-few-samples');
    expectCode(() => energyWh([{ t: 0, watts: 5 }, { t: 0, watts: 5 }]), 'unsorted-times');
    expectCode(() => energyWh([{ t: 10, watts: 5 }, { t: 0, watts: 5 }]), 'unsorted-times');
    expectCode(() => energyWh([{ t: 0, watts: -5 }, { t: 1, watts: 5 }]), 'out-of-range');
    expectCode(() => energyWh([{ t: 0, volts: 5, amps: -1 }, { t: 1, watts: 5 }]), 'out-of-range');
    expectCode(() => energyWh([{ t: 0, volts: 5 } as never, { t: 1, watts: 5 }]), 'bad-sample');
    expectCode(() => energyWh([{ t: 0 } as never, { t: 1, watts: 5 }]), 'bad-sample');
    expectCode(() => energyWh([{ t: 0, watts: Number.NaN }, { t: 1, watts: 5 }]), 'not-finite');
  });
});

describe('energyWh properties', () => {
  const logArb = fc
    .array(fc.tuple(fc.double({ min: 0.001, max: 3600, noNaN: true }), fc.double({ min: 0, max: 2000, noNaN: true })), {
      minLength: 2,
      maxLength: 40,
    })
    .map((pairs) => {
      let t = 0;
      return pairs.map(([dt, watts], i) => {
        if (i > 0) t += dt;
        return { t, watts };
      });
    });

  it('agrees with an independent trapezoid', () => {
    fc.assert(
      fc.property(logArb, (log) => {
        const expected = referenceTrapezoid(log.map((r) => r.t), log.map((r) => r.watts)) / 3600;
        expectClose(energyWh(log), expected, 1e-12, 1e-12);
      }),
      { numRuns: 200 },
    );
  });

  it('is additive over a series split at a shared sample', () => {
    fc.assert(
      fc.property(logArb.filter((log) => log.length >= 3), fc.nat(), (log, k) => {
        const cut = 1 + (k % (log.length - 2)); // 1 … length − 2: both parts keep ≥ 2 samples
        const left = log.slice(0, cut + 1);
        const right = log.slice(cut);
        expectClose(energyWh(left) + energyWh(right), energyWh(log), 1e-11, 1e-12);
      }),
      { numRuns: 200 },
    );
  });

  it('never returns NaN or ±Infinity', () => {
    const sample = fc.oneof(
      fc.record({ t: fc.double(), watts: fc.double() }),
      fc.record({ t: fc.double(), volts: fc.double(), amps: fc.double() }),
    );
    fc.assert(
      fc.property(fc.array(sample, { maxLength: 6 }), (log) => finiteOrMeasureError(() => energyWh(log as PowerReading[]))),
      { numRuns: 300 },
    );
    fc.assert(
      fc.property(
        fc.array(fc.double({ min: 0, max: 1.7e308, noNaN: true }), { minLength: 2, maxLength: 5 }),
        (watts) => finiteOrMeasureError(() => energyWh(watts.map((w, i) => ({ t: i * 1e300, watts: w })))),
      ),
      { numRuns: 100 },
    );
  });
});

describe('chargeTimeS (end: input below 5 % of peak for 5 min — common practice, no source)', () => {
  // Closed form: 20 W until 3600 s, linear to 0 W at 3700 s, then 0 W. 5 % of peak = 1 W, reached at
  // 3600 + 19/20 × 100 = 3695 s; it stays below for the 5 minutes logged after.
  it('ends where input falls below 5 % of peak', () => {
    const log = [
      { t: 0, watts: 20 },
      { t: 3600, watts: 20 },
      { t: 3700, watts: 0 },
      { t: 4200, watts: 0 },
    ];
    expect(chargeTimeS(log)).toBe(3695);
  });

  it('counts from the first sample', () => {
    const log = [
      { t: 100, watts: 10 },
      { t: 200, watts: 10 },
      { t: 200.5, watts: 0.25 },
      { t: 600, watts: 0.25 },
    ];
    // 5 % of 10 W = 0.5 W, crossed on 200 → 200.5 at 200 + (9.5/9.75) × 0.5.
    expectClose(chargeTimeS(log)!, 100 + (9.5 * 0.5) / 9.75);
  });

  it('ignores a dip shorter than 5 minutes', () => {
    const log = [
      { t: 0, watts: 10 },
      { t: 60, watts: 10 },
      { t: 61, watts: 0 },
      { t: 200, watts: 0 }, // below for about 140 s only
      { t: 201, watts: 10 },
      { t: 1000, watts: 10 },
      { t: 1001, watts: 0 },
      { t: 1400, watts: 0 },
    ];
    // Second drop: 10 → 0 over 1000–1001; 0.5 W at 1000.95.
    expectClose(chargeTimeS(log)!, 1000.95, 1e-12);
  });

  it('needs the full 5 minutes of logged time, ending exactly at 300 s counting', () => {
    const base = [
      { t: 0, watts: 10 },
      { t: 100, watts: 10 },
      { t: 100.5, watts: 0 }, // 0.5 W at 100.475
    ];
    expect(chargeTimeS([...base, { t: 400, watts: 0 }])).toBeNull(); // 299.525 s below
    expectClose(chargeTimeS([...base, { t: 400.475, watts: 0 }])!, 100.475);
  });

  it('returns null when the charge never ends, or the log is all zero', () => {
    expect(chargeTimeS([{ t: 0, watts: 10 }, { t: 3600, watts: 9 }])).toBeNull();
    expect(chargeTimeS([{ t: 0, watts: 0 }, { t: 3600, watts: 0 }])).toBeNull();
  });

  it('returns 0 when input is already below 5 % of the peak at the start and stays there', () => {
    expect(chargeTimeS([{ t: 0, watts: 0 }, { t: 10, watts: 0 }, { t: 400, watts: 0 }, { t: 401, watts: 100 }])).toBe(0);
  });

  it('rejects bad logs and never returns NaN or ±Infinity', () => {
    expectCode(() => chargeTimeS([{ t: 0, watts: 1 }]), 'too-few-samples');
    expectCode(() => chargeTimeS([{ t: 0, watts: 1 }, { t: 0, watts: 1 }]), 'unsorted-times');
    fc.assert(
      fc.property(fc.array(fc.record({ t: fc.double(), watts: fc.double() }), { maxLength: 8 }), (log) =>
        finiteOrMeasureError(() => chargeTimeS(log)),
      ),
      { numRuns: 300 },
    );
  });
});
