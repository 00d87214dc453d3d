/**
 * Parsing of typed quantities ("12.3 oz", "10 400 mAh at 3.6 V", "3 h 30 min") into the canonical
 * units of lib/measure. Pure: no framework, database or locale data, so the form can echo the
 * converted value as the reviewer types and the server can parse the same text the same way.
 *
 * Accepted text (decided here, tested in tests/unit/gear-parse-quantity.test.ts):
 * - A number, then a unit: "450 g", "2.1 lb", "37 Wh", "5W". Unit symbols are matched without regard
 *   to case ("OZ", "wh"); "lbs", "hr", "hrs", "lux", "sec" … are accepted aliases.
 * - Numbers use a point for decimals. Thousands may be grouped with a space ("10 400") or with
 *   commas ("10,400"); a lone comma before other than three digits ("1,5") is refused as ambiguous.
 * - A sum of parts, largest unit first, each unit once: "1 lb 4 oz" (= 566.990 462 5 g),
 *   "3 h 30 min", "1 kg 200 g". Parts must be of the same quantity.
 * - Charge at a nominal voltage for energy: "10 400 mAh at 3.6 V", "10400 mAh @ 3.6 V", "100 Ah @ 12.8 V"
 *   (Wh = Ah × V, 49 CFR 171.8, through lib/measure `chargeToWh`).
 * - Current at a supply voltage for power: "1.5 A at 13.8 V", "450 mA @ 5 V" (W = A × V).
 * - A bare number is taken in the canonical unit (g, Wh, W, lm, cd, lx, m, s, V, A, cycles, %) and the echo says so.
 * - Counts ("2000 cycles") are whole numbers; shares ("92 %") are at most 100 %.
 * - Negative, zero (unless allowed), non-finite and absurdly large values are refused.
 */
import { chargeToWh, convert, quantityOf, CANONICAL_UNIT, type Quantity, type UnitSymbol } from '@/lib/measure';

export type ParseErrorCode = 'empty' | 'not-a-number' | 'unknown-unit' | 'wrong-quantity' | 'negative' | 'zero' | 'too-large' | 'bad-compound';

export class QuantityParseError extends Error {
  readonly code: ParseErrorCode;
  constructor(code: ParseErrorCode, message: string) {
    super(message);
    this.name = 'QuantityParseError';
    this.code = code;
  }
}

/** Quantities a reviewer may type into a spec field. */
export type TypedQuantity = Extract<
  Quantity,
  'mass' | 'energy' | 'power' | 'luminousFlux' | 'luminousIntensity' | 'illuminance' | 'length' | 'duration' | 'voltage' | 'current' | 'count' | 'fraction' | 'level'
>;

/** Typed aliases (lower-case) → unit symbol of lib/measure. */
const ALIASES: Record<string, UnitSymbol> = {
  g: 'g', gram: 'g', grams: 'g', kg: 'kg', oz: 'oz', lb: 'lb', lbs: 'lb',
  wh: 'Wh', kwh: 'kWh', j: 'J',
  w: 'W', kw: 'kW',
  lm: 'lm', cd: 'cd', lx: 'lx', lux: 'lx', fc: 'fc',
  mm: 'mm', cm: 'cm', m: 'm', km: 'km', in: 'in', ft: 'ft', yd: 'yd', mi: 'mi',
  s: 's', sec: 's', min: 'min', h: 'h', hr: 'h', hrs: 'h', d: 'd', day: 'd', days: 'd',
  v: 'V', a: 'A', ma: 'mA', mah: 'mAh', ah: 'Ah',
  cycles: 'cycles', cycle: 'cycles', '%': '%', percent: '%',
  db: 'dB',
};

/** Units a reviewer may type per quantity (as shown in hints), canonical first. */
export const TYPED_UNITS: Record<TypedQuantity, readonly string[]> = {
  mass: ['g', 'kg', 'oz', 'lb'],
  energy: ['Wh', 'kWh', 'mAh at V', 'Ah at V'],
  power: ['W', 'kW', 'A at V', 'mA at V'],
  luminousFlux: ['lm'],
  luminousIntensity: ['cd'],
  illuminance: ['lx', 'fc'],
  length: ['m', 'mm', 'cm', 'km', 'in', 'ft', 'yd', 'mi'],
  duration: ['h', 'min', 's', 'd'],
  voltage: ['V'],
  current: ['A', 'mA'],
  count: ['cycles'],
  fraction: ['%'],
  level: ['dB'],
};

