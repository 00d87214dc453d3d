import { z } from 'zod';
import { RECORD_STATES } from '@/db/schema';
import { FIELD_TEST_KINDS, SKIES } from '@/lib/field-tests/kinds';
import { csvUploadRequestSchema, fieldTestInputSchema, fieldTestTransitionSchema, typedReadingsUploadSchema, typedTrialSchema } from '@/lib/field-tests/schemas';
import { columnSelectionSchema, readingsParseRequestSchema } from '@/lib/readings/schemas';
import { radioNoiseReadingsInputSchema } from '@/lib/field-tests/radio-noise';
import { radioNoiseViewSchema } from './radio-noise';
import { errorResponses, OPTIONALLY_SIGNED_IN, SIGNED_IN, type OpenAPIRegistry } from '../registry';

const TAG = 'Field tests';

const idParam = z.string().min(1).max(100).meta({ description: 'The field test’s id.' });
const testParams = z.object({ id: idParam });

/** Responses, as app/api/v1/field-tests/handlers.ts builds them. */
export const fieldTestCreatedSchema = z.object({
  fieldTest: z.object({
    id: z.string(),
    status: z.literal('draft'),
    path: z.string().meta({ description: 'Public page once approved: `/field-tests/{id}`.' }),
    logbookPath: z.string().meta({ description: 'The author’s page for trials and readings.' }),
  }),
});

export const fieldTestSavedSchema = z.object({ fieldTest: z.object({ id: z.string() }) });

export const fieldTestViewSchema = z.object({
  fieldTest: z.object({
    id: z.string(),
    kind: z.enum(FIELD_TEST_KINDS),
    status: z.enum(RECORD_STATES),
    public: z.boolean(),
    testedAt: z.string().meta({ description: 'ISO 8601, UTC.' }),
    placeLabel: z.string(),
    sky: z.enum(SKIES),
    ambientC: z.number().nullable(),
    instruments: z.array(z.object({ name: z.string(), accuracy: z.string().optional() })),
    methodNotes: z.string(),
    author: z.string(),
    items: z.array(z.object({ slug: z.string(), name: z.string() })),
    trials: z.array(
      z.object({
        id: z.string(),
        item: z.string().optional().meta({ description: 'Slug of the trial’s item.' }),
        label: z.string(),
        rows: z.number().int(),
        notes: z.array(z.string()),
        analysis: z.record(z.string(), z.unknown()).meta({ description: 'What lib/field-tests/analysis.ts works out for the trial (runtime to 10 %, energy delivered …), in canonical units.' }),
      }),
    ),
    results: z.array(z.record(z.string(), z.unknown())).meta({ description: 'Per item: mean, sd and n of each figure over the trials.' }),
    methods: z.array(z.unknown()).meta({ description: 'The methods the results were computed by, with their source.' }),
    radioNoise: radioNoiseViewSchema.shape.radioNoise
      .optional()
      .meta({ description: 'Radio-noise checks only: the band readings and radio-quiet summaries, as `GET /api/v1/field-tests/{id}/radio-noise` sends them.' }),
  }),
});

export const trialSavedSchema = z.object({
  trial: z.object({
    id: z.string(),
    rows: z.number().int().meta({ description: 'Readings stored.' }),
    bytes: z.number().int().meta({ description: 'Stored size of the compact series.' }),
    notes: z.array(z.string()).meta({ description: 'What the parser noticed (dropped rows, clock offsets …).' }),
  }),
});

export const typedTrialSavedSchema = z.object({ trial: z.object({ id: z.string() }) });

export const transitionResultSchema = z.object({
  fieldTest: z.object({
    id: z.string(),
    status: z.enum(RECORD_STATES),
    measured: z.number().int().meta({ description: 'Measured specs written to the items (on approval; else 0).' }),
  }),
});

/** The column choice as JSON Schema (input side: unknown keys are ignored, not refused). */
function selectionJsonSchema() {
  const schema: Record<string, unknown> = { ...z.toJSONSchema(columnSelectionSchema, { target: 'draft-2020-12', io: 'input' }) };
  delete schema.$schema; // the document's dialect applies
  return schema;
}

