import { describe, expect, it } from 'vitest';
import fc from 'fast-check';
import { beamDistanceM, candelaFromLux, lightRuntime, type LightReading } from '@/lib/measure';
import { expectClose, expectCode, finiteOrMeasureError } from './helpers';

describe('beamDistanceM', () => {
  // ANSI/PLATO FL 1 (beam distance: where illuminance falls to 0.25 lx) with the inverse-square
  // law E = I/d² (IES lighting definitions, "Inverse-square law" [9.1.1]): d = √(I/0.25) = 2√I. Check values exact by hand.
  it.each([
    [2500, 100],
    [10000, 200],
    [40000, 400],
    [0, 0],
  ])('%d cd → %d m', (cd, m) => {
    expect(beamDistanceM(cd)).toBe(m);
  });

  // Same formula, irrational results: 2√1000 = 63.245553…, 2√100000 = 632.455532…
  it('handles non-square intensities', () => {
    expect(beamDistanceM(1000)).toBeCloseTo(63.245553203, 8);
    expect(beamDistanceM(100000)).toBeCloseTo(632.455532034, 8);
  });

  it('rejects negative and non-finite intensities', () => {
    expectCode(() => beamDistanceM(-1), 'out-of-range');
    expectCode(() => beamDistanceM(Number.NaN), 'not-finite');
    expectCode(() => beamDistanceM(Infinity), 'not-finite');
  });
});

describe('candelaFromLux', () => {
  // IES lighting definitions, "Inverse-square law" [9.1.1]: I = E × d². 125 lx at 5 m → 3125 cd → beam distance 2√3125 = 111.80 m.
  it('125 lx at 5 m', () => {
    expect(candelaFromLux(125, 5)).toBe(3125);
    expect(beamDistanceM(candelaFromLux(125, 5))).toBeCloseTo(111.803398875, 8);
  });

  // IES lighting definitions [9.1.1] (inverse-square law): 2000 lx at 2 m is 8000 cd (a secondary page's "4000 cd" is an arithmetic slip),
  // and ANSI/PLATO FL 1 beam distance 2√8000 = 178.885 m.
  it('2000 lx at 2 m is 8000 cd, not 4000', () => {
    expect(candelaFromLux(2000, 2)).toBe(8000);
    expect(beamDistanceM(8000)).toBeCloseTo(178.885438, 5);
  });

  it('rejects a zero or negative distance and negative illuminance', () => {
    expectCode(() => candelaFromLux(100, 0), 'out-of-range');
    expectCode(() => candelaFromLux(100, -2), 'out-of-range');
    expectCode(() => candelaFromLux(-1, 2), 'out-of-range');
    expectCode(() => candelaFromLux(1e200, 1e100), 'not-finite');
  });
});

// ANSI/PLATO FL 1 runtime definition as published summaries give it (the standard text itself was not read).
describe('lightRuntime (ANSI/PLATO FL 1: to 10 % of the output at 30 s)', () => {
  // Closed form, exact by hand: 300 lm flat for 1 h, then linear to 0 at 11 h. The reference is
  // 300 lm; 10 % is 30 lm, reached when 300·(1 − (t − 3600)/36000) = 30 → t = 36 000 s.
  it('flat then linear decay: exactly 36 000 s', () => {
    const log = [
      { t: 0, value: 300 },
      { t: 3600, value: 300 },
      { t: 39600, value: 0 },
    ];
    expect(lightRuntime(log)).toEqual({ referenceValue: 300, runtimeS: 36000 });
  });

  // ANSI/PLATO FL 1 example as summarised: a light reading 300 lm at 30 s ends its runtime at 30 lm.
  it('ends at 10 % of the 30 s reading, with a sample exactly at the threshold', () => {
    const log = [
      { t: 0, value: 320 },
      { t: 30, value: 300 },
      { t: 100, value: 30.5 },
      { t: 200, value: 30 },
      { t: 300, value: 0 },
    ];
    expect(lightRuntime(log)).toEqual({ referenceValue: 300, runtimeS: 200 });
  });

  // Exact by hand: reference interpolated between (0, 400) and (60, 200) → 300 at 30 s; threshold 30;
  // on (60, 200)–(3660, 0) the output is 30 at 60 + 170/200 × 3600 = 3120 s.
  it('interpolates both the reference and the crossing', () => {
    const log = [
      { t: 0, value: 400 },
      { t: 60, value: 200 },
      { t: 3660, value: 0 },
    ];
    expect(lightRuntime(log)).toEqual({ referenceValue: 300, runtimeS: 3120 });
  });

  it('counts from switch-on even when the log starts later, and takes the first crossing', () => {
    // Reference 100 at t = 30 (first sample); drops to 0 at 130 → 10 at 120; later recovery ignored.
    const log = [
      { t: 30, value: 100 },
      { t: 130, value: 0 },
      { t: 200, value: 100 },
    ];
    expect(lightRuntime(log).runtimeS).toBe(120);
  });

  it('ignores a dip before 30 s', () => {
    const log = [
      { t: 0, value: 0 },
      { t: 10, value: 5 },
      { t: 30, value: 200 },
      { t: 1030, value: 0 },
    ];
    // 200 → 0 over 1000 s; 20 reached after 900 s → t = 930.
    expect(lightRuntime(log)).toEqual({ referenceValue: 200, runtimeS: 930 });
  });

  it('returns null when the log ends before the output falls to 10 %', () => {
    const log = [
      { t: 0, value: 300 },
      { t: 30, value: 300 },
      { t: 7200, value: 31 },
    ];
    expect(lightRuntime(log)).toEqual({ referenceValue: 300, runtimeS: null });
    expect(lightRuntime([{ t: 30, value: 5 }])).toEqual({ referenceValue: 5, runtimeS: null });
  });

  it('throws for logs it cannot judge', () => {
    expectCode(() => lightRuntime([]), 'too-few-samples');
    expectCode(() => lightRuntime([{ t: 31, value: 100 }, { t: 600, value: 0 }]), 'no-reference');
    expectCode(() => lightRuntime([{ t: 0, value: 100 }, { t: 29, value: 90 }]), 'no-reference');
    expectCode(() => lightRuntime([{ t: 0, value: 100 }, { t: 60, value: 90 }, { t: 40, value: 80 }]), 'unsorted-times');
    expectCode(() => lightRuntime([{ t: 0, value: 100 }, { t: 0, value: 90 }, { t: 40, value: 80 }]), 'unsorted-times');
    expectCode(() => lightRuntime([{ t: 0, value: 100 }, { t: 40, value: -1 }]), 'out-of-range');
    expectCode(() => lightRuntime([{ t: 0, value: 100 }, { t: 40, value: Number.NaN }]), 'not-finite');
    expectCode(() => lightRuntime([{ t: 0, value: 100 }, { t: Infinity, value: 1 }]), 'not-finite');
    expectCode(() => lightRuntime([{ t: 0, value: 0 }, { t: 60, value: 0 }]), 'reference-not-positive');
    expectCode(() => lightRuntime([{ t: 0 } as LightReading, { t: 60, value: 0 }]), 'bad-sample');
  });
});

