import { z } from 'zod';
import { isSpecKey } from '@/lib/measure';
import { columnSelectionSchema, readingsParseRequestSchema, typedReadingsSchema } from '@/lib/readings/schemas';
import { FIELD_TEST_KINDS, KINDS, SKIES, type FieldTestKind } from './kinds';
import { PORT_OUTPUT_KEYS } from './port-output';

/*
 * One zod schema per field-test input, shared by the logbook forms, the data layer and the API routes.
 */

/** "51.5, -0.12", "N 51° 30'", "geo:" … — a place label names a place; it never carries a position. */
const COORDINATES = /(-?\d{1,3}[.,]\d{3,}\s*[,;/ ]\s*-?\d{1,3}[.,]\d{3,})|(\d{1,3}\s*°)|(\bgeo:)|(\b[NS]\s*\d{1,2}[.,]\d+.*[EW]\s*\d{1,3}[.,]\d+)/i;

/** Date and time of the test: ISO 8601 or the form's `YYYY-MM-DDTHH:MM`; a time without a zone is taken as UTC. */
export const testDateTimeSchema = z
  .string()
  .trim()
  .regex(/^\d{4}-\d{2}-\d{2}[T ]\d{2}:\d{2}(:\d{2}(\.\d{1,3})?)?(Z|[+-]\d{2}:\d{2})?$/, 'Give a date and time, e.g. 2026-09-19 11:00.')
  .refine((s) => !Number.isNaN(parseTestDateTime(s).getTime()), 'This is not a real date and time.');

export function parseTestDateTime(text: string): Date {
  const s = text.trim().replace(' ', 'T');
  return new Date(/(Z|[+-]\d{2}:\d{2})$/.test(s) ? s : `${s}Z`);
}

/** The form's `YYYY-MM-DDTHH:MM` for a stored time (UTC, as it was entered). */
export function toDateTimeInput(d: Date): string {
  return d.toISOString().slice(0, 16);
}

export const instrumentSchema = z.object({
  name: z.string().trim().min(1, 'Name the instrument.').max(200, 'At most 200 characters.'),
  accuracy: z.string().trim().max(200, 'At most 200 characters.').optional().default(''),
});

const slugSchema = z.string().trim().min(1).max(200);

/** A field test record (everything but its trials). */
export const fieldTestInputSchema = z.object({
  kind: z.enum(FIELD_TEST_KINDS, 'Choose the kind of test.'),
  testedAt: testDateTimeSchema,
  placeLabel: z
    .string()
    .trim()
    .min(1, 'Name the place, e.g. “Upper Meadow camp”.')
    .max(120, 'At most 120 characters.')
    .refine((s) => !COORDINATES.test(s), 'Give a place name, not coordinates: Trailbench never stores GPS positions.'),
  sky: z.enum(SKIES, 'Choose the sky.'),
  ambientC: z.number('Give the temperature in °C.').finite().min(-60, 'Below −60 °C? Check the reading.').max(70, 'Above 70 °C? Check the reading.').nullable(),
  instruments: z.array(instrumentSchema).max(20, 'At most 20 instruments.'),
  methodNotes: z.string().trim().max(5000, 'At most 5000 characters.'),
  /** Gear item slugs. */
  items: z
    .array(slugSchema)
    .min(1, 'Choose at least one gear item.')
    .max(12, 'At most 12 items in one test.')
    .refine((a) => new Set(a).size === a.length, 'Each item once.'),
});
export type FieldTestInput = z.infer<typeof fieldTestInputSchema>;
export type FieldTestFormValues = z.input<typeof fieldTestInputSchema>;

/** Extra typed keys a light-output trial takes besides spec keys: a lux reading at a distance. */
export const LIGHT_OUTPUT_EXTRA_KEYS = ['illuminanceLx', 'distanceM'] as const;

/** Keys a typed trial of this kind may carry (every spec key for `other`). */
export function typedKeysFor(kind: FieldTestKind): string[] | null {
  if (kind === 'other') return null;
  if (kind === 'port-output') return [...PORT_OUTPUT_KEYS];
  return [...KINDS[kind].specKeys, ...(kind === 'light-output' ? LIGHT_OUTPUT_EXTRA_KEYS : [])];
}

const trialHead = {
  /** Gear item slug (one of the test's items). */
  item: slugSchema,
  label: z.string().trim().max(80, 'At most 80 characters.').default(''),
};

/** A trial of typed values, e.g. a scale reading: `{ mass: 428 }` in canonical units. */
export const typedTrialSchema = z.object({
  ...trialHead,
  typedValues: z
    .record(z.string().max(40), z.number('Give a number.').finite('Give a finite number.').min(0, 'Give a number ≥ 0.'))
    .refine((r) => Object.keys(r).length > 0 && Object.keys(r).length <= 12, 'Give between 1 and 12 values.')
    .refine((r) => Object.keys(r).every((k) => isSpecKey(k) || (LIGHT_OUTPUT_EXTRA_KEYS as readonly string[]).includes(k) || (PORT_OUTPUT_KEYS as readonly string[]).includes(k)), 'Unknown figure.'),
});
export type TypedTrialInput = z.infer<typeof typedTrialSchema>;

/** The form fields of a CSV upload besides the file (multipart field `request`, JSON of this). */
export const csvUploadRequestSchema = readingsParseRequestSchema.extend({
  ...trialHead,
  /** Absent → the columns `inspectCsv` guesses. */
  selection: columnSelectionSchema.optional(),
  /** Replace the series of this trial instead of adding a trial. */
  trialId: z.string().trim().min(1).max(100).optional(),
});
export type CsvUploadRequest = z.infer<typeof csvUploadRequestSchema>;

/** Typed-in readings (a handful of timed readings) as a trial's series. */
export const typedReadingsUploadSchema = typedReadingsSchema.extend({
  ...trialHead,
  trialId: z.string().trim().min(1).max(100).optional(),
});
export type TypedReadingsUpload = z.infer<typeof typedReadingsUploadSchema>;

export const FIELD_TEST_ACTIONS = ['submit', 'withdraw', 'request-changes', 'approve'] as const;
export type FieldTestAction = (typeof FIELD_TEST_ACTIONS)[number];

export const fieldTestTransitionSchema = z.object({
  action: z.enum(FIELD_TEST_ACTIONS, 'Unknown action.'),
  comment: z.string().trim().max(4000, 'At most 4000 characters.').optional().default(''),
});
export type FieldTestTransition = z.infer<typeof fieldTestTransitionSchema>;