/** The trial's fields besides the file (`csvUploadRequestSchema`), each as text: multipart fields, or the query of a text/csv upload. */
const trialTextFields = {
  item: csvUploadRequestSchema.shape.item.meta({ description: 'Slug of one of the test’s items.' }),
  label: z.string().max(80).optional().meta({ description: 'Trial label, e.g. “run 2”.' }),
  trialId: z.string().max(100).optional().meta({ description: 'Replace this trial’s series instead of adding a trial.' }),
  selection: z
    .string()
    .optional()
    .meta({ contentMediaType: 'application/json', contentSchema: selectionJsonSchema(), description: 'JSON: which column holds the time (and its unit) and which the readings; absent → the columns the server guesses.' }),
  switchOn: readingsParseRequestSchema.shape.switchOn.meta({ description: 'Clock time the device was switched on (t = 0) for clock-stamped logs.' }),
  clockUtcOffsetMinutes: z.string().regex(/^-?\d+$/).optional().meta({ description: 'The logger clock’s offset from UTC in minutes (−840 to 840).' }),
  dropRows: z.string().optional().meta({ description: 'Rows (1-based) to leave out: a JSON array or a comma list.' }),
};

const readingsForm = z.object({
  file: z.string().meta({ format: 'binary', contentMediaType: 'text/csv', description: 'The logger’s CSV (or TSV / TXT) export, UTF-8; at most READINGS_MAX_BYTES (20 MB by default).' }),
  ...trialTextFields,
});

/** With a text/csv body the same fields travel in the query string (all optional here: `item` is checked by the handler, 422 when missing). */
const readingsQuery = z.object({
  ...Object.fromEntries(Object.entries(trialTextFields).map(([k, v]) => [k, v.optional()])),
  fileName: z.string().max(200).optional().meta({ description: 'Name to keep with the trial (default readings.csv).' }),
});

