import { assertFinite, MeasureError } from './errors';

/** Grams per unit. The pound is exact by the international yard and pound agreement (1959); oz = lb / 16. */
export const GRAMS_PER = { g: 1, kg: 1000, oz: 28.349523125, lb: 453.59237 } as const;
export type MassUnit = keyof typeof GRAMS_PER;

/** Converts a mass in `unit` to the canonical unit, grams. */
export function massToGrams(value: number, unit: MassUnit): number {
  assertFinite(value, 'Mass');
  const factor = GRAMS_PER[unit];
  if (factor === undefined) throw new MeasureError('unknown_unit', `Unknown mass unit "${unit}". Use g, kg, oz or lb.`);
  return value * factor;
}

/** Converts grams to `unit`. */
export function gramsTo(grams: number, unit: MassUnit): number {
  assertFinite(grams, 'Mass');
  const factor = GRAMS_PER[unit];
  if (factor === undefined) throw new MeasureError('unknown_unit', `Unknown mass unit "${unit}". Use g, kg, oz or lb.`);
  return grams / factor;
}
