/**
 * Field tests: records, trials, readings series and the review workflow (issue 5). The only module that
 * writes field_tests, field_test_items, trials and field_test_state_events, and measured specs.
 *
 * - Visibility and edit rights: db/field-tests-access.ts (404 → 403 → 409).
 * - A trial holds typed values or one readings series stored as a TBS1 blob (lib/readings `encodeSeries`).
 * - Transitions go through lib/workflow `decide` (kind `record`); each writes a state event.
 * - Approval runs the analysis over every row of every trial, writes the measured specs of the items
 *   (mean ± sd, n, linked to the test; the latest approved test of a kind wins) and recomputes the
 *   stored ratios of public items — all in one synchronous immediate transaction.
 *
 * Every multi-statement write is one synchronous `behavior: 'immediate'` transaction.
 */
import { randomUUID } from 'node:crypto';
import { and, asc, eq, inArray, max } from 'drizzle-orm';
import type { Db } from './connection';
import {
  fieldTestItems,
  fieldTests,
  fieldTestStateEvents,
  gearItems,
  readings,
  specs,
  trials,
  type FieldTest,
  type GearItem,
  type RecordState,
  type Trial,
  type TrialSeriesMeta,
} from './schema';
import { findVisibleGear, recomputeStoredRatios, type Actor } from './gear';
import { currentMeasuredSource, writeMeasuredSpec } from './measured-specs';
import { applyRadioNoiseSpecs, radioNoiseReadinessProblem, RADIO_NOISE_KIND } from './radio-noise';
import { applyMeasuredPorts, assertPortOutputTrial, portOutputReadinessProblem, PORT_OUTPUT_KIND } from './measured-ports';
import { findEditableFieldTest, findVisibleFieldTest, type Q, type Tx } from './field-tests-access';
import { hasRole } from '@/lib/auth/roles';
import { AppError } from '@/lib/http/errors';
import { zodFieldErrors } from '@/lib/http/api';
import { analyzeFieldTest, measuredSpecs, type FieldTestAnalysis, type ItemContext, type TrialInput } from '@/lib/field-tests/analysis';
import { KINDS, type FieldTestKind } from '@/lib/field-tests/kinds';
import { kindCategoryProblem } from '@/lib/field-tests/kind-categories';
import { fieldTestInputSchema, parseTestDateTime, typedKeysFor, typedTrialSchema, type FieldTestInput } from '@/lib/field-tests/schemas';
import { decodeSeries, encodeSeries, type ReadingsMeta, type Sample } from '@/lib/readings';
import { decide, type WorkflowAction } from '@/lib/workflow/transitions';
import type { z } from 'zod';

export { findVisibleFieldTest, findEditableFieldTest, canViewFieldTest, isPublicFieldTest, isFieldTestInsider } from './field-tests-access';

/** Most trials one test may hold. */
export const MAX_TRIALS_PER_TEST = 50;
export const SERIES_FORMAT = 'TBS1';

function parse<S extends z.ZodType>(schema: S, raw: unknown): z.output<S> {
  const r = schema.safeParse(raw);
  if (!r.success) throw new AppError('invalid', 'Some fields are not valid.', { fields: zodFieldErrors(r.error) });
  return r.data;
}

function event(tx: Tx, testId: string, from: RecordState | null, to: RecordState, actorId: string, at: Date, comment = '') {
  tx.insert(fieldTestStateEvents).values({ fieldTestId: testId, fromState: from, toState: to, actorId, comment, createdAt: at }).run();
}

function touch(tx: Tx, testId: string, at: Date) {
  tx.update(fieldTests).set({ updatedAt: at }).where(eq(fieldTests.id, testId)).run();
}

