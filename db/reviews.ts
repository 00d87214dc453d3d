/**
 * Reviews: the only module that queries reviews, review_items, review_revisions and review_state_events.
 *
 * Model (issue 6):
 * - State lives on each revision. The *working* revision is the latest one (highest number). The
 *   *public* revision is the latest one that is published or retracted; earlier public revisions
 *   stay readable as the review's history.
 * - Published text is immutable: a correction is a new draft revision (a copy of the public one) with
 *   a correction note, approved and published the same way.
 * - Visibility: a review with a public revision is readable by everyone; its other revisions, and any
 *   review without a public revision, only by the author, editors and admins — everyone else gets
 *   404, the same answer as for an unknown id, so a draft's existence does not leak.
 * - Transitions are decided by lib/workflow/transitions.ts and written with their state event in
 *   one synchronous `behavior: 'immediate'` transaction; every refusal throws before any write.
 */
import { randomUUID } from 'node:crypto';
import { and, asc, desc, eq, inArray, isNotNull, or } from 'drizzle-orm';
import type { Db } from './connection';
import { gearItems, notificationSettings, reviewBuyLinks, reviewItems, reviewRevisions, reviews, reviewStateEvents, specs, users, type Role } from './schema';
import { expireReviewTags } from './reviews-cache-tags';
import { AppError } from '@/lib/http/errors';
import { hasRole } from '@/lib/auth/roles';
import { parseWith } from '@/lib/http/api';
import { decide, canEditText, availableActions, type WorkflowAction, type WorkflowState } from '@/lib/workflow/transitions';
import { createReviewSchema, DISCLOSURE_LABELS, notificationSettingsSchema, reviewDraftSchema, submitProblems, type Disclosure, type NotificationSettings } from '@/lib/reviews/schemas';
import { buyLinksSchema, type BuyLink } from '@/lib/reviews/buy-links';
import type { RevisionText } from '@/lib/reviews/diff';

export interface Actor {
  id: string;
  role: Role;
}

type Tx = Parameters<Parameters<Db['transaction']>[0]>[0];
type Q = Db | Tx;

export type Review = typeof reviews.$inferSelect;
export type ReviewRevision = typeof reviewRevisions.$inferSelect;

const PUBLIC_STATES: readonly WorkflowState[] = ['published', 'retracted'];
const isPublicState = (state: WorkflowState) => PUBLIC_STATES.includes(state);

const NOT_FOUND = 'No review here, or you may not see it.';

/* ------------------------------------------------------------------------------------------------ */
/* Visibility                                                                                       */
/* ------------------------------------------------------------------------------------------------ */

/** Author, editors and admins see every revision; everyone else only public ones. */
export function canSeeWorkingRevisions(viewer: Actor | null | undefined, review: Pick<Review, 'authorId'>): boolean {
  return !!viewer && (viewer.id === review.authorId || hasRole(viewer, 'editor'));
}

interface Loaded {
  review: Review;
  /** Oldest first. */
  revisions: ReviewRevision[];
}

function loadBy(q: Q, field: 'id' | 'slug', value: unknown): Loaded | null {
  if (typeof value !== 'string' || value.length === 0 || value.length > 200) return null;
  const review = q
    .select()
    .from(reviews)
    .where(eq(field === 'id' ? reviews.id : reviews.slug, value))
    .get();
  if (!review) return null;
  const revisions = q.select().from(reviewRevisions).where(eq(reviewRevisions.reviewId, review.id)).orderBy(asc(reviewRevisions.number)).all();
  return { review, revisions };
}

const latest = (revisions: ReviewRevision[]) => revisions.at(-1)!;
const latestPublic = (revisions: ReviewRevision[]) => [...revisions].reverse().find((r) => isPublicState(r.state));

/** The review if the viewer may see it at all, else AppError 404. */
function findVisible(q: Q, field: 'id' | 'slug', value: unknown, viewer: Actor | null | undefined): Loaded {
  const loaded = loadBy(q, field, value);
  if (!loaded || loaded.revisions.length === 0) throw new AppError('not_found', NOT_FOUND);
  if (!latestPublic(loaded.revisions) && !canSeeWorkingRevisions(viewer, loaded.review)) throw new AppError('not_found', NOT_FOUND);
  return loaded;
}

/* ------------------------------------------------------------------------------------------------ */
/* Writing                                                                                          */
/* ------------------------------------------------------------------------------------------------ */

