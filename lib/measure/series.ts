import { MeasureError } from './errors';

/**
 * Checks a time series: at least `minSamples` samples, every `t` finite, times strictly
 * increasing, every value finite and ≥ 0. `valueOf` extracts the value of a sample (and
 * throws `bad-sample` if the sample lacks its fields). Returns parallel arrays.
 */
export function checkedSeries<T extends { t: number }>(
  readings: readonly T[],
  valueOf: (r: T, i: number) => number,
  what: string,
  minSamples: number,
): { t: number[]; v: number[] } {
  if (!Array.isArray(readings)) {
    throw new MeasureError('bad-sample', `${what} must be a list of readings.`);
  }
  if (readings.length < minSamples) {
    throw new MeasureError(
      'too-few-samples',
      `${what} needs at least ${minSamples} readings, got ${readings.length}.`,
    );
  }
  const t: number[] = [];
  const v: number[] = [];
  readings.forEach((r, i) => {
    if (r === null || typeof r !== 'object') {
      throw new MeasureError('bad-sample', `${what}: reading ${i + 1} is not a reading.`);
    }
    const ti = r.t;
    if (typeof ti !== 'number' || !Number.isFinite(ti)) {
      throw new MeasureError('not-finite', `${what}: reading ${i + 1} has a time that is not a finite number (${String(ti)}).`);
    }
    const prev = t[t.length - 1];
    if (prev !== undefined && !(ti > prev)) {
      throw new MeasureError(
        'unsorted-times',
        `${what}: times must be strictly increasing; reading ${i + 1} (t = ${ti} s) is not after the one before (t = ${prev} s).`,
      );
    }
    const vi = valueOf(r, i);
    if (typeof vi !== 'number' || !Number.isFinite(vi)) {
      throw new MeasureError('not-finite', `${what}: reading ${i + 1} has a value that is not a finite number (${String(vi)}).`);
    }
    if (vi < 0) {
      throw new MeasureError('out-of-range', `${what}: reading ${i + 1} has a negative value (${vi}).`);
    }
    t.push(ti);
    v.push(vi);
  });
  return { t, v };
}

/** Reads field `key` of a sample as a number, else throws `bad-sample`. */
export function field(r: object, key: string, what: string, i: number): number {
  const value = (r as Record<string, unknown>)[key];
  if (value === undefined) {
    throw new MeasureError('bad-sample', `${what}: reading ${i + 1} has no "${key}".`);
  }
  if (typeof value !== 'number' || !Number.isFinite(value)) {
    throw new MeasureError('not-finite', `${what}: reading ${i + 1} has a "${key}" that is not a finite number (${String(value)}).`);
  }
  if (value < 0) {
    throw new MeasureError('out-of-range', `${what}: reading ${i + 1} has a negative "${key}" (${value}).`);
  }
  return value;
}

/** Trapezoidal integral of v over t (units of v × units of t). Arrays already checked. */
export function trapezoid(t: readonly number[], v: readonly number[]): number {
  let sum = 0;
  for (let i = 1; i < t.length; i++) {
    // Halving first (exact in binary) keeps the sum of two large readings from overflowing.
    sum += (v[i - 1]! / 2 + v[i]! / 2) * (t[i]! - t[i - 1]!);
  }
  return sum;
}

/** Largest element of a non-empty array (a loop: spreading a long log into Math.max overflows the stack). */
export function maxOf(v: readonly number[]): number {
  let max = -Infinity;
  for (const x of v) if (x > max) max = x;
  return max;
}