/** The items named by slug, each visible to the actor (else a 422 naming the slug: no draft of someone else leaks). */
function resolveItems(tx: Q, slugs: readonly string[], actor: Actor): GearItem[] {
  const missing: string[] = [];
  const items: GearItem[] = [];
  for (const slug of slugs) {
    try {
      items.push(findVisibleGear(tx, slug, actor));
    } catch (e) {
      if (e instanceof AppError && e.code === 'not_found') missing.push(slug);
      else throw e;
    }
  }
  if (missing.length) {
    throw new AppError('invalid', 'Some items are not in the catalog, or you may not see them.', {
      fields: { items: missing.map((s) => `No gear item “${s}”, or you may not see it.`) },
    });
  }
  return items;
}

/** Every item must be of a category the test kind can measure (lib/field-tests/kind-categories.ts): a 422 naming each misfit. */
function assertKindFitsItems(kind: FieldTestKind, items: readonly GearItem[]): void {
  const problems = items.map((i) => kindCategoryProblem(kind, i)).filter((p): p is string => p !== null);
  if (problems.length) throw new AppError('invalid', problems[0]!, { fields: { items: problems } });
}

function recordColumns(data: FieldTestInput) {
  return {
    kind: data.kind,
    testedAt: parseTestDateTime(data.testedAt),
    placeLabel: data.placeLabel,
    sky: data.sky,
    ambientC: data.ambientC,
    instruments: data.instruments.map((i) => (i.accuracy ? { name: i.name, accuracy: i.accuracy } : { name: i.name })),
    methodNotes: data.methodNotes,
  };
}

/** Creates a draft field test (reviewers and above) from raw input (`fieldTestInputSchema`). */
export function createFieldTest(db: Db, actor: Actor, raw: unknown, now = new Date()): { id: string } {
  if (!hasRole(actor, 'reviewer')) throw new AppError('forbidden', 'Only reviewers, editors and admins log field tests.');
  const data = parse(fieldTestInputSchema, raw);
  return db.transaction(
    (tx) => {
      const items = resolveItems(tx, data.items, actor);
      assertKindFitsItems(data.kind, items);
      const id = randomUUID();
      tx.insert(fieldTests)
        .values({ id, ownerId: actor.id, ...recordColumns(data), status: 'draft', createdAt: now, updatedAt: now })
        .run();
      tx.insert(fieldTestItems)
        .values(items.map((i) => ({ fieldTestId: id, gearItemId: i.id })))
        .run();
      event(tx, id, null, 'draft', actor.id, now);
      return { id };
    },
    { behavior: 'immediate' },
  );
}

/** Updates the author's own draft (or returned) field test. An item with trials cannot be removed. */
export function updateFieldTest(db: Db, actor: Actor, id: string, raw: unknown, now = new Date()): { id: string } {
  const data = parse(fieldTestInputSchema, raw);
  return db.transaction(
    (tx) => {
      const { test, items: before } = findEditableFieldTest(tx, id, actor);
      const kept = new Set(before.map((i) => i.id));
      // Items already in the test stay allowed even if they are no longer visible to the author.
      const bySlug = new Map(before.map((i) => [i.slug, i]));
      const items = [...data.items.filter((s) => bySlug.has(s)).map((s) => bySlug.get(s)!), ...resolveItems(tx, data.items.filter((s) => !bySlug.has(s)), actor)];
      assertKindFitsItems(data.kind, items);
      const next = new Set(items.map((i) => i.id));
      const removed = [...kept].filter((i) => !next.has(i));
      if (removed.length) {
        const withTrials = tx.select({ item: trials.gearItemId }).from(trials).where(and(eq(trials.fieldTestId, test.id), inArray(trials.gearItemId, removed))).all();
        if (withTrials.length) {
          const names = before.filter((i) => withTrials.some((t) => t.item === i.id)).map((i) => i.name);
          throw new AppError('invalid', 'Some fields are not valid.', { fields: { items: [`Delete the trials of ${names.join(', ')} before removing it from the test.`] } });
        }
      }
      if (data.kind !== test.kind) {
        const n = tx.select({ id: trials.id }).from(trials).where(eq(trials.fieldTestId, test.id)).all().length;
        if (n > 0) throw new AppError('invalid', 'Some fields are not valid.', { fields: { kind: ['The kind cannot change once the test has trials: delete them first.'] } });
      }
      tx.update(fieldTests).set({ ...recordColumns(data), updatedAt: now }).where(eq(fieldTests.id, test.id)).run();
      if (removed.length) tx.delete(fieldTestItems).where(and(eq(fieldTestItems.fieldTestId, test.id), inArray(fieldTestItems.gearItemId, removed))).run();
      const added = items.filter((i) => !kept.has(i.id));
      if (added.length) tx.insert(fieldTestItems).values(added.map((i) => ({ fieldTestId: test.id, gearItemId: i.id }))).run();
      return { id: test.id };
    },
    { behavior: 'immediate' },
  );
}

