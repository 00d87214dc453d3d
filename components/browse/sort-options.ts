/**
 * What the browse page offers to sort and range-filter by: every spec and value ratio of the chosen
 * category (measured ÷ claimed per spec too) and the price; without a category, the figures every
 * category shares (mass, price) and the radio-noise rises.
 */
import { MEASURED_VS_CLAIMED, isMoneyKey } from '@/lib/browse/query';
import { CATEGORY_DEFS, ratioLabel } from '@/lib/gear/categories';
import { isCategory, SPECS } from '@/lib/measure';

export interface SortOption {
  key: string;
  label: string;
  /** Canonical unit of the API's range filters ("g", "lm/g", "major units"). */
  unit: string;
  money: boolean;
}

const RATIO_UNITS: Record<string, string> = {
  'lm-per-g': 'lm/g',
  'runtime-h-per-100g': 'h/100 g',
  'wh-per-kg': 'Wh/kg',
  'w-per-kg': 'W/kg',
  'delivered-vs-rated': 'ratio',
};

function unitOf(key: string, currency: string | null): string {
  if (key === 'price') return currency ?? 'currency';
  if (key.startsWith(MEASURED_VS_CLAIMED)) return 'ratio';
  if (key in SPECS) return SPECS[key as keyof typeof SPECS].unit;
  if (isMoneyKey(key)) {
    const c = currency ?? 'money';
    return key === 'money-per-wh' ? `${c}/Wh` : `${key.startsWith('lm') ? 'lm' : key.startsWith('w-') ? 'W' : 'Wh'}/${c}`;
  }
  return RATIO_UNITS[key] ?? '';
}

/** Shorter labels where a spec's own label is too long for the sort menu. */
const SORT_LABELS: Record<string, string> = {
  noiseRiseBelow30: 'Radio noise rise below 30 MHz',
  noiseRiseAbove30: 'Radio noise rise above 30 MHz',
};

export function sortOptions(category: string | null, currency: string | null): SortOption[] {
  const option = (key: string, label: string): SortOption => ({ key, label: SORT_LABELS[key] ?? label, unit: unitOf(key, currency), money: isMoneyKey(key) });
  if (!category || !isCategory(category)) {
    // Noise rises are measured on anything powered, so they sort across categories too (items never checked come last).
    return [option('mass', SPECS.mass.label), option('price', 'Price paid'), option('noiseRiseBelow30', SPECS.noiseRiseBelow30.label), option('noiseRiseAbove30', SPECS.noiseRiseAbove30.label)];
  }
  const def = CATEGORY_DEFS[category];
  return [
    ...def.specs.map((s) => option(s.key, s.label)),
    option('price', 'Price paid'),
    ...def.ratios.map((id) => option(id, ratioLabel(id))),
    ...def.specs.filter((s) => s.basis !== 'measured-only').map((s) => option(`${MEASURED_VS_CLAIMED}${s.key}`, `${s.label}: measured ÷ claimed`)),
  ];
}

/** Currencies offered for money figures (ISO 4217); the catalog's prices are mostly in these. */
export const BROWSE_CURRENCIES = ['USD', 'EUR', 'GBP', 'CAD', 'AUD', 'NZD', 'CHF', 'SEK', 'NOK', 'JPY'] as const;