describe('lightRuntime properties', () => {
  // Linear decay from R at 30 s to 0 at T: 10 % is reached at 30 + 0.9 (T − 30); longer decay, longer runtime.
  it('linear decay: runtime = 30 + 0.9 (T − 30), increasing in T', () => {
    fc.assert(
      fc.property(
        fc.double({ min: 1, max: 1e5, noNaN: true }),
        fc.double({ min: 31, max: 1e6, noNaN: true }),
        fc.double({ min: 0, max: 1e5, noNaN: true }),
        (ref, end, extra) => {
          const r1 = lightRuntime([{ t: 0, value: ref }, { t: 30, value: ref }, { t: end, value: 0 }]).runtimeS!;
          const r2 = lightRuntime([{ t: 0, value: ref }, { t: 30, value: ref }, { t: end + extra, value: 0 }]).runtimeS!;
          expectClose(r1, 30 + 0.9 * (end - 30), 1e-12, 1e-9);
          expect(r2).toBeGreaterThanOrEqual(r1 - 1e-9 * r1);
        },
      ),
      { numRuns: 200 },
    );
  });

  // A log that is everywhere at least as bright (same reference at 30 s) never has a shorter runtime.
  it('runtime is monotonic in the decay', () => {
    const arb = fc
      .record({
        ref: fc.double({ min: 1, max: 1000, noNaN: true }),
        steps: fc.array(
          fc.record({
            dt: fc.double({ min: 0.5, max: 600, noNaN: true }),
            a: fc.double({ min: 0, max: 2, noNaN: true }),
            lift: fc.double({ min: 0, max: 1, noNaN: true }),
          }),
          { minLength: 1, maxLength: 30 },
        ),
      });
    fc.assert(
      fc.property(arb, ({ ref, steps }) => {
        const dim: LightReading[] = [{ t: 0, value: ref }, { t: 30, value: ref }];
        const bright: LightReading[] = [{ t: 0, value: ref }, { t: 30, value: ref }];
        let t = 30;
        for (const s of steps) {
          t += s.dt;
          dim.push({ t, value: s.a * ref });
          bright.push({ t, value: (s.a + s.lift) * ref });
        }
        const rd = lightRuntime(dim).runtimeS;
        const rb = lightRuntime(bright).runtimeS;
        if (rb !== null) {
          expect(rd).not.toBeNull();
          expect(rb).toBeGreaterThanOrEqual(rd! - 1e-9 * rd!);
        }
        if (rd !== null && rb !== null) expect(rd).toBeGreaterThan(30);
      }),
      { numRuns: 300 },
    );
  });

  it('never returns NaN or ±Infinity from any generated log', () => {
    const sample = fc.record({ t: fc.double(), value: fc.double() });
    fc.assert(
      fc.property(fc.array(sample, { maxLength: 8 }), (log) => finiteOrMeasureError(() => lightRuntime(log))),
      { numRuns: 300 },
    );
    const sorted = fc
      .array(fc.tuple(fc.double({ min: 0, max: 1e300, noNaN: true }), fc.double({ min: 0, max: 1e308, noNaN: true })), {
        maxLength: 8,
      })
      .map((pairs) => {
        const log: LightReading[] = [{ t: 0, value: 1e308 }];
        let t = 0;
        for (const [dt, value] of pairs) {
          t += dt;
          log.push({ t, value });
        }
        return log;
      });
    fc.assert(fc.property(sorted, (log) => finiteOrMeasureError(() => lightRuntime(log))), { numRuns: 300 });
  });
});