function slugBase(title: string): string {
  const base = title
    .normalize('NFKD')
    .replace(/[\u0300-\u036f]/g, '')
    .toLowerCase()
    .replace(/[^a-z0-9]+/g, '-')
    .replace(/^-+|-+$/g, '')
    .slice(0, 80)
    .replace(/-+$/g, '');
  return base || 'review';
}

function uniqueSlug(q: Q, title: string): string {
  const base = slugBase(title);
  for (let n = 1; ; n++) {
    const slug = n === 1 ? base : `${base}-${n}`;
    if (!q.select({ id: reviews.id }).from(reviews).where(eq(reviews.slug, slug)).get()) return slug;
  }
}

/** Items a writer may cover: their own, and any approved (public) item. */
function assertPickableItems(q: Q, actor: Actor, ids: string[]): void {
  const rows = q
    .select({ id: gearItems.id, ownerId: gearItems.ownerId, approvedAt: gearItems.approvedAt })
    .from(gearItems)
    .where(inArray(gearItems.id, ids))
    .all();
  const ok = new Set(rows.filter((r) => r.ownerId === actor.id || r.approvedAt !== null).map((r) => r.id));
  const missing = ids.filter((id) => !ok.has(id));
  if (missing.length) {
    throw new AppError('invalid', 'Some fields are not valid.', {
      fields: { itemIds: ['Pick gear items from your own logbook or from the published catalog.'] },
    });
  }
}

function writeEvent(tx: Tx, revisionId: string, from: WorkflowState | null, to: WorkflowState, actorId: string, now: Date, comment = ''): void {
  tx.insert(reviewStateEvents).values({ revisionId, fromState: from, toState: to, actorId, comment, createdAt: now }).run();
}

function requireWriter(actor: Actor): void {
  if (!hasRole(actor, 'reviewer')) throw new AppError('forbidden', 'Writing reviews needs the reviewer role.');
}

/** Starts a review: the review, its items, revision 1 as a draft and its first state event. */
export function createReviewDraft(db: Db, actor: Actor, raw: unknown, now = new Date()): { id: string; slug: string } {
  requireWriter(actor);
  const input = parseWith(createReviewSchema, raw);
  return db.transaction(
    (tx) => {
      assertPickableItems(tx, actor, input.itemIds);
      const id = randomUUID();
      const slug = uniqueSlug(tx, input.title);
      tx.insert(reviews).values({ id, slug, authorId: actor.id, createdAt: now }).run();
      tx.insert(reviewItems)
        .values(input.itemIds.map((gearItemId) => ({ reviewId: id, gearItemId })))
        .run();
      const revisionId = randomUUID();
      tx.insert(reviewRevisions).values({ id: revisionId, reviewId: id, number: 1, title: input.title, state: 'draft', createdAt: now, updatedAt: now }).run();
      writeEvent(tx, revisionId, null, 'draft', actor.id, now);
      return { id, slug };
    },
    { behavior: 'immediate' },
  );
}

/**
 * Saves the working revision's text (autosave and the form's Save). Only the author, only while the
 * revision is a draft or returned with changes requested: 404 if not visible, 403 if not the author,
 * 409 if locked, 422 if invalid — nothing is written on any of them.
 */
export function updateReviewDraft(db: Db, actor: Actor, reviewId: string, raw: unknown, now = new Date()): { updatedAt: Date } {
  return db.transaction(
    (tx) => {
      const { review, revisions } = findVisible(tx, 'id', reviewId, actor);
      const working = latest(revisions);
      if (actor.id !== review.authorId || !hasRole(actor, 'reviewer')) throw new AppError('forbidden', 'Only the author may change this review.');
      if (!canEditText(working.state, actor, review.authorId)) {
        throw new AppError(
          'conflict',
          working.state === 'in-review'
            ? 'This draft is with the editors and locked. Withdraw it to edit, or wait until an editor returns it.'
            : isPublicState(working.state)
              ? 'Published text never changes. Start a correction to write a new revision.'
              : 'This revision is approved and locked until an editor publishes it or requests changes.',
        );
      }
      const input = parseWith(reviewDraftSchema, raw);
      assertPickableItemsOrKept(tx, actor, review.id, input.itemIds);
      tx.update(reviewRevisions)
        .set({
          title: input.title,
          summary: input.summary,
          verdict: input.verdict,
          body: input.body,
          disclosure: input.disclosure,
          disclosureNote: input.disclosureNote,
          correctionNote: working.number > 1 ? input.correctionNote : null,
          updatedAt: now,
        })
        .where(eq(reviewRevisions.id, working.id))
        .run();
      tx.delete(reviewItems).where(eq(reviewItems.reviewId, review.id)).run();
      tx.insert(reviewItems)
        .values(input.itemIds.map((gearItemId) => ({ reviewId: review.id, gearItemId })))
        .run();
      return { updatedAt: now };
    },
    { behavior: 'immediate' },
  );
}

