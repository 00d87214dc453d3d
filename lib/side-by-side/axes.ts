/**
 * Axes of the best-value line: for a category, the specs and value ratios a reader may plot, which
 * end of each is better, whether it needs a currency, the default pair, and reading an axis value
 * from an item of the public API. Pure.
 */
import type { GearSummary } from '@/lib/browse/contract';
import { CATEGORY_DEFS, ratioLabel } from '@/lib/gear/categories';
import { convert, minorUnitDigits, SPECS, type Category, type Direction, type SpecKey } from '@/lib/measure';
import type { UnitSystem } from './table-model';

export interface AxisOption {
  /** `price`, a spec key or a ratio id: the same key the API sorts and filters by. */
  key: string;
  label: string;
  /** Canonical unit ("g", "lm", "lm/g"); money axes hold `{currency}` where the currency code goes. */
  unit: string;
  better: Direction;
  money: boolean;
}

/** Ratios where less is better (cost per watt-hour); every other plotted ratio is "more is better". */
const LOWER_IS_BETTER_RATIOS = new Set(['money-per-wh']);
const MONEY_RATIOS = new Set(['lm-per-money', 'wh-per-money', 'money-per-wh', 'delivered-wh-per-money', 'w-per-money']);

const RATIO_UNITS: Record<string, string> = {
  'lm-per-g': 'lm/g',
  'lm-per-money': 'lm/{currency}',
  'runtime-h-per-100g': 'h/100 g',
  'wh-per-kg': 'Wh/kg',
  'wh-per-money': 'Wh/{currency}',
  'money-per-wh': '{currency}/Wh',
  'delivered-wh-per-money': 'Wh/{currency}',
  'delivered-vs-rated': '',
  'w-per-kg': 'W/kg',
  'w-per-money': 'W/{currency}',
};

export function axisOptions(category: Category): AxisOption[] {
  const def = CATEGORY_DEFS[category];
  const specs: AxisOption[] = def.specs
    .filter((s) => SPECS[s.key].higherIsBetter !== null)
    .map((s) => ({ key: s.key, label: s.label, unit: SPECS[s.key].unit === 's' ? 'h' : SPECS[s.key].unit, better: SPECS[s.key].higherIsBetter ? 'max' : 'min', money: false }));
  const price: AxisOption = { key: 'price', label: 'Price paid', unit: '{currency}', better: 'min', money: true };
  const ratios: AxisOption[] = def.ratios.map((id) => ({
    key: id,
    label: ratioLabel(id),
    unit: RATIO_UNITS[id] ?? '',
    better: LOWER_IS_BETTER_RATIOS.has(id) ? 'min' : 'max',
    money: MONEY_RATIOS.has(id),
  }));
  return [...specs, price, ...ratios];
}

const DEFAULT_AXES: Partial<Record<Category, { x: string; y: string }>> = {
  light: { x: 'mass', y: 'luminousFlux' },
  'power-bank': { x: 'price', y: 'ratedEnergy' },
  'battery-12v': { x: 'price', y: 'ratedEnergy' },
  'solar-panel': { x: 'mass', y: 'ratedPower' },
};

export function defaultAxes(category: Category): { x: string; y: string } {
  const preset = DEFAULT_AXES[category];
  if (preset) return preset;
  const options = axisOptions(category);
  const y = options.find((o) => o.key !== 'mass' && !o.money) ?? options.find((o) => o.key !== 'mass')!;
  return { x: 'mass', y: y.key };
}

/** The option for `key` in `category`, or undefined when it cannot be plotted there. */
export function findAxis(category: Category, key: string | null | undefined): AxisOption | undefined {
  return key ? axisOptions(category).find((o) => o.key === key) : undefined;
}

/** The unit shown on an axis, in the reader's unit system and currency. */
export function axisUnit(axis: AxisOption, currency: string | null, units: UnitSystem): string {
  if (axis.money) return axis.unit.replace('{currency}', currency ?? 'money');
  if (units === 'imperial' && axis.unit === 'g') return 'oz';
  if (units === 'imperial' && axis.unit === 'm') return 'ft';
  return axis.unit;
}

/**
 * An item's value on an axis in display units, or null when it lacks the figure. A price in another
 * currency than the one plotted counts as missing (the API leaves such items out already).
 */
export function axisValue(item: GearSummary, axis: AxisOption, currency: string | null, units: UnitSystem): number | null {
  if (axis.key === 'price') {
    if (!item.price || item.price.currency !== currency) return null;
    return item.price.minor / 10 ** minorUnitDigits(item.price.currency);
  }
  const figure = SPECS[axis.key as SpecKey] ? item.specs[axis.key] : item.ratios[axis.key];
  if (!figure) return null;
  if (axis.money && currency && !figure.unit.includes(currency)) return null;
  if (figure.unit === 's') return convert(figure.value, 's', 'h');
  if (units === 'imperial' && figure.unit === 'g') return convert(figure.value, 'g', 'oz');
  if (units === 'imperial' && figure.unit === 'm') return convert(figure.value, 'm', 'ft');
  return figure.value;
}
