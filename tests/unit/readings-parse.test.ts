import { describe, expect, it } from 'vitest';
import { readFileSync } from 'node:fs';
import { fileURLToPath } from 'node:url';
import { inspectCsv, parseReadings, typedReadings, decodeCsvBytes, parseClockCell, type ReadingsResult } from '@/lib/readings';

const fixture = (name: string) => new Uint8Array(readFileSync(fileURLToPath(new URL(`../fixtures/readings/${name}`, import.meta.url))));

function ok(r: ReadingsResult) {
  if (!r.ok) throw new Error(`expected ok, got ${r.error.code}: ${r.error.message}`);
  return r;
}
function err(r: ReadingsResult) {
  if (r.ok) throw new Error('expected an error');
  return r.error;
}

describe('inspectCsv', () => {
  it('finds header, preamble, delimiter and roles of the lantern log', () => {
    const r = inspectCsv(fixture('lantern-fade.csv'));
    if (!r.ok) throw new Error(r.error.message);
    const i = r.inspection;
    expect(i.delimiter).toBe(',');
    expect(i.headerRow).toBe(2); // line 1 is a # comment
    expect(i.firstDataRow).toBe(3);
    expect(i.columns.map((c) => [c.name, c.role, c.timeUnit ?? c.unit])).toEqual([
      ['elapsed_s', 'time', 's'],
      ['lux', 'value', 'lx'],
      ['temp_C', 'unknown', undefined],
    ]);
    expect(i.guess).toEqual({ time: { column: 0, unit: 's' }, value: { column: 1 } });
    expect(i.preview[0]).toEqual({ row: 3, cells: ['0', '400', '19.5'] });
  });

  it('reads minutes, volts and milliamps (scale 0.001) from the bank log', () => {
    const r = inspectCsv(fixture('bank-discharge.csv'));
    if (!r.ok) throw new Error(r.error.message);
    expect(r.inspection.guess).toEqual({ time: { column: 0, unit: 'min' }, volts: { column: 1 }, amps: { column: 2, scale: 0.001 } });
  });

  it('reads semicolons, decimal commas and clock timestamps from the panel log', () => {
    const r = inspectCsv(fixture('panel-cloud.csv'));
    if (!r.ok) throw new Error(r.error.message);
    expect(r.inspection.delimiter).toBe(';');
    expect(r.inspection.decimalComma).toBe(true);
    expect(r.inspection.guess).toEqual({ time: { column: 0, unit: 'clock' }, watts: { column: 1 } });
  });

  it('detects tabs and a file without a header', () => {
    const r = inspectCsv('0\t5.0\n60\t5.1\n');
    if (!r.ok) throw new Error(r.error.message);
    expect(r.inspection.delimiter).toBe('\t');
    expect(r.inspection.headerRow).toBeNull();
    expect(r.inspection.columns.map((c) => c.name)).toEqual(['column 1', 'column 2']);
  });
});