/** Upper bound for any typed figure in its canonical unit: far above any real gear, far below overflow. */
export const MAX_CANONICAL = 1e9;

export interface ParsedQuantity {
  /** Value in the canonical unit. */
  value: number;
  /** Canonical unit symbol (g, Wh, W …). */
  unit: UnitSymbol;
  /** True when the text had no unit and the canonical unit was assumed. */
  assumedUnit: boolean;
}

const NUMBER = String.raw`(?:(?:\d{1,3}(?:[ \u00a0\u202f]\d{3})+(?!\d)|\d{1,3}(?:,\d{3})+(?!\d)|\d+)(?:\.\d+)?|\.\d+)`;
const PART = new RegExp(String.raw`^([-\u2212]?)\s*(${NUMBER})\s*([a-zA-Z]+|%)?\s*`);
const JOIN = /^(?:at|@)\s*/i;

function toNumber(raw: string): number {
  return Number(raw.replace(/[ ,\u00a0\u202f]/g, ''));
}

interface Part {
  value: number;
  unit: UnitSymbol | null;
  negative: boolean;
}

function readParts(text: string): { parts: Part[]; joined: Part | null } {
  let rest = text.trim();
  const parts: Part[] = [];
  let joined: Part | null = null;
  while (rest.length > 0) {
    if (parts.length > 0 && JOIN.test(rest)) {
      rest = rest.replace(JOIN, '');
      const m = PART.exec(rest);
      if (!m) throw new QuantityParseError('not-a-number', `Give the voltage after "at", e.g. "10 400 mAh at 3.6 V".`);
      joined = { value: toNumber(m[2]!), unit: unitOf(m[3]), negative: m[1] === '-' };
      rest = rest.slice(m[0].length);
      if (rest.length > 0) throw new QuantityParseError('not-a-number', `Unexpected "${rest}" after the voltage.`);
      break;
    }
    const m = PART.exec(rest);
    if (!m || m[0].length === 0) {
      if (/^\d+,\d/.test(rest) || /\d,\d/.test(rest)) {
        throw new QuantityParseError('not-a-number', 'Use a point for decimals (e.g. 1.5); commas only group thousands (10,400).');
      }
      throw new QuantityParseError('not-a-number', `"${text.trim()}" is not a number with a unit, e.g. "450 g".`);
    }
    parts.push({ value: toNumber(m[2]!), unit: unitOf(m[3]), negative: m[1] === '-' });
    rest = rest.slice(m[0].length);
    if (/^,\d/.test(rest)) throw new QuantityParseError('not-a-number', 'Use a point for decimals (e.g. 1.5); commas only group thousands (10,400).');
  }
  return { parts, joined };
}

function unitOf(raw: string | undefined): UnitSymbol | null {
  if (raw === undefined) return null;
  const symbol = ALIASES[raw.toLowerCase()];
  if (!symbol) throw new QuantityParseError('unknown-unit', `Unknown unit "${raw}".`);
  return symbol;
}


function allowedHint(quantity: TypedQuantity): string {
  return TYPED_UNITS[quantity].join(', ');
}

/**
 * Parses typed text into the canonical unit of `quantity`. Throws `QuantityParseError` with a message
 * a reviewer can act on. `allowZero` permits 0 (claimed specs do not).
 */
