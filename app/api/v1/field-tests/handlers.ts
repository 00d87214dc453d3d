import 'server-only';
import { readBodyCapped } from '@/lib/http/body';
import { NextResponse } from 'next/server';
import type { Db } from '@/db/connection';
import type { Actor } from '@/db/gear';
import { addTypedTrial, createFieldTest, deleteTrial, findEditableFieldTest, saveTrialSeries, transitionFieldTest, updateFieldTest } from '@/db/field-tests';
import { getFieldTestView } from '@/db/field-tests-view';
import { getTestRadioNoise, RADIO_NOISE_KIND } from '@/db/radio-noise';
import { radioNoiseBody } from './radio-noise-handlers';
import { apiHandler, assertSameOrigin, hasMediaType, parseWith, readJson } from '@/lib/http/api';
import { AppError } from '@/lib/http/errors';
import { csvUploadRequestSchema, fieldTestTransitionSchema, typedReadingsUploadSchema } from '@/lib/field-tests/schemas';
import { parseReadings, typedReadings, type ReadingsError } from '@/lib/readings';

/*
 * The field-test API without Next's request context: route files resolve the session and call these;
 * integration tests call them with a user and a Request. Every failure leaves in the shared error format.
 */

const MB = 1024 * 1024;
const NO_STORE = { 'Cache-Control': 'no-store' };

/** Largest logger file accepted (READINGS_MAX_BYTES, default 20 MB). */
export function readingsMaxBytes(): number {
  const fromEnv = Number(process.env.READINGS_MAX_BYTES);
  return Number.isFinite(fromEnv) && fromEnv > 0 ? Math.floor(fromEnv) : 20 * MB;
}

/** Multipart boundaries, part headers and the small form fields around the file. */
const FORM_OVERHEAD = 64 * 1024;
const CSV_EXTENSIONS = /\.(csv|tsv|txt|dat|log)$/i;

function requireActor(user: Actor | null): Actor {
  if (!user) throw new AppError('unauthenticated', 'Sign in to do this.');
  return user;
}

export const fieldTestPath = (id: string) => `/field-tests/${encodeURIComponent(id)}`;
export const logbookFieldTestPath = (id: string) => `/logbook/field-tests/${encodeURIComponent(id)}`;

const tooLarge = (limit: number) => new AppError('too_large', `The file is larger than ${formatMb(limit)}. Split the log or keep fewer columns.`);

function formatMb(bytes: number): string {
  return `${Number((bytes / MB).toFixed(1))} MB`;
}


/** A refused file in the shared error format: 415 for binary, 413 for too many rows, else 422 with row messages. */
function readingsRefusal(error: ReadingsError): AppError {
  if (error.code === 'binary-file' || error.code === 'not-utf8') return new AppError('unsupported_media_type', error.message);
  if (error.code === 'too-many-rows') return new AppError('too_large', error.message);
  const fields: Record<string, string[]> = {};
  if (error.code === 'bad-rows' || error.code === 'too-few-readings') {
    fields.file = [error.message];
    if (error.rowErrors.length) fields.rows = error.rowErrors.map((r) => r.message);
    if (error.badRows.length) fields.dropRows = error.badRows.slice(0, 10_000).map(String);
  } else if (error.code === 'bad-switch-on' || error.code === 'time-zone-needed') {
    fields.switchOn = [error.message];
  } else if (error.code === 'missing-column' || error.code === 'no-time-column' || error.code === 'no-value-column' || error.code === 'bad-selection') {
    fields.selection = [error.message];
  } else fields.file = [error.message];
  return new AppError('invalid', error.message, { fields });
}

/** Where the upload's small fields come from: the multipart form, or the query string of a text/csv upload. */
type FieldSource = { get(name: string): FormDataEntryValue | null };

function jsonField(form: FieldSource, name: string): unknown {
  const v = form.get(name);
  if (typeof v !== 'string' || v.trim() === '') return undefined;
  try {
    return JSON.parse(v);
  } catch {
    throw new AppError('invalid', 'Some fields are not valid.', { fields: { [name]: [`“${name}” must be JSON.`] } });
  }
}

function textField(form: FieldSource, name: string): string | undefined {
  const v = form.get(name);
  return typeof v === 'string' && v !== '' ? v : undefined;
}

function dropRowsField(form: FieldSource): unknown {
  const v = textField(form, 'dropRows');
  if (v === undefined) return undefined;
  if (v.trim().startsWith('[')) return jsonField(form, 'dropRows');
  return v
    .split(/[\s,]+/)
    .filter(Boolean)
    .map((x) => (/^\d+$/.test(x) ? Number(x) : x));
}

