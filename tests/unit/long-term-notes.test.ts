import { describe, expect, it } from 'vitest';
import { LONG_TERM_NOTE_KINDS as SCHEMA_KINDS } from '@/db/schema';
import { LONG_TERM_NOTE_KIND_INFO, LONG_TERM_NOTE_KINDS, longTermNoteKindLabel } from '@/lib/long-term-notes/kinds';
import { wholeMonthsBetween } from '@/lib/long-term-notes/months';
import { monthsInServiceText, notedOnText } from '@/lib/long-term-notes/render';
import { isCalendarDate, latestNoteDate, longTermNoteInputSchema } from '@/lib/long-term-notes/schemas';

describe('long-term note kinds', () => {
  it('the form list equals the column enum, and every kind has a text label', () => {
    expect([...LONG_TERM_NOTE_KINDS]).toEqual([...SCHEMA_KINDS]);
    for (const k of LONG_TERM_NOTE_KINDS) expect(LONG_TERM_NOTE_KIND_INFO[k].label).toMatch(/\w/);
    expect(longTermNoteKindLabel('repair')).toBe('Repair');
    expect(longTermNoteKindLabel('unknown-kind')).toBe('unknown-kind');
  });
});

describe('dates and months', () => {
  it('isCalendarDate accepts real days only (Gregorian calendar: 2028 is a leap year, 2026 and 2100 are not)', () => {
    expect(isCalendarDate('2026-11-20')).toBe(true);
    expect(isCalendarDate('2028-02-29')).toBe(true);
    expect(isCalendarDate('2026-02-29')).toBe(false);
    expect(isCalendarDate('2100-02-29')).toBe(false);
    expect(isCalendarDate('2026-04-31')).toBe(false);
    expect(isCalendarDate('2026-1-5')).toBe(false);
    expect(isCalendarDate('2026-11-20T10:00')).toBe(false);
  });

  it('latestNoteDate is the next UTC day (a reviewer east of UTC may date a note today)', () => {
    expect(latestNoteDate(new Date('2026-12-02T09:00:00Z'))).toBe('2026-12-03');
    expect(latestNoteDate(new Date('2026-12-31T23:30:00Z'))).toBe('2027-01-01');
  });

  it('wholeMonthsBetween counts completed calendar months (worked by hand)', () => {
    expect(wholeMonthsBetween('2026-08-14', '2026-11-13')).toBe(2); // Aug 14 → Nov 13: two full months and 30 days
    expect(wholeMonthsBetween('2026-08-14', '2026-11-14')).toBe(3);
    expect(wholeMonthsBetween('2025-12-31', '2026-01-30')).toBe(0);
    expect(wholeMonthsBetween('2025-11-02', '2026-12-02')).toBe(13);
    expect(wholeMonthsBetween('2026-12-02', '2026-08-01')).toBe(0); // earlier: none, never negative
    expect(wholeMonthsBetween('not a date', '2026-08-01')).toBe(0);
  });

  it('words for dates and months', () => {
    expect(notedOnText('2026-11-20')).toBe('20 November 2026');
    expect(monthsInServiceText(0)).toBe('under a month in service');
    expect(monthsInServiceText(1)).toBe('1 month in service');
    expect(monthsInServiceText(4)).toBe('4 months in service');
  });
});

describe('longTermNoteInputSchema', () => {
  const ok = { notedOn: '2026-11-20', monthsInService: 3, kind: 'wear', title: 'Port wore loose', body: 'The USB-C port wobbles now.' };
  it('accepts a note and trims text', () => {
    expect(longTermNoteInputSchema.parse({ ...ok, title: '  Port wore loose  ' }).title).toBe('Port wore loose');
  });
  it('refuses unknown keys instead of dropping them (mass assignment, security-tests.md IV-02)', () => {
    const r = longTermNoteInputSchema.safeParse({ ...ok, gearItemId: 'someone-elses' });
    expect(r.success).toBe(false);
  });
});