/** Items already on the review may stay (even if someone else's item went back to draft); new ones must be pickable. */
function assertPickableItemsOrKept(tx: Tx, actor: Actor, reviewId: string, ids: string[]): void {
  const kept = new Set(tx.select({ id: reviewItems.gearItemId }).from(reviewItems).where(eq(reviewItems.reviewId, reviewId)).all().map((r) => r.id));
  const added = ids.filter((id) => !kept.has(id));
  if (added.length) assertPickableItems(tx, actor, added);
}

export interface TransitionOutcome {
  reviewId: string;
  slug: string;
  authorId: string;
  revisionId: string;
  revisionNumber: number;
  title: string;
  action: WorkflowAction;
  from: WorkflowState;
  to: WorkflowState;
  comment: string;
}

/**
 * One workflow action on a review (lib/workflow/transitions.ts decides). Order of checks: 404 not
 * visible → 403 not allowed → 409 state → 422 comment or incomplete draft. On success the state
 * change and its event are written together; `start-correction` adds a new draft revision copied
 * from the public one.
 */
export function transitionReview(db: Db, actor: Actor, reviewId: string, action: WorkflowAction, comment: string | null = null, now = new Date()): TransitionOutcome {
  const outcome = transitionInTransaction(db, actor, reviewId, action, comment, now);
  // Cached public pages (db/reviews-cache.ts) change on publish and retract; a correction's start is included so its page links refresh.
  if (action === 'publish' || action === 'retract' || action === 'start-correction') expireReviewTags(outcome.slug);
  return outcome;
}

function transitionInTransaction(db: Db, actor: Actor, reviewId: string, action: WorkflowAction, comment: string | null, now: Date): TransitionOutcome {
  return db.transaction(
    (tx) => {
      const { review, revisions } = findVisible(tx, 'id', reviewId, actor);
      const working = latest(revisions);
      // Retracting acts on the public revision even while a correction is being written.
      const target = action === 'retract' ? (latestPublic(revisions) ?? working) : working;
      const decision = decide({ kind: 'review', state: target.state, action, actor, authorId: review.authorId, comment });
      if (!decision.ok) {
        if (decision.code === 'conflict' && action === 'start-correction' && latestPublic(revisions) && !isPublicState(working.state)) {
          throw new AppError('conflict', `A correction (revision ${working.number}) is already open: continue it instead.`);
        }
        throw new AppError(decision.code, decision.message);
      }
      const items = tx.select({ id: reviewItems.gearItemId }).from(reviewItems).where(eq(reviewItems.reviewId, review.id)).all();
      if (action === 'submit') {
        const fields = submitProblems({ ...target, isCorrection: target.number > 1, itemCount: items.length });
        if (Object.keys(fields).length) throw new AppError('invalid', 'This draft is not ready to submit yet.', { fields });
      }
      if (action === 'publish' && target.disclosure === null) {
        throw new AppError('conflict', 'This review has no disclosure of how the tester got the gear, so it cannot be published. Request changes so the author adds one.');
      }
      const base = { reviewId: review.id, slug: review.slug, authorId: review.authorId, title: target.title, action, from: decision.from, to: decision.to, comment: decision.comment };
      if (decision.newRevision) {
        const revisionId = randomUUID();
        const number = working.number + 1;
        tx.insert(reviewRevisions)
          .values({
            id: revisionId,
            reviewId: review.id,
            number,
            title: target.title,
            summary: target.summary,
            verdict: target.verdict,
            body: target.body,
            disclosure: target.disclosure,
            disclosureNote: target.disclosureNote,
            correctionNote: '',
            state: 'draft',
            createdAt: now,
            updatedAt: now,
          })
          .run();
        const links = buyLinksOf(tx, target.id);
        if (links.length) tx.insert(reviewBuyLinks).values(links.map((l, position) => ({ revisionId, position, ...l }))).run();
        writeEvent(tx, revisionId, null, 'draft', actor.id, now, `Correction of revision ${target.number}.`);
        return { ...base, revisionId, revisionNumber: number, to: 'draft' as const };
      }
      tx.update(reviewRevisions)
        .set({ state: decision.to, updatedAt: now, ...(decision.to === 'published' ? { publishedAt: now } : {}) })
        .where(eq(reviewRevisions.id, target.id))
        .run();
      writeEvent(tx, target.id, decision.from, decision.to, actor.id, now, decision.comment);
      return { ...base, revisionId: target.id, revisionNumber: target.number };
    },
    { behavior: 'immediate' },
  );
}

