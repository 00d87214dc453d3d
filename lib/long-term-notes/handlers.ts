import 'server-only';
import { NextResponse } from 'next/server';
import type { Db } from '@/db/connection';
import type { Actor } from '@/db/gear';
import { createLongTermNote, getLongTermNote, listItemLongTermNotes, transitionLongTermNote, updateLongTermNote, type LongTermNoteView } from '@/db/long-term-notes';
import { apiHandler, parseWith, readJson } from '@/lib/http/api';
import { cachedJson } from '@/lib/http/cache';
import { AppError } from '@/lib/http/errors';
import { logbookNotePath } from './paths';
import { longTermNoteTransitionSchema } from './schemas';

/*
 * The long-term-note API without Next's request context: route files resolve the caller and call these;
 * integration tests call them with a user and a Request. Every failure leaves in the shared error format.
 * Writes read the body only after the caller is known (401 first); the data layer then answers 404 → 403 →
 * 409 → 422 and leaves the database as it was on any refusal.
 */

const NO_STORE = { 'Cache-Control': 'no-store' };

function requireActor(user: Actor | null): Actor {
  if (!user) throw new AppError('unauthenticated', 'Sign in, or send a personal API token as “Authorization: Bearer <token>”.');
  return user;
}

/** A note as the API shows it (Markdown body; dates as YYYY-MM-DD or ISO 8601 UTC). */
export function noteJson(n: LongTermNoteView) {
  return {
    id: n.id,
    item: n.item.slug,
    author: n.authorName,
    notedOn: n.notedOn,
    monthsInService: n.monthsInService,
    kind: n.kind,
    title: n.title,
    body: n.body,
    status: n.status,
    public: n.public,
    approvedAt: n.approvedAt ? n.approvedAt.toISOString() : null,
    createdAt: n.createdAt.toISOString(),
    updatedAt: n.updatedAt.toISOString(),
  };
}

/** GET /api/v1/gear/{slug}/notes — approved notes of the item; a signed-in caller also gets their own in any state. */
export const handleListNotes = apiHandler(async (db: Db, user: Actor | null, slug: string, request: Request) => {
  const notes = listItemLongTermNotes(db, slug, user, { withOwn: true });
  return cachedJson(request, { notes: notes.map(noteJson) }, user !== null);
});

/** POST /api/v1/gear/{slug}/notes — JSON `longTermNoteInputSchema`; 201 with the new draft. */
export const handleCreateNote = apiHandler(async (db: Db, user: Actor | null, slug: string, request: Request) => {
  const actor = requireActor(user);
  const body = await readJson(request, { maxBytes: 64 * 1024 });
  const { id } = createLongTermNote(db, actor, slug, body);
  const { note } = getLongTermNote(db, id, actor);
  return NextResponse.json({ note: { ...noteJson(note), logbookPath: logbookNotePath(id) } }, { status: 201, headers: { Location: logbookNotePath(id), ...NO_STORE } });
});

/** GET /api/v1/long-term-notes/{id} — one note (unapproved ones only for the author and editors), with its history. */
export const handleGetNote = apiHandler(async (db: Db, user: Actor | null, id: string) => {
  const { note, events } = getLongTermNote(db, id, user);
  return NextResponse.json(
    {
      note: {
        ...noteJson(note),
        events: events.map((e) => ({ from: e.from, to: e.to, by: e.actorName, comment: e.comment, at: e.at.toISOString() })),
      },
    },
    { headers: note.public && !user ? { 'Cache-Control': 'no-cache' } : { 'Cache-Control': 'private, no-store' } },
  );
});

/** PATCH /api/v1/long-term-notes/{id} — the author's draft or sent-back note, the whole note again. */
export const handleUpdateNote = apiHandler(async (db: Db, user: Actor | null, id: string, request: Request) => {
  const actor = requireActor(user);
  const body = await readJson(request, { maxBytes: 64 * 1024 });
  updateLongTermNote(db, actor, id, body);
  return NextResponse.json({ note: noteJson(getLongTermNote(db, id, actor).note) }, { headers: NO_STORE });
});

/** POST /api/v1/long-term-notes/{id}/transitions — JSON `{ action, comment? }`. */
export const handleNoteTransition = apiHandler(async (db: Db, user: Actor | null, id: string, request: Request) => {
  const actor = requireActor(user);
  const { action, comment } = parseWith(longTermNoteTransitionSchema, await readJson(request));
  const result = transitionLongTermNote(db, actor, id, action, comment);
  return NextResponse.json({ note: result }, { headers: NO_STORE });
});
