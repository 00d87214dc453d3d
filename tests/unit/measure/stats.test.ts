import { describe, expect, it } from 'vitest';
import fc from 'fast-check';
import { summarize } from '@/lib/measure';
import { expectClose, expectCode, finiteOrMeasureError } from './helpers';

// Sample standard deviation with divisor n − 1 (ISO 3534-1, "sample standard deviation";
// clause number from memory, unconfirmed). Fixtures exact by hand.

describe('summarize', () => {
  // 2, 4, 4, 4, 5, 5, 7, 9: mean 5; Σ(x − 5)² = 32; sample variance 32/7; sd √(32/7) = 2.13809…
  it('eight values', () => {
    const s = summarize([2, 4, 4, 4, 5, 5, 7, 9]);
    expect(s.n).toBe(8);
    expect(s.mean).toBe(5);
    expectClose(s.sd!, Math.sqrt(32 / 7), 1e-15);
  });

  // Two trials 10 and 12: mean 11, sd √((1 + 1)/1) = √2.
  it('two trials', () => {
    const s = summarize([10, 12]);
    expect(s).toEqual({ n: 2, mean: 11, sd: Math.SQRT2 });
  });

  it('one value: sd is null', () => {
    expect(summarize([42])).toEqual({ n: 1, mean: 42, sd: null });
  });

  it('identical values: sd is 0', () => {
    expect(summarize([3.3, 3.3, 3.3])).toEqual({ n: 3, mean: 3.3, sd: 0 });
  });

  it('throws on an empty list or a non-finite value', () => {
    expectCode(() => summarize([]), 'empty');
    expectCode(() => summarize([1, Number.NaN]), 'not-finite');
    expectCode(() => summarize([1, Infinity]), 'not-finite');
  });

  it('handles values near the top of the double range without overflow', () => {
    const s = summarize([1.5e308, 1.7e308]);
    expectClose(s.mean, 1.6e308, 1e-15);
    expectClose(s.sd!, Math.SQRT2 * 1e307, 1e-12);
  });
});

describe('summarize properties', () => {
  const values = fc.array(fc.double({ min: -1e6, max: 1e6, noNaN: true }), { minLength: 2, maxLength: 30 });

  it('agrees with the textbook two-pass formula', () => {
    fc.assert(
      fc.property(values, (xs) => {
        const n = xs.length;
        const mean = xs.reduce((a, b) => a + b, 0) / n;
        const sd = Math.sqrt(xs.reduce((a, x) => a + (x - mean) ** 2, 0) / (n - 1));
        const s = summarize(xs);
        expectClose(s.mean, mean, 1e-9, 1e-9);
        expectClose(s.sd!, sd, 1e-9, 1e-9);
      }),
      { numRuns: 200 },
    );
  });

  it('is unchanged in sd by a shift and scales with a factor', () => {
    fc.assert(
      fc.property(values, fc.integer({ min: -1000, max: 1000 }), (xs, shift) => {
        const a = summarize(xs);
        const b = summarize(xs.map((x) => x + shift));
        const c = summarize(xs.map((x) => 2 * x));
        expectClose(b.sd!, a.sd!, 1e-6, 1e-6);
        expectClose(c.sd!, 2 * a.sd!, 1e-12, 1e-12);
      }),
      { numRuns: 200 },
    );
  });

  it('never returns NaN or ±Infinity', () => {
    fc.assert(
      fc.property(fc.array(fc.double(), { maxLength: 10 }), (xs) => finiteOrMeasureError(() => summarize(xs))),
      { numRuns: 500 },
    );
  });
});
