/**
 * Field tests: what pages and routes read (every read checks visibility: db/field-tests-access.ts).
 */
import { and, asc, desc, eq, inArray, isNotNull } from 'drizzle-orm';
import type { Db } from './connection';
import { fieldTestItems, fieldTests, fieldTestStateEvents, gearItems, users, type FieldTest, type RecordState, type TrialSeriesMeta } from './schema';
import type { Actor } from './gear';
import { canViewFieldTest, findVisibleFieldTest, isFieldTestInsider, isPublicFieldTest, itemsOfTest } from './field-tests-access';
import { analyzeStoredTest, itemContexts, trialsOfTest } from './field-tests';
import { hasRole } from '@/lib/auth/roles';
import type { FieldTestAnalysis, ItemContext, TrialAnalysis } from '@/lib/field-tests/analysis';
import type { FieldTestKind } from '@/lib/field-tests/kinds';
import { powerOf } from '@/lib/field-tests/analysis';
import { availableActions, type WorkflowAction } from '@/lib/workflow/transitions';
import { downsample, CHART_POINTS, type Sample } from '@/lib/readings';

export interface FieldTestItemView {
  id: string;
  slug: string;
  name: string;
  maker: string;
  category: string;
  public: boolean;
  context: ItemContext;
}

export interface TrialView {
  id: string;
  itemId: string;
  label: string;
  switchedOnAt: Date | null;
  typedValues: Record<string, number> | null;
  /** Every row stored; `chartSamples` is a thinned copy (about 2 000 points) for drawing only. */
  rows: number;
  seriesBytes: number;
  chartSamples: Sample[];
  seriesMeta: TrialSeriesMeta | null;
  notes: string[];
  analysis: TrialAnalysis;
}

export interface FieldTestView {
  test: FieldTest & { ownerName: string };
  kind: FieldTestKind;
  items: FieldTestItemView[];
  trials: TrialView[];
  analysis: FieldTestAnalysis;
  /** Public to everyone (approved, every item public); false → shown to insiders only, marked pending. */
  public: boolean;
  insider: boolean;
  canEdit: boolean;
  actions: WorkflowAction[];
  events: { fromState: RecordState | null; toState: RecordState; comment: string; actorName: string | null; createdAt: Date }[];
}

function chartCopy(kind: FieldTestKind, samples: readonly Sample[]): Sample[] {
  const y = (s: Sample) => (kind === 'light-runtime' || kind === 'light-output' ? (s.value ?? 0) : (powerOf(s) ?? s.value ?? 0));
  return downsample(samples, y, CHART_POINTS);
}

/** Everything the field test pages show, for this viewer (AppError 404 when the viewer may not see it). */
export function getFieldTestView(db: Db, id: string, viewer: Actor | null): FieldTestView {
  const { test, items } = findVisibleFieldTest(db, id, viewer);
  const kind = test.kind as FieldTestKind;
  const list = trialsOfTest(db, test.id);
  const { analysis, samples } = analyzeStoredTest(db, test, items, list);
  const contexts = itemContexts(db, items);
  const owner = db.select({ name: users.name }).from(users).where(eq(users.id, test.ownerId)).get();
  const insider = isFieldTestInsider(viewer, test, items);
  const order = new Map(list.map((t, i) => [t.gearItemId, i]));
  const itemViews = items
    .map((i) => ({ id: i.id, slug: i.slug, name: i.name, maker: i.maker, category: i.category, public: i.approvedAt !== null, context: contexts[i.id] ?? {} }))
    .sort((a, b) => (order.get(a.id) ?? 99) - (order.get(b.id) ?? 99) || a.name.localeCompare(b.name));
  const trialViews: TrialView[] = list.map((t, i) => {
    const s = samples.get(t.id) ?? [];
    return {
      id: t.id,
      itemId: t.gearItemId,
      label: t.label,
      switchedOnAt: t.switchedOnAt,
      typedValues: t.typedValues,
      rows: s.length,
      seriesBytes: t.series?.byteLength ?? 0,
      chartSamples: chartCopy(kind, s),
      seriesMeta: t.seriesMeta,
      notes: t.seriesNotes,
      analysis: analysis.trials[i]!,
    };
  });
  const events = insider
    ? db
        .select({ fromState: fieldTestStateEvents.fromState, toState: fieldTestStateEvents.toState, comment: fieldTestStateEvents.comment, actorName: users.name, createdAt: fieldTestStateEvents.createdAt })
        .from(fieldTestStateEvents)
        .leftJoin(users, eq(users.id, fieldTestStateEvents.actorId))
        .where(eq(fieldTestStateEvents.fieldTestId, test.id))
        .orderBy(desc(fieldTestStateEvents.createdAt), desc(fieldTestStateEvents.id))
        .all()
    : [];
  const actions = viewer ? availableActions({ kind: 'record', state: test.status, actor: viewer, authorId: test.ownerId }).filter((a) => a === 'submit' || a === 'withdraw' || a === 'request-changes' || a === 'approve') : [];
  return {
    test: { ...test, ownerName: owner?.name ?? 'Unknown' },
    kind,
    items: itemViews,
    trials: trialViews,
    analysis,
    public: isPublicFieldTest(test, items),
    insider,
    canEdit: !!viewer && viewer.id === test.ownerId && hasRole(viewer, 'reviewer') && (test.status === 'draft' || test.status === 'changes-requested'),
    actions,
    events,
  };
}

