import { assertRange, finiteResult, MeasureError } from './errors';

/** Battery chemistries the power budget knows. */
export const CHEMISTRIES = ['lead-acid', 'agm', 'lifepo4', 'li-ion', 'nimh'] as const;
export type Chemistry = (typeof CHEMISTRIES)[number];

/**
 * Default allowed depth of discharge per chemistry (fraction of capacity that may be used).
 * Lead-acid and AGM 0.5 ("around 50 %" for deep-cycle lead-acid; check-values §5).
 * LiFePO4, Li-ion and NiMH 0.8: common practice, no source.
 */
export const DEFAULT_DEPTH_OF_DISCHARGE: Readonly<Record<Chemistry, number>> = {
  'lead-acid': 0.5,
  agm: 0.5,
  lifepo4: 0.8,
  'li-ion': 0.8,
  nimh: 0.8,
};

/** Default efficiency from storage to the loads (converters, cables): 0.9, common practice, no source. */
export const DEFAULT_CONVERSION_EFFICIENCY = 0.9;
/** Default PV system losses in the budget: 0.14 (the rounded PVWatts v5 default, NREL/TP-6A20-62641). */
export const DEFAULT_LOSS_FRACTION = 0.14;

/** A load in a kit: a device drawing `watts` (W) for `hoursPerDay` (h). */
export interface BudgetLoad {
  name: string;
  watts: number;
  hoursPerDay: number;
  /** Share of the on-time the device actually draws `watts`, (0, 1]; default 1. */
  dutyCycle?: number;
  /** Whole number ≥ 1; default 1. */
  quantity?: number;
  /** Efficiency of this load's path from storage, (0, 1]; default the budget's conversionEfficiency. */
  efficiency?: number;
}

/** A battery or power bank in a kit. */
export interface BudgetBattery {
  name?: string;
  /** Rated energy, Wh (> 0). */
  capacityWh: number;
  chemistry: Chemistry;
  /** (0, 1]; default per chemistry (`DEFAULT_DEPTH_OF_DISCHARGE`). */
  depthOfDischarge?: number;
  /** Whole number ≥ 1; default 1. */
  quantity?: number;
  /** Maximum continuous output, W (≥ 0), if the maker states one. */
  maxContinuousW?: number;
}

/** A solar panel in a kit. */
export interface BudgetPanel {
  /** Rated power at STC, W (> 0). */
  ratedW: number;
  /** Whole number ≥ 1; default 1. */
  quantity?: number;
}

/** Input of `powerBudget`. */
export interface PowerBudgetInput {
  loads: BudgetLoad[];
  batteries: BudgetBattery[];
  /** (0, 1]; default 0.9 (common practice, no source). */
  conversionEfficiency?: number;
  panels?: BudgetPanel[];
  /** Clear-sky peak sun hours for the place and season, 0–24 h; required with panels. */
  peakSunHours?: number;
  /** Output under the expected sky ÷ the same panel's clear-sky output, 0–1; default 1. */
  skyShare?: number;
  /** PV system losses, 0 ≤ l < 1; default 0.14. */
  lossFraction?: number;
  /** Whole number of days, 1–3650; default 1. */
  tripDays?: number;
}

export type PowerBudgetWarningCode = 'net-negative' | 'autonomy-under-one-day' | 'does-not-close' | 'load-exceeds-battery';

export interface PowerBudgetWarning {
  code: PowerBudgetWarningCode;
  message: string;
  /** 1-based trip day, for `does-not-close`. */
  day?: number;
}

/** Result of `powerBudget`; energies in Wh, per day where named so. */
export interface PowerBudgetResult {
  /** Σ watts × hoursPerDay × dutyCycle × quantity. */
  dailyLoadWh: number;
  /** Σ each load's daily Wh ÷ its path efficiency: energy taken from storage per day. */
  dailyDrawWh: number;
  /** Σ capacityWh × quantity. */
  capacityWh: number;
  /** Σ capacityWh × depthOfDischarge × quantity. */
  usableBatteryWh: number;
  /** usableBatteryWh ÷ dailyDrawWh; null exactly when dailyDrawWh = 0. */
  autonomyDays: number | null;
  /** Σ ratedW × quantity × peakSunHours × skyShare × (1 − lossFraction). */
  dailySolarWh: number;
  /** dailySolarWh − dailyDrawWh. */
  netDailyWh: number;
  /** usableBatteryWh ÷ dailySolarWh (loads off); null exactly when dailySolarWh = 0. */
  daysToRefill: number | null;
  /** Stored energy at the end of each trip day (entry 0 = end of day 1), starting full. */
  stateOfChargeByDay: number[];
  /** True when no day ends below capacityWh − usableBatteryWh (relative tolerance 1e-9). */
  closes: boolean;
  warnings: PowerBudgetWarning[];
}

