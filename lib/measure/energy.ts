import { assertRange, finiteResult, MeasureError } from './errors';
import { checkedSeries, field, maxOf, trapezoid } from './series';

/**
 * Rated energy in Wh from a rated charge and a nominal voltage: Wh = Ah × V
 * (the watt-hour rating of 49 CFR 171.8). `unit` is `mAh` or `Ah`; `nominalVolts` in V.
 * 20 000 mAh at 3.6 V → 72 Wh.
 */
export function chargeToWh(charge: number, unit: 'mAh' | 'Ah', nominalVolts: number): number {
  assertRange(charge, 'Charge', { min: 0 });
  assertRange(nominalVolts, 'Nominal voltage (V)', { min: 0, minExclusive: true });
  let wh: number;
  if (unit === 'Ah') wh = charge * nominalVolts;
  else if (unit === 'mAh') wh = (charge * nominalVolts) / 1000;
  else throw new MeasureError('unknown-unit', `Unknown charge unit "${String(unit)}". Use mAh or Ah.`);
  return finiteResult(wh, 'Energy (Wh)');
}

/** Passenger air-travel band of a lithium-ion battery by its rated energy. */
export type AirlineBand = 'no-approval' | 'approval' | 'cargo-only';

/**
 * Passenger band for a lithium-ion battery of rated energy `wh` (Wh):
 * ≤ 100 Wh `no-approval`; > 100 and ≤ 160 Wh `approval` (operator approval); > 160 Wh
 * `cargo-only`. Feed it the rated energy (Ah × nominal V, 49 CFR 171.8), never a measured
 * delivered figure, and show it only for lithium chemistries.
 */
export function airlineBand(wh: number): AirlineBand {
  assertRange(wh, 'Rated energy (Wh)', { min: 0 });
  if (wh <= 100) return 'no-approval';
  if (wh <= 160) return 'approval';
  return 'cargo-only';
}

/** A power reading: `t` in s, `watts` in W. */
export interface PowerReading {
  t: number;
  watts: number;
}

/** A voltage and current reading: `t` in s, `volts` in V, `amps` in A. */
export interface VoltAmpReading {
  t: number;
  volts: number;
  amps: number;
}

function powerOf(r: PowerReading | VoltAmpReading, what: string, i: number): number {
  if ('watts' in r && r.watts !== undefined) return field(r, 'watts', what, i);
  if ('volts' in r || 'amps' in r) {
    const p = field(r, 'volts', what, i) * field(r, 'amps', what, i);
    return finiteResult(p, `${what}: power of reading ${i + 1}`);
  }
  throw new MeasureError('bad-sample', `${what}: reading ${i + 1} needs "watts", or "volts" and "amps".`);
}

/**
 * Energy in Wh delivered over a logged series, by the trapezoidal rule:
 * E = Σ (Pᵢ + Pᵢ₊₁)/2 × (tᵢ₊₁ − tᵢ) ÷ 3600. Each reading is `{t, watts}` or
 * `{t, volts, amps}` (P = V × I); t in s. At least 2 readings; times strictly increasing;
 * values finite and ≥ 0.
 */
export function energyWh(readings: readonly (PowerReading | VoltAmpReading)[]): number {
  const what = 'Power log';
  const { t, v } = checkedSeries(readings, (r, i) => powerOf(r, what, i), what, 2);
  return finiteResult(trapezoid(t, v) / 3600, 'Energy (Wh)');
}

/** Share of peak input power below which a charge counts as finished (common practice, no source). */
export const CHARGE_END_SHARE = 0.05;
/** How long input must stay below that share (s) (common practice, no source). */
export const CHARGE_END_HOLD_S = 300;

/**
 * Charge time in s from a log of a charger's input power (`{t, watts}`, t in s): the time
 * from the first sample until input power falls below 5 % of its peak and stays below for
 * 5 minutes (common practice, no source). The power between samples is taken as linear, so
 * the end is the interpolated moment power crosses 5 % of peak, provided power stays below
 * from there for at least 300 s of logged time. Returns null when that never happens
 * (including an all-zero log). At least 2 readings; times strictly increasing; values ≥ 0.
 */
export function chargeTimeS(readings: readonly PowerReading[]): number | null {
  const what = 'Charger input log';
  const { t, v } = checkedSeries(readings, (r, i) => field(r, 'watts', what, i), what, 2);
  const peak = maxOf(v);
  const threshold = peak / 20; // 5 % of peak
  const n = t.length;
  const t0 = t[0]!;
  // Start of the current below-threshold run, or null while at or above the threshold.
  let runStart: number | null = v[0]! < threshold ? t0 : null;
  for (let i = 1; i < n; i++) {
    const ta = t[i - 1]!;
    const tb = t[i]!;
    const va = v[i - 1]!;
    const vb = v[i]!;
    if (runStart === null) {
      if (vb < threshold) {
        // Falls below within this segment (va ≥ threshold > vb).
        const cross = ta + ((va - threshold) * (tb - ta)) / (va - vb);
        runStart = Math.min(tb, Math.max(ta, cross));
      }
    } else if (vb >= threshold) {
      // Rises back to the threshold within this segment (va < threshold ≤ vb).
      const cross = ta + ((threshold - va) * (tb - ta)) / (vb - va);
      const runEnd = Math.min(tb, Math.max(ta, cross));
      if (runEnd - runStart >= CHARGE_END_HOLD_S) return finiteResult(runStart - t0, 'Charge time');
      runStart = null;
    }
    if (runStart !== null && tb - runStart >= CHARGE_END_HOLD_S && vb < threshold) {
      return finiteResult(runStart - t0, 'Charge time');
    }
  }
  return null;
}
