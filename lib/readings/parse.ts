import Papa from 'papaparse';
import { SeriesBuilder, type FieldSpec } from './builder';
import { inspectText, type CsvInspection } from './columns';
import { checkText, decodeCsvBytes } from './decode';
import { failure, VALUE_FIELDS, type ColumnSelection, type ReadingsError, type ReadingsResult } from './types';

/** Characters per parsing chunk: about 10 000 rows of a two-column log, so progress moves often. */
const CHUNK_CHARS = 256 * 1024;

export interface ParseOptions {
  /** Columns and time unit; absent → the guess of `inspectCsv`. */
  selection?: ColumnSelection;
  /** Clock time of switch-on, for a clock-stamped log (ISO 8601 or YYYY-MM-DD HH:MM:SS); absent → the first row. */
  switchOn?: string;
  /** UTC offset of the logger's clock in minutes, when only one of log and switch-on states a zone. */
  clockUtcOffsetMinutes?: number;
  /** 1-based rows to leave out (the bad rows a previous pass named). */
  dropRows?: readonly number[];
  /** Called with 0…1 as the text is parsed. */
  onProgress?: (fraction: number) => void;
  /** Row errors listed in full (all bad rows are still counted in `badRows`); default 100. */
  maxListedErrors?: number;
  /** Refuse files with more data rows than this; default 1 000 000. */
  maxRows?: number;
  /** Fewest readings accepted; default 2. */
  minReadings?: number;
}

/**
 * Runs papaparse over a string chunk by chunk, synchronously. papaparse streams strings in chunks
 * (its StringStreamer) although its typings list `chunk` for files only. Blank lines are kept so
 * that record i is line i of the file (logger files have no quoted line breaks).
 */
function parseInChunks(text: string, delimiter: string, onChunk: (data: string[][], cursor: number) => void): void {
  const config = {
    delimiter,
    skipEmptyLines: false,
    chunkSize: CHUNK_CHARS,
    chunk: (res: Papa.ParseResult<string[]>) => onChunk(res.data, res.meta.cursor),
  };
  (Papa.parse as unknown as (input: string, c: typeof config) => void)(text, config);
}

type TextResult = { ok: true; text: string } | { ok: false; error: ReadingsError };

function toText(input: string | Uint8Array): TextResult {
  return typeof input === 'string' ? checkText(input) : decodeCsvBytes(input);
}

/** Decodes and inspects a CSV (bytes or text): delimiter, header, columns and their guessed roles. */
export function inspectCsv(input: string | Uint8Array): { ok: true; inspection: CsvInspection; text: string } | { ok: false; error: ReadingsError } {
  const decoded = toText(input);
  if (!decoded.ok) return decoded;
  try {
    return { ok: true, inspection: inspectText(decoded.text), text: decoded.text };
  } catch (e) {
    return failure('no-data-rows', `The file could not be read as CSV (${e instanceof Error ? e.message : String(e)}).`);
  }
}

/** Checks a selection against the file's columns; returns the field specs or an error. */
function fieldSpecs(sel: ColumnSelection, inspection: CsvInspection): { ok: true; fields: FieldSpec[] } | { ok: false; error: ReadingsError } {
  const width = inspection.columns.length;
  const nameOf = (i: number) => inspection.columns[i]?.name ?? `column ${i + 1}`;
  const picks: [string, number][] = [['time', sel.time.column]];
  for (const f of VALUE_FIELDS) if (sel[f]) picks.push([f, sel[f]!.column]);
  for (const [what, col] of picks) {
    if (!Number.isInteger(col) || col < 0 || col >= width) {
      return failure('missing-column', `The ${what} column (column ${col + 1}) is not in the file; it has ${width} column${width === 1 ? '' : 's'}.`);
    }
  }
  if (!sel.value && !sel.watts && !(sel.volts && sel.amps)) {
    return failure('no-value-column', 'Choose a column of readings: light output (lux or relative), watts, or volts and amps.');
  }
  const fields: FieldSpec[] = [];
  for (const f of VALUE_FIELDS) {
    const pick = sel[f];
    if (!pick) continue;
    const scale = pick.scale ?? 1;
    if (!(Number.isFinite(scale) && scale > 0)) return failure('bad-selection', `The scale of the ${f} column must be a positive number.`);
    fields.push({ field: f, name: nameOf(pick.column), scale });
  }
  return { ok: true, fields };
}

/**
 * Parses a logger CSV into a series of `{ t (s since switch-on), value? | watts? | volts? | amps? }`.
 * Reads in chunks with `onProgress`; never throws: every problem comes back as a typed error with
 * row-level messages (rows are 1-based lines of the file, header included). Rows before switch-on
 * are left out and counted; rows named in `dropRows` are left out.
 */
export function parseReadings(input: string | Uint8Array, options: ParseOptions = {}): ReadingsResult {
  try {
    const inspected = inspectCsv(input);
    if (!inspected.ok) return inspected;
    const { inspection, text } = inspected;
    const guessed = inspection.guess;
    const selection = options.selection ?? (guessed.time ? (guessed as ColumnSelection) : null);
    if (!selection) {
      const names = inspection.columns.map((c) => `"${c.name}"`).join(', ');
      return failure('no-time-column', `No column looks like time (columns: ${names}). Choose the time column and its unit.`);
    }
    const specs = fieldSpecs(selection, inspection);
    if (!specs.ok) return specs;
    const timeCol = selection.time.column;
    const builder = new SeriesBuilder({
      timeUnit: selection.time.unit,
      timeName: inspection.columns[timeCol]!.name,
      fields: specs.fields,
      decimalComma: inspection.decimalComma,
      switchOn: options.switchOn,
      clockUtcOffsetMinutes: options.clockUtcOffsetMinutes,
      dropRows: options.dropRows,
      maxListedErrors: options.maxListedErrors,
      minReadings: options.minReadings,
      maxRows: options.maxRows ?? 1_000_000,
    });
    const valueCols = VALUE_FIELDS.filter((f) => selection[f]).map((f) => selection[f]!.column);
    const skipBefore = inspection.headerRow ?? inspection.firstDataRow - 1;
    let row = 0;
    const total = text.length;
    parseInChunks(text, inspection.delimiter, (data, cursor) => {
      for (const cells of data) {
        row++;
        if (row <= skipBefore) continue;
        if ((cells[timeCol] ?? '').trim() === '' && cells.every((c) => c.trim() === '')) continue;
        if ((cells[0] ?? '').trimStart().startsWith('#')) continue;
        builder.add(row, cells, timeCol, valueCols);
      }
      options.onProgress?.(Math.min(1, cursor / total));
    });
    options.onProgress?.(1);
    return builder.finish();
  } catch (e) {
    return failure('no-data-rows', `The file could not be read (${e instanceof Error ? e.message : String(e)}).`);
  }
}
