import { z } from 'zod';
import { meterReadingSchema, RADIO_MODES } from '@/lib/field-tests/radio-noise';
import { RADIO_QUIET_VERDICTS, S_METER_RANGES } from '@/lib/measure';

/** Responses of /api/v1/field-tests/{id}/radio-noise, as app/api/v1/field-tests/radio-noise-handlers.ts builds them. */
const range = z.enum(S_METER_RANGES);
const verdict = z.enum(RADIO_QUIET_VERDICTS);
const rangeQuietness = z.object({ verdict, worstRiseDb: z.number(), worstBand: z.string(), bands: z.number().int() });

export const radioNoiseViewSchema = z.object({
  radioNoise: z.object({
    readings: z.array(
      z.object({
        item: z.string().meta({ description: 'Slug of the item under test.' }),
        band: z.string(),
        frequencyMHz: z.number(),
        range,
        mode: z.enum(RADIO_MODES),
        bandwidthHz: z.number(),
        antenna: z.string(),
        distanceM: z.number(),
        baseline: meterReadingSchema.meta({ description: 'On the quiet reference supply, as entered.' }),
        withItem: meterReadingSchema.meta({ description: 'With the item under test, as entered.' }),
        baselineDbm: z.number(),
        withItemDbm: z.number(),
        riseDb: z.number().meta({ description: 'withItemDbm − baselineDbm; negative is meter scatter.' }),
        verdict,
      }),
    ),
    summaries: z.array(
      z.object({
        item: z.string(),
        bands: z.array(z.object({ band: z.string(), range, riseDb: z.number(), verdict, readings: z.number().int() })),
        byRange: z.object({ 'below-30mhz': rangeQuietness.nullable(), 'above-30mhz': rangeQuietness.nullable() }),
        overall: rangeQuietness,
      }),
    ),
    verdictWording: z.record(z.string(), z.string()).meta({ description: 'What each verdict means (our own thresholds).' }),
  }),
});
