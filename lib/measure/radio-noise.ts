import { assertFinite, assertRange, finiteResult, MeasureError } from './errors';

/** Frequency ranges of the S-meter scale (IARU Region 1 Technical Recommendation R.1). */
export const S_METER_RANGES = ['below-30mhz', 'above-30mhz'] as const;
export type SMeterRange = (typeof S_METER_RANGES)[number];

/** S9 reference level in dBm per range: −73 dBm below 30 MHz, −93 dBm above (IARU Region 1 Rec. R.1). */
export const S9_DBM: Readonly<Record<SMeterRange, number>> = {
  'below-30mhz': -73,
  'above-30mhz': -93,
};
/** dB per S-unit (IARU Region 1 Rec. R.1). */
export const DB_PER_S_UNIT = 6;
/** Highest "S9 + N dB" accepted: the usual top of an S-meter scale is S9 + 60 dB (common practice, no source). */
export const MAX_DB_OVER_S9 = 60;

function checkRange(range: unknown): SMeterRange {
  if (typeof range !== 'string' || !(S_METER_RANGES as readonly string[]).includes(range)) {
    throw new MeasureError('out-of-range', `The S-meter range must be one of ${S_METER_RANGES.join(', ')}, got "${String(range)}".`);
  }
  return range as SMeterRange;
}

/**
 * An S-meter reading in dBm at the receiver input, by IARU Region 1 Rec. R.1:
 * dBm = S9 + 6 × (S − 9) for S0–S9, and S9 + N dB above it.
 *
 * `sUnits` is 0 to 9; fractions are allowed for a needle read between marks.
 * `dbOverS9` (0 to 60) is only for a reading at or above S9: it must be 0 unless `sUnits` is 9.
 */
export function sMeterToDbm(sUnits: number, dbOverS9: number, range: SMeterRange): number {
  const r = checkRange(range);
  const s = assertRange(sUnits, 'S-units', { min: 0, max: 9 });
  const over = assertRange(dbOverS9, 'dB over S9', { min: 0, max: MAX_DB_OVER_S9 });
  if (over > 0 && s !== 9) {
    throw new MeasureError('out-of-range', `"dB over S9" applies only to a reading of S9; got S${s} + ${over} dB.`);
  }
  return S9_DBM[r] + DB_PER_S_UNIT * (s - 9) + over;
}

/**
 * The rise of a receiver's noise floor when the item under test powers it (or runs nearby):
 * withItem − baseline, in dB. Negative when the reading with the item is lower (meter scatter).
 */
export function noiseRiseDb(baselineDbm: number, withItemDbm: number): number {
  const base = assertFinite(baselineDbm, 'Baseline noise floor (dBm)');
  const withItem = assertFinite(withItemDbm, 'Noise floor with the item (dBm)');
  return finiteResult(withItem - base, 'Noise rise');
}

/** Our own verdict words for a noise rise (Trailbench convention). */
export const RADIO_QUIET_VERDICTS = ['quiet', 'slight', 'noisy'] as const;
export type RadioQuietVerdict = (typeof RADIO_QUIET_VERDICTS)[number];

/**
 * Verdict thresholds in dB — our own convention, common practice, no source:
 * under 1 dB is `quiet` (below what a meter shows reliably), under 6 dB (one S-unit) `slight`,
 * 6 dB or more `noisy`.
 */
export const RADIO_QUIET_THRESHOLDS_DB = { quietBelow: 1, slightBelow: 6 } as const;

/** Plain-language meaning of each verdict. */
export const RADIO_QUIET_WORDING: Readonly<Record<RadioQuietVerdict, string>> = {
  quiet: 'no rise a meter shows reliably (under 1 dB)',
  slight: 'a rise of less than one S-unit (under 6 dB)',
  noisy: 'a rise of one S-unit or more (6 dB or more)',
};

export function radioQuietVerdict(riseDb: number): RadioQuietVerdict {
  const rise = assertFinite(riseDb, 'Noise rise (dB)');
  if (rise < RADIO_QUIET_THRESHOLDS_DB.quietBelow) return 'quiet';
  if (rise < RADIO_QUIET_THRESHOLDS_DB.slightBelow) return 'slight';
  return 'noisy';
}

/** One measured noise rise: a band ("40 m", "2 m"), its S-meter range, and the rise in dB. */
export interface BandNoiseRise {
  band: string;
  range: SMeterRange;
  riseDb: number;
}

export interface BandQuietness {
  band: string;
  range: SMeterRange;
  /** The largest rise recorded on the band (repeats are summarised by their worst). */
  riseDb: number;
  verdict: RadioQuietVerdict;
  /** Number of readings on the band. */
  readings: number;
}

export interface RangeQuietness {
  verdict: RadioQuietVerdict;
  worstRiseDb: number;
  worstBand: string;
  bands: number;
}

export interface RadioQuietSummary {
  /** One entry per band, in order of first appearance. */
  bands: BandQuietness[];
  /** Worst band per range; null when the range was not tested. */
  byRange: Record<SMeterRange, RangeQuietness | null>;
  /** Worst over all bands. */
  overall: RangeQuietness;
}

const MAX_BAND_NAME = 40;

/**
 * A "radio-quiet" summary of an item from its noise rises per band: each band's worst rise and
 * verdict, the worst per range (below / above 30 MHz) and overall. Thresholds:
 * `RADIO_QUIET_THRESHOLDS_DB` (our own convention). Throws `empty` for no readings.
 */
export function radioQuietSummary(rises: readonly BandNoiseRise[]): RadioQuietSummary {
  if (!Array.isArray(rises)) throw new MeasureError('out-of-range', 'Noise rises must be a list.');
  if (rises.length === 0) throw new MeasureError('empty', 'A radio-quiet summary needs at least one noise reading.');
  const byBand = new Map<string, BandQuietness>();
  rises.forEach((r, i) => {
    if (r === null || typeof r !== 'object') throw new MeasureError('out-of-range', `Reading ${i + 1} must be an object.`);
    if (typeof r.band !== 'string' || !r.band.trim() || r.band.length > MAX_BAND_NAME) {
      throw new MeasureError('out-of-range', `Reading ${i + 1}: the band must be a name of at most ${MAX_BAND_NAME} characters.`);
    }
    const range = checkRange(r.range);
    const rise = assertFinite(r.riseDb, `Reading ${i + 1}: noise rise (dB)`);
    const band = r.band.trim();
    const key = `${range}\u0000${band}`;
    const seen = byBand.get(key);
    if (!seen) {
      byBand.set(key, { band, range, riseDb: rise, verdict: radioQuietVerdict(rise), readings: 1 });
    } else {
      seen.readings += 1;
      if (rise > seen.riseDb) {
        seen.riseDb = rise;
        seen.verdict = radioQuietVerdict(rise);
      }
    }
  });
  const bands = [...byBand.values()];
  const worstOf = (list: BandQuietness[]): RangeQuietness | null => {
    if (list.length === 0) return null;
    const worst = list.reduce((a, b) => (b.riseDb > a.riseDb ? b : a));
    return { verdict: worst.verdict, worstRiseDb: worst.riseDb, worstBand: worst.band, bands: list.length };
  };
  return {
    bands,
    byRange: {
      'below-30mhz': worstOf(bands.filter((b) => b.range === 'below-30mhz')),
      'above-30mhz': worstOf(bands.filter((b) => b.range === 'above-30mhz')),
    },
    overall: worstOf(bands) as RangeQuietness,
  };
}
