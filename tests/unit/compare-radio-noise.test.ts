import { describe, expect, it } from 'vitest';
import type { CompareResponse } from '@/lib/browse/contract';
import { buildComparison, type CompareFigure, type CompareItemInput } from '@/lib/compare';
import { radioNoiseGroup, withRadioNoise } from '@/lib/compare/radio-noise';
import { sideBySideCsvRows, sideBySideView } from '@/lib/side-by-side/table-model';

/*
 * Verdicts: quiet under 1 dB, slight under 6 dB, noisy from 6 dB (RADIO_QUIET_THRESHOLDS_DB: our own
 * convention, common practice, no source). Rises from S-meter readings by IARU Region 1 R.1 (6 dB per S-unit):
 * S3 → S5 on HF = 12 dB; S2 → S2 on VHF = 0 dB (check-values.md §12).
 */
const dB = (value: number, test = 'ft-1'): CompareFigure => ({ value, unit: 'dB', basis: 'measured', provenance: `/field-tests/${test}` });
const item = (slug: string, specs: CompareItemInput['specs']): CompareItemInput => ({
  item: { slug, name: slug, maker: 'Voltmoth', category: 'power-bank', kind: 'pocket', path: `/gear/${slug}`, photo: null, price: null },
  specs: { mass: { value: 200, unit: 'g', basis: 'claimed', provenance: null }, ...specs },
  ratios: {},
  conditions: null,
});

describe('side-by-side Radio noise group', () => {
  const items = [
    item('a', { noiseRiseBelow30: dB(12, 'ft-a'), noiseRiseAbove30: dB(0, 'ft-a') }),
    item('b', { noiseRiseBelow30: dB(0.4, 'ft-b') }),
    item('c', {}),
  ];

  it('a verdict row and a worst-rise row per tested range; lower rise is best; untested cells empty', () => {
    const group = radioNoiseGroup(items)!;
    expect(group.id).toBe('radio-noise');
    expect(group.label).toBe('Radio noise');
    expect(group.rows.map((r) => r.key)).toEqual(['radio-noise-verdict:below-30mhz', 'noiseRiseBelow30', 'radio-noise-verdict:above-30mhz', 'noiseRiseAbove30']);
    const [verdictHf, riseHf, verdictVhf, riseVhf] = group.rows;
    expect(verdictHf!.cells.map((c) => c.value)).toEqual(['noisy', 'quiet', null]);
    expect(verdictHf!.direction).toBeNull();
    expect(verdictHf!.cells.some((c) => c.best)).toBe(false);
    expect(riseHf).toMatchObject({ unit: 'dB', direction: 'lower', label: 'Worst noise rise below 30 MHz' });
    expect(riseHf!.cells.map((c) => c.value)).toEqual([12, 0.4, null]);
    expect(riseHf!.cells.map((c) => c.best)).toEqual([false, true, false]);
    expect(riseHf!.cells[0]!.provenance).toBe('/field-tests/ft-a');
    // One item tested above 30 MHz: nothing to compare, so nothing is best (as in every row).
    expect(verdictVhf!.cells.map((c) => c.value)).toEqual(['quiet', null, null]);
    expect(riseVhf!.cells.map((c) => c.best)).toEqual([false, false, false]);
  });

  it('ties are all best; a rise of exactly 1 dB is slight and 6 dB noisy', () => {
    const group = radioNoiseGroup([item('x', { noiseRiseBelow30: dB(1) }), item('y', { noiseRiseBelow30: dB(1) }), item('z', { noiseRiseBelow30: dB(6) })])!;
    expect(group.rows[0]!.cells.map((c) => c.value)).toEqual(['slight', 'slight', 'noisy']);
    expect(group.rows[1]!.cells.map((c) => c.best)).toEqual([true, true, false]);
  });

  it('no group when no item was checked', () => {
    expect(radioNoiseGroup([item('p', {}), item('q', {})])).toBeNull();
  });

  it('moves the noise rises out of Specs and places the group after it; the table and CSV show the words and numbers', () => {
    const built = withRadioNoise(buildComparison(items), items);
    expect(built.groups.map((g) => g.id)).toEqual(['specs', 'radio-noise']);
    expect(built.groups[0]!.rows.map((r) => r.key)).toEqual(['mass']);
    const view = sideBySideView(built as CompareResponse, { units: 'imperial', hideEqual: false });
    const csv = sideBySideCsvRows(view);
    expect(csv).toContainEqual(['Radio noise', 'Verdict below 30 MHz', '', 'noisy', 'quiet', '', '']);
    expect(csv).toContainEqual(['Radio noise', 'Worst noise rise below 30 MHz', 'dB', '12', '0.4', '', 'Voltmoth b']);
  });
});
