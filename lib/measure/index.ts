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

export {
  PORT_KINDS,
  PORT_DIRECTIONS,
  PORT_KIND_LABELS,
  NOMINAL_VOLTAGE_TOLERANCE,
  PD_MAX_VOLTS,
  PD_MAX_AMPS,
  PD_STANDARD_CABLE_AMPS,
  validatePort,
  pdProfileSatisfies,
  portFits,
  connectorsJoin,
  nominalVolts,
  portKindLabel,
  formatFigure,
  type Port,
  type PortKind,
  type PortDirection,
  type PdProfile,
  type VoltageWindow,
  type PortFit,
  type PortFitProblem,
} from './ports';

export {
  findChargingPaths,
  KIT_POWER_ROLES,
  PATH_SEARCH_LIMITS,
  type KitPowerRole,
  type KitPowerItem,
  type LinkEnd,
  type ChargingKit,
  type PathStep,
  type ChargingPath,
  type DeviceChargingPaths,
  type ChargingPathsResult,
} from './paths';

export {
  sMeterToDbm,
  noiseRiseDb,
  radioQuietVerdict,
  radioQuietSummary,
  S_METER_RANGES,
  S9_DBM,
  DB_PER_S_UNIT,
  MAX_DB_OVER_S9,
  RADIO_QUIET_VERDICTS,
  RADIO_QUIET_THRESHOLDS_DB,
  RADIO_QUIET_WORDING,
  type SMeterRange,
  type RadioQuietVerdict,
  type BandNoiseRise,
  type BandQuietness,
  type RangeQuietness,
  type RadioQuietSummary,
} from './radio-noise';
