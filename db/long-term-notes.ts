/**
 * Long-term notes (issue 9): dated notes on an item in service. The only module that reads or writes
 * long_term_notes and long_term_note_state_events, and where every rule about them is checked:
 *
 * - Adding: a reviewer (or above) who owns the item or authored a field test that covers it; the item
 *   must be visible to them (404 otherwise, as for an unknown slug).
 * - Seeing: an approved note of a public item is public; otherwise only its author and editors/admins
 *   see it, everyone else gets 404 (the same answer as an unknown id).
 * - Changing: only the author (a reviewer or above), only while draft or sent back (lib/workflow).
 * - Workflow: lib/workflow `decide`, kind `record` — the author submits or withdraws; an editor, never the
 *   author, approves or sends it back with a comment. Each move writes a state event.
 *
 * Status order as everywhere (lib/http/errors.ts): 404 → 403 → 409 → 422. Input is parsed after the
 * access checks, so a refused caller learns nothing from validation messages. Every write is one
 * synchronous `behavior: 'immediate'` transaction.
 */
import { randomUUID } from 'node:crypto';
import { and, asc, desc, eq } from 'drizzle-orm';
import type { Db } from './connection';
import { fieldTestItems, fieldTests, gearItems, longTermNotes, longTermNoteStateEvents, users, type GearItem, type LongTermNote, type RecordState } from './schema';
import { findVisibleGear, isPublicGear, type Actor } from './gear';
import type { DeskRow } from './desk';
import { userNamesById } from './users';
import { hasRole } from '@/lib/auth/roles';
import { AppError } from '@/lib/http/errors';
import { zodFieldErrors } from '@/lib/http/api';
import { longTermNoteInputSchema, type LongTermNoteAction, type LongTermNoteInput } from '@/lib/long-term-notes/schemas';
import { availableActions, canEditText, decide, type WorkflowAction } from '@/lib/workflow/transitions';

type Tx = Parameters<Parameters<Db['transaction']>[0]>[0];
type Q = Db | Tx;

const notFound = () => new AppError('not_found', 'No long-term note here, or you may not see it.');

/** Note ids are server-made UUIDs (or stable demo ids); anything else cannot exist. */
export function isLongTermNoteId(id: unknown): id is string {
  return typeof id === 'string' && /^[A-Za-z0-9-]{1,100}$/.test(id);
}

function parseInput(raw: unknown): LongTermNoteInput {
  const r = longTermNoteInputSchema.safeParse(raw);
  if (!r.success) throw new AppError('invalid', 'Some fields are not valid.', { fields: zodFieldErrors(r.error) });
  return r.data;
}

/* ------------------------------------------------------------------------------------------------ */
/* Who may do what                                                                                  */
/* ------------------------------------------------------------------------------------------------ */

/** Did this user author a field test (in any state) that covers the item? */
export function hasTestedItem(db: Q, userId: string, gearItemId: string): boolean {
  return !!db
    .select({ id: fieldTests.id })
    .from(fieldTests)
    .innerJoin(fieldTestItems, eq(fieldTestItems.fieldTestId, fieldTests.id))
    .where(and(eq(fieldTests.ownerId, userId), eq(fieldTestItems.gearItemId, gearItemId)))
    .get();
}

/** May this user add a long-term note to the item: a reviewer or above who owns it or has tested it. */
export function mayAddLongTermNote(db: Q, actor: Actor | null | undefined, item: Pick<GearItem, 'id' | 'ownerId'>): boolean {
  if (!actor || !hasRole(actor, 'reviewer')) return false;
  return item.ownerId === actor.id || hasTestedItem(db, actor.id, item.id);
}

export function isPublicLongTermNote(note: Pick<LongTermNote, 'status' | 'approvedAt'>, item: Pick<GearItem, 'approvedAt'>): boolean {
  return note.status === 'approved' && note.approvedAt !== null && isPublicGear(item);
}

export function canViewLongTermNote(viewer: Actor | null | undefined, note: LongTermNote, item: Pick<GearItem, 'approvedAt'>): boolean {
  return isPublicLongTermNote(note, item) || (!!viewer && (viewer.id === note.authorId || hasRole(viewer, 'editor')));
}

