import Papa from 'papaparse';
import { isNumberCell, parseClockCell, parseElapsedCell } from './cells';
import type { ColumnRole, ColumnSelection, TimeUnit, ValueField } from './types';

/** How much of the file the inspection reads (the first lines are enough to guess). */
const HEAD_CHARS = 64 * 1024;
const PREVIEW_ROWS = 12;
const SAMPLE_ROWS = 50;

export const DELIMITERS = [',', ';', '\t', '|'] as const;
export type Delimiter = (typeof DELIMITERS)[number];

/** One column of the file with a guess of what it holds. */
export interface ColumnInfo {
  /** 0-based index. */
  index: number;
  /** The header cell, or "column 3" when the file has no header. */
  name: string;
  role: ColumnRole;
  /** For a time column: how its cells are written. */
  timeUnit?: TimeUnit;
  /** For a value column: factor to canonical units (0.001 for mA, mV, mW; 1000 for kW). */
  scale?: number;
  /** Unit as the header states it (W, mA, lx, %, s …), when it does. */
  unit?: string;
  /** Every sampled cell parses as a number. */
  numeric: boolean;
  /** The first few cells, as written. */
  samples: string[];
}

export interface CsvInspection {
  delimiter: Delimiter;
  /** Numbers are written with a decimal comma ("12,5"); only when the delimiter is not a comma. */
  decimalComma: boolean;
  /** 1-based row of the header, or null when the first data row has no header before it. */
  headerRow: number | null;
  /** 1-based row of the first data row (rows before it are a preamble, comments or blank). */
  firstDataRow: number;
  columns: ColumnInfo[];
  /** The first data rows, for a monospace preview. */
  preview: { row: number; cells: string[] }[];
  /** The columns guessed for each role; `time` is absent when no column looks like time. */
  guess: Partial<ColumnSelection>;
}

interface Line {
  row: number;
  cells: string[];
}

function isBlank(cells: string[]): boolean {
  return cells.every((c) => c.trim() === '');
}

function isComment(cells: string[]): boolean {
  return (cells[0] ?? '').trimStart().startsWith('#');
}

/** The start of the text, cut at a line end. */
function headOf(text: string): string {
  if (text.length <= HEAD_CHARS) return text;
  const cut = text.lastIndexOf('\n', HEAD_CHARS);
  return cut > 0 ? text.slice(0, cut + 1) : text.slice(0, HEAD_CHARS);
}

function linesOf(head: string, delimiter: string): Line[] {
  const data = Papa.parse<string[]>(head, { delimiter, skipEmptyLines: false }).data;
  const lines: Line[] = [];
  data.forEach((cells, i) => {
    if (!isBlank(cells) && !isComment(cells)) lines.push({ row: i + 1, cells });
  });
  return lines;
}

/** The most common field count among lines, and how many lines have it. */
function modalCount(lines: Line[]): { count: number; share: number } {
  const counts = new Map<number, number>();
  for (const l of lines) counts.set(l.cells.length, (counts.get(l.cells.length) ?? 0) + 1);
  let best = 1;
  let bestN = 0;
  for (const [count, n] of counts) if (n > bestN || (n === bestN && count > best)) [best, bestN] = [count, n];
  return { count: best, share: lines.length ? bestN / lines.length : 0 };
}

/** Picks the delimiter that splits most lines into the same number (> 1) of fields; tab, then semicolon, win ties. */
export function detectDelimiter(head: string): Delimiter {
  let best: Delimiter = ',';
  let bestScore = 0;
  for (const d of ['\t', ';', ',', '|'] as const) {
    const lines = linesOf(head, d).slice(0, SAMPLE_ROWS + 10);
    const { count, share } = modalCount(lines);
    if (count < 2) continue;
    if (share > bestScore + 1e-9) [best, bestScore] = [d, share];
  }
  return best;
}

function looksLikeData(cell: string, decimalComma: boolean): boolean {
  const s = cell.trim();
  return s === '' || isNumberCell(s, decimalComma) || parseClockCell(s) !== null || parseElapsedCell(s) !== null;
}

function tokens(name: string): string[] {
  return name
    .toLowerCase()
    .replace(/µ/g, 'u')
    .split(/[^a-z0-9%]+|(?<=[a-z])(?=\d)|(?<=\d)(?=[a-z])/)
    .filter(Boolean);
}

const TIME_WORDS = new Set(['t', 'time', 'elapsed', 'timestamp', 'datetime', 'date', 'clock', 'seconds', 'secs', 'minutes', 'mins', 'hours', 'hrs', 'runtime', 'uptime']);
const TIME_UNITS_BY_TOKEN: Record<string, TimeUnit> = {
  s: 's', sec: 's', secs: 's', second: 's', seconds: 's',
  min: 'min', mins: 'min', minute: 'min', minutes: 'min',
  h: 'h', hr: 'h', hrs: 'h', hour: 'h', hours: 'h',
};

