import { assertFinite, finiteResult, MeasureError } from './errors';

/** Physical quantities `convert` knows, each with one canonical unit (see `CANONICAL_UNIT`). */
export type Quantity =
  | 'mass'
  | 'energy'
  | 'power'
  | 'luminousFlux'
  | 'luminousIntensity'
  | 'illuminance'
  | 'length'
  | 'duration'
  | 'temperature'
  | 'voltage'
  | 'current'
  | 'charge'
  /** A count such as a battery's rated charge cycles. */
  | 'count'
  /** A share in per cent, such as a converter's efficiency. */
  | 'fraction'
  /** A level difference in decibels, such as a receiver's noise-floor rise. */
  | 'level';

/**
 * A linear unit: value in the canonical unit = value × num ÷ den.
 * Factors are kept as a fraction of two exact decimals so that conversions such as
 * J → Wh (÷ 3600) or fc → lx (÷ 0.09290304) are done by one division, not by multiplying
 * with a rounded reciprocal.
 */
interface LinearUnit {
  quantity: Quantity;
  num: number;
  den: number;
}

/**
 * Unit table. Exact defining constants:
 * - international yard and pound agreement (1959): 1 lb = 0.45359237 kg, 1 yd = 0.9144 m,
 *   so 1 ft = 0.3048 m, 1 in = 0.0254 m, 1 mi = 1760 yd = 1609.344 m; 1 oz = lb/16 = 28.349523125 g;
 * - 1 fc = 1 lm/ft² = 1/0.3048² lx = 1/0.09290304 lx (IEC 60050-845 gives 10.764 lx, rounded);
 * - 1 Wh = 3600 J; 1 h = 3600 s; 1 d = 86 400 s.
 * Temperature is affine and handled separately.
 */
const LINEAR = {
  // mass, canonical g
  g: { quantity: 'mass', num: 1, den: 1 },
  kg: { quantity: 'mass', num: 1000, den: 1 },
  oz: { quantity: 'mass', num: 28.349523125, den: 1 },
  lb: { quantity: 'mass', num: 453.59237, den: 1 },
  // energy, canonical Wh
  Wh: { quantity: 'energy', num: 1, den: 1 },
  kWh: { quantity: 'energy', num: 1000, den: 1 },
  J: { quantity: 'energy', num: 1, den: 3600 },
  // power, canonical W
  W: { quantity: 'power', num: 1, den: 1 },
  kW: { quantity: 'power', num: 1000, den: 1 },
  // light
  lm: { quantity: 'luminousFlux', num: 1, den: 1 },
  cd: { quantity: 'luminousIntensity', num: 1, den: 1 },
  lx: { quantity: 'illuminance', num: 1, den: 1 },
  fc: { quantity: 'illuminance', num: 1, den: 0.09290304 },
  // length, canonical m
  mm: { quantity: 'length', num: 1, den: 1000 },
  cm: { quantity: 'length', num: 1, den: 100 },
  m: { quantity: 'length', num: 1, den: 1 },
  km: { quantity: 'length', num: 1000, den: 1 },
  in: { quantity: 'length', num: 0.0254, den: 1 },
  ft: { quantity: 'length', num: 0.3048, den: 1 },
  yd: { quantity: 'length', num: 0.9144, den: 1 },
  mi: { quantity: 'length', num: 1609.344, den: 1 },
  // duration, canonical s
  s: { quantity: 'duration', num: 1, den: 1 },
  min: { quantity: 'duration', num: 60, den: 1 },
  h: { quantity: 'duration', num: 3600, den: 1 },
  d: { quantity: 'duration', num: 86400, den: 1 },
  // electrical
  V: { quantity: 'voltage', num: 1, den: 1 },
  mA: { quantity: 'current', num: 1, den: 1000 },
  A: { quantity: 'current', num: 1, den: 1 },
  mAh: { quantity: 'charge', num: 1, den: 1000 },
  Ah: { quantity: 'charge', num: 1, den: 1 },
  // dimensionless
  cycles: { quantity: 'count', num: 1, den: 1 },
  '%': { quantity: 'fraction', num: 1, den: 1 },
  // level difference (a ratio on a log scale); only dB itself, so no conversion arises
  dB: { quantity: 'level', num: 1, den: 1 },
} as const satisfies Record<string, LinearUnit>;

const TEMPERATURE_UNITS = ['degC', 'degF', 'K'] as const;
type TemperatureUnit = (typeof TEMPERATURE_UNITS)[number];

/** Every unit symbol `convert` accepts. */
export type UnitSymbol = keyof typeof LINEAR | TemperatureUnit;

