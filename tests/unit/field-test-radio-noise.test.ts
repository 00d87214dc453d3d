import { describe, expect, it } from 'vitest';
import {
  bandFigures,
  formatMeterReading,
  meterReadingSchema,
  noiseRiseSpecs,
  radioNoiseBandSchema,
  radioNoiseReadingsInputSchema,
  rangeOfFrequency,
  readingDbm,
  summaryOfRises,
} from '@/lib/field-tests/radio-noise';

const band = (over: Record<string, unknown> = {}) => ({
  item: 'bank',
  band: '40 m',
  frequencyMHz: 7.1,
  mode: 'ssb',
  bandwidthHz: 2400,
  distanceM: 1,
  baseline: { scale: 's-meter', sUnits: 3 },
  withItem: { scale: 's-meter', sUnits: 5 },
  ...over,
});
const messages = (r: { success: boolean; error?: { issues: { message: string }[] } }) => (r.error?.issues ?? []).map((i) => i.message).join(' | ');

describe('rangeOfFrequency: the 30 MHz boundary', () => {
  // ITU Radio Regulations Art. 2, No. 2.1 (from memory): a band includes its upper limit, so HF (3–30 MHz) holds 30 MHz itself.
  it.each([
    [0.5, 'below-30mhz'],
    [7.1, 'below-30mhz'],
    [29.999, 'below-30mhz'],
    [30, 'below-30mhz'],
    [30.001, 'above-30mhz'],
    [50.1, 'above-30mhz'],
    [145.5, 'above-30mhz'],
    [433.5, 'above-30mhz'],
  ])('%s MHz → %s', (mhz, range) => {
    expect(rangeOfFrequency(mhz)).toBe(range);
  });
});

describe('meterReadingSchema', () => {
  it('accepts S0–S9 (fractions too), dB over S9 only at S9, and dBm within the plausible span', () => {
    expect(meterReadingSchema.parse({ scale: 's-meter', sUnits: 0 })).toEqual({ scale: 's-meter', sUnits: 0, dbOverS9: 0 });
    expect(meterReadingSchema.parse({ scale: 's-meter', sUnits: 4.5 })).toEqual({ scale: 's-meter', sUnits: 4.5, dbOverS9: 0 });
    expect(meterReadingSchema.parse({ scale: 's-meter', sUnits: 9, dbOverS9: 60 })).toEqual({ scale: 's-meter', sUnits: 9, dbOverS9: 60 });
    expect(meterReadingSchema.parse({ scale: 'dbm', dbm: -174 })).toEqual({ scale: 'dbm', dbm: -174 });
    expect(meterReadingSchema.parse({ scale: 'dbm', dbm: 0 })).toEqual({ scale: 'dbm', dbm: 0 });
  });

  it.each([
    [{ scale: 's-meter', sUnits: 9.5 }, /S-units run from 0 to 9/],
    [{ scale: 's-meter', sUnits: -1 }, /S-units run from 0 to 9/],
    [{ scale: 's-meter', sUnits: 8, dbOverS9: 5 }, /applies only to a reading of S9/],
    [{ scale: 's-meter', sUnits: 9, dbOverS9: 61 }, /At most S9 \+ 60 dB/],
    [{ scale: 's-meter', sUnits: 9, dbOverS9: -3 }, /cannot be negative/],
    [{ scale: 's-meter', sUnits: Number.NaN }, /S-units/],
    [{ scale: 's-meter' }, /S-units as a number/],
    [{ scale: 'dbm', dbm: -175 }, /thermal noise floor/],
    [{ scale: 'dbm', dbm: 3 }, /not a noise floor/],
    [{ scale: 'dbm', dbm: Number.POSITIVE_INFINITY }, /level in dBm/],
    [{ scale: 'uv', value: 1 }, /Choose S-meter or dBm/],
    [{ sUnits: 5 }, /Choose S-meter or dBm/],
  ])('refuses %j', (input, message) => {
    const r = meterReadingSchema.safeParse(input);
    expect(r.success).toBe(false);
    expect(messages(r)).toMatch(message);
  });
});