function findVisibleNote(db: Q, id: string, viewer: Actor | null | undefined): { note: LongTermNote; item: GearItem } {
  if (!isLongTermNoteId(id)) throw notFound();
  const row = db.select({ note: longTermNotes, item: gearItems }).from(longTermNotes).innerJoin(gearItems, eq(gearItems.id, longTermNotes.gearItemId)).where(eq(longTermNotes.id, id)).get();
  if (!row || !canViewLongTermNote(viewer, row.note, row.item)) {
    if (row) console.warn(`long-term note ${id}: denied to ${viewer ? viewer.id : 'anonymous'} (not visible)`);
    throw notFound();
  }
  return row;
}

/* ------------------------------------------------------------------------------------------------ */
/* Writes                                                                                           */
/* ------------------------------------------------------------------------------------------------ */

function event(tx: Tx, noteId: string, from: RecordState | null, to: RecordState, actorId: string, at: Date, comment = '') {
  tx.insert(longTermNoteStateEvents).values({ noteId, fromState: from, toState: to, actorId, comment, createdAt: at }).run();
}

/** Adds a draft note to the item `slug`: 404 when the item is not visible, 403 when not eligible, 422 for bad input. */
export function createLongTermNote(db: Db, actor: Actor, slug: string, raw: unknown, now = new Date()): { id: string; status: RecordState } {
  return db.transaction(
    (tx) => {
      const item = findVisibleGear(tx, slug, actor);
      if (!mayAddLongTermNote(tx, actor, item)) {
        console.warn(`long-term note on ${slug}: add refused to ${actor.id} (not owner or tester)`);
        throw new AppError('forbidden', 'Only a reviewer who owns this item or has logged a field test of it may add a long-term note.');
      }
      const data = parseInput(raw);
      const id = randomUUID();
      tx.insert(longTermNotes)
        .values({ id, gearItemId: item.id, authorId: actor.id, ...data, status: 'draft', createdAt: now, updatedAt: now })
        .run();
      event(tx, id, null, 'draft', actor.id, now);
      return { id, status: 'draft' as const };
    },
    { behavior: 'immediate' },
  );
}

/** The author's change to their draft or sent-back note (the whole note again). */
export function updateLongTermNote(db: Db, actor: Actor, id: string, raw: unknown, now = new Date()): { id: string } {
  return db.transaction(
    (tx) => {
      const { note } = findVisibleNote(tx, id, actor);
      if (note.authorId !== actor.id || !hasRole(actor, 'reviewer')) {
        console.warn(`long-term note ${id}: change refused to ${actor.id} (not the author)`);
        throw new AppError('forbidden', 'Only the author may change this long-term note.');
      }
      if (!canEditText(note.status, actor, note.authorId)) {
        throw new AppError(
          'conflict',
          note.status === 'in-review'
            ? 'This note is in review and locked: withdraw it first, or wait for the editor.'
            : 'This note is approved and public: it can no longer be changed. Add a new note instead.',
        );
      }
      const data = parseInput(raw);
      tx.update(longTermNotes).set({ ...data, updatedAt: now }).where(eq(longTermNotes.id, id)).run();
      return { id };
    },
    { behavior: 'immediate' },
  );
}

/** Submit, withdraw, send back (comment needed) or approve: 404, then 403/409/422 from lib/workflow. */
export function transitionLongTermNote(db: Db, actor: Actor, id: string, action: LongTermNoteAction, comment = '', now = new Date()): { id: string; status: RecordState } {
  return db.transaction(
    (tx) => {
      const { note } = findVisibleNote(tx, id, actor);
      const decision = decide({ kind: 'record', state: note.status, action, actor, authorId: note.authorId, comment });
      if (!decision.ok) {
        if (decision.code === 'forbidden') console.warn(`long-term note ${id}: ${action} refused to ${actor.id}`);
        throw new AppError(decision.code, decision.message, decision.code === 'invalid' ? { fields: { comment: [decision.message] } } : {});
      }
      const to = decision.to as RecordState;
      tx.update(longTermNotes)
        .set({ status: to, updatedAt: now, ...(action === 'approve' && { approvedAt: now }) })
        .where(eq(longTermNotes.id, id))
        .run();
      event(tx, id, note.status, to, actor.id, now, decision.comment);
      return { id, status: to };
    },
    { behavior: 'immediate' },
  );
}

