import { parseClockCell, parseElapsedCell, parseNumberCell, type ClockTime } from './cells';
import { failure, type ReadingsMeta, type ReadingsResult, type RowError, type RowErrorCode, type Sample, type TimeUnit, type ValueField } from './types';

/** One value field to read: where its cell is, what to call it in messages, and its scale. */
export interface FieldSpec {
  field: ValueField;
  name: string;
  scale: number;
}

export interface BuilderOptions {
  timeUnit: TimeUnit;
  timeName: string;
  fields: FieldSpec[];
  decimalComma: boolean;
  /** Clock time of switch-on as written (for `clock`); absent → t = 0 at the first row. */
  switchOn?: string;
  /** UTC offset of the logger's clock in minutes, needed when only one of log and switch-on has a zone. */
  clockUtcOffsetMinutes?: number;
  /** Rows (1-based) the reviewer chose to leave out. */
  dropRows?: readonly number[];
  maxListedErrors?: number;
  minReadings?: number;
  maxRows?: number;
  /** "row" for files, "reading" for typed-in entries: the word used in messages. */
  rowWord?: string;
}

const TIME_FACTOR: Record<'s' | 'min' | 'h', number> = { s: 1, min: 60, h: 3600 };

/** Trims a cell for quoting in a message. */
function quote(cell: string): string {
  const s = cell.trim();
  return `'${s.length > 40 ? `${s.slice(0, 40)}…` : s}'`;
}

function fmtT(t: number): string {
  return `${Number.isInteger(t) ? t : Number(t.toPrecision(12))} s`;
}

/**
 * Validates rows one at a time and collects the series. Shared by the CSV parser and the
 * typed-in entry, so both give the same row-level messages. Never throws for bad data.
 */
export class SeriesBuilder {
  private readonly o: BuilderOptions;
  private readonly drop: Set<number>;
  private readonly t: number[] = [];
  private readonly colArrays: number[][];
  private readonly scratch: number[];
  private readonly errors: RowError[] = [];
  private readonly badRows: number[] = [];
  private readonly dropped: number[] = [];
  private beforeSwitchOn = 0;
  private dataRows = 0;
  private lastT: number | null = null;
  private lastRow = 0;
  private zoned: boolean | null = null;
  private origin: number | null = null;
  private originNote: string | null = null;
  private switchOnEpochMs: number | null = null;
  private fatal: { code: 'bad-switch-on' | 'time-zone-needed' | 'too-many-rows'; message: string } | null = null;

  constructor(options: BuilderOptions) {
    this.o = options;
    this.drop = new Set(options.dropRows ?? []);
    this.colArrays = options.fields.map(() => []);
    this.scratch = options.fields.map(() => 0);
  }

  private get word(): string {
    return this.o.rowWord ?? 'row';
  }

  private fail(row: number, code: RowErrorCode, message: string): void {
    this.badRows.push(row);
    if (this.errors.length < (this.o.maxListedErrors ?? 100)) this.errors.push({ row, code, message });
  }

  /** Seconds since switch-on for a clock cell, or an error message. */
  private clockT(row: number, c: ClockTime, cell: string): number | null {
    const w = this.word;
    if (this.zoned === null) {
      this.zoned = c.zoned;
      if (!this.resolveOrigin(c, cell)) return null;
    } else if (this.zoned !== c.zoned) {
      this.fail(row, 'mixed-time-zones', `${w} ${row}: ${quote(cell)} ${c.zoned ? 'has a time zone and earlier rows do not' : 'has no time zone and earlier rows do'}`);
      return null;
    }
    return c.epochS - this.origin!;
  }