describe('radioNoiseBandSchema and the readings list', () => {
  it('trims text, defaults the antenna notes, and keeps the numbers', () => {
    const r = radioNoiseBandSchema.parse(band({ band: '  40 m ' }));
    expect(r).toMatchObject({ band: '40 m', antenna: '', frequencyMHz: 7.1, bandwidthHz: 2400, distanceM: 1 });
  });

  it.each([
    [{ frequencyMHz: 0 }, /greater than 0 MHz/],
    [{ frequencyMHz: 10_001 }, /At most 10000 MHz/],
    [{ mode: 'usb' }, /Choose the mode/],
    [{ bandwidthHz: -2400 }, /greater than 0 Hz/],
    [{ bandwidthHz: 600_000 }, /At most 500000 Hz/],
    [{ distanceM: -0.5 }, /cannot be negative/],
    [{ band: ' ' }, /Name the band/],
    [{ band: 'x'.repeat(41) }, /At most 40 characters/],
    [{ item: '' }, /Choose the item/],
    [{ antenna: 'a'.repeat(201) }, /At most 200 characters/],
  ])('refuses %j', (over, message) => {
    const r = radioNoiseBandSchema.safeParse(band(over));
    expect(r.success).toBe(false);
    expect(messages(r)).toMatch(message);
  });

  it('takes 1 to 60 bands', () => {
    expect(radioNoiseReadingsInputSchema.safeParse({ readings: [band()] }).success).toBe(true);
    expect(messages(radioNoiseReadingsInputSchema.safeParse({ readings: [] }))).toMatch(/at least one band/);
    expect(messages(radioNoiseReadingsInputSchema.safeParse({ readings: Array.from({ length: 61 }, () => band()) }))).toMatch(/At most 60/);
  });
});

describe('dBm and rise of a band', () => {
  // check-values.md §12, IARU Region 1 Rec. R.1 worked values: HF S9 = −73, S5 = −97, S1 = −121, S9+20 = −53 dBm; VHF S9 = −93, S7 = −105 dBm.
  it('converts S-meter readings per range and keeps dBm readings as entered', () => {
    expect(readingDbm({ scale: 's-meter', sUnits: 5, dbOverS9: 0 }, 'below-30mhz')).toBe(-97);
    expect(readingDbm({ scale: 's-meter', sUnits: 1, dbOverS9: 0 }, 'below-30mhz')).toBe(-121);
    expect(readingDbm({ scale: 's-meter', sUnits: 9, dbOverS9: 20 }, 'below-30mhz')).toBe(-53);
    expect(readingDbm({ scale: 's-meter', sUnits: 7, dbOverS9: 0 }, 'above-30mhz')).toBe(-105);
    expect(readingDbm({ scale: 'dbm', dbm: -118.5 }, 'above-30mhz')).toBe(-118.5);
  });

  it('works out range, both levels and the rise (HF S3 → S5 is 12 dB, check-values.md §12)', () => {
    const parsed = radioNoiseBandSchema.parse(band());
    expect(bandFigures(parsed)).toEqual({ range: 'below-30mhz', baselineDbm: -109, withItemDbm: -97, riseDb: 12 });
    // The same S-units on 2 m: S9 = −93 dBm above 30 MHz, so S3 = −129 dBm and S5 = −117 dBm; still 12 dB.
    expect(bandFigures(radioNoiseBandSchema.parse(band({ frequencyMHz: 145.5 })))).toEqual({ range: 'above-30mhz', baselineDbm: -129, withItemDbm: -117, riseDb: 12 });
    // Mixed scales: baseline in dBm, with-item on the S-meter (HF S9 = −73 dBm): −73 − (−80) = 7 dB.
    expect(bandFigures(radioNoiseBandSchema.parse(band({ baseline: { scale: 'dbm', dbm: -80 }, withItem: { scale: 's-meter', sUnits: 9 } }))).riseDb).toBe(7);
  });

  it('formats readings as entered', () => {
    expect(formatMeterReading({ scale: 's-meter', sUnits: 5, dbOverS9: 0 })).toBe('S5');
    expect(formatMeterReading({ scale: 's-meter', sUnits: 9, dbOverS9: 10 })).toBe('S9 + 10 dB');
    expect(formatMeterReading({ scale: 'dbm', dbm: -118.25 })).toBe('−118.3 dBm');
  });
});

describe('summary and specs from stored rises', () => {
  it('is null without readings', () => {
    expect(summaryOfRises([])).toBeNull();
  });

  it('gives the worst band per range as the two measured specs', () => {
    const summary = summaryOfRises([
      { band: '40 m', range: 'below-30mhz', riseDb: 12 },
      { band: '80 m', range: 'below-30mhz', riseDb: 6 },
      { band: '40 m', range: 'below-30mhz', riseDb: 2 },
      { band: '2 m', range: 'above-30mhz', riseDb: 0.5 },
    ])!;
    expect(summary.bands.map((b) => [b.band, b.riseDb, b.verdict, b.readings])).toEqual([
      ['40 m', 12, 'noisy', 2],
      ['80 m', 6, 'noisy', 1],
      ['2 m', 0.5, 'quiet', 1],
    ]);
    expect(noiseRiseSpecs(summary)).toEqual({ noiseRiseBelow30: 12, noiseRiseAbove30: 0.5 });
    expect(noiseRiseSpecs(summaryOfRises([{ band: '20 m', range: 'below-30mhz', riseDb: 3 }])!)).toEqual({ noiseRiseBelow30: 3 });
  });
});