/* ------------------------------------------------------------------------------------------------ */
/* Reads                                                                                            */
/* ------------------------------------------------------------------------------------------------ */

export interface LongTermNoteView {
  id: string;
  item: { slug: string; name: string; maker: string };
  authorId: string;
  authorName: string;
  notedOn: string;
  monthsInService: number;
  kind: LongTermNote['kind'];
  title: string;
  /** Markdown as written; render with lib/long-term-notes/render.ts. */
  body: string;
  status: RecordState;
  public: boolean;
  approvedAt: Date | null;
  createdAt: Date;
  updatedAt: Date;
}

export interface LongTermNoteEvent {
  from: RecordState | null;
  to: RecordState;
  actorName: string | null;
  comment: string;
  at: Date;
}


type ItemHead = Pick<GearItem, 'slug' | 'name' | 'maker' | 'approvedAt'>;

function toViews(db: Q, rows: { note: LongTermNote; item: ItemHead }[]): LongTermNoteView[] {
  const names = userNamesById(
    db,
    rows.map((r) => r.note.authorId),
  );
  return rows.map(({ note, item }) => ({
    id: note.id,
    item: { slug: item.slug, name: item.name, maker: item.maker },
    authorId: note.authorId,
    authorName: names.get(note.authorId) ?? 'Former member',
    notedOn: note.notedOn,
    monthsInService: note.monthsInService,
    kind: note.kind,
    title: note.title,
    body: note.body,
    status: note.status,
    public: isPublicLongTermNote(note, item),
    approvedAt: note.approvedAt,
    createdAt: note.createdAt,
    updatedAt: note.updatedAt,
  }));
}

/** One note the viewer may see, with its state events (newest first), what they may do now, and whether they may edit it. */
export function getLongTermNote(
  db: Db,
  id: string,
  viewer: Actor | null | undefined,
): { note: LongTermNoteView; events: LongTermNoteEvent[]; actions: WorkflowAction[]; canEdit: boolean } {
  const row = findVisibleNote(db, id, viewer);
  const [note] = toViews(db, [row]);
  const events = db
    .select({ from: longTermNoteStateEvents.fromState, to: longTermNoteStateEvents.toState, actorName: users.name, comment: longTermNoteStateEvents.comment, at: longTermNoteStateEvents.createdAt })
    .from(longTermNoteStateEvents)
    .leftJoin(users, eq(users.id, longTermNoteStateEvents.actorId))
    .where(eq(longTermNoteStateEvents.noteId, id))
    .orderBy(desc(longTermNoteStateEvents.createdAt), desc(longTermNoteStateEvents.id))
    .all();
  const actions = viewer ? availableActions({ kind: 'record', state: row.note.status, actor: viewer, authorId: row.note.authorId }) : [];
  return { note: note!, events, actions, canEdit: canEditText(row.note.status, viewer, row.note.authorId) };
}

/**
 * The notes of item `slug` the viewer may see in a list: public ones, plus (when `withOwn`) the viewer's
 * own notes in any state. Oldest first by date noted, as a timeline reads. 404 when the item is not visible.
 */
export function listItemLongTermNotes(db: Db, slug: string, viewer: Actor | null | undefined, options: { withOwn?: boolean } = {}): LongTermNoteView[] {
  const item = findVisibleGear(db, slug, viewer);
  const rows = db
    .select()
    .from(longTermNotes)
    .where(eq(longTermNotes.gearItemId, item.id))
    .orderBy(asc(longTermNotes.notedOn), asc(longTermNotes.createdAt))
    .all()
    .filter((note) => isPublicLongTermNote(note, item) || (options.withOwn && !!viewer && note.authorId === viewer.id));
  return toViews(
    db,
    rows.map((note) => ({ note, item })),
  );
}

