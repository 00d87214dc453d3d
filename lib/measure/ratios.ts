import { assertRange, finiteResult, MeasureError } from './errors';
import { assertMoney, moneyToMajor, type Money } from './money';
import { isCategory, isSpecKey, SPECS, type Category, type SpecKey, type Specs } from './specs';

/** Which figures a ratio was computed from. */
export type RatioBasis = 'measured' | 'claimed' | 'mixed';

/** One value ratio of a gear item. */
export interface ValueRatio {
  /** e.g. `lm-per-g`, `wh-per-money`, `measured-vs-claimed:mass`, `delivered-vs-rated`. */
  id: string;
  value: number;
  /** e.g. `lm/g`, `Wh/USD`, `USD/Wh`, `h/100 g`; empty string for a dimensionless ratio. */
  unit: string;
  /**
   * True when a larger value is better. For `measured-vs-claimed:<key>` it follows the spec
   * (false for mass, power draw and charge time); null when neither direction is better
   * (supply voltage, which should match its claim).
   */
  higherIsBetter: boolean | null;
  basis: RatioBasis;
}

type Basis = 'measured' | 'claimed';

interface Picked {
  value: number;
  basis: Basis;
}

function combineBasis(bases: readonly Basis[]): RatioBasis {
  if (bases.every((b) => b === 'measured')) return 'measured';
  if (bases.every((b) => b === 'claimed')) return 'claimed';
  return 'mixed';
}

function checkFigure(value: number | null | undefined, what: string): number | undefined {
  if (value === null || value === undefined) return undefined;
  return assertRange(value, what, { min: 0 });
}

/**
 * Value ratios of one gear item in its category.
 *
 * - `specs`: figures in canonical units (see `SPECS`); each ratio uses a spec's measured
 *   value when there is one, else the claimed, and reports which in `basis`
 *   (`mixed` when its inputs differ). `deliveredEnergy` is measured only: a claimed
 *   delivered figure is ignored.
 * - `price`: money in minor units; "per money" ratios are per major unit (per dollar), their
 *   unit names the currency. The price never affects `basis`.
 * - A ratio whose inputs are missing or zero is absent.
 *
 * Throws for an unknown category or spec key, a negative or non-finite figure, or a bad price.
 */
export function valueRatios(category: Category, specs: Specs, price?: Money | null): ValueRatio[] {
  if (typeof category !== 'string' || !isCategory(category)) {
    throw new MeasureError('unknown-category', `Unknown gear category "${String(category)}".`);
  }
  if (specs === null || typeof specs !== 'object') {
    throw new MeasureError('unknown-spec', 'Specs must be a record of spec keys to figures.');
  }
  const measured = new Map<SpecKey, number>();
  const claimed = new Map<SpecKey, number>();
  for (const [key, figure] of Object.entries(specs)) {
    if (!isSpecKey(key)) throw new MeasureError('unknown-spec', `Unknown spec "${key}".`);
    if (figure === undefined || figure === null) continue;
    const unit = SPECS[key].unit;
    const m = checkFigure(figure.measured, `Measured ${key} (${unit})`);
    const c = checkFigure(figure.claimed, `Claimed ${key} (${unit})`);
    if (m !== undefined) measured.set(key, m);
    if (c !== undefined && !SPECS[key].measuredOnly) claimed.set(key, c);
  }

  let priceMajor: number | undefined;
  let currency = '';
  if (price !== undefined && price !== null) {
    assertMoney(price);
    if (price.amountMinor < 0) {
      throw new MeasureError('out-of-range', `The price must not be negative, got ${price.amountMinor} minor units.`);
    }
    priceMajor = moneyToMajor(price);
    currency = price.currency;
  }

  /** Measured if present, else claimed; undefined when missing or zero. */
  const pick = (key: SpecKey): Picked | undefined => {
    const m = measured.get(key);
    if (m !== undefined) return m === 0 ? undefined : { value: m, basis: 'measured' };
    const c = claimed.get(key);
    if (c !== undefined) return c === 0 ? undefined : { value: c, basis: 'claimed' };
    return undefined;
  };

  const out: ValueRatio[] = [];
  const add = (id: string, value: number, unit: string, higherIsBetter: boolean | null, bases: Basis[]) => {
    out.push({ id, value: finiteResult(value, `Ratio ${id}`), unit, higherIsBetter, basis: combineBasis(bases) });
  };
  const hasPrice = priceMajor !== undefined && priceMajor > 0;

  const mass = pick('mass');
  const kg = mass && mass.value / 1000;

  if (category === 'light') {
    const flux = pick('luminousFlux');
    const runtime = pick('runtime');
    const energy = pick('ratedEnergy');
    if (flux && mass) add('lm-per-g', flux.value / mass.value, 'lm/g', true, [flux.basis, mass.basis]);
    if (flux && hasPrice) add('lm-per-money', flux.value / priceMajor!, `lm/${currency}`, true, [flux.basis]);
    if (runtime && mass) {
      add('runtime-h-per-100g', (runtime.value / 3600) / (mass.value / 100), 'h/100 g', true, [runtime.basis, mass.basis]);
    }
    if (energy && mass) add('wh-per-kg', energy.value / kg!, 'Wh/kg', true, [energy.basis, mass.basis]);
  }

  if (category === 'power-bank' || category === 'battery-12v') {
    const energy = pick('ratedEnergy');
    const delivered = pick('deliveredEnergy');
    if (energy && mass) add('wh-per-kg', energy.value / kg!, 'Wh/kg', true, [energy.basis, mass.basis]);
    if (energy && hasPrice) {
      add('wh-per-money', energy.value / priceMajor!, `Wh/${currency}`, true, [energy.basis]);
      add('money-per-wh', priceMajor! / energy.value, `${currency}/Wh`, false, [energy.basis]);
    }
    if (delivered && hasPrice) {
      add('delivered-wh-per-money', delivered.value / priceMajor!, `Wh/${currency}`, true, [delivered.basis]);
    }
  }

  if (category === 'solar-panel') {
    const power = pick('ratedPower');
    if (power && mass) add('w-per-kg', power.value / kg!, 'W/kg', true, [power.basis, mass.basis]);
    if (power && hasPrice) add('w-per-money', power.value / priceMajor!, `W/${currency}`, true, [power.basis]);
  }

  for (const key of Object.keys(SPECS) as SpecKey[]) {
    const m = measured.get(key);
    const c = claimed.get(key);
    if (m && c) add(`measured-vs-claimed:${key}`, m / c, '', SPECS[key].higherIsBetter, ['measured', 'claimed']);
  }

  const delivered = measured.get('deliveredEnergy');
  const rated = pick('ratedEnergy');
  if (delivered && rated) {
    add('delivered-vs-rated', delivered / rated.value, '', true, ['measured', rated.basis]);
  }

  return out;
}