/* ------------------------------------------------------------------------------------------------ */
/* Trials                                                                                           */
/* ------------------------------------------------------------------------------------------------ */

function itemOfTest(items: readonly GearItem[], slug: string): GearItem {
  const item = items.find((i) => i.slug === slug);
  if (!item) throw new AppError('invalid', 'Some fields are not valid.', { fields: { item: ['Choose one of the items of this test.'] } });
  return item;
}

function nextPosition(tx: Tx, testId: string): number {
  const row = tx.select({ p: max(trials.position) }).from(trials).where(eq(trials.fieldTestId, testId)).get();
  return (row?.p ?? -1) + 1;
}

function assertRoomForTrial(tx: Tx, testId: string) {
  const n = tx.select({ id: trials.id }).from(trials).where(eq(trials.fieldTestId, testId)).all().length;
  if (n >= MAX_TRIALS_PER_TEST) throw new AppError('conflict', `A field test holds at most ${MAX_TRIALS_PER_TEST} trials.`);
}

function existingTrial(tx: Tx, testId: string, trialId: string): Trial {
  const trial = tx.select().from(trials).where(and(eq(trials.id, trialId), eq(trials.fieldTestId, testId))).get();
  if (!trial) throw new AppError('not_found', 'No such trial in this field test.');
  return trial;
}

/** Adds a trial of typed values (e.g. a scale reading) to the author's draft. */
export function addTypedTrial(db: Db, actor: Actor, testId: string, raw: unknown, now = new Date()): { trialId: string } {
  const data = parse(typedTrialSchema, raw);
  return db.transaction(
    (tx) => {
      const { test, items } = findEditableFieldTest(tx, testId, actor);
      const kind = test.kind as FieldTestKind;
      if (KINDS[kind].input === 'series') {
        throw new AppError('invalid', `A ${KINDS[kind].label.toLowerCase()} test takes a readings log, not typed values.`, { fields: { typedValues: ['Upload or type in readings instead.'] } });
      }
      const allowed = typedKeysFor(kind);
      const wrong = Object.keys(data.typedValues).filter((k) => allowed !== null && !allowed.includes(k));
      if (wrong.length) throw new AppError('invalid', 'Some fields are not valid.', { fields: { typedValues: [`A ${KINDS[kind].label.toLowerCase()} test does not record ${wrong.join(', ')}.`] } });
      const item = itemOfTest(items, data.item);
      if (kind === PORT_OUTPUT_KIND) assertPortOutputTrial(tx, item, data.typedValues);
      assertRoomForTrial(tx, test.id);
      const trialId = randomUUID();
      tx.insert(trials)
        .values({ id: trialId, fieldTestId: test.id, gearItemId: item.id, label: data.label, typedValues: data.typedValues, position: nextPosition(tx, test.id), createdAt: now })
        .run();
      touch(tx, test.id, now);
      return { trialId };
    },
    { behavior: 'immediate' },
  );
}