describe('parseReadings: fixtures with answers exact by hand', () => {
  it('lantern: every row, t in s, values as logged', () => {
    const r = ok(parseReadings(fixture('lantern-fade.csv')));
    expect(r.samples).toHaveLength(38);
    expect(r.samples.slice(0, 5)).toEqual([
      { t: 0, value: 400 },
      { t: 30, value: 400 },
      { t: 60, value: 400 },
      { t: 120, value: 400 },
      { t: 180, value: 300 },
    ]);
    expect(r.meta).toMatchObject({ fields: ['value'], timeUnit: 's', dataRows: 38, droppedBeforeSwitchOn: 0, durationS: 40200 });
  });

  it('bank: minutes → s and mA → A', () => {
    const r = ok(parseReadings(fixture('bank-discharge.csv')));
    expect(r.samples[1]).toEqual({ t: 720, volts: 5.08, amps: 2 });
    expect(r.samples.at(-1)).toEqual({ t: 7260, volts: 4.9, amps: 0 });
    expect(r.meta.fields).toEqual(['volts', 'amps']);
  });

  it('panel: rows before the switch-on time are left out and counted', () => {
    const r = ok(parseReadings(fixture('panel-cloud.csv'), { switchOn: '2026-09-19 11:00:00' }));
    expect(r.meta.droppedBeforeSwitchOn).toBe(3);
    expect(r.meta.notes).toContain('3 rows were before switch-on and left out.');
    expect(r.samples[0]).toEqual({ t: 0, watts: 40 });
    expect(r.samples[11]).toEqual({ t: 660, watts: 25 }); // 11:11:00, decimal comma "25,0"
    expect(r.samples).toHaveLength(31);
    // Without a switch-on time, t = 0 is the first row (10:57:00) and nothing is dropped.
    const first = ok(parseReadings(fixture('panel-cloud.csv')));
    expect(first.samples[3]).toEqual({ t: 180, watts: 40 });
    expect(first.meta.notes[0]).toMatch(/time counts from the first reading \(2026-09-19 10:57:00\)/);
  });

  it('clock times with zones: switch-on in another zone, and a naive log with a stated offset', () => {
    const zoned = ok(parseReadings('time,W\n2026-09-19T09:00:00Z,5\n2026-09-19T09:00:30Z,5\n', { switchOn: '2026-09-19T10:59:50+02:00' }));
    expect(zoned.samples.map((s) => s.t)).toEqual([10, 40]);
    expect(zoned.meta.switchOnEpochMs).toBe(Date.UTC(2026, 8, 19, 8, 59, 50));
    const naive = err(parseReadings('time,W\n2026-09-19 11:00:00,5\n2026-09-19 11:00:30,5\n', { switchOn: '2026-09-19T09:00:00Z' }));
    expect(naive.code).toBe('time-zone-needed');
    const offset = ok(parseReadings('time,W\n2026-09-19 11:00:00,5\n2026-09-19 11:00:30,5\n', { switchOn: '2026-09-19T09:00:00Z', clockUtcOffsetMinutes: 120 }));
    expect(offset.samples.map((s) => s.t)).toEqual([0, 30]);
  });

  it('leaves out the named bad rows when asked', () => {
    const first = err(parseReadings(fixture('text-in-numbers.csv')));
    expect(first.badRows).toEqual([4]);
    const second = ok(parseReadings(fixture('text-in-numbers.csv'), { dropRows: first.badRows }));
    expect(second.samples.map((s) => s.t)).toEqual([0, 30, 90]);
    expect(second.meta.droppedRows).toEqual([4]);
    expect(second.meta.notes).toContain('Row 4 left out as the reviewer chose.');
  });
});

describe('parseReadings: malformed files give row-level messages', () => {
  it('text in numbers', () => {
    const e = err(parseReadings(fixture('text-in-numbers.csv')));
    expect(e.code).toBe('bad-rows');
    expect(e.rowErrors).toEqual([{ row: 4, code: 'not-a-number', message: "row 4: 'n/a' is not a number (lux)" }]);
    expect(e.message).toBe("Row 4: 'n/a' is not a number (lux). Correct the file, or leave this row out.");
  });

  it('unsorted times', () => {
    const e = err(parseReadings(fixture('unsorted-times.csv')));
    expect(e.rowErrors.map((r) => r.message)).toEqual(['time goes backwards at row 5 (50 s comes after 60 s at row 4)']);
  });

  it('repeated times, empty cells, negative values and short rows', () => {
    const e = err(parseReadings('t,W\n0,5\n0,5\n10,\n20,-1\n30\n40,5\n'));
    expect(e.rowErrors.map((r) => r.message)).toEqual([
      'time repeats at row 3 (0 s, as at row 2)',
      'row 4: the W cell is empty',
      "row 5: '-1' is negative (W); readings must be zero or more",
      'row 6 has no W cell',
    ]);
    expect(e.message).toBe(
      '4 rows cannot be used; the first: time repeats at row 3 (0 s, as at row 2). Correct the file, or leave these rows out. More than half the rows fail: check the column and time-unit choice.',
    );
  });

  it('a missing value column, a column outside the file, no time column', () => {
    expect(err(parseReadings(fixture('missing-column.csv'))).message).toBe(
      'Choose a column of readings: light output (lux or relative), watts, or volts and amps.',
    );
    expect(err(parseReadings(fixture('missing-column.csv'), { selection: { time: { column: 0, unit: 's' }, value: { column: 4 } } })).message).toBe(
      'The value column (column 5) is not in the file; it has 2 columns.',
    );
    const e = err(parseReadings(fixture('no-time-column.csv')));
    expect(e.code).toBe('no-time-column');
    expect(e.message).toBe('No column looks like time (columns: "lux", "temp_C"). Choose the time column and its unit.');
  });

  it('empty file, binary renamed .csv, invalid UTF-8', () => {
    expect(err(parseReadings(fixture('empty.csv')))).toMatchObject({ code: 'empty-file', message: 'The file is empty.' });
    expect(err(parseReadings('\n\n'))).toMatchObject({ code: 'empty-file' });
    expect(err(parseReadings(fixture('binary-renamed.csv')))).toMatchObject({
      code: 'binary-file',
      message: 'This file is not a CSV text file: it looks like a PNG image. Export the logger data as CSV (comma, semicolon or tab separated text) and try again.',
    });
    expect(err(parseReadings(new Uint8Array([0x74, 0x2c, 0x57, 0x0a, 0x30, 0x00, 0x35])))).toMatchObject({ code: 'binary-file', message: expect.stringContaining('NUL byte (at byte 6)') });
    expect(err(parseReadings(new Uint8Array([0x74, 0x2c, 0x57, 0x0a, 0x30, 0x2c, 0xff, 0x0a])))).toMatchObject({ code: 'not-utf8', message: expect.stringContaining('first bad byte at 7') });
  });

  it('a header and no data, and a single reading', () => {
    expect(err(parseReadings('time_s,lux\n')).code).toBe('no-data-rows');
    expect(err(parseReadings('time_s,lux\n0,5\n')).message).toBe('Only 1 reading is left; at least 2 are needed.');
  });

  it('UTF-8 and UTF-16 byte-order marks are accepted', () => {
    const utf8 = new Uint8Array([0xef, 0xbb, 0xbf, ...new TextEncoder().encode('t_s,W\n0,1\n1,2\n')]);
    expect(ok(parseReadings(utf8)).samples).toHaveLength(2);
    const text = 't_s\tW\n0\t1\n1\t2\n';
    const u16 = new Uint8Array(2 + text.length * 2);
    u16.set([0xff, 0xfe]);
    for (let i = 0; i < text.length; i++) u16[2 + 2 * i] = text.charCodeAt(i);
    expect(ok(parseReadings(u16)).samples).toEqual([{ t: 0, watts: 1 }, { t: 1, watts: 2 }]);
  });

  it('lists at most maxListedErrors messages but names every bad row', () => {
    const text = 'time_s,lux\n' + Array.from({ length: 300 }, (_, i) => `${i},x`).join('\n');
    const e = err(parseReadings(text, { maxListedErrors: 5 }));
    expect(e.rowErrors).toHaveLength(5);
    expect(e.badRows).toHaveLength(300);
    expect(e.message).toMatch(/More than half the rows fail: check the column and time-unit choice\.$/);
  });
});

