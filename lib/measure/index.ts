/**
 * Trailbench measurement core: pure computations on canonical units.
 *
 * Canonical units: mass g, energy Wh, power W, luminous flux lm, luminous intensity cd,
 * illuminance lx, length m, duration s, temperature °C, voltage V, current A, charge Ah.
 * Money is `{ amountMinor, currency }` (integer minor units, ISO 4217 code).
 *
 * Every function throws `MeasureError` for bad input and never returns NaN or ±Infinity.
 * Formulas, sources and edge cases: lib/measure/README.md.
 */
export { MeasureError, type MeasureErrorCode } from './errors';

export {
  convert,
  quantityOf,
  isUnitSymbol,
  UNITS_BY_QUANTITY,
  UNIT_SYMBOLS,
  CANONICAL_UNIT,
  type Quantity,
  type UnitSymbol,
} from './units';

export {
  ISO4217_MINOR_UNITS,
  isCurrencyCode,
  minorUnitDigits,
  assertMoney,
  moneyToMajor,
  moneyFromMajor,
  type CurrencyCode,
  type Money,
} from './money';

export {
  CATEGORIES,
  isCategory,
  SPECS,
  SPEC_KEYS,
  isSpecKey,
  type Category,
  type SpecKey,
  type SpecInfo,
  type SpecUnit,
  type SpecValue,
  type Specs,
} from './specs';

export {
  beamDistanceM,
  candelaFromLux,
  lightRuntime,
  BEAM_DISTANCE_LUX,
  RUNTIME_REFERENCE_S,
  type LightReading,
  type LightRuntimeResult,
} from './light';

export {
  chargeToWh,
  airlineBand,
  energyWh,
  chargeTimeS,
  CHARGE_END_SHARE,
  CHARGE_END_HOLD_S,
  type AirlineBand,
  type PowerReading,
  type VoltAmpReading,
} from './energy';

export {
  combinedLossFraction,
  expectedDailyWh,
  solarOutput,
  PVWATTS_DEFAULT_LOSSES,
  type SolarOutputResult,
} from './solar';

export {
  powerBudget,
  CHEMISTRIES,
  DEFAULT_DEPTH_OF_DISCHARGE,
  DEFAULT_CONVERSION_EFFICIENCY,
  DEFAULT_LOSS_FRACTION,
  type Chemistry,
  type BudgetLoad,
  type BudgetBattery,
  type BudgetPanel,
  type PowerBudgetInput,
  type PowerBudgetResult,
  type PowerBudgetWarning,
  type PowerBudgetWarningCode,
} from './budget';

export { paretoFront, type Direction, type ParetoDirections } from './pareto';

export { summarize, type TrialSummary } from './stats';

export { valueRatios, type ValueRatio, type RatioBasis } from './ratios';
