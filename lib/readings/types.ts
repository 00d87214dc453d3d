/**
 * Types shared by the readings parser, the typed-in entry, the storage encoding and the worker.
 * A series is a list of samples; `t` is in seconds since switch-on (t = 0).
 */

/** The value fields a sample can carry, in canonical units (`value` is lux or relative output). */
export const VALUE_FIELDS = ['value', 'watts', 'volts', 'amps'] as const;
export type ValueField = (typeof VALUE_FIELDS)[number];

/** One reading: `t` in s since switch-on; `value` light output (lux or relative), `watts` W, `volts` V, `amps` A. */
export interface Sample {
  t: number;
  value?: number;
  watts?: number;
  volts?: number;
  amps?: number;
}

/** How a time column is written: seconds, minutes or hours since switch-on, elapsed h:mm[:ss], or clock timestamps. */
export const TIME_UNITS = ['s', 'min', 'h', 'hms', 'clock'] as const;
export type TimeUnit = (typeof TIME_UNITS)[number];

/** What a column seems to hold. */
export type ColumnRole = 'time' | ValueField | 'unknown';

/** A column picked for a value field: its 0-based index and the factor to canonical units (0.001 for mA, mV, mW). */
export interface ValuePick {
  column: number;
  scale?: number;
}

/** The user's choice of columns (0-based indices). At least `value`, `watts`, or `volts` and `amps`. */
export interface ColumnSelection {
  time: { column: number; unit: TimeUnit };
  value?: ValuePick;
  watts?: ValuePick;
  volts?: ValuePick;
  amps?: ValuePick;
}

/** A problem with one row. `row` is 1-based: the line of the file as a spreadsheet numbers it, header included. */
export interface RowError {
  row: number;
  code: RowErrorCode;
  message: string;
}

export type RowErrorCode =
  | 'not-a-number'
  | 'empty-cell'
  | 'missing-cell'
  | 'negative'
  | 'bad-time'
  | 'time-backwards'
  | 'time-repeated'
  | 'mixed-time-zones';

/** Problems with the file or the request as a whole. */
export type ReadingsErrorCode =
  | 'empty-file'
  | 'binary-file'
  | 'not-utf8'
  | 'no-data-rows'
  | 'no-time-column'
  | 'no-value-column'
  | 'missing-column'
  | 'bad-selection'
  | 'bad-switch-on'
  | 'time-zone-needed'
  | 'bad-rows'
  | 'too-few-readings'
  | 'too-many-rows';

export interface ReadingsError {
  code: ReadingsErrorCode;
  /** A sentence a reviewer can act on. */
  message: string;
  /** Row-level problems in row order; at most `maxListedErrors` of them (see `badRows` for all). */
  rowErrors: RowError[];
  /** Every row with a problem (1-based), for "leave out these rows". */
  badRows: number[];
}

/** What the parser did, for the note beside the chart and for storage. */
export interface ReadingsMeta {
  /** Which value fields each sample carries. */
  fields: ValueField[];
  timeUnit: TimeUnit;
  /** Data rows read (blank and # comment lines not counted). */
  dataRows: number;
  /** Rows left out because they were before switch-on (t < 0). */
  droppedBeforeSwitchOn: number;
  /** Rows left out because the reviewer asked to (1-based). */
  droppedRows: number[];
  /** Switch-on as epoch ms when the log has zoned clock times or an offset was given; null otherwise. */
  switchOnEpochMs: number | null;
  /** Seconds from the first to the last sample. */
  durationS: number;
  /** Plain sentences about what was left out or assumed. */
  notes: string[];
}

export type ReadingsResult =
  | { ok: true; samples: Sample[]; meta: ReadingsMeta }
  | { ok: false; error: ReadingsError };

export function failure(code: ReadingsErrorCode, message: string, rowErrors: RowError[] = [], badRows: number[] = []): { ok: false; error: ReadingsError } {
  return { ok: false, error: { code, message, rowErrors, badRows } };
}