/** POST /api/v1/field-tests — JSON `fieldTestInputSchema`; 201 with the new draft's id and pages. */
export const handleCreateFieldTest = apiHandler(async (db: Db, user: Actor | null, request: Request) => {
  const actor = requireActor(user);
  const body = await readJson(request);
  const { id } = createFieldTest(db, actor, body);
  return NextResponse.json({ fieldTest: { id, status: 'draft', path: fieldTestPath(id), logbookPath: logbookFieldTestPath(id) } }, { status: 201, headers: { Location: logbookFieldTestPath(id), ...NO_STORE } });
});

/** PATCH /api/v1/field-tests/{id} — the author's draft, JSON `fieldTestInputSchema`. */
export const handleUpdateFieldTest = apiHandler(async (db: Db, user: Actor | null, id: string, request: Request) => {
  const actor = requireActor(user);
  const body = await readJson(request);
  updateFieldTest(db, actor, id, body);
  return NextResponse.json({ fieldTest: { id } }, { headers: NO_STORE });
});

/** GET /api/v1/field-tests/{id} — the record, its trials and their results (no raw series); a radio-noise check's band readings too. */
export const handleGetFieldTest = apiHandler(async (db: Db, user: Actor | null, id: string) => {
  const view = getFieldTestView(db, id, user);
  const { test } = view;
  return NextResponse.json(
    {
      fieldTest: {
        id: test.id,
        kind: test.kind,
        status: test.status,
        public: view.public,
        testedAt: test.testedAt.toISOString(),
        placeLabel: test.placeLabel,
        sky: test.sky,
        ambientC: test.ambientC,
        instruments: test.instruments,
        methodNotes: test.methodNotes,
        author: test.ownerName,
        items: view.items.map((i) => ({ slug: i.slug, name: i.name })),
        trials: view.trials.map((t) => ({ id: t.id, item: view.items.find((i) => i.id === t.itemId)?.slug, label: t.label, rows: t.rows, notes: t.notes, analysis: t.analysis })),
        results: view.analysis.items,
        methods: view.analysis.methods,
        // Read under the same visibility rule as the test itself (db/radio-noise.ts getTestRadioNoise).
        ...(test.kind === RADIO_NOISE_KIND ? { radioNoise: radioNoiseBody(getTestRadioNoise(db, test.id, user)) } : {}),
      },
    },
    { headers: view.public ? { 'Cache-Control': 'no-cache' } : { 'Cache-Control': 'private, no-store' } },
  );
});

function csvUploadRequest(fields: FieldSource) {
  const offset = textField(fields, 'clockUtcOffsetMinutes');
  return parseWith(csvUploadRequestSchema, {
    item: textField(fields, 'item'),
    label: textField(fields, 'label'),
    trialId: textField(fields, 'trialId'),
    selection: jsonField(fields, 'selection'),
    switchOn: textField(fields, 'switchOn'),
    clockUtcOffsetMinutes: offset === undefined ? undefined : Number(offset),
    dropRows: dropRowsField(fields),
  });
}

function saveCsvTrial(db: Db, actor: Actor, id: string, bytes: Uint8Array, fileName: string, fields: FieldSource) {
  const req = csvUploadRequest(fields);
  const parsed = parseReadings(bytes, { selection: req.selection, switchOn: req.switchOn, clockUtcOffsetMinutes: req.clockUtcOffsetMinutes, dropRows: req.dropRows });
  if (!parsed.ok) throw readingsRefusal(parsed.error);
  const saved = saveTrialSeries(db, actor, id, {
    item: req.item,
    label: req.label,
    trialId: req.trialId,
    samples: parsed.samples,
    meta: parsed.meta,
    source: { kind: 'csv', fileName, fileBytes: bytes.byteLength },
  });
  return NextResponse.json({ trial: { id: saved.trialId, rows: saved.rows, bytes: saved.bytes, notes: parsed.meta.notes } }, { status: 201, headers: NO_STORE });
}

/**
 * POST /api/v1/field-tests/{id}/readings — a trial's readings, re-parsed and decided here, in one of:
 * - text/csv: the logger file as the body; `item`, `label`, `trialId`?, `selection` (JSON), `switchOn`?,
 *   `clockUtcOffsetMinutes`?, `dropRows`? in the query string (what a script or `curl --data-binary` sends);
 * - multipart/form-data: `file` (a logger CSV) and the same fields as form fields (the logbook page, with progress);
 * - application/json: typed-in readings (`typedReadingsUploadSchema`).
 * 201 with the trial's id and row count; 415 for any other media type.
 */
