import { describe, expect, it } from 'vitest';
import { FIELD_TEST_KINDS } from '@/lib/field-tests/kinds';
import { KIND_CATEGORIES, kindCategoryProblem, kindFitsCategory } from '@/lib/field-tests/kind-categories';
import { CATEGORIES } from '@/lib/measure';
import { DEMO_FIELD_TESTS, DEMO_GEAR } from '@/db/seed/demo-data';

/*
 * Which category a test kind can measure is a product rule of issue 5 (common practice, no source):
 * solar output needs a solar panel; light runtime and output a light; energy delivered a bank or a
 * 12 V battery; charge time a bank, a battery or a light (they charge); mass check and other any item.
 */
describe('field test kind ↔ gear category', () => {
  it('has a rule for every kind, naming only real categories', () => {
    expect(Object.keys(KIND_CATEGORIES).sort()).toEqual([...FIELD_TEST_KINDS].sort());
    for (const allowed of Object.values(KIND_CATEGORIES)) for (const c of allowed ?? []) expect(CATEGORIES).toContain(c);
  });

  it.each([
    ['solar-output', 'solar-panel', true],
    ['solar-output', 'power-bank', false],
    ['light-runtime', 'light', true],
    ['light-runtime', 'radio', false],
    ['light-output', 'solar-panel', false],
    ['energy-delivered', 'power-bank', true],
    ['energy-delivered', 'battery-12v', true],
    ['energy-delivered', 'light', false],
    ['charge-time', 'light', true],
    ['charge-time', 'battery-12v', true],
    ['charge-time', 'cable-adapter', false],
    ['mass-check', 'cable-adapter', true],
    ['other', 'radio', true],
  ] as const)('%s on a %s: %s', (kind, category, fits) => {
    expect(kindFitsCategory(kind, category)).toBe(fits);
    expect(kindCategoryProblem(kind, { name: 'X', category }) === null).toBe(fits);
  });

  it('names the item and the kind in its message', () => {
    expect(kindCategoryProblem('solar-output', { maker: 'Voltmoth', name: 'Cell 20', category: 'power-bank' })).toBe(
      'A solar output test measures a solar panel; “Voltmoth Cell 20” is not one. Choose another item or another kind of test.',
    );
    expect(kindCategoryProblem('energy-delivered', { name: 'Lamp', category: 'light' })).toContain('a power bank or a 12 V battery');
  });

  it('fits every demo field test (the seed writes them directly, past the data layer)', () => {
    const category = new Map(DEMO_GEAR.map((g) => [g.slug, g.category]));
    const misfits = DEMO_FIELD_TESTS.flatMap((t) => t.items.filter((slug) => !kindFitsCategory(t.kind, category.get(slug) ?? 'unknown')).map((slug) => `${t.id}: ${t.kind} on ${slug}`));
    expect(misfits).toEqual([]);
    expect(DEMO_FIELD_TESTS.length).toBeGreaterThan(0);
  });
});
