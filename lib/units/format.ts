/**
 * Figures for people in the viewer's unit system: metric figures as lib/gear/format shows them, masses,
 * lengths and temperatures converted by lib/units/display for imperial. Display only; nothing stored changes.
 */
import { formatQuantity } from '@/lib/gear/format';
import { convert, SPECS, type SpecKey } from '@/lib/measure';
import { displayValue, type UnitSystem } from './display';

/** "348.7 g" / "12.3 oz"; "1.2 m" / "3.94 ft"; units without an imperial display unchanged. */
export function formatFigure(value: number, unit: string, system: UnitSystem): string {
  const shown = displayValue(value, unit, system);
  return formatQuantity(shown.value, shown.unit);
}

/**
 * A spec figure, optionally "mean ± sd" with the spread in the same display unit as the mean
 * (a spread is a difference, so it converts by the factor alone).
 */
export function formatSpecIn(key: SpecKey, value: number, system: UnitSystem, sd?: number | null): string {
  const unit = SPECS[key].unit;
  const shown = displayValue(value, unit, system);
  const main = formatQuantity(shown.value, shown.unit);
  if (sd === null || sd === undefined) return main;
  const spread = shown.unit === unit ? sd : convert(sd, unit, shown.unit);
  return `${main} ± ${formatQuantity(spread, shown.unit)}`;
}