export interface FieldTestRow {
  id: string;
  kind: FieldTestKind;
  testedAt: Date;
  placeLabel: string;
  status: RecordState;
  public: boolean;
  items: { slug: string; name: string }[];
  updatedAt: Date;
}

function rowsFor(db: Db, tests: FieldTest[]): FieldTestRow[] {
  if (tests.length === 0) return [];
  const links = db
    .select({ testId: fieldTestItems.fieldTestId, slug: gearItems.slug, name: gearItems.name, approvedAt: gearItems.approvedAt })
    .from(fieldTestItems)
    .innerJoin(gearItems, eq(gearItems.id, fieldTestItems.gearItemId))
    .where(inArray(fieldTestItems.fieldTestId, tests.map((t) => t.id)))
    .orderBy(asc(gearItems.name))
    .all();
  return tests.map((t) => {
    const its = links.filter((l) => l.testId === t.id);
    return {
      id: t.id,
      kind: t.kind as FieldTestKind,
      testedAt: t.testedAt,
      placeLabel: t.placeLabel,
      status: t.status,
      public: isPublicFieldTest(t, its),
      items: its.map((l) => ({ slug: l.slug, name: l.name })),
      updatedAt: t.updatedAt ?? t.createdAt,
    };
  });
}

/** A user's own field tests, newest change first (for the logbook). */
export function listOwnFieldTests(db: Db, ownerId: string): FieldTestRow[] {
  const tests = db.select().from(fieldTests).where(eq(fieldTests.ownerId, ownerId)).all();
  return rowsFor(db, tests).sort((a, b) => b.updatedAt.getTime() - a.updatedAt.getTime());
}

/** Field tests waiting for an editor, oldest first (editors and admins only; [] for anyone else). */
export function listFieldTestsInReview(db: Db, viewer: Actor): FieldTestRow[] {
  if (!hasRole(viewer, 'editor')) return [];
  const tests = db.select().from(fieldTests).where(eq(fieldTests.status, 'in-review')).all();
  return rowsFor(db, tests).sort((a, b) => a.updatedAt.getTime() - b.updatedAt.getTime());
}

/**
 * The field tests of an item that this viewer may see, newest test first: approved public ones for everyone,
 * and (marked `public: false`) the pending ones for the author, the item's owner and editors.
 */
export function listItemFieldTests(db: Db, itemId: string, viewer: Actor | null): FieldTestRow[] {
  const ids = db.select({ id: fieldTestItems.fieldTestId }).from(fieldTestItems).where(eq(fieldTestItems.gearItemId, itemId)).all().map((r) => r.id);
  if (ids.length === 0) return [];
  const tests = db.select().from(fieldTests).where(inArray(fieldTests.id, ids)).orderBy(desc(fieldTests.testedAt)).all();
  const visible = tests.filter((t) => canViewFieldTest(viewer, t, itemsOfTest(db, t.id)));
  return rowsFor(db, visible);
}

/** Approved field tests (every item public), newest first — for a public index. */
export function listPublicFieldTests(db: Db): FieldTestRow[] {
  const tests = db.select().from(fieldTests).where(and(eq(fieldTests.status, 'approved'), isNotNull(fieldTests.approvedAt))).orderBy(desc(fieldTests.testedAt)).all();
  return rowsFor(db, tests).filter((r) => r.public);
}