export interface SeriesToSave {
  item: string;
  label: string;
  /** Replace the series of this trial (same test) instead of adding one. */
  trialId?: string;
  samples: readonly Sample[];
  meta: ReadingsMeta;
  source: { kind: 'csv'; fileName: string; fileBytes: number } | { kind: 'typed' };
}

/**
 * Stores a parsed readings series (already validated by lib/readings on the server) as a trial of the
 * author's draft, encoded with `encodeSeries`. The switch-on time comes from the log when it has zoned clock times.
 */
export function saveTrialSeries(db: Db, actor: Actor, testId: string, input: SeriesToSave, now = new Date()): { trialId: string; rows: number; bytes: number } {
  if (input.samples.length === 0) throw new AppError('invalid', 'The readings are empty.');
  const encoded = encodeSeries(input.samples);
  const meta: TrialSeriesMeta = {
    source: input.source.kind,
    ...(input.source.kind === 'csv' && { fileName: input.source.fileName.slice(0, 200), fileBytes: input.source.fileBytes }),
    timeUnit: input.meta.timeUnit,
    fields: input.meta.fields,
    dataRows: input.meta.dataRows,
    droppedBeforeSwitchOn: input.meta.droppedBeforeSwitchOn,
    droppedRows: input.meta.droppedRows.length,
    durationS: input.meta.durationS,
  };
  const columns = {
    series: Buffer.from(encoded.buffer, encoded.byteOffset, encoded.byteLength),
    seriesFormat: SERIES_FORMAT,
    seriesLength: input.samples.length,
    seriesMeta: meta,
    seriesNotes: input.meta.notes,
    switchedOnAt: input.meta.switchOnEpochMs === null ? null : new Date(input.meta.switchOnEpochMs),
  };
  return db.transaction(
    (tx) => {
      const { test, items } = findEditableFieldTest(tx, testId, actor);
      const kind = test.kind as FieldTestKind;
      if (KINDS[kind].input === 'typed') {
        throw new AppError('invalid', `A ${KINDS[kind].label.toLowerCase()} test takes typed values, not a readings log.`, { fields: { file: ['Type in the figures instead.'] } });
      }
      const fieldSets = KINDS[kind].seriesFields;
      if (!fieldSets.some((set) => set.every((f) => input.meta.fields.includes(f)))) {
        const want = fieldSets.map((set) => set.join(' and ')).join(', or ');
        throw new AppError('invalid', `A ${KINDS[kind].label.toLowerCase()} log needs a column of ${want.replace('value', 'light output')}.`, { fields: { selection: [`Choose a ${want.replace('value', 'light output')} column.`] } });
      }
      const item = itemOfTest(items, input.item);
      let trialId: string;
      if (input.trialId) {
        const trial = existingTrial(tx, test.id, input.trialId);
        trialId = trial.id;
        tx.update(trials).set({ ...columns, gearItemId: item.id, label: input.label, typedValues: null }).where(eq(trials.id, trialId)).run();
        tx.delete(readings).where(eq(readings.trialId, trialId)).run();
      } else {
        assertRoomForTrial(tx, test.id);
        trialId = randomUUID();
        tx.insert(trials)
          .values({ id: trialId, fieldTestId: test.id, gearItemId: item.id, label: input.label, position: nextPosition(tx, test.id), createdAt: now, ...columns })
          .run();
      }
      touch(tx, test.id, now);
      return { trialId, rows: input.samples.length, bytes: encoded.byteLength };
    },
    { behavior: 'immediate' },
  );
}

/** Deletes a trial of the author's draft. */
export function deleteTrial(db: Db, actor: Actor, testId: string, trialId: string, now = new Date()): void {
  db.transaction(
    (tx) => {
      const { test } = findEditableFieldTest(tx, testId, actor);
      const trial = existingTrial(tx, test.id, trialId);
      tx.delete(trials).where(eq(trials.id, trial.id)).run();
      touch(tx, test.id, now);
    },
    { behavior: 'immediate' },
  );
}

