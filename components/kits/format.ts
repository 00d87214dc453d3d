import { isCurrencyCode, moneyToMajor, minorUnitDigits } from '@/lib/measure';

/** A figure for people: at most `digits` decimals, thousands grouped, never "-0". */
export function fmt(value: number, digits = 1): string {
  const rounded = Number(value.toFixed(digits));
  return (Object.is(rounded, -0) ? 0 : rounded).toLocaleString('en-US', { maximumFractionDigits: digits });
}

export function fmtPercent(fraction: number): string {
  return `${fmt(fraction * 100, 1)} %`;
}

export function fmtMass(grams: number): string {
  return grams >= 1000 ? `${fmt(grams / 1000, 2)} kg` : `${fmt(grams, 0)} g`;
}

export function fmtMoney(amountMinor: number, currency: string): string {
  if (!isCurrencyCode(currency)) return `${amountMinor} ${currency}`;
  const digits = minorUnitDigits(currency);
  return `${moneyToMajor({ amountMinor, currency }).toLocaleString('en-US', { minimumFractionDigits: digits, maximumFractionDigits: digits })} ${currency}`;
}

export function fmtDays(days: number | null): string {
  if (days === null) return '—';
  return `${fmt(days, 1)} ${Number(days.toFixed(1)) === 1 ? 'day' : 'days'}`;
}
