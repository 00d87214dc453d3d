import { z } from 'zod';
import {
  MAX_DB_OVER_S9,
  noiseRiseDb,
  radioQuietSummary,
  sMeterToDbm,
  type RadioQuietSummary,
  type SMeterRange,
} from '@/lib/measure';

/*
 * Radio-noise check (issue 9): a receiver's noise floor per band, read on a quiet reference supply
 * (baseline) and then with the item under test powering it or running nearby. One zod schema per input,
 * shared by the logbook form, the data layer (db/radio-noise.ts) and the API route.
 */

/** Receive modes a reviewer picks (our own list). */
export const RADIO_MODES = ['ssb', 'cw', 'am', 'fm', 'data'] as const;
export type RadioMode = (typeof RADIO_MODES)[number];
export const RADIO_MODE_LABELS: Record<RadioMode, string> = { ssb: 'SSB', cw: 'CW', am: 'AM', fm: 'FM', data: 'Data' };

/** How a reading was taken: an S-meter (S-units, and dB over S9 at S9) or a level in dBm. */
export const METER_SCALES = ['s-meter', 'dbm'] as const;
export type MeterScale = (typeof METER_SCALES)[number];

/** The S-meter range boundary in MHz. */
export const RANGE_BOUNDARY_MHZ = 30;

/**
 * The S-meter range of a frequency. The IARU Region 1 Rec. R.1 S9 levels differ below and above 30 MHz;
 * 30 MHz itself counts as below, because the HF band (3–30 MHz) includes its upper limit (ITU Radio
 * Regulations Art. 2, No. 2.1: each band includes its upper limit and excludes its lower; from memory).
 */
export function rangeOfFrequency(frequencyMHz: number): SMeterRange {
  return frequencyMHz <= RANGE_BOUNDARY_MHZ ? 'below-30mhz' : 'above-30mhz';
}

export const RANGE_LABELS: Record<SMeterRange, string> = {
  'below-30mhz': 'Below 30 MHz (HF)',
  'above-30mhz': 'Above 30 MHz (VHF and up)',
};

/** Highest frequency accepted, MHz (a receiver a field school carries stops well below 10 GHz; common practice, no source). */
export const MAX_FREQUENCY_MHZ = 10_000;
/** Widest receiver bandwidth accepted, Hz (a wide FM broadcast filter is about 200 kHz; common practice, no source). */
export const MAX_BANDWIDTH_HZ = 500_000;
/** Plausible dBm readings: the thermal floor is −174 dBm in 1 Hz (kTB at 290 K); a meter at 0 dBm is pinned. */
export const MIN_DBM = -174;
export const MAX_DBM = 0;
export const MAX_BANDS_PER_TEST = 60;

const number = (what: string) => z.number(`Give the ${what} as a number.`).finite(`Give the ${what} as a finite number.`);

/** One noise-floor reading as entered. */
export const meterReadingSchema = z.discriminatedUnion(
  'scale',
  [
    z
      .object({
        scale: z.literal('s-meter'),
        sUnits: number('S-units').min(0, 'S-units run from 0 to 9.').max(9, 'S-units run from 0 to 9; above S9 give “dB over S9”.'),
        dbOverS9: number('dB over S9').min(0, 'dB over S9 cannot be negative.').max(MAX_DB_OVER_S9, `At most S9 + ${MAX_DB_OVER_S9} dB.`).default(0),
      })
      .refine((r) => r.dbOverS9 === 0 || r.sUnits === 9, { message: '“dB over S9” applies only to a reading of S9.', path: ['dbOverS9'] }),
    z.object({
      scale: z.literal('dbm'),
      dbm: number('level in dBm').min(MIN_DBM, `Below ${MIN_DBM} dBm is under the thermal noise floor: check the reading.`).max(MAX_DBM, `Above ${MAX_DBM} dBm is not a noise floor: check the reading.`),
    }),
  ],
  { error: 'Choose S-meter or dBm for the reading.' },
);
export type MeterReading = z.output<typeof meterReadingSchema>;

const slugSchema = z.string().trim().min(1, 'Choose the item.').max(200);