describe('typedReadings', () => {
  it('h:mm times and the same validation as a CSV', () => {
    const r = ok(typedReadings([{ time: '0:00', watts: '5' }, { time: '1:00', watts: '5' }, { time: '', watts: '' }], { timeUnit: 'hms', fields: ['watts'] }));
    expect(r.samples).toEqual([{ t: 0, watts: 5 }, { t: 3600, watts: 5 }]);
    // A row that fails is not a reference for the next time (as if left out).
    const entries = [{ time: '0', value: '300' }, { time: '30', value: 'abc' }, { time: '20', value: '280' }, { time: '10', value: '270' }];
    const e = err(typedReadings(entries, { timeUnit: 's', fields: ['value'] }));
    expect(e.rowErrors.map((x) => x.message)).toEqual(["reading 2: 'abc' is not a number (output)", 'time goes backwards at reading 4 (10 s comes after 20 s at reading 3)']);
  });

  it('decimal commas and minutes', () => {
    expect(ok(typedReadings([{ time: '0', value: '12,5' }, { time: '1,5', value: '12' }], { timeUnit: 'min', fields: ['value'] })).samples).toEqual([
      { t: 0, value: 12.5 },
      { t: 90, value: 12 },
    ]);
  });
});

describe('cells', () => {
  it('clock timestamps: ISO 8601 and "YYYY-MM-DD HH:MM:SS", invalid dates refused', () => {
    // 2026-09-19 is 20 715 days after 1970-01-01 (exact by hand: 56 years incl. 14 leap days = 20 454, + 261 days to 19 Sep).
    expect(parseClockCell('2026-09-19 00:00:00')).toEqual({ epochS: 20715 * 86400, zoned: false });
    expect(parseClockCell('2026-09-19T01:30:00+01:30')).toEqual({ epochS: 20715 * 86400, zoned: true });
    expect(parseClockCell('2026-09-19T00:00:00.250Z')).toEqual({ epochS: 20715 * 86400 + 0.25, zoned: true });
    expect(parseClockCell('2026-02-29 10:00:00')).toBeNull();
    expect(parseClockCell('2026-09-19 24:00:00')).toBeNull();
    expect(parseClockCell('19/09/2026 10:00')).toBeNull();
  });

  it('decodeCsvBytes names a zip workbook', () => {
    const r = decodeCsvBytes(new Uint8Array([0x50, 0x4b, 0x03, 0x04, 0x14, 0x00]));
    expect(r.ok).toBe(false);
    if (!r.ok) expect(r.error.message).toMatch(/spreadsheet workbook/);
  });
});
