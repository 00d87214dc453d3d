import { describe, expect, it } from 'vitest';
import fc from 'fast-check';
import { noiseRiseDb, radioQuietSummary, radioQuietVerdict, sMeterToDbm, type SMeterRange } from '@/lib/measure';
import { expectCode, finiteOrMeasureError } from './measure/helpers';

// IARU Region 1 Technical Recommendation R.1 (check-values §12): one S-unit is 6 dB; S9 = −73 dBm
// below 30 MHz and −93 dBm above; dBm = S9 + 6 × (S − 9); "S9 + N dB" = S9 + N.
describe('sMeterToDbm against the IARU Region 1 Rec. R.1 worked values (check-values §12)', () => {
  it.each([
    [9, 0, 'below-30mhz', -73], // S9 on HF
    [5, 0, 'below-30mhz', -97], // S5 on HF
    [1, 0, 'below-30mhz', -121], // S1 on HF (0.2 µV)
    [9, 20, 'below-30mhz', -53], // S9 + 20 dB on HF
    [9, 0, 'above-30mhz', -93], // S9 on VHF/UHF
    [7, 0, 'above-30mhz', -105], // S7 on VHF/UHF
  ] as const)('S%d + %d dB (%s) = %d dBm', (s, over, range, dbm) => {
    expect(sMeterToDbm(s, over, range)).toBe(dbm);
  });

  it('S0 extends the scale by one more S-unit (−73 − 9 × 6 = −127 dBm on HF)', () => {
    expect(sMeterToDbm(0, 0, 'below-30mhz')).toBe(-127);
  });

  it('a needle read between marks: S5.5 on HF = −73 + 6 × (−3.5) = −94 dBm', () => {
    expect(sMeterToDbm(5.5, 0, 'below-30mhz')).toBe(-94);
  });

  it('each S-unit is 6 dB and the two ranges differ by 20 dB at every reading', () => {
    fc.assert(
      fc.property(fc.integer({ min: 0, max: 8 }), fc.constantFrom<SMeterRange>('below-30mhz', 'above-30mhz'), (s, r) => {
        expect(sMeterToDbm(s + 1, 0, r) - sMeterToDbm(s, 0, r)).toBe(6);
        expect(sMeterToDbm(s, 0, 'below-30mhz') - sMeterToDbm(s, 0, 'above-30mhz')).toBe(20);
      }),
    );
  });

  it('rejects readings off the scale', () => {
    expectCode(() => sMeterToDbm(10, 0, 'below-30mhz'), 'out-of-range');
    expectCode(() => sMeterToDbm(-1, 0, 'below-30mhz'), 'out-of-range');
    expectCode(() => sMeterToDbm(5, 10, 'below-30mhz'), 'out-of-range'); // "dB over S9" only at S9
    expectCode(() => sMeterToDbm(9, -3, 'below-30mhz'), 'out-of-range');
    expectCode(() => sMeterToDbm(9, 61, 'below-30mhz'), 'out-of-range');
    expectCode(() => sMeterToDbm(9, 0, 'hf' as never), 'out-of-range');
    expectCode(() => sMeterToDbm(Number.NaN, 0, 'below-30mhz'), 'not-finite');
  });

  it('never returns NaN or ±Infinity', () => {
    fc.assert(fc.property(fc.double(), fc.double(), (s, o) => finiteOrMeasureError(() => sMeterToDbm(s, o, 'above-30mhz'))), { numRuns: 300 });
  });
});

describe('noiseRiseDb', () => {
  it('S3 → S5 on HF is a rise of 12 dB (check-values §12)', () => {
    const base = sMeterToDbm(3, 0, 'below-30mhz'); // −109 dBm
    const withItem = sMeterToDbm(5, 0, 'below-30mhz'); // −97 dBm
    expect(noiseRiseDb(base, withItem)).toBe(12);
  });

  it('is the difference of the readings: antisymmetric and additive', () => {
    const dbm = fc.double({ min: -160, max: 0, noNaN: true });
    fc.assert(
      fc.property(dbm, dbm, dbm, (a, b, c) => {
        expect(noiseRiseDb(a, b)).toBeCloseTo(-noiseRiseDb(b, a), 9);
        expect(noiseRiseDb(a, c)).toBeCloseTo(noiseRiseDb(a, b) + noiseRiseDb(b, c), 9);
      }),
    );
    expectCode(() => noiseRiseDb(Number.NaN, -90), 'not-finite');
    expectCode(() => noiseRiseDb(-90, Number.POSITIVE_INFINITY), 'not-finite');
  });
});