/** /api/v1/field-tests… (app/api/v1/field-tests/handlers.ts). */
export function registerFieldTests(registry: OpenAPIRegistry): void {
  registry.registerPath({
    method: 'post',
    path: '/api/v1/field-tests',
    tags: [TAG],
    summary: 'Log a field test (draft)',
    description: 'The record without its trials. Items are gear slugs the caller may see. Reviewers, editors and admins.',
    security: SIGNED_IN,
    request: { body: { required: true, content: { 'application/json': { schema: fieldTestInputSchema } } } },
    responses: {
      201: { description: 'Created; `Location` is the logbook page.', headers: z.object({ Location: z.string() }), content: { 'application/json': { schema: fieldTestCreatedSchema } } },
      ...errorResponses(400, 401, 403, 413, 415, 422, 503),
    },
  });

  registry.registerPath({
    method: 'get',
    path: '/api/v1/field-tests/{id}',
    tags: [TAG],
    summary: 'Read a field test',
    description: 'The record, its trials and their results (never the raw series); for a radio-noise check also its band readings (`radioNoise`). Unapproved tests only for the author and editors.',
    security: OPTIONALLY_SIGNED_IN,
    request: { params: testParams },
    responses: {
      200: { description: 'The field test.', content: { 'application/json': { schema: fieldTestViewSchema } } },
      ...errorResponses(401, 404),
    },
  });

  registry.registerPath({
    method: 'patch',
    path: '/api/v1/field-tests/{id}',
    tags: [TAG],
    summary: 'Change a draft field test',
    description: 'The whole record again (`fieldTestInputSchema`). Only the author, and only while it is a draft or sent back.',
    security: SIGNED_IN,
    request: { params: testParams, body: { required: true, content: { 'application/json': { schema: fieldTestInputSchema } } } },
    responses: {
      200: { description: 'Saved.', content: { 'application/json': { schema: fieldTestSavedSchema } } },
      ...errorResponses(400, 401, 403, 404, 409, 413, 415, 422, 503),
    },
  });

  registry.registerPath({
    method: 'post',
    path: '/api/v1/field-tests/{id}/readings',
    tags: [TAG],
    summary: 'Upload a trial’s readings',
    description:
      'A logger file as the whole body (`text/csv`, the trial’s fields in the query string: only with text/csv), or as `multipart/form-data` (field `file` plus the same fields), or a handful of typed-in readings as `application/json`. The server parses the file again and decides; refused rows are listed in `error.fields.rows` and their numbers in `error.fields.dropRows`. A binary or non-UTF-8 file is 415; too many rows 413.',
    security: SIGNED_IN,
    request: {
      params: testParams,
      query: readingsQuery,
      body: {
        required: true,
        content: {
          'text/csv': { schema: z.string().meta({ description: 'The logger’s CSV (or TSV / TXT) export as it is, UTF-8; at most READINGS_MAX_BYTES (20 MB by default).' }) },
          'multipart/form-data': { schema: readingsForm },
          'application/json': { schema: typedReadingsUploadSchema },
        },
      },
    },
    responses: {
      201: { description: 'The trial and the number of readings stored.', content: { 'application/json': { schema: trialSavedSchema } } },
      ...errorResponses(400, 401, 403, 404, 409, 413, 415, 422, 503),
    },
  });

  registry.registerPath({
    method: 'post',
    path: '/api/v1/field-tests/{id}/trials',
    tags: [TAG],
    summary: 'Add a trial of typed values',
    description:
      'For tests without a readings log, e.g. a scale reading: `{ "item": "…", "typedValues": { "mass": 428 } }` in canonical units. A port-output test takes `{ "portNumber": 1, "portVolts": 19.84, "portAmps": 2.21, "loadAmps": 2.25 }` (port number as in the item’s Ports table; `loadAmps` optional); a port the item lacks, or an input, is 422.',
    security: SIGNED_IN,
    request: { params: testParams, body: { required: true, content: { 'application/json': { schema: typedTrialSchema } } } },
    responses: {
      201: { description: 'The new trial.', content: { 'application/json': { schema: typedTrialSavedSchema } } },
      ...errorResponses(400, 401, 403, 404, 409, 413, 415, 422, 503),
    },
  });

  registry.registerPath({
    method: 'delete',
    path: '/api/v1/field-tests/{id}/trials/{trialId}',
    tags: [TAG],
    summary: 'Delete a trial',
    security: SIGNED_IN,
    request: { params: z.object({ id: idParam, trialId: z.string().min(1).max(100).meta({ description: 'The trial’s id.' }) }) },
    responses: {
      204: { description: 'Deleted.' },
      ...errorResponses(401, 403, 404, 409, 503),
    },
  });

  registry.registerPath({
    method: 'get',
    path: '/api/v1/field-tests/{id}/radio-noise',
    tags: [TAG],
    summary: 'Read a radio-noise check’s band readings',
    description:
      'Per band: frequency, S-meter range (30 MHz and below: `below-30mhz`), mode, bandwidth, antenna, distance, the baseline and with-item readings as entered and in dBm (IARU Region 1 Rec. R.1: S9 = −73 dBm below 30 MHz, −93 dBm above, 6 dB per S-unit), the rise in dB and its verdict; and the radio-quiet summary per item. Empty for other kinds. Unapproved tests only for the author, the items’ owners and editors.',
    security: OPTIONALLY_SIGNED_IN,
    request: { params: testParams },
    responses: {
      200: { description: 'The band readings.', content: { 'application/json': { schema: radioNoiseViewSchema } } },
      ...errorResponses(401, 404),
    },
  });

  registry.registerPath({
    method: 'put',
    path: '/api/v1/field-tests/{id}/radio-noise',
    tags: [TAG],
    summary: 'Replace a radio-noise check’s band readings',
    description:
      'Every band reading of the test at once (what is stored is replaced). Each reading is `{ "scale": "s-meter", "sUnits": 0–9, "dbOverS9": 0–60 (only at S9) }` or `{ "scale": "dbm", "dbm": −174–0 }`. Only the author, only while the test is a draft or sent back (409 after submitting), only for a radio-noise test (422).',
    security: SIGNED_IN,
    request: { params: testParams, body: { required: true, content: { 'application/json': { schema: radioNoiseReadingsInputSchema } } } },
    responses: {
      200: { description: 'Saved; the stored readings with their dBm, rise and verdict.', content: { 'application/json': { schema: radioNoiseViewSchema } } },
      ...errorResponses(400, 401, 403, 404, 409, 413, 415, 422, 503),
    },
  });

  registry.registerPath({
    method: 'post',
    path: '/api/v1/field-tests/{id}/transitions',
    tags: [TAG],
    summary: 'Submit, withdraw, request changes or approve',
    description:
      'The author submits or withdraws; an editor (never the author) requests changes (with a comment) or approves. Approval writes the measured specs and ratios of the items.',
    security: SIGNED_IN,
    request: { params: testParams, body: { required: true, content: { 'application/json': { schema: fieldTestTransitionSchema } } } },
    responses: {
      200: { description: 'The new state.', content: { 'application/json': { schema: transitionResultSchema } } },
      ...errorResponses(400, 401, 403, 404, 409, 413, 415, 422, 503),
    },
  });
}
