/**
 * Imperial display values for the quantities readers commonly read in imperial units: mass (oz below
 * one pound, lb from one pound), length (in below one foot, ft from one foot) and temperature (°F).
 * Pure; the factors are lib/measure's exact ones (1959 international yard and pound agreement). Values
 * are stored, filtered and computed in canonical metric units; this only changes what is shown.
 */
import { convert } from '@/lib/measure';

export type UnitSystem = 'metric' | 'imperial';

export interface DisplayValue {
  value: number;
  unit: string;
}

/** 1 lb in grams and 1 ft in metres, exact (1959 agreement), via lib/measure. */
const GRAMS_PER_POUND = convert(1, 'lb', 'g');
const METRES_PER_FOOT = convert(1, 'ft', 'm');

/** Canonical (and other metric) unit symbols this module converts; temperatures as `degC` or `°C`. */
const MASS_UNITS = new Set(['g', 'kg']);
const LENGTH_UNITS = new Set(['mm', 'cm', 'm', 'km']);
const CELSIUS = new Set(['degC', '°C']);

/** True when `unit` is a metric mass, length or temperature unit with an imperial display. */
export function hasImperialDisplay(unit: string): boolean {
  return MASS_UNITS.has(unit) || LENGTH_UNITS.has(unit) || CELSIUS.has(unit);
}

/**
 * The imperial display value of a metric figure, or null for units without one (lm, Wh, V, ratios …).
 * Masses under one pound in oz, else lb; lengths under one foot in in, else ft; °C to °F.
 */
export function imperialValue(value: number, unit: string): DisplayValue | null {
  if (!Number.isFinite(value)) return null;
  if (MASS_UNITS.has(unit)) {
    const grams = convert(value, unit, 'g');
    return Math.abs(grams) < GRAMS_PER_POUND ? { value: convert(grams, 'g', 'oz'), unit: 'oz' } : { value: convert(grams, 'g', 'lb'), unit: 'lb' };
  }
  if (LENGTH_UNITS.has(unit)) {
    const metres = convert(value, unit, 'm');
    return Math.abs(metres) < METRES_PER_FOOT ? { value: convert(metres, 'm', 'in'), unit: 'in' } : { value: convert(metres, 'm', 'ft'), unit: 'ft' };
  }
  if (CELSIUS.has(unit)) return { value: convert(value, 'degC', 'degF'), unit: '°F' };
  return null;
}

/** The value to show in a unit system: unchanged for metric, and for units without an imperial display. */
export function displayValue(value: number, unit: string, system: UnitSystem): DisplayValue {
  return (system === 'imperial' && imperialValue(value, unit)) || { value, unit };
}

/** Adds `imperial` to a figure (the API's `units=imperial`) when its unit has an imperial display. */
export function withImperial<F extends { value: number; unit: string }>(figure: F): F & { imperial?: DisplayValue } {
  const imperial = imperialValue(figure.value, figure.unit);
  return imperial ? { ...figure, imperial } : figure;
}
