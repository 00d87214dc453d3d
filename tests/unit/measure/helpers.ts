import { expect } from 'vitest';
import { MeasureError, type MeasureErrorCode } from '@/lib/measure';

/** Asserts that `fn` throws a MeasureError with `code`. */
export function expectCode(fn: () => unknown, code: MeasureErrorCode): void {
  let thrown: unknown;
  try {
    fn();
  } catch (e) {
    thrown = e;
  }
  expect(thrown, `expected a MeasureError "${code}"`).toBeInstanceOf(MeasureError);
  expect((thrown as MeasureError).code).toBe(code);
}

/** Asserts |actual − expected| ≤ max(abs, rel × |expected|). */
export function expectClose(actual: number, expected: number, rel = 1e-12, abs = 1e-12): void {
  expect(Math.abs(actual - expected), `${actual} vs ${expected}`).toBeLessThanOrEqual(Math.max(abs, rel * Math.abs(expected)));
}

/** Runs `fn`; passes when it returns a value whose numbers are all finite, or throws a MeasureError. */
export function finiteOrMeasureError(fn: () => unknown): void {
  let result: unknown;
  try {
    result = fn();
  } catch (e) {
    expect(e).toBeInstanceOf(MeasureError);
    return;
  }
  const walk = (v: unknown): void => {
    if (typeof v === 'number') expect(Number.isFinite(v), `non-finite ${v}`).toBe(true);
    else if (Array.isArray(v)) v.forEach(walk);
    else if (v && typeof v === 'object') Object.values(v).forEach(walk);
  };
  walk(result);
}