/* ------------------------------------------------------------------------------------------------ */
/* Reads                                                                                            */
/* ------------------------------------------------------------------------------------------------ */

export interface ReviewItemRef {
  id: string;
  slug: string;
  name: string;
  maker: string;
  category: string;
  isPublic: boolean;
}

function itemsOf(q: Q, reviewId: string): ReviewItemRef[] {
  return q
    .select({ id: gearItems.id, slug: gearItems.slug, name: gearItems.name, maker: gearItems.maker, category: gearItems.category, approvedAt: gearItems.approvedAt })
    .from(reviewItems)
    .innerJoin(gearItems, eq(gearItems.id, reviewItems.gearItemId))
    .where(eq(reviewItems.reviewId, reviewId))
    .orderBy(asc(gearItems.name))
    .all()
    .map(({ approvedAt, ...rest }) => ({ ...rest, isPublic: approvedAt !== null }));
}

export interface ReviewEvent {
  id: number;
  revisionId: string;
  revisionNumber: number;
  from: WorkflowState | null;
  to: WorkflowState;
  actorName: string | null;
  comment: string;
  at: Date;
}

function eventsOf(q: Q, revisions: ReviewRevision[]): ReviewEvent[] {
  if (revisions.length === 0) return [];
  const numbers = new Map(revisions.map((r) => [r.id, r.number]));
  return q
    .select({
      id: reviewStateEvents.id,
      revisionId: reviewStateEvents.revisionId,
      from: reviewStateEvents.fromState,
      to: reviewStateEvents.toState,
      actorName: users.name,
      comment: reviewStateEvents.comment,
      at: reviewStateEvents.createdAt,
    })
    .from(reviewStateEvents)
    .leftJoin(users, eq(users.id, reviewStateEvents.actorId))
    .where(
      inArray(
        reviewStateEvents.revisionId,
        revisions.map((r) => r.id),
      ),
    )
    .orderBy(asc(reviewStateEvents.createdAt), asc(reviewStateEvents.id))
    .all()
    .map((e) => ({ ...e, revisionNumber: numbers.get(e.revisionId) ?? 0 }));
}

function authorName(q: Q, authorId: string): string {
  return q.select({ name: users.name }).from(users).where(eq(users.id, authorId)).get()?.name ?? 'Former member';
}

export interface PublicRevisionRef {
  number: number;
  state: WorkflowState;
  publishedAt: Date | null;
  correctionNote: string | null;
}

export interface ReviewPageData {
  review: Review;
  authorName: string;
  /** The revision shown: the requested public one, else the latest public one, else (for its viewers) the working one. */
  revision: ReviewRevision;
  /** True when the shown revision is not public (author/editor preview of a draft). */
  isPreview: boolean;
  /** When the shown revision was first published (revision 1's date). */
  firstPublishedAt: Date | null;
  /** Public note of the retraction, when the shown revision is retracted. */
  retraction: { note: string; at: Date } | null;
  /** Public revisions, newest first (the reader's history). */
  history: PublicRevisionRef[];
  latestPublicNumber: number | null;
  /** For the author and editors: the working revision when it is not the shown one. */
  working: ReviewRevision | null;
  items: ReviewItemRef[];
  /** Where-to-buy links of the shown revision. */
  buyLinks: BuyLink[];
  viewerIsAuthor: boolean;
}

/**
 * The reader's page of a review, `/reviews/[slug]` (optionally `?revision=N`). 404 when the review
 * has no public revision and the viewer is not its author, an editor or an admin, and for a
 * non-public revision number asked by such a viewer.
 */