function quantity(value: number | undefined, what: string): number {
  return value === undefined ? 1 : assertRange(value, `${what}: quantity`, { min: 1, integer: true });
}

function fraction01(value: number, what: string): number {
  return assertRange(value, what, { min: 0, max: 1, minExclusive: true });
}

function assertObject(value: unknown, what: string): void {
  if (value === null || typeof value !== 'object') {
    throw new MeasureError('out-of-range', `${what} must be an object.`);
  }
}

const round = (x: number) => Number(x.toPrecision(4));

/**
 * The daily energy balance of a kit: loads, storage, panels, days of autonomy and a
 * day-by-day state of charge. A planning aid, not an electrical design.
 *
 * Throws `MeasureError` for values out of range (see `PowerBudgetInput`), no battery,
 * an unknown chemistry, or panels without `peakSunHours` (`sun-hours-required`).
 */
export function powerBudget(input: PowerBudgetInput): PowerBudgetResult {
  if (input === null || typeof input !== 'object') {
    throw new MeasureError('out-of-range', 'A power budget needs loads and batteries.');
  }
  const loads = input.loads ?? [];
  const batteries = input.batteries ?? [];
  const panels = input.panels ?? [];
  if (!Array.isArray(loads) || !Array.isArray(batteries) || !Array.isArray(panels)) {
    throw new MeasureError('out-of-range', 'Loads, batteries and panels must be lists.');
  }
  if (batteries.length === 0) {
    throw new MeasureError('empty', 'A power budget needs at least one battery or power bank.');
  }
  const overallEff =
    input.conversionEfficiency === undefined
      ? DEFAULT_CONVERSION_EFFICIENCY
      : fraction01(input.conversionEfficiency, 'Conversion efficiency');
  const skyShare = input.skyShare === undefined ? 1 : assertRange(input.skyShare, 'Sky share', { min: 0, max: 1 });
  const lossFraction =
    input.lossFraction === undefined
      ? DEFAULT_LOSS_FRACTION
      : assertRange(input.lossFraction, 'Loss fraction', { min: 0, max: 1, maxExclusive: true });
  const tripDays =
    input.tripDays === undefined ? 1 : assertRange(input.tripDays, 'Trip days', { min: 1, max: 3650, integer: true });
  const peakSunHours =
    input.peakSunHours === undefined ? undefined : assertRange(input.peakSunHours, 'Peak sun hours', { min: 0, max: 24 });
  if (panels.length > 0 && peakSunHours === undefined) {
    throw new MeasureError(
      'sun-hours-required',
      'Panels need the peak sun hours of the place and season (clear sky) to estimate their daily energy.',
    );
  }

  let dailyLoadWh = 0;
  let dailyDrawWh = 0;
  let loadWatts = 0;
  loads.forEach((load, i) => {
    assertObject(load, `Load ${i + 1}`);
    const what = `Load ${i + 1}${load.name ? ` (${load.name})` : ''}`;
    const watts = assertRange(load.watts, `${what}: watts`, { min: 0 });
    const hours = assertRange(load.hoursPerDay, `${what}: hours per day`, { min: 0, max: 24 });
    const duty = load.dutyCycle === undefined ? 1 : fraction01(load.dutyCycle, `${what}: duty cycle`);
    const qty = quantity(load.quantity, what);
    const eff = load.efficiency === undefined ? overallEff : fraction01(load.efficiency, `${what}: efficiency`);
    const wh = watts * hours * duty * qty;
    dailyLoadWh += wh;
    dailyDrawWh += wh / eff;
    loadWatts += watts * qty;
  });

  let capacityWh = 0;
  let usableBatteryWh = 0;
  let batteryMaxW = 0;
  let anyMaxStated = false;
  batteries.forEach((b, i) => {
    assertObject(b, `Battery ${i + 1}`);
    const what = `Battery ${i + 1}${b.name ? ` (${b.name})` : ''}`;
    const cap = assertRange(b.capacityWh, `${what}: capacity (Wh)`, { min: 0, minExclusive: true });
    if (!(CHEMISTRIES as readonly string[]).includes(b.chemistry)) {
      throw new MeasureError(
        'unknown-chemistry',
        `${what}: unknown chemistry "${String(b.chemistry)}". Use one of ${CHEMISTRIES.join(', ')}.`,
      );
    }
    const dod =
      b.depthOfDischarge === undefined
        ? DEFAULT_DEPTH_OF_DISCHARGE[b.chemistry]
        : fraction01(b.depthOfDischarge, `${what}: depth of discharge`);
    const qty = quantity(b.quantity, what);
    capacityWh += cap * qty;
    usableBatteryWh += cap * dod * qty;
    if (b.maxContinuousW !== undefined) {
      batteryMaxW += assertRange(b.maxContinuousW, `${what}: maximum continuous power (W)`, { min: 0 }) * qty;
      anyMaxStated = true;
    }
  });

  let dailySolarWh = 0;
  panels.forEach((p, i) => {
    assertObject(p, `Panel ${i + 1}`);
    const what = `Panel ${i + 1}`;
    const rated = assertRange(p.ratedW, `${what}: rated power (W)`, { min: 0, minExclusive: true });
    const qty = quantity(p.quantity, what);
    dailySolarWh += rated * qty * (peakSunHours ?? 0) * skyShare * (1 - lossFraction);
  });

  finiteResult(dailyLoadWh, 'Daily load');
  finiteResult(dailyDrawWh, 'Daily draw');
  finiteResult(loadWatts, 'Total load power');
  finiteResult(capacityWh, 'Battery capacity');
  finiteResult(usableBatteryWh, 'Usable battery energy');
  finiteResult(batteryMaxW, 'Battery maximum power');
  finiteResult(dailySolarWh, 'Daily solar energy');
  const netDailyWh = finiteResult(dailySolarWh - dailyDrawWh, 'Net daily energy');
  const autonomyDays = dailyDrawWh === 0 ? null : finiteResult(usableBatteryWh / dailyDrawWh, 'Days of autonomy');
  const daysToRefill = dailySolarWh === 0 ? null : finiteResult(usableBatteryWh / dailySolarWh, 'Days to refill');

  const floor = capacityWh - usableBatteryWh;
  const tolerance = 1e-9 * capacityWh;
  const stateOfChargeByDay: number[] = [];
  let soc = capacityWh;
  let firstDayBelow: number | null = null;
  for (let day = 1; day <= tripDays; day++) {
    soc = Math.min(capacityWh, Math.max(0, soc - dailyDrawWh + dailySolarWh));
    stateOfChargeByDay.push(soc);
    if (firstDayBelow === null && soc < floor - tolerance) firstDayBelow = day;
  }
  const closes = firstDayBelow === null;

  const warnings: PowerBudgetWarning[] = [];
  if (netDailyWh < 0) {
    warnings.push({
      code: 'net-negative',
      message: `The loads take about ${round(dailyDrawWh)} Wh a day from storage but the panels return about ${round(dailySolarWh)} Wh: the batteries run down by about ${round(-netDailyWh)} Wh a day.`,
    });
  }
  if (autonomyDays !== null && autonomyDays < 1) {
    warnings.push({
      code: 'autonomy-under-one-day',
      message: `The usable battery energy (about ${round(usableBatteryWh)} Wh) covers less than one day of the loads (about ${round(dailyDrawWh)} Wh a day).`,
    });
  }
  if (firstDayBelow !== null) {
    warnings.push({
      code: 'does-not-close',
      day: firstDayBelow,
      message: `On day ${firstDayBelow} the batteries fall below the allowed depth of discharge. Add storage or panels, or cut the loads.`,
    });
  }
  if (anyMaxStated && loadWatts > batteryMaxW) {
    warnings.push({
      code: 'load-exceeds-battery',
      message: `All loads together can draw ${round(loadWatts)} W, more than the ${round(batteryMaxW)} W the batteries are rated to deliver continuously.`,
    });
  }

  return {
    dailyLoadWh,
    dailyDrawWh,
    capacityWh,
    usableBatteryWh,
    autonomyDays,
    dailySolarWh,
    netDailyWh,
    daysToRefill,
    stateOfChargeByDay,
    closes,
    warnings,
  };
}
