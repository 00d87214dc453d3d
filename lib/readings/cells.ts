/**
 * Reading one cell: numbers (with a decimal comma when the delimiter is not a comma),
 * elapsed h:mm[:ss] and clock timestamps. Pure; no Date, Intl or locale data.
 */

const NUMBER = /^[+-]?(?:\d+\.?\d*|\.\d+)(?:[eE][+-]?\d+)?$/;
const DECIMAL_COMMA = /^[+-]?\d+,\d+$/;

/** A number cell, or null if the cell is not a plain decimal number. `decimalComma` accepts "12,5". */
export function parseNumberCell(cell: string, decimalComma: boolean): number | null {
  const s = cell.trim();
  if (NUMBER.test(s)) {
    const n = Number(s);
    return Number.isFinite(n) ? n : null;
  }
  if (decimalComma && DECIMAL_COMMA.test(s)) return Number(s.replace(',', '.'));
  return null;
}

/** True when the cell reads as a number. */
export function isNumberCell(cell: string, decimalComma = false): boolean {
  return parseNumberCell(cell, decimalComma) !== null;
}

const HMS = /^(\d+):([0-5]\d)(?::([0-5]\d(?:[.,]\d+)?))?$/;

/** Elapsed time "h:mm" or "h:mm:ss(.fff)" in seconds, or null. */
export function parseElapsedCell(cell: string): number | null {
  const m = HMS.exec(cell.trim());
  if (!m) return null;
  const s = m[3] === undefined ? 0 : Number(m[3].replace(',', '.'));
  return Number(m[1]) * 3600 + Number(m[2]) * 60 + s;
}

// YYYY-MM-DD or YYYY/MM/DD, then T or space, HH:MM[:SS[.fff]], then optional Z or ±HH[:]MM.
const CLOCK = /^(\d{4})[-/](\d{2})[-/](\d{2})[T ](\d{2}):(\d{2})(?::(\d{2})(?:[.,](\d{1,9}))?)?\s*(Z|[+-]\d{2}(?::?\d{2})?)?$/i;

/** A clock time: seconds since 1970-01-01 00:00 (naive times are read as if UTC) and whether it had a zone. */
export interface ClockTime {
  epochS: number;
  zoned: boolean;
}

function daysInMonth(y: number, m: number): number {
  if (m === 2) return (y % 4 === 0 && y % 100 !== 0) || y % 400 === 0 ? 29 : 28;
  return [4, 6, 9, 11].includes(m) ? 30 : 31;
}

/**
 * A clock timestamp, ISO 8601 ("2026-09-19T11:00:05Z", "2026-09-19T11:00:05+02:00") or
 * "YYYY-MM-DD HH:MM:SS" (also with "/" in the date), or null. A time without a zone is
 * read as the logger's own clock; differences between such times are exact.
 */
export function parseClockCell(cell: string): ClockTime | null {
  const m = CLOCK.exec(cell.trim());
  if (!m) return null;
  const [y, mo, d, h, mi] = [1, 2, 3, 4, 5].map((i) => Number(m[i]));
  const sec = m[6] === undefined ? 0 : Number(m[6]);
  if (mo! < 1 || mo! > 12 || d! < 1 || d! > daysInMonth(y!, mo!) || h! > 23 || mi! > 59 || sec > 59) return null;
  const frac = m[7] === undefined ? 0 : Number(`0.${m[7]}`);
  let offsetMin = 0;
  const zone = m[8];
  if (zone && zone.toUpperCase() !== 'Z') {
    const digits = zone.slice(1).replace(':', '');
    const oh = Number(digits.slice(0, 2));
    const om = digits.length > 2 ? Number(digits.slice(2, 4)) : 0;
    if (oh > 23 || om > 59) return null;
    offsetMin = (zone[0] === '-' ? -1 : 1) * (oh * 60 + om);
  }
  // Date.UTC is plain calendar arithmetic here: it reads no clock and no time-zone data.
  const epochS = Date.UTC(y!, mo! - 1, d!, h!, mi!, sec) / 1000 - offsetMin * 60 + frac;
  return { epochS, zoned: zone !== undefined };
}

/** Formats seconds as h:mm:ss (negative values get a minus sign), for messages. */
export function formatElapsed(s: number): string {
  const sign = s < 0 ? '-' : '';
  const abs = Math.abs(s);
  const h = Math.floor(abs / 3600);
  const m = Math.floor((abs % 3600) / 60);
  const sec = abs - h * 3600 - m * 60;
  const secText = Number.isInteger(sec) ? String(sec).padStart(2, '0') : sec.toFixed(3).padStart(6, '0');
  return `${sign}${h}:${String(m).padStart(2, '0')}:${secText}`;
}
