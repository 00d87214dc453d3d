/**
 * One zod schema per input, shared by the kit form (react-hook-form + zodResolver), the browser's
 * saved guest kit, and the API route handlers. Objects are strict: unknown keys (ownerId, id,
 * shareToken …) are refused with a field error, never stored.
 */
import { z } from 'zod';
import { CHEMISTRIES, isCurrencyCode } from '@/lib/measure';
import { SKIES } from './sky';

export const MAX_TRIP_DAYS = 3650;
export const MAX_ENTRIES = 200;
export const MAX_QUANTITY = 999;

const finite = (what: string) => z.number({ error: `${what} must be a number.` }).refine(Number.isFinite, `${what} must be a finite number.`);

/** A number or null ("not set, use the default"). */
const optionalNumber = (schema: z.ZodNumber | z.ZodType<number>) => schema.nullable().optional();

const hours = finite('Hours per day').min(0, 'Hours per day cannot be negative.').max(24, 'A day has at most 24 hours.');
const duty = finite('Duty cycle')
  .gt(0, 'Duty cycle must be more than 0 (use 0 hours to switch a load off).')
  .max(1, 'Duty cycle is a share of the on-time: at most 1 (100 %).');
const depth = finite('Depth of discharge')
  .gt(0, 'Depth of discharge must be more than 0: a battery you may not use at all stores nothing for the trip.')
  .max(1, 'Depth of discharge is a share of the capacity: at most 1 (100 %).');

export const priceSchema = z.strictObject({
  amountMinor: z.number({ error: 'Price must be a number.' }).int('Price is in whole minor units (cents).').min(0, 'Price cannot be negative.').max(1e11, 'Price is too large.'),
  currency: z.string().refine((code): boolean => isCurrencyCode(code), 'Use a three-letter ISO 4217 currency code such as USD or EUR.'),
});

export const kitEntrySchema = z
  .strictObject({
    /** A catalog item id, or null for a free-form entry. */
    gearItemId: z.string().min(1).max(100).nullable().optional(),
    quantity: z
      .number({ error: 'Quantity must be a number.' })
      .int('Quantity must be a whole number.')
      .min(1, 'Quantity must be at least 1.')
      .max(MAX_QUANTITY, `Quantity must be at most ${MAX_QUANTITY}.`),
    freeName: z.string().trim().max(120, 'Use at most 120 characters.').nullable().optional(),
    freeMassG: optionalNumber(finite('Mass').min(0, 'Mass cannot be negative.').max(1e7, 'Mass is too large.')),
    freePrice: priceSchema.nullable().optional(),
    freeDrawW: optionalNumber(finite('Draw').min(0, 'Draw cannot be negative.').max(1e5, 'Draw is too large for a camp kit (over 100 kW).')),
    loadMode: z.string().max(40).nullable().optional(),
    hoursPerDay: optionalNumber(hours),
    dutyCycle: optionalNumber(duty),
    chemistry: z.enum(CHEMISTRIES, { error: `Chemistry must be one of ${CHEMISTRIES.join(', ')}.` }).nullable().optional(),
    depthOfDischarge: optionalNumber(depth),
  })
  .superRefine((entry, ctx) => {
    const hasItem = typeof entry.gearItemId === 'string';
    const hasName = typeof entry.freeName === 'string' && entry.freeName.length > 0;
    if (!hasItem && !hasName) ctx.addIssue({ code: 'custom', path: ['freeName'], message: 'Give the entry a name, or pick an item from the catalog.' });
    if (hasItem && (hasName || entry.freeMassG != null || entry.freePrice != null || entry.freeDrawW != null)) {
      ctx.addIssue({ code: 'custom', path: ['gearItemId'], message: 'A catalog entry takes its name, mass, price and draw from the catalog.' });
    }
  });

const kitFields = {
  name: z.string({ error: 'Give the kit a name.' }).trim().min(1, 'Give the kit a name.').max(120, 'Use at most 120 characters.'),
  purpose: z.string().trim().max(1000, 'Use at most 1000 characters.'),
  tripDays: z
    .number({ error: 'Trip length must be a number of days.' })
    .int('Trip length is a whole number of days.')
    .min(1, 'A trip lasts at least 1 day.')
    .max(MAX_TRIP_DAYS, `Trip length must be at most ${MAX_TRIP_DAYS} days (ten years).`),
  peakSunHours: optionalNumber(finite('Peak sun hours').min(0, 'Peak sun hours cannot be negative.').max(24, 'Peak sun hours are at most 24 a day.')),
  sky: z.enum(SKIES).nullable().optional(),
  skyShare: optionalNumber(finite('Sky share').min(0, 'Sky share cannot be negative.').max(1, 'Sky share is at most 1 (a clear sky).')),
  lossFraction: optionalNumber(finite('System losses').min(0, 'System losses cannot be negative.').lt(1, 'System losses must be under 1 (100 %).')),
  conversionEfficiency: optionalNumber(
    finite('Conversion efficiency').gt(0, 'Conversion efficiency must be more than 0.').max(1, 'Conversion efficiency is at most 1 (100 %).'),
  ),
  entries: z.array(kitEntrySchema).max(MAX_ENTRIES, `A kit holds at most ${MAX_ENTRIES} entries.`),
};

/** A whole kit: create (POST), the form, and the guest kit in localStorage. */
export const kitInputSchema = z.strictObject({ ...kitFields, purpose: kitFields.purpose.default('') });

/** PATCH: any subset of the fields; `entries`, when given, replaces the list. */
export const kitPatchSchema = z.strictObject({
  name: kitFields.name.optional(),
  purpose: kitFields.purpose.optional(),
  tripDays: kitFields.tripDays.optional(),
  peakSunHours: kitFields.peakSunHours,
  sky: kitFields.sky,
  skyShare: kitFields.skyShare,
  lossFraction: kitFields.lossFraction,
  conversionEfficiency: kitFields.conversionEfficiency,
  entries: kitFields.entries.optional(),
});

export type KitEntryInput = z.output<typeof kitEntrySchema>;
export type KitInput = z.output<typeof kitInputSchema>;
export type KitFormValues = z.input<typeof kitInputSchema>;
export type KitPatch = z.output<typeof kitPatchSchema>;

/** A new, empty kit for the form. */
export function emptyKit(): KitInput {
  return { name: 'My camp kit', purpose: '', tripDays: 3, peakSunHours: null, sky: null, skyShare: null, lossFraction: null, conversionEfficiency: null, entries: [] };
}
