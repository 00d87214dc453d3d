import { assertRange, finiteResult, MeasureError } from './errors';
import { checkedSeries, field } from './series';

/** Illuminance that defines beam distance in the flashlight performance standard (ANSI/PLATO FL 1): 0.25 lx. */
export const BEAM_DISTANCE_LUX = 0.25;

/** Time after switch-on at which the reference output is read (ANSI/PLATO FL 1): 30 s. */
export const RUNTIME_REFERENCE_S = 30;

/**
 * Beam distance in m: the distance at which the illuminance from a peak intensity of
 * `peakCandela` (cd) falls to 0.25 lx, by the inverse-square law: d = √(I / 0.25) = 2√I.
 * Throws for a negative or non-finite intensity.
 */
export function beamDistanceM(peakCandela: number): number {
  assertRange(peakCandela, 'Peak intensity (cd)', { min: 0 });
  return finiteResult(Math.sqrt(peakCandela / BEAM_DISTANCE_LUX), 'Beam distance');
}

/**
 * Luminous intensity in cd from an illuminance `lux` (lx) read at `distanceM` (m) on the
 * beam axis, meter facing the light: I = E × d² (inverse-square law).
 */
export function candelaFromLux(lux: number, distanceM: number): number {
  assertRange(lux, 'Illuminance (lx)', { min: 0 });
  assertRange(distanceM, 'Distance (m)', { min: 0, minExclusive: true });
  return finiteResult(lux * distanceM * distanceM, 'Luminous intensity');
}

/** One sample of a light-output log: `t` in s since switch-on, `value` in any unit of output (lm, lx, a meter reading). */
export interface LightReading {
  t: number;
  value: number;
}

/** Result of `lightRuntime`. */
export interface LightRuntimeResult {
  /** Output at t = 30 s, interpolated linearly between samples; same unit as the readings. */
  referenceValue: number;
  /** Seconds from switch-on (t = 0) until the output first falls to 10 % of the reference after t = 30 s; null when the log ends first. */
  runtimeS: number | null;
}

/**
 * Runtime as the flashlight performance standard (ANSI/PLATO FL 1) defines it: from
 * switch-on until output falls to 10 % of the output 30 s after switch-on.
 *
 * Both the reference (the output at t = 30 s) and the moment of crossing are found by linear
 * interpolation between samples. Time is counted from t = 0 (switch-on), so a log whose
 * samples start later still counts from switch-on.
 *
 * Throws: fewer than 1 reading or a log that does not reach t = 30 s (`no-reference`);
 * unsorted or repeated times; negative or non-finite values; a reference ≤ 0.
 */
export function lightRuntime(readings: readonly LightReading[]): LightRuntimeResult {
  const what = 'Light-output log';
  const { t, v } = checkedSeries(readings, (r, i) => field(r, 'value', what, i), what, 1);
  const ref = RUNTIME_REFERENCE_S;
  const first = t[0]!;
  const last = t[t.length - 1]!;
  if (first > ref || last < ref) {
    throw new MeasureError(
      'no-reference',
      `${what} must cover t = ${ref} s after switch-on to set the reference output; it runs from ${first} s to ${last} s.`,
    );
  }
  // Index of the segment [t[k], t[k+1]] containing t = 30 (or k with t[k] = 30 exactly).
  let k = 0;
  while (t[k]! < ref) k++;
  let referenceValue: number;
  if (t[k] === ref) {
    referenceValue = v[k]!;
  } else {
    const ta = t[k - 1]!;
    const tb = t[k]!;
    const va = v[k - 1]!;
    const vb = v[k]!;
    referenceValue = va + ((vb - va) * (ref - ta)) / (tb - ta);
    k = k - 1;
  }
  finiteResult(referenceValue, 'Reference output');
  if (!(referenceValue > 0)) {
    throw new MeasureError(
      'reference-not-positive',
      `${what}: the output at t = ${ref} s is ${referenceValue}; runtime needs a positive reference output.`,
    );
  }
  const threshold = referenceValue / 10;
  // Walk the segments after t = 30 s; the first starts at (30, reference).
  let ta = ref;
  let va = referenceValue;
  for (let i = k + 1; i < t.length; i++) {
    const tb = t[i]!;
    const vb = v[i]!;
    if (tb <= ref) continue;
    if (vb <= threshold) {
      // va > threshold here (the reference is, and every earlier segment end was).
      const crossing = ta + ((va - threshold) * (tb - ta)) / (va - vb);
      // Clamp against rounding: the crossing lies within its segment.
      return { referenceValue, runtimeS: finiteResult(Math.min(tb, Math.max(ta, crossing)), 'Runtime') };
    }
    ta = tb;
    va = vb;
  }
  return { referenceValue, runtimeS: null };
}