/** The approved notes of a public item (the item page's timeline); none for an item that is not public. */
export function listPublicLongTermNotes(db: Db, item: Pick<GearItem, 'id' | 'slug' | 'name' | 'maker' | 'approvedAt'>): LongTermNoteView[] {
  if (!isPublicGear(item)) return [];
  const rows = db
    .select()
    .from(longTermNotes)
    .where(and(eq(longTermNotes.gearItemId, item.id), eq(longTermNotes.status, 'approved')))
    .orderBy(asc(longTermNotes.notedOn), asc(longTermNotes.createdAt))
    .all();
  return toViews(
    db,
    rows.map((note) => ({ note, item })),
  );
}

/** How many of the author's notes on the item are not public yet (a hint under the timeline). */
export function countOwnPendingNotes(db: Db, authorId: string, gearItemId: string): number {
  return db
    .select({ id: longTermNotes.id, status: longTermNotes.status })
    .from(longTermNotes)
    .where(and(eq(longTermNotes.authorId, authorId), eq(longTermNotes.gearItemId, gearItemId)))
    .all()
    .filter((n) => n.status !== 'approved').length;
}

export interface OwnLongTermNoteRow extends LongTermNoteView {
  /** The editor's comment when the note was sent back. */
  sentBackComment: string | null;
}

/** The author's own notes, newest change first (the logbook list). */
export function listOwnLongTermNotes(db: Db, authorId: string): OwnLongTermNoteRow[] {
  const rows = db
    .select({ note: longTermNotes, item: gearItems })
    .from(longTermNotes)
    .innerJoin(gearItems, eq(gearItems.id, longTermNotes.gearItemId))
    .where(eq(longTermNotes.authorId, authorId))
    .orderBy(desc(longTermNotes.updatedAt))
    .all();
  return toViews(db, rows).map((view) => ({
    ...view,
    sentBackComment:
      view.status === 'changes-requested'
        ? (db
            .select({ comment: longTermNoteStateEvents.comment })
            .from(longTermNoteStateEvents)
            .where(and(eq(longTermNoteStateEvents.noteId, view.id), eq(longTermNoteStateEvents.toState, 'changes-requested')))
            .orderBy(desc(longTermNoteStateEvents.createdAt), desc(longTermNoteStateEvents.id))
            .get()?.comment ?? null)
        : null,
  }));
}

export interface WaitingLongTermNote extends LongTermNoteView {
  /** When it was (last) submitted. */
  since: Date;
}

/** Notes in review, oldest submission first (the review desk). Callers check the editor role. */
export function listLongTermNotesInReview(db: Db): WaitingLongTermNote[] {
  const rows = db
    .select({ note: longTermNotes, item: gearItems })
    .from(longTermNotes)
    .innerJoin(gearItems, eq(gearItems.id, longTermNotes.gearItemId))
    .where(eq(longTermNotes.status, 'in-review'))
    .all();
  return toViews(db, rows)
    .map((view) => ({
      ...view,
      since:
        db
          .select({ at: longTermNoteStateEvents.createdAt })
          .from(longTermNoteStateEvents)
          .where(and(eq(longTermNoteStateEvents.noteId, view.id), eq(longTermNoteStateEvents.toState, 'in-review')))
          .orderBy(desc(longTermNoteStateEvents.createdAt))
          .get()?.at ?? view.updatedAt,
    }))
    .sort((a, b) => a.since.getTime() - b.since.getTime());
}

/** Desk queue rows (db/desk.ts): each links to its card with the actions further down the desk page. */
export function longTermNoteDeskRows(db: Db): DeskRow[] {
  return listLongTermNotesInReview(db).map((n) => ({
    kind: 'long-term-note' as const,
    id: n.id,
    title: n.title,
    authorId: n.authorId,
    authorName: n.authorName,
    state: 'in-review' as const,
    since: n.since,
    href: `/desk#${longTermNoteAnchor(n.id)}`,
    detail: `${n.item.maker} ${n.item.name}, ${n.monthsInService} months in service`,
  }));
}

export const longTermNoteAnchor = (id: string) => `long-term-note-${id}`;
