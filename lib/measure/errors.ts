/**
 * Error codes used by lib/measure. Stable strings: callers may switch on them.
 *
 * - `not-finite`: an input or a result is NaN or ±Infinity.
 * - `not-integer`: a value that must be a whole number is not.
 * - `out-of-range`: a finite value outside its allowed range.
 * - `unknown-unit`, `incompatible-units`: `convert` was given a symbol it does not know,
 *   or two units of different quantities.
 * - `unknown-currency`, `currency-mismatch`: money with a code outside the ISO 4217 table,
 *   or money of two currencies combined.
 * - `unknown-chemistry`, `unknown-category`, `unknown-spec`: an enum value outside its list.
 * - `too-few-samples`, `empty`: a series or list that is too short.
 * - `unsorted-times`: sample times not strictly increasing (unsorted or repeated).
 * - `bad-sample`: a reading without the fields its series needs.
 * - `no-reference`: a light log that does not cover t = 30 s.
 * - `reference-not-positive`: the light output at t = 30 s is ≤ 0.
 * - `sun-hours-required`: a power budget with panels but no peak sun hours.
 */
export type MeasureErrorCode =
  | 'not-finite'
  | 'not-integer'
  | 'out-of-range'
  | 'unknown-unit'
  | 'incompatible-units'
  | 'unknown-currency'
  | 'currency-mismatch'
  | 'unknown-chemistry'
  | 'unknown-category'
  | 'unknown-spec'
  | 'too-few-samples'
  | 'empty'
  | 'unsorted-times'
  | 'bad-sample'
  | 'no-reference'
  | 'reference-not-positive'
  | 'sun-hours-required';

/** The one error class thrown by lib/measure for bad input; `code` is stable, `message` is for people. */
export class MeasureError extends Error {
  readonly code: MeasureErrorCode;
  constructor(code: MeasureErrorCode, message: string) {
    super(message);
    this.name = 'MeasureError';
    this.code = code;
  }
}

/** Throws `not-finite` unless `value` is a finite number; returns it. */
export function assertFinite(value: number, what: string): number {
  if (typeof value !== 'number' || !Number.isFinite(value)) {
    throw new MeasureError('not-finite', `${what} must be a finite number, got ${String(value)}.`);
  }
  return value;
}

/** Throws `not-finite` when a computed result is not finite (e.g. overflow); returns it. */
export function finiteResult(value: number, what: string): number {
  if (!Number.isFinite(value)) {
    throw new MeasureError(
      'not-finite',
      `${what} cannot be computed as a finite number from these inputs (got ${String(value)}); check for values that are far too large or too small.`,
    );
  }
  return value;
}

interface RangeOptions {
  min?: number;
  max?: number;
  /** When true, `min` itself is not allowed. */
  minExclusive?: boolean;
  /** When true, `max` itself is not allowed. */
  maxExclusive?: boolean;
  integer?: boolean;
}

function describeRange(o: RangeOptions): string {
  const lo = o.min === undefined ? '' : `${o.minExclusive ? 'greater than' : 'at least'} ${o.min}`;
  const hi = o.max === undefined ? '' : `${o.maxExclusive ? 'less than' : 'at most'} ${o.max}`;
  return [lo, hi].filter(Boolean).join(' and ');
}

/** Throws unless `value` is finite (and an integer, if asked) and within the range; returns it. */
export function assertRange(value: number, what: string, o: RangeOptions): number {
  assertFinite(value, what);
  if (o.integer && !Number.isInteger(value)) {
    throw new MeasureError('not-integer', `${what} must be a whole number, got ${value}.`);
  }
  const below = o.min !== undefined && (o.minExclusive ? value <= o.min : value < o.min);
  const above = o.max !== undefined && (o.maxExclusive ? value >= o.max : value > o.max);
  if (below || above) {
    throw new MeasureError('out-of-range', `${what} must be ${describeRange(o)}, got ${value}.`);
  }
  return value;
}