export function getReviewPage(db: Db, slug: string, viewer: Actor | null, revisionNumber?: number): ReviewPageData {
  const { review, revisions } = findVisible(db, 'slug', slug, viewer);
  const privileged = canSeeWorkingRevisions(viewer, review);
  const publicRevs = revisions.filter((r) => isPublicState(r.state));
  const current = latestPublic(revisions);
  let shown: ReviewRevision | undefined;
  if (revisionNumber !== undefined) {
    shown = revisions.find((r) => r.number === revisionNumber && (isPublicState(r.state) || privileged));
    if (!shown) throw new AppError('not_found', NOT_FOUND);
  } else {
    shown = current ?? latest(revisions);
  }
  const retractEvent =
    shown.state === 'retracted'
      ? db
          .select()
          .from(reviewStateEvents)
          .where(and(eq(reviewStateEvents.revisionId, shown.id), eq(reviewStateEvents.toState, 'retracted')))
          .orderBy(desc(reviewStateEvents.createdAt))
          .get()
      : undefined;
  const working = latest(revisions);
  return {
    review,
    authorName: authorName(db, review.authorId),
    revision: shown,
    isPreview: !isPublicState(shown.state),
    firstPublishedAt: publicRevs[0]?.publishedAt ?? null,
    retraction: retractEvent ? { note: retractEvent.comment, at: retractEvent.createdAt } : null,
    history: publicRevs
      .map((r) => ({ number: r.number, state: r.state, publishedAt: r.publishedAt, correctionNote: r.correctionNote }))
      .reverse(),
    latestPublicNumber: current?.number ?? null,
    working: privileged && working.id !== shown.id && !isPublicState(working.state) ? working : null,
    items: itemsOf(db, review.id),
    buyLinks: buyLinksOf(db, shown.id),
    viewerIsAuthor: viewer?.id === review.authorId,
  };
}

/** Slugs of reviews with a public (published or retracted) revision, each with its public revision numbers: the keys db/reviews-cache.ts may cache. */
export function listPublicReviewSlugs(db: Db): Record<string, number[]> {
  const rows = db
    .select({ slug: reviews.slug, number: reviewRevisions.number })
    .from(reviewRevisions)
    .innerJoin(reviews, eq(reviews.id, reviewRevisions.reviewId))
    .where(inArray(reviewRevisions.state, ['published', 'retracted']))
    .orderBy(asc(reviewRevisions.number))
    .all();
  const out: Record<string, number[]> = {};
  for (const r of rows) (out[r.slug] ??= []).push(r.number);
  return out;
}

/* ------------------------------------------------------------------------------------------------ */
/* Where to buy                                                                                     */
/* ------------------------------------------------------------------------------------------------ */

/** Where-to-buy links of one revision, in order. */
export function buyLinksOf(q: Q, revisionId: string): BuyLink[] {
  return q
    .select({ label: reviewBuyLinks.label, url: reviewBuyLinks.url, isAffiliate: reviewBuyLinks.isAffiliate })
    .from(reviewBuyLinks)
    .where(eq(reviewBuyLinks.revisionId, revisionId))
    .orderBy(asc(reviewBuyLinks.position), asc(reviewBuyLinks.id))
    .all();
}

/**
 * Replaces the where-to-buy links of the working revision (lib/reviews/buy-links.ts). The same rules
 * as the text: only the author, only while the revision is a draft or returned — 404 / 403 / 409 /
 * 422 in that order, nothing written on any of them. Published links never change: a correction
 * copies them into its new draft.
 */
export function saveBuyLinks(db: Db, actor: Actor, reviewId: string, raw: unknown, now = new Date()): BuyLink[] {
  return db.transaction(
    (tx) => {
      const { review, revisions } = findVisible(tx, 'id', reviewId, actor);
      const working = latest(revisions);
      if (actor.id !== review.authorId || !hasRole(actor, 'reviewer')) throw new AppError('forbidden', 'Only the author may change this review.');
      if (!canEditText(working.state, actor, review.authorId)) throw new AppError('conflict', 'This revision is locked: links change with the text, in a draft or a correction.');
      const { links } = parseWith(buyLinksSchema, raw);
      tx.delete(reviewBuyLinks).where(eq(reviewBuyLinks.revisionId, working.id)).run();
      if (links.length) tx.insert(reviewBuyLinks).values(links.map((l, position) => ({ revisionId: working.id, position, ...l }))).run();
      tx.update(reviewRevisions).set({ updatedAt: now }).where(eq(reviewRevisions.id, working.id)).run();
      return links;
    },
    { behavior: 'immediate' },
  );
}

