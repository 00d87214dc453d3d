/**
 * Range filters typed in the reader's display units: an imperial reader types "10" next to "oz", the
 * API query (and the shareable URL) carries canonical grams. Pure; the factors are lib/measure's exact
 * ones (1959 international yard and pound agreement: 1 lb = 453.59237 g, 1 ft = 0.3048 m).
 */
import { convert } from '@/lib/measure';
import type { UnitSystem } from './display';

/**
 * The unit a range filter on a canonical unit is typed in. Imperial masses in oz (lb for 12 V
 * batteries, which weigh tens of pounds), lengths in ft; everything else in its canonical unit.
 */
export function filterUnit(canonicalUnit: string, system: UnitSystem, category?: string | null): string {
  if (system !== 'imperial') return canonicalUnit;
  if (canonicalUnit === 'g') return category === 'battery-12v' ? 'lb' : 'oz';
  if (canonicalUnit === 'm') return 'ft';
  return canonicalUnit;
}

/** Significant digits kept when a converted filter value is written out (well past any scale's resolution). */
const DIGITS = 12;

function plain(value: number): string {
  return String(Number(value.toPrecision(DIGITS)));
}

const DECIMAL = /^\s*-?(?:\d+\.?\d*|\.\d+)\s*$/;

/**
 * The API value of a typed filter figure: `text` in `typedUnit` as a decimal in `canonicalUnit`.
 * Blank stays null (no filter); text that is not a plain decimal is passed on as typed,
 * so the API's 400 names the parameter rather than the browser silently dropping it.
 */
export function typedToCanonical(text: string, typedUnit: string, canonicalUnit: string): string | null {
  const trimmed = text.trim();
  if (trimmed === '') return null;
  if (typedUnit === canonicalUnit || !DECIMAL.test(trimmed)) return trimmed;
  return plain(convert(Number(trimmed), typedUnit, canonicalUnit));
}

/** The figure to show in a filter input for an API value (canonical units), in the unit it is typed in. */
export function canonicalToTyped(value: string | null | undefined, typedUnit: string, canonicalUnit: string): string {
  if (value === null || value === undefined || value.trim() === '') return '';
  const trimmed = value.trim();
  if (typedUnit === canonicalUnit || !DECIMAL.test(trimmed)) return trimmed;
  // Six significant digits: what a reader typed (10 oz) comes back as typed, not as 9.99999999999.
  return String(Number(convert(Number(trimmed), canonicalUnit, typedUnit).toPrecision(6)));
}
