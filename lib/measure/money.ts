import { assertFinite, finiteResult, MeasureError } from './errors';

/**
 * ISO 4217 minor-unit digits (the "E" column of List One) for the active currency codes
 * that have a minor unit. Codes whose minor unit ISO gives as "N.A." (precious metals,
 * XDR, XSU, XUA, test and "no currency" codes) are left out: they are not prices.
 *
 * This is the one table the app uses; it does not read the runtime's Intl data, which
 * differs from ISO 4217 for some codes (for example IQD, whose ISO exponent is 3).
 * Transcribed from ISO 4217 List One; the amendment level was not re-checked against the
 * published list (from memory) — recently withdrawn codes (HRK, CUC, SLL, ZWL) are omitted.
 */
export const ISO4217_MINOR_UNITS = {
  AED: 2, AFN: 2, ALL: 2, AMD: 2, ANG: 2, AOA: 2, ARS: 2, AUD: 2, AWG: 2, AZN: 2,
  BAM: 2, BBD: 2, BDT: 2, BGN: 2, BHD: 3, BIF: 0, BMD: 2, BND: 2, BOB: 2, BOV: 2,
  BRL: 2, BSD: 2, BTN: 2, BWP: 2, BYN: 2, BZD: 2,
  CAD: 2, CDF: 2, CHE: 2, CHF: 2, CHW: 2, CLF: 4, CLP: 0, CNY: 2, COP: 2, COU: 2,
  CRC: 2, CUP: 2, CVE: 2, CZK: 2,
  DJF: 0, DKK: 2, DOP: 2, DZD: 2,
  EGP: 2, ERN: 2, ETB: 2, EUR: 2,
  FJD: 2, FKP: 2,
  GBP: 2, GEL: 2, GHS: 2, GIP: 2, GMD: 2, GNF: 0, GTQ: 2, GYD: 2,
  HKD: 2, HNL: 2, HTG: 2, HUF: 2,
  IDR: 2, ILS: 2, INR: 2, IQD: 3, IRR: 2, ISK: 0,
  JMD: 2, JOD: 3, JPY: 0,
  KES: 2, KGS: 2, KHR: 2, KMF: 0, KPW: 2, KRW: 0, KWD: 3, KYD: 2, KZT: 2,
  LAK: 2, LBP: 2, LKR: 2, LRD: 2, LSL: 2, LYD: 3,
  MAD: 2, MDL: 2, MGA: 2, MKD: 2, MMK: 2, MNT: 2, MOP: 2, MRU: 2, MUR: 2, MVR: 2,
  MWK: 2, MXN: 2, MXV: 2, MYR: 2, MZN: 2,
  NAD: 2, NGN: 2, NIO: 2, NOK: 2, NPR: 2, NZD: 2,
  OMR: 3,
  PAB: 2, PEN: 2, PGK: 2, PHP: 2, PKR: 2, PLN: 2, PYG: 0,
  QAR: 2,
  RON: 2, RSD: 2, RUB: 2, RWF: 0,
  SAR: 2, SBD: 2, SCR: 2, SDG: 2, SEK: 2, SGD: 2, SHP: 2, SLE: 2, SOS: 2, SRD: 2,
  SSP: 2, STN: 2, SVC: 2, SYP: 2, SZL: 2,
  THB: 2, TJS: 2, TMT: 2, TND: 3, TOP: 2, TRY: 2, TTD: 2, TWD: 2, TZS: 2,
  UAH: 2, UGX: 0, USD: 2, USN: 2, UYI: 0, UYU: 2, UYW: 4, UZS: 2,
  VED: 2, VES: 2, VND: 0, VUV: 0,
  WST: 2,
  XAF: 0, XCD: 2, XCG: 2, XOF: 0, XPF: 0,
  YER: 2,
  ZAR: 2, ZMW: 2, ZWG: 2,
} as const satisfies Record<string, 0 | 2 | 3 | 4>;

/** An ISO 4217 alphabetic code present in `ISO4217_MINOR_UNITS`. */
export type CurrencyCode = keyof typeof ISO4217_MINOR_UNITS;

/**
 * A price: an integer number of minor units (cents, pence, yen …) and an ISO 4217 code.
 * `currency` is typed as a string because it usually arrives from storage or a form;
 * every function here checks it against `ISO4217_MINOR_UNITS` and throws `unknown-currency`.
 */
export interface Money {
  readonly amountMinor: number;
  readonly currency: CurrencyCode | (string & {});
}

/** True when `code` is an upper-case ISO 4217 code in the table. */
export function isCurrencyCode(code: string): code is CurrencyCode {
  return Object.prototype.hasOwnProperty.call(ISO4217_MINOR_UNITS, code);
}

/** Minor-unit digits of a currency (2 for USD, 0 for JPY, 3 for KWD); throws `unknown-currency`. */
export function minorUnitDigits(currency: string): 0 | 2 | 3 | 4 {
  if (!isCurrencyCode(currency)) {
    throw new MeasureError(
      'unknown-currency',
      `Unknown currency "${currency}". Use an upper-case ISO 4217 code such as USD, EUR or GBP.`,
    );
  }
  return ISO4217_MINOR_UNITS[currency];
}

/** Checks a Money value: known currency, integer `amountMinor` within the safe-integer range. */
export function assertMoney(money: Money, what = 'The price'): Money {
  minorUnitDigits(money.currency);
  assertFinite(money.amountMinor, `${what} (amountMinor)`);
  if (!Number.isSafeInteger(money.amountMinor)) {
    throw new MeasureError(
      'not-integer',
      `${what} must be a whole number of minor units (e.g. cents), got ${money.amountMinor}.`,
    );
  }
  return money;
}

/** The amount in major units (dollars, euros): amountMinor ÷ 10^digits. 1999 USD → 19.99. */
export function moneyToMajor(money: Money): number {
  assertMoney(money);
  return money.amountMinor / 10 ** minorUnitDigits(money.currency);
}

/**
 * Money from an amount in major units, rounded to the nearest minor unit (halves away from
 * zero). 19.99 USD → { amountMinor: 1999, currency: 'USD' }; 1500 JPY → 1500.
 */
export function moneyFromMajor(amountMajor: number, currency: string): Money {
  assertFinite(amountMajor, 'The amount');
  const digits = minorUnitDigits(currency);
  const scaled = finiteResult(amountMajor * 10 ** digits, 'The amount in minor units');
  const rounded = Math.sign(scaled) * Math.round(Math.abs(scaled));
  if (!Number.isSafeInteger(rounded)) {
    throw new MeasureError('out-of-range', `The amount ${amountMajor} ${currency} is too large to store exactly.`);
  }
  return { amountMinor: rounded === 0 ? 0 : rounded, currency };
}