describe('radioQuietSummary (thresholds: our own convention, common practice, no source)', () => {
  it('verdict boundaries: < 1 dB quiet, < 6 dB (one S-unit) slight, else noisy', () => {
    expect(radioQuietVerdict(-2)).toBe('quiet'); // the item's reading lower than the baseline: meter scatter
    expect(radioQuietVerdict(0.99)).toBe('quiet');
    expect(radioQuietVerdict(1)).toBe('slight');
    expect(radioQuietVerdict(5.99)).toBe('slight');
    expect(radioQuietVerdict(6)).toBe('noisy'); // exactly one S-unit (IARU R.1: 6 dB)
  });

  it('worst reading per band, worst band per range and overall', () => {
    const s = radioQuietSummary([
      { band: '40 m', range: 'below-30mhz', riseDb: 3 },
      { band: '40 m', range: 'below-30mhz', riseDb: 7 }, // repeat: the worst counts
      { band: '20 m', range: 'below-30mhz', riseDb: 0.5 },
      { band: '2 m', range: 'above-30mhz', riseDb: 0 },
    ]);
    expect(s.bands).toEqual([
      { band: '40 m', range: 'below-30mhz', riseDb: 7, verdict: 'noisy', readings: 2 },
      { band: '20 m', range: 'below-30mhz', riseDb: 0.5, verdict: 'quiet', readings: 1 },
      { band: '2 m', range: 'above-30mhz', riseDb: 0, verdict: 'quiet', readings: 1 },
    ]);
    expect(s.byRange).toEqual({
      'below-30mhz': { verdict: 'noisy', worstRiseDb: 7, worstBand: '40 m', bands: 2 },
      'above-30mhz': { verdict: 'quiet', worstRiseDb: 0, worstBand: '2 m', bands: 1 },
    });
    expect(s.overall).toEqual({ verdict: 'noisy', worstRiseDb: 7, worstBand: '40 m', bands: 3 });
  });

  it('a range that was not tested is null', () => {
    const s = radioQuietSummary([{ band: '80 m', range: 'below-30mhz', riseDb: 2 }]);
    expect(s.byRange['above-30mhz']).toBeNull();
    expect(s.overall.verdict).toBe('slight');
  });

  it('rejects empty or malformed readings', () => {
    expectCode(() => radioQuietSummary([]), 'empty');
    expectCode(() => radioQuietSummary(null as never), 'out-of-range');
    expectCode(() => radioQuietSummary([{ band: '', range: 'below-30mhz', riseDb: 1 }]), 'out-of-range');
    expectCode(() => radioQuietSummary([{ band: '40 m', range: 'hf' as never, riseDb: 1 }]), 'out-of-range');
    expectCode(() => radioQuietSummary([{ band: '40 m', range: 'below-30mhz', riseDb: Number.NaN }]), 'not-finite');
  });

  it('the overall verdict is the worst band verdict', () => {
    const reading = fc.record({
      band: fc.constantFrom('80 m', '40 m', '20 m', '2 m', '70 cm'),
      range: fc.constantFrom<SMeterRange>('below-30mhz', 'above-30mhz'),
      riseDb: fc.double({ min: -5, max: 40, noNaN: true }),
    });
    const order = { quiet: 0, slight: 1, noisy: 2 } as const;
    fc.assert(
      fc.property(fc.array(reading, { minLength: 1, maxLength: 12 }), (rs) => {
        const s = radioQuietSummary(rs);
        expect(s.overall.worstRiseDb).toBe(Math.max(...rs.map((r) => r.riseDb)));
        expect(order[s.overall.verdict]).toBe(Math.max(...s.bands.map((b) => order[b.verdict])));
      }),
    );
  });
});
