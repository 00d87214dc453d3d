import { describe, expect, it } from 'vitest';
import { allEqual, bestFlags, buildComparison, directionOf, sameNumber, type CompareItemInput } from '@/lib/compare';

const item = (slug: string, category: string, specs: CompareItemInput['specs'], ratios: CompareItemInput['ratios'] = {}, conditions: CompareItemInput['conditions'] = null): CompareItemInput => ({
  item: { slug, name: slug, maker: 'Northcairn', category, kind: null, path: `/gear/${slug}`, photo: null, price: null },
  specs,
  ratios,
  conditions,
});
const claimed = (value: number, unit: string) => ({ value, unit, basis: 'claimed' as const, provenance: null });

describe('best in a row', () => {
  it('is direction-aware and marks every tie', () => {
    expect(bestFlags([250, 300, 100], 'lower')).toEqual([false, false, true]);
    expect(bestFlags([250, 300, 100], 'higher')).toEqual([false, true, false]);
    expect(bestFlags([2, 1.2, 2], 'higher')).toEqual([true, false, true]);
    // 0.1 + 0.2 and 0.3 differ in the last bit (IEEE 754 binary64) but are the same figure.
    expect(bestFlags([0.1 + 0.2, 0.3, 0.2], 'higher')).toEqual([true, true, false]);
  });

  it('marks nothing without a direction, or with fewer than two values to compare', () => {
    expect(bestFlags([12.8, 13.2], null)).toEqual([false, false]);
    expect(bestFlags([600, null], 'higher')).toEqual([false, false]);
    expect(bestFlags([null, null], 'lower')).toEqual([false, false]);
    expect(bestFlags(['2026-10-03', '2026-10-04'], 'higher')).toEqual([false, false]);
  });

  it('follows lib/measure for directions', () => {
    expect(directionOf(true)).toBe('higher');
    expect(directionOf(false)).toBe('lower');
    expect(directionOf(null)).toBeNull();
  });
});

describe('all equal', () => {
  it('counts a missing value as different from a present one', () => {
    expect(allEqual([300, 300])).toBe(true);
    expect(allEqual([300, null])).toBe(false);
    expect(allEqual(['Clear', 'Clear'])).toBe(true);
    expect(allEqual([0.1 + 0.2, 0.3])).toBe(true);
    expect(sameNumber(1, 1 + 1e-6)).toBe(false);
  });
});

describe('buildComparison', () => {
  it('aligns rows by spec in the shared category’s order and groups ratios and measured ÷ claimed', () => {
    const result = buildComparison([
      item('a', 'light', { luminousFlux: claimed(300, 'lm'), mass: claimed(250, 'g') }, { 'lm-per-g': claimed(1.2, 'lm/g'), 'measured-vs-claimed:mass': { value: 1.05, unit: '', basis: 'mixed', provenance: null } }),
      item('b', 'light', { mass: claimed(100, 'g'), runtime: claimed(18000, 's') }, { 'lm-per-g': claimed(2, 'lm/g') }),
    ]);
    expect(result.items.map((i) => i.slug)).toEqual(['a', 'b']);
    expect(result.groups.map((g) => g.id)).toEqual(['specs', 'ratios', 'measured-vs-claimed']);
    const specs = result.groups[0]!.rows;
    // lib/gear/categories light order: mass, light output, runtime.
    expect(specs.map((r) => r.key)).toEqual(['mass', 'luminousFlux', 'runtime']);
    expect(specs[1]!.label).toBe('Light output (highest mode)');
    expect(specs[2]!.cells.map((c) => c.value)).toEqual([null, 18000]);
    expect(specs[0]!.cells.map((c) => c.best)).toEqual([false, true]);
    const mvc = result.groups[2]!.rows[0]!;
    // Mass: more than claimed is worse (lib/measure SPECS.mass.higherIsBetter = false).
    expect(mvc).toMatchObject({ key: 'measured-vs-claimed:mass', direction: 'lower', unit: '' });
  });

  it('does not rank per-money ratios in different currencies', () => {
    const result = buildComparison([
      item('a', 'power-bank', {}, { 'wh-per-money': claimed(1.48, 'Wh/USD') }),
      item('b', 'power-bank', {}, { 'wh-per-money': claimed(1.5, 'Wh/GBP') }),
    ]);
    const row = result.groups[0]!.rows[0]!;
    expect(row).toMatchObject({ key: 'wh-per-money', unit: '', direction: null });
    expect(row.cells.map((c) => c.best)).toEqual([false, false]);
    const same = buildComparison([
      item('a', 'power-bank', {}, { 'money-per-wh': claimed(0.68, 'USD/Wh') }),
      item('b', 'power-bank', {}, { 'money-per-wh': claimed(0.5, 'USD/Wh') }),
    ]);
    // Cost per Wh: lower is better (lib/measure valueRatios money-per-wh higherIsBetter false).
    expect(same.groups[0]!.rows[0]!).toMatchObject({ unit: 'USD/Wh', direction: 'lower' });
    expect(same.groups[0]!.rows[0]!.cells.map((c) => c.best)).toEqual([false, true]);
  });

  it('uses SPECS labels across categories and lists test conditions without ranking them', () => {
    const result = buildComparison(
      [
        item('a', 'light', { mass: claimed(250, 'g') }, {}, { provenance: '/field-tests/t1', testedOn: '2026-10-03', ambientC: 20, sky: 'overcast', place: 'Cedar Hollow Field School' }),
        item('b', 'solar-panel', { mass: claimed(2000, 'g') }),
      ],
      { imperial: true },
    );
    expect(result.groups.map((g) => g.id)).toEqual(['specs', 'test-conditions']);
    expect(result.groups[0]!.rows[0]!.label).toBe('Mass');
    // 2000 g = 4.409 lb (1 lb = 453.592 37 g, 1959 agreement).
    expect(result.groups[0]!.rows[0]!.cells[1]!.imperial).toEqual({ value: expect.closeTo(2000 / 453.59237, 12), unit: 'lb' });
    const conditions = result.groups[1]!.rows;
    expect(conditions.map((r) => r.key)).toEqual(['tested-on', 'ambient-temperature', 'sky', 'place']);
    expect(conditions.every((r) => r.direction === null && r.cells.every((c) => !c.best))).toBe(true);
    expect(conditions[2]!.cells.map((c) => c.value)).toEqual(['Overcast', null]);
    // 20 °C = 68 °F (t/°F = 1.8 t/°C + 32, NIST SP 811 B.9; quoted from memory).
    expect(conditions[1]!.cells[0]!.imperial).toEqual({ value: 68, unit: '°F' });
    expect(conditions[1]!.cells[0]!.provenance).toBe('/field-tests/t1');
  });
});