/** Every sample of a trial: the TBS1 series, or (older data) its rows in the legacy readings table. */
export function trialSamples(db: Q, trial: Pick<Trial, 'id' | 'series' | 'seriesFormat'>): Sample[] {
  if (trial.series) {
    const decoded = decodeSeries(new Uint8Array(trial.series.buffer, trial.series.byteOffset, trial.series.byteLength));
    if (!decoded.ok) throw new Error(`Trial ${trial.id}: stored series cannot be decoded (${decoded.error})`);
    return decoded.samples;
  }
  return db
    .select()
    .from(readings)
    .where(eq(readings.trialId, trial.id))
    .orderBy(asc(readings.seq))
    .all()
    .map((r) => {
      const s: Sample = { t: r.t };
      if (r.value !== null) s.value = r.value;
      if (r.watts !== null) s.watts = r.watts;
      if (r.volts !== null) s.volts = r.volts;
      if (r.amps !== null) s.amps = r.amps;
      return s;
    });
}

/* ------------------------------------------------------------------------------------------------ */
/* Analysis                                                                                         */
/* ------------------------------------------------------------------------------------------------ */

export function trialsOfTest(db: Q, testId: string): Trial[] {
  return db.select().from(trials).where(eq(trials.fieldTestId, testId)).orderBy(asc(trials.position), asc(trials.createdAt), asc(trials.id)).all();
}

/** Rated energy and rated power the items claim (for delivered ÷ rated and a panel's share of rating). */
export function itemContexts(db: Q, items: readonly GearItem[]): Record<string, ItemContext> {
  const out: Record<string, ItemContext> = {};
  if (items.length === 0) return out;
  const rows = db
    .select({ item: specs.gearItemId, key: specs.key, value: specs.value })
    .from(specs)
    .where(and(inArray(specs.gearItemId, items.map((i) => i.id)), eq(specs.basis, 'claimed'), eq(specs.mode, ''), inArray(specs.key, ['ratedEnergy', 'ratedPower'])))
    .all();
  for (const i of items) out[i.id] = {};
  for (const r of rows) {
    if (r.key === 'ratedEnergy') out[r.item]!.ratedEnergyWh = r.value;
    if (r.key === 'ratedPower') out[r.item]!.ratedW = r.value;
  }
  return out;
}

/** Runs lib/field-tests analysis over every row of every trial. */
export function analyzeStoredTest(db: Q, test: FieldTest, items: readonly GearItem[], list: readonly Trial[] = trialsOfTest(db, test.id)): { analysis: FieldTestAnalysis; samples: Map<string, Sample[]> } {
  const samples = new Map<string, Sample[]>();
  const inputs: TrialInput[] = list.map((t) => {
    const s = trialSamples(db, t);
    samples.set(t.id, s);
    return { itemId: t.gearItemId, id: t.id, label: t.label, samples: s, typed: t.typedValues };
  });
  return { analysis: analyzeFieldTest(test.kind as FieldTestKind, inputs, itemContexts(db, items)), samples };
}

/** Why a test cannot go to review or be approved yet, or null. */
function readinessProblem(test: FieldTest, items: readonly GearItem[], list: readonly Trial[], analysis: FieldTestAnalysis): string | null {
  if (list.length === 0) return 'Add at least one trial before submitting.';
  const without = items.filter((i) => !list.some((t) => t.gearItemId === i.id));
  if (without.length) return `Add a trial for ${without.map((i) => i.name).join(', ')}, or remove it from the test.`;
  const bad = analysis.trials.find((t) => !t.ok);
  if (bad && !bad.ok) {
    const trial = list.find((t) => t.id === bad.id);
    return `${trial?.label || 'A trial'}: ${bad.error.message}`;
  }
  return null;
}

/* ------------------------------------------------------------------------------------------------ */
/* Workflow                                                                                         */
/* ------------------------------------------------------------------------------------------------ */