/* ------------------------------------------------------------------------------------------------ */
/* Revision diff                                                                                    */
/* ------------------------------------------------------------------------------------------------ */

export interface ReviewDiffData {
  slug: string;
  title: string;
  from: { number: number; publishedAt: Date | null; state: WorkflowState; text: RevisionText };
  to: { number: number; publishedAt: Date | null; state: WorkflowState; text: RevisionText };
  /** Public revision numbers, oldest first (to pick another one). */
  publicNumbers: number[];
}

function revisionText(r: ReviewRevision): RevisionText {
  return {
    title: r.title,
    summary: r.summary,
    verdict: r.verdict,
    body: r.body,
    disclosureLabel: r.disclosure ? DISCLOSURE_LABELS[r.disclosure] : 'Not stated',
    disclosureNote: r.disclosureNote,
  };
}

/**
 * Two public revisions of a review for the reader's comparison: `fromNumber` against the current
 * public one. Public revisions only, for everyone (drafts are compared on the writing page, not here):
 * 404 for an unknown review, a review without public revisions, or a revision number that is not public.
 */
export function getReviewDiff(db: Db, slug: string, fromNumber: number): ReviewDiffData {
  const loaded = loadBy(db, 'slug', slug);
  const publicRevs = loaded?.revisions.filter((r) => isPublicState(r.state)) ?? [];
  const current = publicRevs.at(-1);
  const from = publicRevs.find((r) => r.number === fromNumber);
  if (!loaded || !current || !from) throw new AppError('not_found', NOT_FOUND);
  const side = (r: ReviewRevision) => ({ number: r.number, publishedAt: r.publishedAt, state: r.state, text: revisionText(r) });
  return { slug: loaded.review.slug, title: current.title, from: side(from), to: side(current), publicNumbers: publicRevs.map((r) => r.number) };
}

export interface PublishedReviewRow {
  slug: string;
  title: string;
  summary: string;
  verdict: string;
  authorName: string;
  disclosure: Disclosure | null;
  firstPublishedAt: Date | null;
  updatedAt: Date | null;
  revisionNumber: number;
  items: { slug: string; name: string }[];
}

/** Reviews whose latest public revision is published (not retracted), newest first. */
export function listPublishedReviews(db: Db, limit = 200): PublishedReviewRow[] {
  const revs = db
    .select()
    .from(reviewRevisions)
    .where(inArray(reviewRevisions.state, ['published', 'retracted']))
    .orderBy(asc(reviewRevisions.number))
    .all();
  const byReview = new Map<string, ReviewRevision[]>();
  for (const r of revs) byReview.set(r.reviewId, [...(byReview.get(r.reviewId) ?? []), r]);
  const live = [...byReview.entries()].filter(([, list]) => list.at(-1)!.state === 'published');
  if (live.length === 0) return [];
  const ids = live.map(([id]) => id);
  const reviewRows = db.select({ id: reviews.id, slug: reviews.slug, authorName: users.name }).from(reviews).leftJoin(users, eq(users.id, reviews.authorId)).where(inArray(reviews.id, ids)).all();
  const itemRows = db
    .select({ reviewId: reviewItems.reviewId, slug: gearItems.slug, name: gearItems.name })
    .from(reviewItems)
    .innerJoin(gearItems, eq(gearItems.id, reviewItems.gearItemId))
    .where(and(inArray(reviewItems.reviewId, ids), isNotNull(gearItems.approvedAt)))
    .orderBy(asc(gearItems.name))
    .all();
  const info = new Map(reviewRows.map((r) => [r.id, r]));
  return live
    .map(([id, list]) => {
      const rev = list.at(-1)!;
      return {
        slug: info.get(id)?.slug ?? '',
        title: rev.title,
        summary: rev.summary,
        verdict: rev.verdict,
        authorName: info.get(id)?.authorName ?? 'Former member',
        disclosure: rev.disclosure,
        firstPublishedAt: list[0]!.publishedAt,
        updatedAt: rev.publishedAt,
        revisionNumber: rev.number,
        items: itemRows.filter((i) => i.reviewId === id).map(({ slug, name }) => ({ slug, name })),
      };
    })
    .sort((a, b) => (b.updatedAt?.getTime() ?? 0) - (a.updatedAt?.getTime() ?? 0))
    .slice(0, limit);
}

