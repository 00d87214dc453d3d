import { z } from 'zod';
import { RECORD_STATES } from '@/db/schema';
import { LONG_TERM_NOTE_KINDS } from '@/lib/long-term-notes/kinds';
import { longTermNoteInputSchema, longTermNoteTransitionSchema } from '@/lib/long-term-notes/schemas';
import { errorResponses, OPTIONALLY_SIGNED_IN, SIGNED_IN, slugParam, type OpenAPIRegistry } from '../registry';

const TAG = 'Long-term notes';

const noteParams = z.object({ id: z.string().min(1).max(100).meta({ description: 'The long-term note’s id.' }) });

/** A note as lib/long-term-notes/handlers.ts `noteJson` builds it. */
export const longTermNoteSchema = z
  .object({
    id: z.string(),
    item: z.string().meta({ description: 'Slug of the gear item.' }),
    author: z.string().meta({ description: 'The author’s display name.' }),
    notedOn: z.string().meta({ description: 'The day the note reports, YYYY-MM-DD.' }),
    monthsInService: z.number().int(),
    kind: z.enum(LONG_TERM_NOTE_KINDS),
    title: z.string(),
    body: z.string().meta({ description: 'Markdown as written; pages render it through a sanitizer (no raw HTML).' }),
    status: z.enum(RECORD_STATES),
    public: z.boolean().meta({ description: 'Approved, and the item is public.' }),
    approvedAt: z.string().nullable().meta({ description: 'ISO 8601, UTC.' }),
    createdAt: z.string(),
    updatedAt: z.string(),
  })
  .meta({ id: 'LongTermNote' });

const noteList = z.object({ notes: z.array(longTermNoteSchema) });
const noteCreated = z.object({ note: longTermNoteSchema.extend({ logbookPath: z.string().meta({ description: 'The author’s page of the note (edit, submit).' }) }) });
const noteSaved = z.object({ note: longTermNoteSchema });
const noteDetail = z.object({
  note: longTermNoteSchema.extend({
    events: z.array(
      z.object({
        from: z.enum(RECORD_STATES).nullable(),
        to: z.enum(RECORD_STATES),
        by: z.string().nullable(),
        comment: z.string(),
        at: z.string(),
      }),
    ),
  }),
});
const transitionResult = z.object({ note: z.object({ id: z.string(), status: z.enum(RECORD_STATES) }) });

const cacheHeaders = z.object({
  'Cache-Control': z.string().meta({ description: '`public, max-age=60` for anonymous reads; `private, no-store` when signed in.' }),
  ETag: z.string().optional().meta({ description: 'Anonymous reads only; send it back as `If-None-Match` for a 304.' }),
});

/** /api/v1/gear/{slug}/notes and /api/v1/long-term-notes… (lib/long-term-notes/handlers.ts). */
export function registerLongTermNotes(registry: OpenAPIRegistry): void {
  registry.registerPath({
    method: 'get',
    path: '/api/v1/gear/{slug}/notes',
    tags: [TAG],
    summary: 'Long-term notes of a gear item',
    description: 'Approved notes of a public item, oldest first by `notedOn`. A signed-in caller also gets their own notes on the item in any state (drafts, in review, sent back).',
    security: OPTIONALLY_SIGNED_IN,
    request: { params: z.object({ slug: slugParam }), headers: z.object({ 'If-None-Match': z.string().optional() }) },
    responses: {
      200: { description: 'The notes the caller may see.', headers: cacheHeaders, content: { 'application/json': { schema: noteList } } },
      304: { description: 'Not modified: the `If-None-Match` tag matches (anonymous reads).' },
      ...errorResponses(401, 404),
    },
  });

  registry.registerPath({
    method: 'post',
    path: '/api/v1/gear/{slug}/notes',
    tags: [TAG],
    summary: 'Add a long-term note (draft)',
    description:
      'A dated note on the item in service: `notedOn` (YYYY-MM-DD, not in the future), `monthsInService` (whole months, 0–600), `kind`, `title`, `body` (Markdown). Only a reviewer (or above) who owns the item or has logged a field test of it; 403 otherwise. Unknown keys are refused (422).',
    security: SIGNED_IN,
    request: { params: z.object({ slug: slugParam }), body: { required: true, content: { 'application/json': { schema: longTermNoteInputSchema } } } },
    responses: {
      201: { description: 'Created as a draft; `Location` is the author’s page of the note.', headers: z.object({ Location: z.string() }), content: { 'application/json': { schema: noteCreated } } },
      ...errorResponses(400, 401, 403, 404, 413, 415, 422, 503),
    },
  });

  registry.registerPath({
    method: 'get',
    path: '/api/v1/long-term-notes/{id}',
    tags: [TAG],
    summary: 'Read a long-term note',
    description: 'The note and its history of states. A note that is not public only for its author and editors (404 for everyone else).',
    security: OPTIONALLY_SIGNED_IN,
    request: { params: noteParams },
    responses: {
      200: { description: 'The note.', content: { 'application/json': { schema: noteDetail } } },
      ...errorResponses(401, 404),
    },
  });

  registry.registerPath({
    method: 'patch',
    path: '/api/v1/long-term-notes/{id}',
    tags: [TAG],
    summary: 'Change a draft long-term note',
    description: 'The whole note again (`longTermNoteInputSchema`). Only the author, and only while it is a draft or sent back (409 while in review or once approved).',
    security: SIGNED_IN,
    request: { params: noteParams, body: { required: true, content: { 'application/json': { schema: longTermNoteInputSchema } } } },
    responses: {
      200: { description: 'Saved.', content: { 'application/json': { schema: noteSaved } } },
      ...errorResponses(400, 401, 403, 404, 409, 413, 415, 422, 503),
    },
  });

  registry.registerPath({
    method: 'post',
    path: '/api/v1/long-term-notes/{id}/transitions',
    tags: [TAG],
    summary: 'Submit, withdraw, send back or approve',
    description:
      'The author submits (`submit`) or withdraws (`withdraw`); an editor, never the author, approves (`approve`, the note becomes public) or sends it back (`request-changes`, `comment` required).',
    security: SIGNED_IN,
    request: { params: noteParams, body: { required: true, content: { 'application/json': { schema: longTermNoteTransitionSchema } } } },
    responses: {
      200: { description: 'The new state.', content: { 'application/json': { schema: transitionResult } } },
      ...errorResponses(400, 401, 403, 404, 409, 413, 415, 422, 503),
    },
  });
}