  /** Sets t = 0 from the switch-on time (or the first row); false after a fatal error. */
  private resolveOrigin(first: ClockTime, firstCell: string): boolean {
    const offsetS = this.o.clockUtcOffsetMinutes === undefined ? null : this.o.clockUtcOffsetMinutes * 60;
    if (this.o.switchOn === undefined || this.o.switchOn.trim() === '') {
      this.origin = first.epochS;
      this.originNote = `No switch-on time was given, so time counts from the first reading (${firstCell.trim()}).`;
      this.switchOnEpochMs = first.zoned ? first.epochS * 1000 : offsetS === null ? null : (first.epochS - offsetS) * 1000;
      return true;
    }
    const s = parseClockCell(this.o.switchOn);
    if (!s) {
      this.fatal = { code: 'bad-switch-on', message: `The switch-on time ${quote(this.o.switchOn)} is not a date and time (YYYY-MM-DD HH:MM:SS or ISO 8601).` };
      return false;
    }
    if (s.zoned === first.zoned) {
      this.origin = s.epochS;
      this.switchOnEpochMs = s.zoned ? s.epochS * 1000 : offsetS === null ? null : (s.epochS - offsetS) * 1000;
      return true;
    }
    if (offsetS === null) {
      this.fatal = {
        code: 'time-zone-needed',
        message: first.zoned
          ? 'The log’s times carry a time zone but the switch-on time does not: add the zone to the switch-on time, or give the logger clock’s UTC offset.'
          : 'The switch-on time carries a time zone but the log’s times do not: give the logger clock’s UTC offset, or enter the switch-on time as the logger’s clock showed it.',
      };
      return false;
    }
    // Bring the switch-on time into the log's frame: naive = zoned + offset.
    this.origin = first.zoned ? s.epochS - offsetS : s.epochS + offsetS;
    this.switchOnEpochMs = (s.zoned ? s.epochS : s.epochS - offsetS) * 1000;
    return true;
  }

  private timeOf(row: number, cell: string | undefined): number | null {
    const w = this.word;
    const name = this.o.timeName;
    if (cell === undefined) {
      this.fail(row, 'missing-cell', `${w} ${row} has no ${name} cell`);
      return null;
    }
    if (cell.trim() === '') {
      this.fail(row, 'empty-cell', `${w} ${row}: the ${name} cell is empty`);
      return null;
    }
    const unit = this.o.timeUnit;
    if (unit === 'clock') {
      const c = parseClockCell(cell);
      if (!c) {
        this.fail(row, 'bad-time', `${w} ${row}: ${quote(cell)} is not a date and time (YYYY-MM-DD HH:MM:SS or ISO 8601)`);
        return null;
      }
      return this.clockT(row, c, cell);
    }
    if (unit === 'hms') {
      const s = parseElapsedCell(cell);
      if (s === null) this.fail(row, 'bad-time', `${w} ${row}: ${quote(cell)} is not an elapsed time (h:mm or h:mm:ss)`);
      return s;
    }
    const n = parseNumberCell(cell, this.o.decimalComma);
    if (n === null) {
      this.fail(row, 'not-a-number', `${w} ${row}: ${quote(cell)} is not a number (${name})`);
      return null;
    }
    return n * TIME_FACTOR[unit];
  }

  /**
   * Adds one data row: its 1-based number and its cells; `timeIndex` and `valueIndexes` (one per
   * field, in `fields` order) say which cells to read. Written as plain loops: it runs per row.
   */
  add(row: number, cells: readonly (string | undefined)[], timeIndex: number, valueIndexes: readonly number[]): void {
    if (this.fatal) return;
    this.dataRows++;
    if (this.o.maxRows !== undefined && this.dataRows > this.o.maxRows) {
      this.fatal = { code: 'too-many-rows', message: `The file has more than ${this.o.maxRows} data rows; split it or log less often.` };
      return;
    }
    if (this.drop.size > 0 && this.drop.has(row)) {
      this.dropped.push(row);
      return;
    }
    const t = this.timeOf(row, cells[timeIndex]);
    if (this.fatal || t === null) return;
    const w = this.word;
    if (this.lastT !== null && t <= this.lastT) {
      if (t === this.lastT) this.fail(row, 'time-repeated', `time repeats at ${w} ${row} (${fmtT(t)}, as at ${w} ${this.lastRow})`);
      else this.fail(row, 'time-backwards', `time goes backwards at ${w} ${row} (${fmtT(t)} comes after ${fmtT(this.lastT)} at ${w} ${this.lastRow})`);
      return;
    }
    if (t < 0) {
      // Before switch-on: left out and counted, values not checked.
      this.beforeSwitchOn++;
      this.lastT = t;
      this.lastRow = row;
      return;
    }
    const fields = this.o.fields;
    const values = this.scratch;
    let ok = true;
    for (let i = 0; i < fields.length; i++) {
      const f = fields[i]!;
      const cell = cells[valueIndexes[i]!];
      if (cell === undefined) {
        this.fail(row, 'missing-cell', `${w} ${row} has no ${f.name} cell`);
        ok = false;
        continue;
      }
      const n = parseNumberCell(cell, this.o.decimalComma);
      if (n === null) {
        if (cell.trim() === '') this.fail(row, 'empty-cell', `${w} ${row}: the ${f.name} cell is empty`);
        else this.fail(row, 'not-a-number', `${w} ${row}: ${quote(cell)} is not a number (${f.name})`);
        ok = false;
      } else if (n < 0) {
        this.fail(row, 'negative', `${w} ${row}: ${quote(cell)} is negative (${f.name}); readings must be zero or more`);
        ok = false;
      } else values[i] = n * f.scale;
    }
    if (!ok) return;
    this.lastT = t;
    this.lastRow = row;
    this.t.push(t);
    for (let i = 0; i < fields.length; i++) this.colArrays[i]!.push(values[i]!);
  }