/** One band's readings: baseline on the reference supply and with the item. */
export const radioNoiseBandSchema = z.object({
  /** Slug of one of the test's items. */
  item: slugSchema,
  band: z.string().trim().min(1, 'Name the band, e.g. “40 m” or “2 m”.').max(40, 'At most 40 characters.'),
  frequencyMHz: number('frequency (MHz)').gt(0, 'The frequency must be greater than 0 MHz.').max(MAX_FREQUENCY_MHZ, `At most ${MAX_FREQUENCY_MHZ} MHz.`),
  mode: z.enum(RADIO_MODES, `Choose the mode: ${RADIO_MODES.map((m) => RADIO_MODE_LABELS[m]).join(', ')}.`),
  bandwidthHz: number('receiver bandwidth (Hz)').gt(0, 'The bandwidth must be greater than 0 Hz.').max(MAX_BANDWIDTH_HZ, `At most ${MAX_BANDWIDTH_HZ} Hz.`),
  antenna: z.string().trim().max(200, 'At most 200 characters.').default(''),
  distanceM: number('distance (m)').min(0, 'The distance cannot be negative.').max(1000, 'At most 1000 m.'),
  baseline: meterReadingSchema,
  withItem: meterReadingSchema,
});
export type RadioNoiseBandInput = z.output<typeof radioNoiseBandSchema>;

/** PUT body: every band reading of the test (replaces what is stored). */
export const radioNoiseReadingsInputSchema = z.object({
  readings: z.array(radioNoiseBandSchema).min(1, 'Add at least one band.').max(MAX_BANDS_PER_TEST, `At most ${MAX_BANDS_PER_TEST} band readings in one test.`),
});
export type RadioNoiseReadingsInput = z.output<typeof radioNoiseReadingsInputSchema>;
export type RadioNoiseReadingsFormValues = z.input<typeof radioNoiseReadingsInputSchema>;

/** A reading's level in dBm: IARU Region 1 Rec. R.1 for S-meter readings (through lib/measure), as entered for dBm. */
export function readingDbm(reading: MeterReading, range: SMeterRange): number {
  return reading.scale === 'dbm' ? reading.dbm : sMeterToDbm(reading.sUnits, reading.dbOverS9, range);
}

/** "S7", "S9 + 10 dB" or "−95 dBm". */
export function formatMeterReading(reading: MeterReading): string {
  if (reading.scale === 'dbm') return `${formatDb(reading.dbm)} dBm`;
  return reading.dbOverS9 > 0 ? `S9 + ${formatDb(reading.dbOverS9)} dB` : `S${formatDb(reading.sUnits)}`;
}

/** A dB figure with at most one decimal and a true minus sign. */
export function formatDb(value: number): string {
  // Half away from zero on both sides, so −118.25 reads −118.3 like 118.25 reads 118.3.
  const magnitude = Math.round(Math.abs(value) * 10) / 10;
  return value < 0 && magnitude !== 0 ? `−${magnitude}` : String(magnitude);
}

/** A band's derived figures: range from the frequency, both levels in dBm and the rise. */
export interface BandFigures {
  range: SMeterRange;
  baselineDbm: number;
  withItemDbm: number;
  riseDb: number;
}

export function bandFigures(band: Pick<RadioNoiseBandInput, 'frequencyMHz' | 'baseline' | 'withItem'>): BandFigures {
  const range = rangeOfFrequency(band.frequencyMHz);
  const baselineDbm = readingDbm(band.baseline, range);
  const withItemDbm = readingDbm(band.withItem, range);
  return { range, baselineDbm, withItemDbm, riseDb: noiseRiseDb(baselineDbm, withItemDbm) };
}

/** The radio-quiet summary of stored band rises (null for none). */
export function summaryOfRises(rises: readonly { band: string; range: SMeterRange; riseDb: number }[]): RadioQuietSummary | null {
  return rises.length === 0 ? null : radioQuietSummary(rises.map((r) => ({ band: r.band, range: r.range, riseDb: r.riseDb })));
}

/** The measured noise-rise spec of each range: the worst rise in it (absent when the range was not tested). */
export function noiseRiseSpecs(summary: RadioQuietSummary): { noiseRiseBelow30?: number; noiseRiseAbove30?: number } {
  const below = summary.byRange['below-30mhz'];
  const above = summary.byRange['above-30mhz'];
  return { ...(below && { noiseRiseBelow30: below.worstRiseDb }), ...(above && { noiseRiseAbove30: above.worstRiseDb }) };
}