export interface WritingData {
  review: Review;
  revision: ReviewRevision;
  items: ReviewItemRef[];
  events: ReviewEvent[];
  editable: boolean;
  actions: WorkflowAction[];
  isCorrection: boolean;
  latestPublicNumber: number | null;
  /** Where-to-buy links of the working revision. */
  buyLinks: BuyLink[];
}

/** The author's writing page: 404 when not visible, 403 for editors who are not the author. */
export function getReviewForWriting(db: Db, reviewId: string, actor: Actor): WritingData {
  const { review, revisions } = findVisible(db, 'id', reviewId, actor);
  if (actor.id !== review.authorId) throw new AppError('forbidden', 'Only the author writes this review; editors read it on the review desk.');
  const revision = latest(revisions);
  return {
    review,
    revision,
    items: itemsOf(db, review.id),
    events: eventsOf(db, revisions),
    editable: canEditText(revision.state, actor, review.authorId),
    actions: availableActions({ kind: 'review', state: revision.state, actor, authorId: review.authorId }),
    isCorrection: revision.number > 1,
    latestPublicNumber: latestPublic(revisions)?.number ?? null,
    buyLinks: buyLinksOf(db, revision.id),
  };
}

export interface DeskReviewData extends WritingData {
  authorName: string;
  publicRevision: ReviewRevision | null;
}

/** The editor's read view on the desk: editors and admins only (403 for others who can see it, 404 otherwise). */
export function getReviewForDesk(db: Db, reviewId: string, actor: Actor): DeskReviewData {
  const { review, revisions } = findVisible(db, 'id', reviewId, actor);
  if (!hasRole(actor, 'editor')) throw new AppError('forbidden', 'The review desk is for editors.');
  const revision = latest(revisions);
  const actions = new Set<WorkflowAction>(availableActions({ kind: 'review', state: revision.state, actor, authorId: review.authorId }));
  const pub = latestPublic(revisions) ?? null;
  if (pub?.state === 'published' && availableActions({ kind: 'review', state: 'published', actor, authorId: review.authorId }).includes('retract')) actions.add('retract');
  return {
    review,
    revision,
    items: itemsOf(db, review.id),
    events: eventsOf(db, revisions),
    editable: false,
    actions: [...actions].filter((a) => a !== 'start-correction' && a !== 'submit' && a !== 'withdraw'),
    isCorrection: revision.number > 1,
    latestPublicNumber: pub?.number ?? null,
    buyLinks: buyLinksOf(db, revision.id),
    authorName: authorName(db, review.authorId),
    publicRevision: pub,
  };
}

export interface MyReviewRow {
  id: string;
  slug: string;
  title: string;
  state: WorkflowState;
  revisionNumber: number;
  updatedAt: Date;
  isPublic: boolean;
}

/** The author's own reviews for /write, latest change first. */
export function listMyReviews(db: Db, authorId: string): MyReviewRow[] {
  const mine = db.select().from(reviews).where(eq(reviews.authorId, authorId)).all();
  if (mine.length === 0) return [];
  const revs = db
    .select()
    .from(reviewRevisions)
    .where(
      inArray(
        reviewRevisions.reviewId,
        mine.map((r) => r.id),
      ),
    )
    .orderBy(asc(reviewRevisions.number))
    .all();
  return mine
    .flatMap((r) => {
      const list = revs.filter((v) => v.reviewId === r.id);
      const last = list.at(-1);
      if (!last) return [];
      return [{ id: r.id, slug: r.slug, title: last.title, state: last.state, revisionNumber: last.number, updatedAt: last.updatedAt, isPublic: list.some((v) => isPublicState(v.state)) }];
    })
    .sort((a, b) => b.updatedAt.getTime() - a.updatedAt.getTime());
}

export interface PickableItem {
  id: string;
  slug: string;
  name: string;
  maker: string;
  category: string;
  mine: boolean;
  isPublic: boolean;
}

/** Items a writer may pick: their own (any state) and every approved item. */
export function listPickableItems(db: Db, actor: Actor): PickableItem[] {
  return db
    .select({ id: gearItems.id, slug: gearItems.slug, name: gearItems.name, maker: gearItems.maker, category: gearItems.category, ownerId: gearItems.ownerId, approvedAt: gearItems.approvedAt })
    .from(gearItems)
    .where(or(eq(gearItems.ownerId, actor.id), isNotNull(gearItems.approvedAt)))
    .orderBy(asc(gearItems.maker), asc(gearItems.name))
    .all()
    .map(({ ownerId, approvedAt, ...rest }) => ({ ...rest, mine: ownerId === actor.id, isPublic: approvedAt !== null }));
}

