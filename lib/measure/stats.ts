import { assertFinite, finiteResult, MeasureError } from './errors';

/** Summary of repeated trials. */
export interface TrialSummary {
  n: number;
  mean: number;
  /** Sample standard deviation (divisor n − 1); null when n = 1. */
  sd: number | null;
}

/**
 * Mean and sample standard deviation (divisor n − 1) of repeated trials.
 * `sd` is null for a single value; throws `empty` for an empty list and `not-finite` for
 * a non-finite value (or a result that overflows).
 */
export function summarize(values: readonly number[]): TrialSummary {
  if (!Array.isArray(values) || values.length === 0) {
    throw new MeasureError('empty', 'At least one value is needed for a mean.');
  }
  values.forEach((x, i) => assertFinite(x, `Value ${i + 1}`));
  const n = values.length;
  let sum = 0;
  for (const x of values) sum += x;
  let mean = sum / n;
  // Fall back to summing x/n when the plain sum overflows.
  if (!Number.isFinite(mean)) {
    mean = 0;
    for (const x of values) mean += x / n;
  }
  finiteResult(mean, 'Mean');
  // One correction pass (the mean of the residuals) removes the rounding of the first sum,
  // so that e.g. three equal values give exactly that value.
  let residual = 0;
  for (const x of values) residual += (x - mean) / n;
  if (Number.isFinite(residual)) mean += residual;
  if (n === 1) return { n, mean, sd: null };
  // Two-pass variance, scaled by the largest deviation so the squares cannot overflow.
  let scale = 0;
  for (const x of values) scale = Math.max(scale, Math.abs(x - mean));
  finiteResult(scale, 'Standard deviation');
  if (scale === 0) return { n, mean, sd: 0 };
  let ss = 0;
  for (const x of values) {
    const d = (x - mean) / scale;
    ss += d * d;
  }
  const sd = scale * Math.sqrt(ss / (n - 1));
  return { n, mean, sd: finiteResult(sd, 'Standard deviation') };
}
