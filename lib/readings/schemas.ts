import { z } from 'zod';
import { TIME_UNITS, VALUE_FIELDS } from './types';

const valuePick = z.object({ column: z.number().int().min(0).max(999), scale: z.number().positive().finite().optional() });

/** The column choice sent with an upload; the server re-validates the file with it. */
export const columnSelectionSchema = z
  .object({
    time: z.object({ column: z.number().int().min(0).max(999), unit: z.enum(TIME_UNITS) }),
    value: valuePick.optional(),
    watts: valuePick.optional(),
    volts: valuePick.optional(),
    amps: valuePick.optional(),
  })
  .refine((s) => s.value || s.watts || (s.volts && s.amps), { message: 'Choose a column of readings: output, W, or V and A.' });

/** Everything `parseReadings` takes besides the file, as sent by the upload form. */
export const readingsParseRequestSchema = z.object({
  selection: columnSelectionSchema,
  switchOn: z.string().trim().max(40).optional(),
  clockUtcOffsetMinutes: z.number().int().min(-14 * 60).max(14 * 60).optional(),
  dropRows: z.array(z.number().int().min(1)).max(1_000_000).optional(),
});

/** Typed-in readings for short tests (a handful of timed readings). */
export const typedReadingsSchema = z.object({
  timeUnit: z.enum(TIME_UNITS),
  fields: z.array(z.enum(VALUE_FIELDS)).min(1),
  switchOn: z.string().trim().max(40).optional(),
  entries: z
    .array(
      z.object({
        time: z.string().max(40),
        value: z.string().max(40).optional(),
        watts: z.string().max(40).optional(),
        volts: z.string().max(40).optional(),
        amps: z.string().max(40).optional(),
      }),
    )
    .min(1)
    .max(500),
});

export type ReadingsParseRequest = z.infer<typeof readingsParseRequestSchema>;
export type TypedReadingsInput = z.infer<typeof typedReadingsSchema>;
