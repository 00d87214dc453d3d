/**
 * Display and form formatting of canonical figures. Pure (no locale data beyond 'en' digits), so the
 * server, the form echo and the tests format the same way.
 */
import { moneyToMajor, minorUnitDigits, SPECS, type Money, type Quantity, type SpecKey } from '@/lib/measure';

const formatters = new Map<number, Intl.NumberFormat>();
function nf(maxFractionDigits: number): Intl.NumberFormat {
  let f = formatters.get(maxFractionDigits);
  if (!f) {
    f = new Intl.NumberFormat('en-US', { maximumFractionDigits: maxFractionDigits, useGrouping: true });
    formatters.set(maxFractionDigits, f);
  }
  return f;
}

/** A figure with a sensible number of decimals: 348.7, 37.44, 0.853, 10,400. */
export function formatNumber(value: number): string {
  const abs = Math.abs(value);
  const digits = abs >= 1000 ? 0 : abs >= 100 ? 1 : abs >= 10 ? 2 : abs >= 1 ? 2 : 3;
  return nf(digits).format(value);
}

/** A duration in seconds as "5 h", "3 h 30 min", "45 min" or "20 s". */
export function formatDuration(seconds: number): string {
  if (seconds >= 3600) {
    const totalMin = Math.round(seconds / 60);
    const h = Math.floor(totalMin / 60);
    const m = totalMin % 60;
    return m === 0 ? `${nf(0).format(h)} h` : `${nf(0).format(h)} h ${m} min`;
  }
  if (seconds >= 60) return `${formatNumber(seconds / 60)} min`;
  return `${formatNumber(seconds)} s`;
}

/** A canonical figure with its unit: "348.7 g", "37.44 Wh", "5 h". */
export function formatQuantity(value: number, unit: string): string {
  if (unit === 's') return formatDuration(value);
  return `${formatNumber(value)} ${unit}`;
}

export function formatSpec(key: SpecKey, value: number): string {
  return formatQuantity(value, SPECS[key].unit);
}

const precise = (v: number) => String(Number(v.toPrecision(12)));

/** A canonical figure as form text that parses back to the same value ("410 g", "5 h", "19.24 Wh"). */
export function formatForInput(value: number, quantity: Quantity): string {
  if (quantity === 'duration') {
    if (value >= 3600) return `${precise(value / 3600)} h`;
    if (value >= 60) return `${precise(value / 60)} min`;
    return `${precise(value)} s`;
  }
  const unit = SPECS_BY_QUANTITY[quantity] ?? '';
  return `${precise(value)} ${unit}`.trim();
}

const SPECS_BY_QUANTITY: Partial<Record<Quantity, string>> = Object.fromEntries(
  Object.values(SPECS).map((s) => [s.quantity, s.unit]),
) as Partial<Record<Quantity, string>>;

/** Money as "59.99 USD". */
export function formatMoney(money: Money): string {
  const digits = minorUnitDigits(money.currency);
  return `${new Intl.NumberFormat('en-US', { minimumFractionDigits: digits, maximumFractionDigits: digits }).format(moneyToMajor(money))} ${money.currency}`;
}

/** measured ÷ claimed as a signed percentage: 0.82 → "−18 %", 1.05 → "+5 %", 1 → "±0 %". */
export function formatSignedPercent(ratio: number): string {
  const pct = Math.round((ratio - 1) * 100);
  if (pct === 0) return '±0 %';
  return pct > 0 ? `+${pct} %` : `−${Math.abs(pct)} %`;
}

/** A value ratio with its unit: "0.853 lm/g", "1.8 Wh/USD", "0.56 USD/Wh". */
export function formatRatio(value: number, unit: string): string {
  return unit ? `${formatNumber(value)} ${unit}` : formatNumber(value);
}
