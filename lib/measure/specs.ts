import type { Quantity, UnitSymbol } from './units';

/** Gear categories; the catalog builds on this list. */
export const CATEGORIES = [
  'light',
  'power-bank',
  'battery-12v',
  'solar-panel',
  'radio',
  'cable-adapter',
  'other',
] as const;

/** A gear category id. */
export type Category = (typeof CATEGORIES)[number];

/** True when `value` is one of `CATEGORIES`. */
export function isCategory(value: string): value is Category {
  return (CATEGORIES as readonly string[]).includes(value);
}

/** Description of a spec key: canonical unit and which direction is better. */
export interface SpecInfo {
  /** Canonical unit the value is stored and computed in. */
  readonly unit: UnitSymbol;
  readonly quantity: Quantity;
  /**
   * Whether a larger value is better for the reader (used for measured ÷ claimed);
   * null when neither direction is better (a supply voltage should match, not exceed).
   */
  readonly higherIsBetter: boolean | null;
  /** True when only a field test can produce the value (no claimed figure). */
  readonly measuredOnly: boolean;
  readonly label: string;
}

/**
 * Spec keys with their canonical units. `luminousFlux` and `runtime` are for the item's
 * highest light mode; other modes may be recorded elsewhere.
 */
export const SPECS = {
  mass: { unit: 'g', quantity: 'mass', higherIsBetter: false, measuredOnly: false, label: 'Mass' },
  luminousFlux: { unit: 'lm', quantity: 'luminousFlux', higherIsBetter: true, measuredOnly: false, label: 'Light output (highest mode)' },
  runtime: { unit: 's', quantity: 'duration', higherIsBetter: true, measuredOnly: false, label: 'Runtime (highest mode)' },
  peakIntensity: { unit: 'cd', quantity: 'luminousIntensity', higherIsBetter: true, measuredOnly: false, label: 'Peak beam intensity' },
  beamDistance: { unit: 'm', quantity: 'length', higherIsBetter: true, measuredOnly: false, label: 'Beam distance' },
  ratedEnergy: { unit: 'Wh', quantity: 'energy', higherIsBetter: true, measuredOnly: false, label: 'Rated energy (capacity × nominal voltage)' },
  deliveredEnergy: { unit: 'Wh', quantity: 'energy', higherIsBetter: true, measuredOnly: true, label: 'Delivered energy' },
  ratedPower: { unit: 'W', quantity: 'power', higherIsBetter: true, measuredOnly: false, label: 'Rated power' },
  powerDraw: { unit: 'W', quantity: 'power', higherIsBetter: false, measuredOnly: false, label: 'Power draw' },
  transmitPower: { unit: 'W', quantity: 'power', higherIsBetter: true, measuredOnly: false, label: 'Transmit power' },
  supplyVoltage: { unit: 'V', quantity: 'voltage', higherIsBetter: null, measuredOnly: false, label: 'Supply voltage' },
  continuousPower: { unit: 'W', quantity: 'power', higherIsBetter: true, measuredOnly: false, label: 'Continuous output power' },
  chargeTime: { unit: 's', quantity: 'duration', higherIsBetter: false, measuredOnly: false, label: 'Time to full charge' },
  rechargePower: { unit: 'W', quantity: 'power', higherIsBetter: true, measuredOnly: false, label: 'Recharge input power' },
  continuousCurrent: { unit: 'A', quantity: 'current', higherIsBetter: true, measuredOnly: false, label: 'Continuous current' },
  ratedCurrent: { unit: 'A', quantity: 'current', higherIsBetter: true, measuredOnly: false, label: 'Rated current' },
  cycleRating: { unit: 'cycles', quantity: 'count', higherIsBetter: true, measuredOnly: false, label: 'Cycle rating' },
  cableLength: { unit: 'm', quantity: 'length', higherIsBetter: null, measuredOnly: false, label: 'Cable length' },
  foldedLength: { unit: 'm', quantity: 'length', higherIsBetter: false, measuredOnly: false, label: 'Folded length' },
  foldedWidth: { unit: 'm', quantity: 'length', higherIsBetter: false, measuredOnly: false, label: 'Folded width' },
  foldedDepth: { unit: 'm', quantity: 'length', higherIsBetter: false, measuredOnly: false, label: 'Folded depth' },
  conversionEfficiency: { unit: '%', quantity: 'fraction', higherIsBetter: true, measuredOnly: false, label: 'Conversion efficiency' },
  // Worst noise-floor rise over an item's approved radio-noise checks, per S-meter range (see radio-noise.ts).
  noiseRiseBelow30: { unit: 'dB', quantity: 'level', higherIsBetter: false, measuredOnly: true, label: 'Radio noise rise, below 30 MHz (worst band)' },
  noiseRiseAbove30: { unit: 'dB', quantity: 'level', higherIsBetter: false, measuredOnly: true, label: 'Radio noise rise, above 30 MHz (worst band)' },
} as const satisfies Record<string, SpecInfo>;

/** A spec key (see `SPECS` for units). */
export type SpecKey = keyof typeof SPECS;

/** All spec keys, in the order of `SPECS`. */
export const SPEC_KEYS = Object.keys(SPECS) as SpecKey[];

/** True when `value` is a spec key. */
export function isSpecKey(value: string): value is SpecKey {
  return Object.prototype.hasOwnProperty.call(SPECS, value);
}

/** The canonical unit of each spec key (e.g. `mass` → `g`). */
export type SpecUnit<K extends SpecKey> = (typeof SPECS)[K]['unit'];

/** One spec's figures, in the canonical unit of its key. */
export interface SpecValue {
  claimed?: number | null;
  measured?: number | null;
}

/** Specs of one gear item, keyed by spec key. */
export type Specs = Partial<Record<SpecKey, SpecValue>>;
