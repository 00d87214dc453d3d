import { describe, expect, it } from 'vitest';
import { browseApiQuery, browseValuesFromSearchParams } from '@/components/browse/browse-params';
import { sortOptions } from '@/components/browse/sort-options';
import { parseGearListQuery } from '@/lib/browse/query';
import { NOISE_RISE_SPEC, RADIO_QUIET_BELOW_DB, radioQuietRanges, radioQuietSpecKeys, rangeVerdicts } from '@/lib/browse/radio-quiet';
import { AppError } from '@/lib/http/errors';
import { buildOpenApiDocument } from '@/lib/openapi/document';
import { RADIO_QUIET_THRESHOLDS_DB, sMeterToDbm, noiseRiseDb, SPECS } from '@/lib/measure';

const parse = (query: string) => parseGearListQuery(new URLSearchParams(query));
function badRequest(run: () => unknown): AppError {
  try {
    run();
  } catch (error) {
    expect(error).toBeInstanceOf(AppError);
    return error as AppError;
  }
  throw new Error('expected a 400');
}

describe('radioQuiet parameter', () => {
  it('parses the three values and leaves the filter off without it', () => {
    expect(parse('radioQuiet=below-30mhz').radioQuiet).toBe('below-30mhz');
    expect(parse('radioQuiet=above-30mhz').radioQuiet).toBe('above-30mhz');
    expect(parse('radioQuiet=both&category=power-bank').radioQuiet).toBe('both');
    expect(parse('').radioQuiet).toBeUndefined();
  });

  it.each(['', 'true', 'Below-30MHz', 'hf', 'both,above-30mhz', 'below-30mhz '])('refuses %j with a 400 naming radioQuiet', (value) => {
    const error = badRequest(() => parse(`radioQuiet=${encodeURIComponent(value)}`));
    expect(error.code).toBe('bad_request');
    expect(error.message).toMatch(/^Query parameter "radioQuiet": Must be one of below-30mhz, above-30mhz, both\./);
    expect(Object.keys(error.fields ?? {})).toEqual(['radioQuiet']);
  });

  it('refuses the parameter given twice', () => {
    expect(badRequest(() => parse('radioQuiet=both&radioQuiet=below-30mhz')).fields).toEqual({ radioQuiet: ['Is given more than once.'] });
  });

  it('maps each value to the measured-only specs it requires', () => {
    expect(radioQuietRanges('both')).toEqual(['below-30mhz', 'above-30mhz']);
    expect(radioQuietSpecKeys('below-30mhz')).toEqual(['noiseRiseBelow30']);
    expect(radioQuietSpecKeys('above-30mhz')).toEqual(['noiseRiseAbove30']);
    expect(radioQuietSpecKeys('both')).toEqual(['noiseRiseBelow30', 'noiseRiseAbove30']);
    for (const key of Object.values(NOISE_RISE_SPEC)) {
      expect(SPECS[key]).toMatchObject({ unit: 'dB', measuredOnly: true, higherIsBetter: false });
    }
    // Quiet means under 1 dB: our own convention (common practice, no source), lib/measure's threshold.
    expect(RADIO_QUIET_BELOW_DB).toBe(RADIO_QUIET_THRESHOLDS_DB.quietBelow);
    expect(RADIO_QUIET_BELOW_DB).toBe(1);
  });
});

describe('verdict per range from an item\'s specs', () => {
  const measured = (value: number) => ({ value, unit: 'dB', basis: 'measured' as const });

  it('gives the verdict word and worst rise for each tested range, in range order', () => {
    // S3 → S5 below 30 MHz: (−97) − (−109) = 12 dB (IARU Region 1 R.1, 6 dB per S-unit; check-values.md §12).
    const hfRise = noiseRiseDb(sMeterToDbm(3, 0, 'below-30mhz'), sMeterToDbm(5, 0, 'below-30mhz'));
    expect(hfRise).toBe(12);
    expect(rangeVerdicts({ noiseRiseAbove30: measured(0.5), noiseRiseBelow30: measured(hfRise) })).toEqual([
      { range: 'below-30mhz', rangeLabel: 'below 30 MHz', riseDb: 12, verdict: 'noisy' },
      { range: 'above-30mhz', rangeLabel: 'above 30 MHz', riseDb: 0.5, verdict: 'quiet' },
    ]);
  });

  it('puts the thresholds at 1 dB and 6 dB (our convention): 0.99 quiet, 1 slight, 5.99 slight, 6 noisy', () => {
    const verdict = (v: number) => rangeVerdicts({ noiseRiseBelow30: measured(v) })[0]!.verdict;
    expect(verdict(-0.5)).toBe('quiet'); // meter scatter: a reading lower with the item
    expect(verdict(0.99)).toBe('quiet');
    expect(verdict(1)).toBe('slight');
    expect(verdict(5.99)).toBe('slight');
    expect(verdict(6)).toBe('noisy'); // one S-unit (IARU Region 1 R.1)
  });

  it('leaves out untested ranges and claimed figures', () => {
    expect(rangeVerdicts({})).toEqual([]);
    expect(rangeVerdicts({ noiseRiseBelow30: { value: 0.2, basis: 'claimed' } })).toEqual([]);
    expect(rangeVerdicts({ noiseRiseBelow30: { value: Number.NaN, basis: 'measured' } })).toEqual([]);
  });
});

describe('browse page wiring', () => {
  it('carries radioQuiet from the page URL into the API query', () => {
    expect(browseApiQuery(browseValuesFromSearchParams({ category: 'power-bank', radioQuiet: 'both' }))).toBe('category=power-bank&radioQuiet=both&limit=24');
    // What the page sends is what the API accepts.
    expect(parse('category=power-bank&radioQuiet=both&limit=24').radioQuiet).toBe('both');
  });

  it('offers the noise rises as sorts without a category and in every category whose specs list them', () => {
    const keys = (category: string | null) => sortOptions(category, null).map((o) => o.key);
    expect(keys(null)).toEqual(expect.arrayContaining(['noiseRiseBelow30', 'noiseRiseAbove30']));
    expect(sortOptions(null, null).find((o) => o.key === 'noiseRiseBelow30')!.unit).toBe('dB');
    expect(keys('power-bank')).toContain('noiseRiseAbove30');
    // Measured-only: no "measured ÷ claimed" sort for them.
    expect(keys('power-bank')).not.toContain('measured-vs-claimed:noiseRiseBelow30');
  });
});

describe('OpenAPI', () => {
  it('documents radioQuiet on GET /api/v1/gear from the zod schema, with its three values', () => {
    const doc = buildOpenApiDocument() as unknown as { paths: Record<string, { get: { parameters: { name: string; in: string; schema: { enum?: string[] }; description?: string }[] } }> };
    const param = doc.paths['/api/v1/gear']!.get.parameters.find((p) => p.name === 'radioQuiet')!;
    expect(param.in).toBe('query');
    expect(param.schema.enum).toEqual(['below-30mhz', 'above-30mhz', 'both']);
    expect(param.description).toContain('under 1 dB');
  });
});

describe('sort menu labels', () => {
  it('are short enough for the menu and keep MHz in capitals', () => {
    const labels = sortOptions('power-bank', null).filter((o) => o.key.startsWith('noiseRise')).map((o) => o.label);
    expect(labels).toEqual(['Radio noise rise below 30 MHz', 'Radio noise rise above 30 MHz']);
  });
});
