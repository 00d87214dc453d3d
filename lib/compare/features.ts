/**
 * The side-by-side's "Features" group: an "Also serves as" row and one row per checklist feature of any
 * compared item that any of them states, each cell in words — "Has", "Has (steel)", "Has not", "Not stated" — or empty where
 * the feature is not on that item's checklist. No direction, so no cell is marked best.
 * Pure: no framework or database.
 */
import type { CompareCell, CompareGroup, CompareResponse, CompareRow, GearSummary } from '@/lib/browse/contract';
import { CATEGORY_DEFS } from '@/lib/gear/categories';
import { FEATURE_DEFS, FEATURE_NAMES, FEATURE_STATE_LABELS, isFeatureName } from '@/lib/gear/features';
import { isCategory } from '@/lib/measure';
import { allEqual } from './index';

type FeatureSource = Pick<GearSummary, 'alsoServesAs' | 'features'>;

const empty: CompareCell = { value: null, unit: '', basis: null, provenance: null, best: false };

function row(key: string, label: string, values: (string | null)[]): CompareRow {
  return {
    key,
    label,
    unit: '',
    direction: null,
    cells: values.map((value) => (value === null ? empty : { ...empty, value, basis: 'claimed' })),
    allEqual: allEqual(values),
  };
}

/** The Features group of the given items (in column order), or null when none has roles or a stated feature. */
export function featuresGroup(items: readonly FeatureSource[]): CompareGroup | null {
  const rows: CompareRow[] = [];
  if (items.some((i) => i.alsoServesAs?.length)) {
    rows.push(
      row(
        'also-serves-as',
        'Also serves as',
        items.map((i) => (i.alsoServesAs ?? []).filter(isCategory).map((c) => CATEGORY_DEFS[c].label).join(', ') || 'Only its own category'),
      ),
    );
  }
  // A feature row shows when at least one item states it; rows of nothing but "Not stated" would only be noise.
  const shown = new Set(items.flatMap((i) => (i.features ?? []).filter((f) => f.state !== 'not-stated').map((f) => f.name)));
  for (const name of FEATURE_NAMES) {
    if (!shown.has(name)) continue;
    const values = items.map((i) => {
      const line = (i.features ?? []).find((f) => f.name === name);
      if (!line) return null;
      const label = FEATURE_STATE_LABELS[line.state];
      return line.detail ? `${label} (${line.detail})` : label;
    });
    rows.push(row(`feature:${name}`, isFeatureName(name) ? FEATURE_DEFS[name].label : name, values));
  }
  return rows.length ? { id: 'features', label: 'Features', rows } : null;
}

/** A built side-by-side with the Features group added at the end. */
export function withFeatures(response: CompareResponse, items: readonly FeatureSource[]): CompareResponse {
  const group = featuresGroup(items);
  return group ? { ...response, groups: [...response.groups, group] } : response;
}