/** Unit tokens first (they are the strongest hint), then words. */
const VALUE_UNIT_TOKENS: Record<string, { role: ValueField; scale: number; unit: string }> = {
  mw: { role: 'watts', scale: 0.001, unit: 'mW' },
  kw: { role: 'watts', scale: 1000, unit: 'kW' },
  w: { role: 'watts', scale: 1, unit: 'W' },
  mv: { role: 'volts', scale: 0.001, unit: 'mV' },
  v: { role: 'volts', scale: 1, unit: 'V' },
  ma: { role: 'amps', scale: 0.001, unit: 'mA' },
  a: { role: 'amps', scale: 1, unit: 'A' },
  lux: { role: 'value', scale: 1, unit: 'lx' },
  lx: { role: 'value', scale: 1, unit: 'lx' },
  lm: { role: 'value', scale: 1, unit: 'lm' },
  '%': { role: 'value', scale: 1, unit: '%' },
};
const VALUE_WORDS: Record<string, ValueField> = {
  watt: 'watts', watts: 'watts', power: 'watts', pwr: 'watts',
  volt: 'volts', volts: 'volts', voltage: 'volts', vbus: 'volts', vbat: 'volts',
  amp: 'amps', amps: 'amps', ampere: 'amps', amperes: 'amps', current: 'amps', ibus: 'amps',
  lumen: 'value', lumens: 'value', output: 'value', relative: 'value', rel: 'value', brightness: 'value',
  light: 'value', illuminance: 'value', intensity: 'value', percent: 'value', pct: 'value', reading: 'value', value: 'value',
};

/** True when at least 80 % of the filled cells pass `test` (a few bad rows must not hide a column). */
function mostly(filled: string[], test: (s: string) => boolean): boolean {
  if (filled.length === 0) return false;
  let n = 0;
  for (const s of filled) if (test(s)) n++;
  return n >= 0.8 * filled.length;
}

/** Guesses a column's role from its header and its cells. */
export function guessColumn(name: string, samples: string[], decimalComma: boolean): Pick<ColumnInfo, 'role' | 'timeUnit' | 'scale' | 'unit' | 'numeric'> {
  const filled = samples.map((s) => s.trim()).filter((s) => s !== '');
  const numeric = mostly(filled, (s) => isNumberCell(s, decimalComma));
  if (mostly(filled, (s) => parseClockCell(s) !== null)) return { role: 'time', timeUnit: 'clock', numeric: false };
  if (mostly(filled, (s) => parseElapsedCell(s) !== null)) return { role: 'time', timeUnit: 'hms', unit: 'h:mm:ss', numeric: false };
  const tks = tokens(name);
  if (tks.some((t) => TIME_WORDS.has(t))) {
    const unitToken = tks.find((t) => TIME_UNITS_BY_TOKEN[t] !== undefined);
    const timeUnit = unitToken ? TIME_UNITS_BY_TOKEN[unitToken]! : 's';
    return { role: 'time', timeUnit, unit: timeUnit, numeric };
  }
  for (const t of tks) {
    const u = VALUE_UNIT_TOKENS[t];
    if (u) return { role: u.role, scale: u.scale, unit: u.unit, numeric };
  }
  for (const t of tks) {
    const role = VALUE_WORDS[t];
    if (role) return { role, scale: 1, numeric };
  }
  return { role: 'unknown', numeric };
}

/**
 * Looks at the start of a decoded CSV text: delimiter, header, preamble, decimal comma, and a
 * guess of each column's role. Pure and fast (reads at most the first 64 KB).
 */
export function inspectText(text: string): CsvInspection {
  const head = headOf(text);
  const delimiter = detectDelimiter(head);
  const lines = linesOf(head, delimiter);
  const { count } = modalCount(lines.slice(0, SAMPLE_ROWS + 10));
  // Lines before the first one with the usual field count are a preamble (logger name, settings …).
  const startIdx = Math.max(0, lines.findIndex((l) => l.cells.length === count));
  const body = lines.slice(startIdx);
  const decimalComma =
    delimiter !== ',' && body.slice(0, SAMPLE_ROWS).some((l) => l.cells.some((c) => /^[+-]?\d+,\d+$/.test(c.trim())));
  const first = body[0];
  const hasHeader = first !== undefined && first.cells.some((c) => !looksLikeData(c, decimalComma));
  const dataLines = hasHeader ? body.slice(1) : body;
  const width = Math.max(count, first?.cells.length ?? 0);
  const columns: ColumnInfo[] = [];
  for (let i = 0; i < width; i++) {
    const rawName = hasHeader ? (first!.cells[i] ?? '').trim() : '';
    const name = rawName || `column ${i + 1}`;
    const samples = dataLines.slice(0, SAMPLE_ROWS).map((l) => l.cells[i] ?? '');
    columns.push({ index: i, name, ...guessColumn(rawName, samples, decimalComma), samples: samples.slice(0, 5) });
  }
  const guess: Partial<ColumnSelection> = {};
  const time = columns.find((c) => c.role === 'time');
  if (time) guess.time = { column: time.index, unit: time.timeUnit ?? 's' };
  for (const field of ['value', 'watts', 'volts', 'amps'] as const) {
    const c = columns.find((col) => col.role === field);
    if (c) guess[field] = c.scale !== undefined && c.scale !== 1 ? { column: c.index, scale: c.scale } : { column: c.index };
  }
  return {
    delimiter,
    decimalComma,
    headerRow: hasHeader ? first!.row : null,
    firstDataRow: dataLines[0]?.row ?? (first ? first.row + 1 : 1),
    columns,
    preview: dataLines.slice(0, PREVIEW_ROWS).map((l) => ({ row: l.row, cells: l.cells })),
    guess,
  };
}