export interface SpecTableItem {
  slug: string;
  name: string;
  maker: string;
  category: string;
  specs: { key: string; mode: string; basis: 'claimed' | 'measured'; value: number; sd: number | null; n: number | null; fieldTestId: string | null }[];
}

/**
 * Gear items for a `::spec-table[…]` directive, in the order asked. Public items for everyone; the
 * viewer's own and (for editors) unapproved items too. Unknown or hidden slugs are simply absent.
 */
export function specTableItems(db: Db, slugs: string[], viewer: Actor | null): SpecTableItem[] {
  const wanted = slugs.filter((s) => typeof s === 'string' && s.length <= 120).slice(0, 12);
  if (wanted.length === 0) return [];
  const rows = db.select().from(gearItems).where(inArray(gearItems.slug, wanted)).all();
  const visible = rows.filter((r) => r.approvedAt !== null || (!!viewer && (viewer.id === r.ownerId || hasRole(viewer, 'editor'))));
  if (visible.length === 0) return [];
  const specRows = db
    .select()
    .from(specs)
    .where(
      inArray(
        specs.gearItemId,
        visible.map((r) => r.id),
      ),
    )
    .orderBy(asc(specs.key), asc(specs.mode))
    .all();
  const bySlug = new Map(visible.map((r) => [r.slug, r]));
  return wanted.flatMap((slug) => {
    const item = bySlug.get(slug);
    if (!item) return [];
    return [
      {
        slug,
        name: item.name,
        maker: item.maker,
        category: item.category,
        specs: specRows
          .filter((s) => s.gearItemId === item.id)
          .map((s) => ({ key: s.key, mode: s.mode, basis: s.basis, value: s.value, sd: s.sd, n: s.n, fieldTestId: s.fieldTestId })),
      },
    ];
  });
}

/* ------------------------------------------------------------------------------------------------ */
/* Mail recipients and their settings                                                               */
/* ------------------------------------------------------------------------------------------------ */

export const DEFAULT_NOTIFICATION_SETTINGS: NotificationSettings = { reviewSubmitted: true, changesRequested: true, approved: true, published: true, retracted: true };

/** A user's mail switches (all on when never saved). */
export function getNotificationSettings(db: Q, userId: string): NotificationSettings {
  const row = db.select().from(notificationSettings).where(eq(notificationSettings.userId, userId)).get();
  if (!row) return { ...DEFAULT_NOTIFICATION_SETTINGS };
  return { reviewSubmitted: row.reviewSubmitted, changesRequested: row.changesRequested, approved: row.approved, published: row.published, retracted: row.retracted };
}

/** Saves the signed-in user's own switches (422 on bad input, nothing written). */
export function saveNotificationSettings(db: Db, actor: Actor, raw: unknown, now = new Date()): NotificationSettings {
  const input = parseWith(notificationSettingsSchema, raw);
  db.insert(notificationSettings)
    .values({ userId: actor.id, ...input, updatedAt: now })
    .onConflictDoUpdate({ target: notificationSettings.userId, set: { ...input, updatedAt: now } })
    .run();
  return input;
}

/** Editors and admins who get a mail when a draft is submitted: never the author, never disabled accounts, never those who turned it off. */
export function editorRecipients(db: Db, exceptUserId: string): { id: string; email: string; name: string }[] {
  return db
    .select({ id: users.id, email: users.email, name: users.name, disabledAt: users.disabledAt, wants: notificationSettings.reviewSubmitted })
    .from(users)
    .leftJoin(notificationSettings, eq(notificationSettings.userId, users.id))
    .where(inArray(users.role, ['editor', 'admin']))
    .all()
    .filter((u) => u.disabledAt === null && u.id !== exceptUserId && u.wants !== false)
    .map(({ id, email, name }) => ({ id, email, name }));
}

/** The author's address for a decision's mail, or null (disabled or deleted account, or that mail turned off). */
export function authorRecipient(db: Db, authorId: string, setting: Exclude<keyof NotificationSettings, 'reviewSubmitted'>): { id: string; email: string; name: string } | null {
  const u = db.select().from(users).where(eq(users.id, authorId)).get();
  if (!u || u.disabledAt !== null) return null;
  return getNotificationSettings(db, authorId)[setting] ? { id: u.id, email: u.email, name: u.name } : null;
}