export const handleReadingsUpload = apiHandler(async (db: Db, user: Actor | null, id: string, request: Request, options: { maxBytes?: number } = {}) => {
  assertSameOrigin(request);
  const actor = requireActor(user);
  findEditableFieldTest(db, id, actor); // 404 / 403 / 409 before reading any of the body
  const type = request.headers.get('content-type') ?? '';

  if (/^application\/json\b/i.test(type)) {
    const data = parseWith(typedReadingsUploadSchema, await readJson(request));
    const parsed = typedReadings(data.entries, { timeUnit: data.timeUnit, fields: data.fields, switchOn: data.switchOn });
    if (!parsed.ok) throw readingsRefusal(parsed.error);
    const saved = saveTrialSeries(db, actor, id, { item: data.item, label: data.label, trialId: data.trialId, samples: parsed.samples, meta: parsed.meta, source: { kind: 'typed' } });
    return NextResponse.json({ trial: { id: saved.trialId, rows: saved.rows, bytes: saved.bytes, notes: parsed.meta.notes } }, { status: 201, headers: NO_STORE });
  }

  const fileLimit = options.maxBytes ?? readingsMaxBytes();
  if (hasMediaType(request, 'text/csv')) {
    const bytes = await readBodyCapped(request, fileLimit, () => tooLarge(fileLimit));
    const fileName = textField(new URL(request.url).searchParams, 'fileName') ?? 'readings.csv';
    return saveCsvTrial(db, actor, id, bytes, fileName.slice(0, 200), new URL(request.url).searchParams);
  }
  const declared = request.headers.get('content-length');
  if (declared !== null && Number(declared) > fileLimit + FORM_OVERHEAD) throw tooLarge(fileLimit);
  if (!/^multipart\/form-data\s*;\s*boundary=/i.test(type)) {
    throw new AppError('unsupported_media_type', 'Send a logger file as text/csv (fields in the query string) or as multipart/form-data with the field “file”, or typed-in readings as application/json.');
  }
  const body = await readBodyCapped(request, fileLimit + FORM_OVERHEAD, () => tooLarge(fileLimit));
  let form: FormData;
  try {
    form = await new Response(body as BodyInit, { headers: { 'content-type': type } }).formData();
  } catch {
    throw new AppError('bad_request', 'The upload could not be read as multipart/form-data.');
  }
  const file = form.get('file');
  if (!(file instanceof File)) throw new AppError('invalid', 'Choose a logger file (CSV) to upload.', { fields: { file: ['Choose a logger file (CSV) to upload.'] } });
  if (file.size > fileLimit) throw tooLarge(fileLimit);
  if (file.name && /\.[A-Za-z0-9]{1,5}$/.test(file.name) && !CSV_EXTENSIONS.test(file.name)) {
    throw new AppError('unsupported_media_type', `“${file.name}” is not a CSV file: upload the logger’s CSV (or TSV / TXT) export.`);
  }
  return saveCsvTrial(db, actor, id, new Uint8Array(await file.arrayBuffer()), file.name || 'readings.csv', form);
});

/** POST /api/v1/field-tests/{id}/trials — JSON `typedTrialSchema` (typed values such as a scale reading). */
export const handleTypedTrial = apiHandler(async (db: Db, user: Actor | null, id: string, request: Request) => {
  const actor = requireActor(user);
  const body = await readJson(request);
  const { trialId } = addTypedTrial(db, actor, id, body);
  return NextResponse.json({ trial: { id: trialId } }, { status: 201, headers: NO_STORE });
});

/** DELETE /api/v1/field-tests/{id}/trials/{trialId} — 204. */
export const handleTrialDelete = apiHandler(async (db: Db, user: Actor | null, id: string, trialId: string, request: Request) => {
  assertSameOrigin(request);
  const actor = requireActor(user);
  deleteTrial(db, actor, id, trialId);
  return new NextResponse(null, { status: 204 });
});

/** POST /api/v1/field-tests/{id}/transitions — JSON `{ action: submit | withdraw | request-changes | approve, comment? }`. */
export const handleTransition = apiHandler(async (db: Db, user: Actor | null, id: string, request: Request) => {
  const actor = requireActor(user);
  const { action, comment } = parseWith(fieldTestTransitionSchema, await readJson(request));
  const result = transitionFieldTest(db, actor, id, action, comment);
  return NextResponse.json({ fieldTest: result }, { headers: NO_STORE });
});