export function parseQuantity(text: string, quantity: TypedQuantity, options: { allowZero?: boolean } = {}): ParsedQuantity {
  if (typeof text !== 'string' || text.trim() === '') throw new QuantityParseError('empty', 'Enter a value with its unit.');
  const canonical = CANONICAL_UNIT[quantity];
  let { parts, joined } = { parts: [] as Part[], joined: null as Part | null };
  try {
    ({ parts, joined } = readParts(text));
  } catch (error) {
    if (error instanceof QuantityParseError && error.code === 'unknown-unit') {
      throw new QuantityParseError('unknown-unit', `${error.message} Use one of: ${allowedHint(quantity)}.`);
    }
    throw error;
  }
  if (parts.some((p) => p.negative) || joined?.negative) {
    throw new QuantityParseError('negative', 'The value must not be negative.');
  }

  let value: number;
  let assumedUnit = false;
  if (joined) {
    // charge at voltage (energy) or current at voltage (power)
    if (parts.length !== 1 || !parts[0]!.unit || joined.unit !== 'V') {
      throw new QuantityParseError('bad-compound', `Write it as "10 400 mAh at 3.6 V" or "1.5 A at 13.8 V".`);
    }
    const first = parts[0]!;
    if (quantity === 'energy' && (first.unit === 'mAh' || first.unit === 'Ah')) {
      if (joined.value <= 0) throw new QuantityParseError('zero', 'The nominal voltage must be greater than zero.');
      value = chargeToWh(first.value, first.unit, joined.value);
    } else if (quantity === 'power' && (first.unit === 'A' || first.unit === 'mA')) {
      value = convert(first.value, first.unit, 'A') * joined.value;
    } else {
      throw new QuantityParseError('wrong-quantity', `"… at V" is for charge (mAh, Ah) as energy or current (A, mA) as power. Use one of: ${allowedHint(quantity)}.`);
    }
  } else if (parts.length === 1 && parts[0]!.unit === null) {
    value = parts[0]!.value;
    assumedUnit = true;
  } else {
    value = 0;
    let previousSize = Infinity;
    const seen = new Set<UnitSymbol>();
    for (const part of parts) {
      if (part.unit === null) {
        throw new QuantityParseError('bad-compound', 'Give a unit for every part, e.g. "1 lb 4 oz" or "3 h 30 min".');
      }
      if (part.unit === 'mAh' || part.unit === 'Ah') {
        throw new QuantityParseError(
          quantity === 'energy' ? 'bad-compound' : 'wrong-quantity',
          quantity === 'energy' ? 'A charge needs its nominal voltage: "10 400 mAh at 3.6 V".' : `mAh is a charge, not a ${quantity}. Use one of: ${allowedHint(quantity)}.`,
        );
      }
      if (quantityOf(part.unit) !== quantity) {
        throw new QuantityParseError('wrong-quantity', `"${part.unit}" is not a unit of ${describe(quantity)}. Use one of: ${allowedHint(quantity)}.`);
      }
      const size = convert(1, part.unit, canonical);
      if (seen.has(part.unit) || size >= previousSize) {
        throw new QuantityParseError('bad-compound', 'Write the parts largest unit first, each unit once, e.g. "1 lb 4 oz".');
      }
      seen.add(part.unit);
      previousSize = size;
      value += convert(part.value, part.unit, canonical);
    }
  }

  if (!Number.isFinite(value)) throw new QuantityParseError('too-large', 'The value is too large.');
  if (value > MAX_CANONICAL) throw new QuantityParseError('too-large', `The value is too large (over ${MAX_CANONICAL.toExponential()} ${canonical}).`);
  if (value === 0 && !options.allowZero) throw new QuantityParseError('zero', 'The value must be greater than zero.');
  if (quantity === 'fraction' && value > 100) throw new QuantityParseError('too-large', 'A share such as an efficiency cannot be over 100 %.');
  if (quantity === 'count' && !Number.isInteger(value)) throw new QuantityParseError('not-a-number', 'A count is a whole number, e.g. "2000 cycles".');
  return { value, unit: canonical, assumedUnit };
}

const QUANTITY_WORDS: Record<TypedQuantity, string> = {
  mass: 'mass',
  energy: 'energy',
  power: 'power',
  luminousFlux: 'light output',
  luminousIntensity: 'intensity',
  illuminance: 'illuminance',
  length: 'length',
  duration: 'time',
  voltage: 'voltage',
  current: 'current',
  count: 'count',
  fraction: 'share',
  level: 'level (dB)',
};

export function describe(quantity: TypedQuantity): string {
  return QUANTITY_WORDS[quantity];
}

/** Same as `parseQuantity` but returns the error instead of throwing (for live echo in forms). */
export function tryParseQuantity(
  text: string,
  quantity: TypedQuantity,
  options: { allowZero?: boolean } = {},
): { ok: true; parsed: ParsedQuantity } | { ok: false; error: QuantityParseError } {
  try {
    return { ok: true, parsed: parseQuantity(text, quantity, options) };
  } catch (error) {
    if (error instanceof QuantityParseError) return { ok: false, error };
    const message = error instanceof Error ? error.message : 'The value could not be read.';
    return { ok: false, error: new QuantityParseError('not-a-number', message) };
  }
}
