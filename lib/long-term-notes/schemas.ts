import { z } from 'zod';
import { LONG_TERM_NOTE_KINDS } from './kinds';

/*
 * One zod schema per long-term-note input, shared by the form (components/long-term-notes), the data
 * layer (db/long-term-notes.ts) and the API routes. Strict objects: unknown keys (an author id, a
 * status) are refused, never silently dropped.
 */

export const MAX_MONTHS_IN_SERVICE = 600;
export const MAX_NOTE_BODY = 8000;
export const EARLIEST_NOTE_DATE = '1980-01-01';

/** True for a real calendar day written as YYYY-MM-DD (2026-02-30 is not one). */
export function isCalendarDate(text: string): boolean {
  if (!/^\d{4}-\d{2}-\d{2}$/.test(text)) return false;
  const d = new Date(`${text}T00:00:00Z`);
  return !Number.isNaN(d.getTime()) && d.toISOString().slice(0, 10) === text;
}

/** The latest day a note may carry: tomorrow in UTC, so a reviewer ahead of UTC can date a note "today". */
export function latestNoteDate(now: Date = new Date()): string {
  return new Date(now.getTime() + 24 * 3600 * 1000).toISOString().slice(0, 10);
}

export const notedOnSchema = z
  .string('Give the date of the note, e.g. 2026-11-20.')
  .trim()
  .regex(/^\d{4}-\d{2}-\d{2}$/, 'Give the date as YYYY-MM-DD, e.g. 2026-11-20.')
  .refine(isCalendarDate, 'This is not a real calendar date.')
  .refine((s) => s >= EARLIEST_NOTE_DATE, `Give a date from ${EARLIEST_NOTE_DATE} on.`)
  .refine((s) => s <= latestNoteDate(), 'This date is in the future: a long-term note reports what has already happened.');

/** A long-term note as its author writes it. */
export const longTermNoteInputSchema = z.strictObject({
  notedOn: notedOnSchema,
  monthsInService: z
    .number('Give the months in service as a whole number, e.g. 4.')
    .int('Give whole months, e.g. 4.')
    .min(0, 'Months in service cannot be negative.')
    .max(MAX_MONTHS_IN_SERVICE, `At most ${MAX_MONTHS_IN_SERVICE} months (50 years).`),
  kind: z.enum(LONG_TERM_NOTE_KINDS, 'Choose what the note is about.'),
  title: z.string('Give a short title.').trim().min(3, 'Give a short title (at least 3 characters).').max(120, 'At most 120 characters.'),
  body: z
    .string('Write the note.')
    .trim()
    .min(10, 'Write at least a sentence (10 characters or more).')
    .max(MAX_NOTE_BODY, `At most ${MAX_NOTE_BODY} characters.`),
});
export type LongTermNoteInput = z.infer<typeof longTermNoteInputSchema>;
export type LongTermNoteFormValues = z.input<typeof longTermNoteInputSchema>;

/** The same workflow moves as a field test: the author submits or withdraws, an editor approves or sends back. */
export const LONG_TERM_NOTE_ACTIONS = ['submit', 'withdraw', 'request-changes', 'approve'] as const;
export type LongTermNoteAction = (typeof LONG_TERM_NOTE_ACTIONS)[number];

export const longTermNoteTransitionSchema = z.strictObject({
  action: z.enum(LONG_TERM_NOTE_ACTIONS, 'Unknown action: submit, withdraw, request-changes or approve.'),
  comment: z.string().trim().max(4000, 'At most 4000 characters.').optional().default(''),
});
export type LongTermNoteTransition = z.infer<typeof longTermNoteTransitionSchema>;