/** All unit symbols, grouped by quantity, canonical unit first. */
export const UNITS_BY_QUANTITY: Readonly<Record<Quantity, readonly UnitSymbol[]>> = {
  mass: ['g', 'kg', 'oz', 'lb'],
  energy: ['Wh', 'kWh', 'J'],
  power: ['W', 'kW'],
  luminousFlux: ['lm'],
  luminousIntensity: ['cd'],
  illuminance: ['lx', 'fc'],
  length: ['m', 'mm', 'cm', 'km', 'in', 'ft', 'yd', 'mi'],
  duration: ['s', 'min', 'h', 'd'],
  temperature: ['degC', 'degF', 'K'],
  voltage: ['V'],
  current: ['A', 'mA'],
  charge: ['Ah', 'mAh'],
  count: ['cycles'],
  fraction: ['%'],
  level: ['dB'],
};

/** The canonical (stored) unit of each quantity. */
export const CANONICAL_UNIT: Readonly<Record<Quantity, UnitSymbol>> = {
  mass: 'g',
  energy: 'Wh',
  power: 'W',
  luminousFlux: 'lm',
  luminousIntensity: 'cd',
  illuminance: 'lx',
  length: 'm',
  duration: 's',
  temperature: 'degC',
  voltage: 'V',
  current: 'A',
  charge: 'Ah',
  count: 'cycles',
  fraction: '%',
  level: 'dB',
};

/** Every unit symbol, in the order of `UNITS_BY_QUANTITY`. */
export const UNIT_SYMBOLS: readonly UnitSymbol[] = Object.values(UNITS_BY_QUANTITY).flat();

function isLinear(symbol: string): symbol is keyof typeof LINEAR {
  return Object.prototype.hasOwnProperty.call(LINEAR, symbol);
}

function isTemperature(symbol: string): symbol is TemperatureUnit {
  return (TEMPERATURE_UNITS as readonly string[]).includes(symbol);
}

/** True when `symbol` is a unit `convert` accepts. */
export function isUnitSymbol(symbol: string): symbol is UnitSymbol {
  return isLinear(symbol) || isTemperature(symbol);
}

/** The quantity a unit measures; throws `unknown-unit` for a symbol outside the table. */
export function quantityOf(symbol: string): Quantity {
  if (isLinear(symbol)) return LINEAR[symbol].quantity;
  if (isTemperature(symbol)) return 'temperature';
  throw new MeasureError(
    'unknown-unit',
    `Unknown unit "${symbol}". Known units: ${UNIT_SYMBOLS.join(', ')} (symbols are case-sensitive).`,
  );
}

function toCelsius(value: number, unit: TemperatureUnit): number {
  switch (unit) {
    case 'degC':
      return value;
    case 'degF':
      return ((value - 32) * 5) / 9;
    case 'K':
      return value - 273.15;
  }
}

function fromCelsius(celsius: number, unit: TemperatureUnit): number {
  switch (unit) {
    case 'degC':
      return celsius;
    case 'degF':
      return (celsius * 9) / 5 + 32;
    case 'K':
      return celsius + 273.15;
  }
}

/**
 * Converts `value` from unit `from` to unit `to` (symbols as in `UNITS_BY_QUANTITY`).
 * Throws `unknown-unit` for a symbol it does not know, `incompatible-units` for units of
 * different quantities, `not-finite` for a non-finite value or result.
 * Temperatures are absolute readings (°C, °F, K), not temperature differences.
 */
export function convert(value: number, from: UnitSymbol | (string & {}), to: UnitSymbol | (string & {})): number {
  assertFinite(value, 'The value to convert');
  const qFrom = quantityOf(from);
  const qTo = quantityOf(to);
  if (qFrom !== qTo) {
    throw new MeasureError(
      'incompatible-units',
      `Cannot convert ${from} (${qFrom}) to ${to} (${qTo}): they measure different quantities.`,
    );
  }
  if (from === to) return value;
  if (isTemperature(from) && isTemperature(to)) {
    return finiteResult(fromCelsius(toCelsius(value, from), to), `${value} ${from} in ${to}`);
  }
  if (isLinear(from) && isLinear(to)) {
    const a = LINEAR[from];
    const b = LINEAR[to];
    // value × (a.num / a.den) ÷ (b.num / b.den), arranged to keep exact factors exact.
    // For values near the double range the factor is applied as one ratio instead.
    let result = (value * a.num * b.den) / (a.den * b.num);
    if (!Number.isFinite(result)) result = value * ((a.num * b.den) / (a.den * b.num));
    return finiteResult(result, `${value} ${from} in ${to}`);
  }
  /* c8 ignore next */
  throw new MeasureError('incompatible-units', `Cannot convert ${from} to ${to}.`);
}
