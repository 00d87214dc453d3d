import { SeriesBuilder } from './builder';
import { VALUE_FIELDS, type ReadingsResult, type TimeUnit, type ValueField } from './types';

/** One typed-in reading as entered in a form: the time and the value cells, as text. */
export interface TypedReading {
  time: string;
  value?: string;
  watts?: string;
  volts?: string;
  amps?: string;
}

export interface TypedOptions {
  /** How the times are written: s, min, h, h:mm[:ss] (`hms`) or clock times (`clock`). */
  timeUnit: TimeUnit;
  /** Which values each reading has: ['value'], ['watts'] or ['volts', 'amps'] (or more). */
  fields: readonly ValueField[];
  /** Clock time of switch-on when `timeUnit` is `clock`; absent → the first reading. */
  switchOn?: string;
  clockUtcOffsetMinutes?: number;
  /** Fewest readings accepted; default 2. */
  minReadings?: number;
}

/** Names of the value fields in messages about typed readings. */
export const FIELD_NAMES: Record<ValueField, string> = { value: 'output', watts: 'W', volts: 'V', amps: 'A' };

/**
 * Validates a handful of typed-in readings with the same rules and messages as a CSV
 * ("reading 3: 'abc' is not a number (W)", "time goes backwards at reading 4 …").
 * Entries whose cells are all blank are skipped (empty form rows). Never throws.
 */
export function typedReadings(entries: readonly TypedReading[], options: TypedOptions): ReadingsResult {
  const fields = VALUE_FIELDS.filter((f) => options.fields.includes(f));
  const builder = new SeriesBuilder({
    timeUnit: options.timeUnit,
    timeName: 'time',
    fields: fields.map((f) => ({ field: f, name: FIELD_NAMES[f], scale: 1 })),
    decimalComma: true,
    switchOn: options.switchOn,
    clockUtcOffsetMinutes: options.clockUtcOffsetMinutes,
    minReadings: options.minReadings,
    rowWord: 'reading',
  });
  const indexes = fields.map((_, k) => k + 1);
  entries.forEach((e, i) => {
    const cells = fields.map((f) => e[f]);
    if ((e.time ?? '').trim() === '' && cells.every((c) => (c ?? '').trim() === '')) return;
    builder.add(i + 1, [e.time ?? '', ...cells.map((c) => c ?? '')], 0, indexes);
  });
  return builder.finish();
}