export type FieldTestAction = Extract<WorkflowAction, 'submit' | 'withdraw' | 'request-changes' | 'approve'>;

/**
 * Moves a field test through the workflow (lib/workflow, kind `record`): 404 when not visible, then
 * 403/409/422 from `decide`, then 422 when a test is not ready (no trials, a trial that fails analysis).
 * Approval writes the measured specs and recomputes stored ratios in the same immediate transaction.
 */
export function transitionFieldTest(db: Db, actor: Actor, id: string, action: FieldTestAction, comment = '', now = new Date()): { id: string; status: RecordState; measured: number } {
  return db.transaction(
    (tx) => {
      const { test, items } = findVisibleFieldTest(tx, id, actor);
      const decision = decide({ kind: 'record', state: test.status, action, actor, authorId: test.ownerId, comment });
      if (!decision.ok) {
        if (decision.code === 'forbidden') console.warn(`field test ${id}: ${action} refused to ${actor.id}`);
        throw new AppError(decision.code, decision.message, decision.code === 'invalid' ? { fields: { comment: [decision.message] } } : {});
      }
      const to = decision.to as RecordState;
      let measured = 0;
      if ((action === 'submit' || action === 'approve') && test.kind === RADIO_NOISE_KIND) {
        // Band readings instead of trials (db/radio-noise.ts).
        const problem = radioNoiseReadinessProblem(tx, test, items);
        if (problem) throw new AppError('invalid', problem);
        if (action === 'approve') measured = applyRadioNoiseSpecs(tx, actor, test, items, now);
      } else if (action === 'submit' || action === 'approve') {
        const list = trialsOfTest(tx, test.id);
        const { analysis } = analyzeStoredTest(tx, test, items, list);
        const problem = readinessProblem(test, items, list, analysis) ?? (test.kind === PORT_OUTPUT_KIND ? portOutputReadinessProblem(tx, items, list) : null);
        if (problem) throw new AppError('invalid', problem);
        if (action === 'approve') measured = applyMeasuredSpecs(tx, actor, test, items, analysis, now) + (test.kind === PORT_OUTPUT_KIND ? applyMeasuredPorts(tx, test, analysis, now, actor.id) : 0);
      }
      tx.update(fieldTests)
        .set({ status: to, updatedAt: now, ...(action === 'approve' && { approvedAt: now }) })
        .where(eq(fieldTests.id, test.id))
        .run();
      event(tx, test.id, test.status, to, actor.id, now, decision.comment);
      return { id: test.id, status: to, measured };
    },
    { behavior: 'immediate' },
  );
}

/**
 * Writes the measured specs of an approved test: mean ± sd (n) per item and spec key, linked to the test.
 * A figure from a test carried out later (by test date) is kept: the latest test of a kind wins, and
 * earlier tests stay linked from the item through field_test_items. Changes are logged in spec_changes;
 * a public item whose figure changes gets a dated "figures updated" note. Returns the figures written.
 */
function applyMeasuredSpecs(tx: Tx, actor: Actor, test: FieldTest, items: readonly GearItem[], analysis: FieldTestAnalysis, at: Date): number {
  let written = 0;
  const touched = new Set<string>();
  for (const m of measuredSpecs(analysis)) {
    const current = currentMeasuredSource(tx, m.itemId, m.key);
    if (current?.testedAt && current.fieldTestId !== test.id && current.approvedAt && current.testedAt.getTime() > test.testedAt.getTime()) continue;
    writeMeasuredSpec(tx, actor, items.find((i) => i.id === m.itemId), { ...m, fieldTestId: test.id, testedAt: test.testedAt }, current, at);
    touched.add(m.itemId);
    written += 1;
  }
  for (const itemId of touched) {
    const item = tx.select().from(gearItems).where(eq(gearItems.id, itemId)).get();
    if (item?.approvedAt) recomputeStoredRatios(tx, item, at);
  }
  return written;
}