  /** The series and what was left out, or every problem found. */
  finish(): ReadingsResult {
    const w = this.word;
    if (this.fatal) return failure(this.fatal.code, this.fatal.message);
    if (this.badRows.length > 0) {
      const n = this.badRows.length;
      const firstMsg = this.errors[0]!.message;
      let message =
        n === 1
          ? `${firstMsg[0]!.toUpperCase()}${firstMsg.slice(1)}. Correct the file, or leave this ${w} out.`
          : `${n} ${w}s cannot be used; the first: ${firstMsg}. Correct the file, or leave these ${w}s out.`;
      if (n > this.dataRows / 2) message += ' More than half the rows fail: check the column and time-unit choice.';
      return failure('bad-rows', message, this.errors, this.badRows);
    }
    const min = this.o.minReadings ?? 2;
    if (this.t.length < min) {
      if (this.dataRows === 0) return failure('no-data-rows', `There are no ${w}s with readings${this.o.rowWord ? '' : ' below the header'}.`);
      const left = this.t.length;
      return failure(
        'too-few-readings',
        `${left === 1 ? 'Only 1 reading is' : `${left} readings are`} left${this.beforeSwitchOn ? ' after switch-on' : ''}; at least ${min} are needed.`,
      );
    }
    const samples: Sample[] = new Array(this.t.length);
    const fields = this.o.fields.map((f) => f.field);
    const arrays = this.colArrays;
    for (let i = 0; i < this.t.length; i++) {
      const s: Sample = { t: this.t[i]! };
      for (let k = 0; k < fields.length; k++) s[fields[k]!] = arrays[k]![i]!;
      samples[i] = s;
    }
    const notes: string[] = [];
    if (this.originNote) notes.push(this.originNote);
    if (this.beforeSwitchOn > 0) {
      notes.push(`${this.beforeSwitchOn} ${this.beforeSwitchOn === 1 ? `${w} was` : `${w}s were`} before switch-on and left out.`);
    }
    if (this.dropped.length > 0) {
      const list = this.dropped.length <= 10 ? this.dropped.join(', ') : `${this.dropped.slice(0, 10).join(', ')} and ${this.dropped.length - 10} more`;
      notes.push(`${this.dropped.length === 1 ? `${w[0]!.toUpperCase()}${w.slice(1)}` : `${w[0]!.toUpperCase()}${w.slice(1)}s`} ${list} left out as the reviewer chose.`);
    }
    const meta: ReadingsMeta = {
      fields,
      timeUnit: this.o.timeUnit,
      dataRows: this.dataRows,
      droppedBeforeSwitchOn: this.beforeSwitchOn,
      droppedRows: this.dropped,
      switchOnEpochMs: this.switchOnEpochMs,
      durationS: this.t[this.t.length - 1]! - this.t[0]!,
      notes,
    };
    return { ok: true, samples, meta };
  }
}

