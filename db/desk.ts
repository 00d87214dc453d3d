/**
 * The review desk: everything waiting for an editor, oldest first. Reviews come from db/reviews.ts's
 * tables; gear items and field tests in review are read here, read-only (their workflow belongs to the
 * gear catalog, db/gear.ts), and linked to their pages.
 */
import { and, asc, desc, eq, inArray } from 'drizzle-orm';
import type { Db } from './connection';
import { fieldTestItems, fieldTests, fieldTestStateEvents, gearItems, gearStateEvents, reviewRevisions, reviews, reviewStateEvents } from './schema';
import type { DeskKind } from '@/lib/reviews/schemas';
import { longTermNoteDeskRows } from './long-term-notes';
import { userNamesById } from './users';

export interface DeskRow {
  kind: DeskKind;
  id: string;
  title: string;
  authorId: string;
  authorName: string;
  /** in-review, or approved (a review waiting to be published). */
  state: 'in-review' | 'approved';
  /** When it reached its present state. */
  since: Date;
  href: string;
  /** For reviews: the revision waiting; > 1 means a correction. */
  revisionNumber?: number;
  detail: string;
}

export interface DeskFilters {
  author?: string;
  kind?: DeskKind;
}


function reviewRows(db: Db): DeskRow[] {
  const revs = db.select().from(reviewRevisions).orderBy(asc(reviewRevisions.number)).all();
  const latest = new Map<string, (typeof revs)[number]>();
  for (const r of revs) latest.set(r.reviewId, r);
  const waiting = [...latest.values()].filter((r) => r.state === 'in-review' || r.state === 'approved');
  if (waiting.length === 0) return [];
  const reviewInfo = new Map(
    db
      .select()
      .from(reviews)
      .where(
        inArray(
          reviews.id,
          waiting.map((r) => r.reviewId),
        ),
      )
      .all()
      .map((r) => [r.id, r]),
  );
  const who = userNamesById(db, [...reviewInfo.values()].map((r) => r.authorId));
  return waiting.map((rev) => {
    const review = reviewInfo.get(rev.reviewId)!;
    const since =
      db
        .select({ at: reviewStateEvents.createdAt })
        .from(reviewStateEvents)
        .where(and(eq(reviewStateEvents.revisionId, rev.id), eq(reviewStateEvents.toState, rev.state)))
        .orderBy(desc(reviewStateEvents.createdAt))
        .get()?.at ?? rev.updatedAt;
    return {
      kind: 'review' as const,
      id: review.id,
      title: rev.title,
      authorId: review.authorId,
      authorName: who.get(review.authorId) ?? 'Former member',
      state: rev.state as 'in-review' | 'approved',
      since,
      href: `/desk/reviews/${encodeURIComponent(review.id)}`,
      revisionNumber: rev.number,
      detail: rev.number > 1 ? `Correction, revision ${rev.number}` : rev.state === 'approved' ? 'Approved, ready to publish' : 'New review',
    };
  });
}

function gearRows(db: Db): DeskRow[] {
  const items = db.select().from(gearItems).where(eq(gearItems.status, 'in-review')).all();
  const who = userNamesById(
    db,
    items.map((i) => i.ownerId),
  );
  return items.map((item) => {
    const since =
      db
        .select({ at: gearStateEvents.createdAt })
        .from(gearStateEvents)
        .where(and(eq(gearStateEvents.gearItemId, item.id), eq(gearStateEvents.toState, 'in-review')))
        .orderBy(desc(gearStateEvents.createdAt))
        .get()?.at ?? item.updatedAt;
    return {
      kind: 'gear-item' as const,
      id: item.id,
      title: `${item.maker} ${item.name}`,
      authorId: item.ownerId,
      authorName: who.get(item.ownerId) ?? 'Former member',
      state: 'in-review' as const,
      since,
      href: `/gear/${encodeURIComponent(item.slug)}`,
      detail: item.approvedAt ? 'Changes to a public item' : 'New gear item',
    };
  });
}

function fieldTestRows(db: Db): DeskRow[] {
  const tests = db.select().from(fieldTests).where(eq(fieldTests.status, 'in-review')).all();
  if (tests.length === 0) return [];
  const who = userNamesById(
    db,
    tests.map((t) => t.ownerId),
  );
  const links = db
    .select({ fieldTestId: fieldTestItems.fieldTestId, slug: gearItems.slug, name: gearItems.name })
    .from(fieldTestItems)
    .innerJoin(gearItems, eq(gearItems.id, fieldTestItems.gearItemId))
    .where(
      inArray(
        fieldTestItems.fieldTestId,
        tests.map((t) => t.id),
      ),
    )
    .all();
  return tests.map((test) => {
    const items = links.filter((l) => l.fieldTestId === test.id);
    const date = test.testedAt.toISOString().slice(0, 10);
    return {
      kind: 'field-test' as const,
      id: test.id,
      title: `${test.kind} test, ${date}${test.placeLabel ? `, ${test.placeLabel}` : ''}`,
      authorId: test.ownerId,
      authorName: who.get(test.ownerId) ?? 'Former member',
      state: 'in-review' as const,
      since:
        db
          .select({ at: fieldTestStateEvents.createdAt })
          .from(fieldTestStateEvents)
          .where(and(eq(fieldTestStateEvents.fieldTestId, test.id), eq(fieldTestStateEvents.toState, 'in-review')))
          .orderBy(desc(fieldTestStateEvents.createdAt))
          .get()?.at ?? test.createdAt,
      href: items[0] ? `/gear/${encodeURIComponent(items[0].slug)}` : '/desk',
      detail: items.length ? `Items: ${items.map((i) => i.name).join(', ')}` : 'No items linked',
    };
  });
}

/** Everything waiting, oldest first, filtered by author id and kind. Callers check the editor role. */
export function listDeskQueue(db: Db, filters: DeskFilters = {}): { rows: DeskRow[]; authors: { id: string; name: string }[] } {
  const all = [
    ...(!filters.kind || filters.kind === 'review' ? reviewRows(db) : []),
    ...(!filters.kind || filters.kind === 'gear-item' ? gearRows(db) : []),
    ...(!filters.kind || filters.kind === 'field-test' ? fieldTestRows(db) : []),
    ...(!filters.kind || filters.kind === 'long-term-note' ? longTermNoteDeskRows(db) : []),
  ];
  const authors = [...new Map(all.map((r) => [r.authorId, r.authorName])).entries()].map(([id, name]) => ({ id, name })).sort((a, b) => a.name.localeCompare(b.name));
  const rows = all.filter((r) => !filters.author || r.authorId === filters.author).sort((a, b) => a.since.getTime() - b.since.getTime());
  return { rows, authors };
}
