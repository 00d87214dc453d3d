import { assertRange, finiteResult } from './errors';
import { checkedSeries, field, maxOf, trapezoid } from './series';
import type { PowerReading } from './energy';

/**
 * Default system losses of the public PV model (PVWatts Version 5, NREL/TP-6A20-62641), as
 * fractions. Combined multiplicatively they give 0.140757 (14.0757 %), not the 15 % sum.
 */
export const PVWATTS_DEFAULT_LOSSES: Readonly<Record<string, number>> = {
  soiling: 0.02,
  shading: 0.03,
  snow: 0,
  mismatch: 0.02,
  wiring: 0.02,
  connections: 0.005,
  lightInducedDegradation: 0.015,
  nameplateRating: 0.01,
  age: 0,
  availability: 0.03,
};

/**
 * Combines loss fractions (each 0–1) multiplicatively: 1 − Π(1 − lᵢ), as the PVWatts model
 * does. An empty list gives 0.
 */
export function combinedLossFraction(losses: readonly number[]): number {
  let remaining = 1;
  losses.forEach((l, i) => {
    assertRange(l, `Loss ${i + 1}`, { min: 0, max: 1 });
    remaining *= 1 - l;
  });
  return finiteResult(1 - remaining, 'Combined loss');
}

/**
 * Expected daily energy in Wh: `ratedW` (W, at STC) × `peakSunHours` (h/day, equal to daily
 * insolation in kWh/m²/day) × (1 − `lossFraction`).
 */
export function expectedDailyWh(ratedW: number, peakSunHours: number, lossFraction: number): number {
  assertRange(ratedW, 'Rated power (W)', { min: 0 });
  assertRange(peakSunHours, 'Peak sun hours', { min: 0, max: 24 });
  assertRange(lossFraction, 'Loss fraction', { min: 0, max: 1, maxExclusive: true });
  return finiteResult(ratedW * peakSunHours * (1 - lossFraction), 'Expected daily energy');
}

/** Result of `solarOutput`. */
export interface SolarOutputResult {
  /** Time-weighted mean power over the whole trial (trapezoidal integral ÷ duration), W. */
  meanW: number;
  /** Highest logged power, W. */
  peakW: number;
  /** meanW ÷ ratedW (dimensionless). */
  shareOfRating: number;
}

/**
 * Summarises a panel trial from a `{t, watts}` log (t in s): time-weighted mean power
 * (trapezoidal integral ÷ (last t − first t)), peak power and mean ÷ rating. `ratedW` > 0.
 * At least 2 readings; times strictly increasing; values ≥ 0.
 */
export function solarOutput(readings: readonly PowerReading[], ratedW: number): SolarOutputResult {
  const what = 'Panel output log';
  assertRange(ratedW, 'Rated power (W)', { min: 0, minExclusive: true });
  const { t, v } = checkedSeries(readings, (r, i) => field(r, 'watts', what, i), what, 2);
  const duration = finiteResult(t[t.length - 1]! - t[0]!, 'Trial duration');
  const meanW = finiteResult(trapezoid(t, v) / duration, 'Mean power');
  const peakW = maxOf(v);
  return { meanW, peakW, shareOfRating: finiteResult(meanW / ratedW, 'Share of rating') };
}
