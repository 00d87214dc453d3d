/**
 * Gear items: the only module that queries gear_items, specs (claimed), gear_pending_changes,
 * spec_changes, gear_ratios, gear_state_events and gear_figure_notes (ports: db/gear-ports.ts).
 *
 * Model:
 * - `gear_items.status` is the state of the item's latest version (draft → in-review →
 *   changes-requested | approved). `approvedAt` set means an approved version is public.
 * - Before the first approval, edits write the item and its claimed specs directly.
 * - After it, the item row and its `specs` rows stay the approved (public) figures; an edit goes to
 *   `gear_pending_changes` (the whole editable state) and moves `status` back to draft. Approval
 *   applies it, logs each spec change, adds a dated "figures updated" note and recomputes the stored
 *   value ratios, all in one transaction.
 * - Visibility: an item with an approved version is public; otherwise only its author, editors and
 *   admins see it (404 for everyone else). Changing it needs the author or an editor (403).
 *
 * Every multi-statement write is one synchronous `behavior: 'immediate'` transaction.
 */
import { randomUUID } from 'node:crypto';
import { and, asc, desc, eq, inArray, isNotNull } from 'drizzle-orm';
import type { Db } from './connection';
import {
  gearFigureNotes,
  gearItems,
  gearPendingChanges,
  gearRatios,
  gearStateEvents,
  photos,
  specChanges,
  specs,
  users,
  type GearItem,
  type GearPendingData,
  type RecordState,
  type Role,
} from './schema';
import { AppError, zodFieldErrors } from '@/lib/http/errors';
import { hasRole } from '@/lib/auth/roles';
import { airlineBand, isSpecKey, SPECS, valueRatios, type AirlineBand, type Category, type Chemistry, type Money, type SpecKey, type Specs, type ValueRatio } from '@/lib/measure';
import { CATEGORY_DEFS, isLithium } from '@/lib/gear/categories';
import { formatMoney, formatSpec } from '@/lib/gear/format';
import { decide, type WorkflowAction } from '@/lib/workflow/transitions';
import { claimRows, gearInputSchema, gearPatchSchema, portClaims, type ClaimRow, type GearData, type PortClaim } from '@/lib/gear/schemas';
import { CLAIM_SOURCE_LABELS } from '@/lib/gear/categories';
import { describePort } from '@/lib/gear/ports';
import { livePorts, writeLivePorts } from './gear-ports';
import { alsoServesAsOf, liveFeatures, writeLiveAlsoServes, writeLiveFeatures } from './gear-roles';
import { cleanAlsoServes } from '@/lib/gear/roles';
import { FEATURE_DEFS, featuresAsInput, featureText, isFeatureName, type FeatureClaim } from '@/lib/gear/features';

export interface Actor {
  id: string;
  role: Role;
}

type Tx = Parameters<Parameters<Db['transaction']>[0]>[0];
type Q = Db | Tx;

/* ------------------------------------------------------------------------------------------------ */
/* Visibility and permissions                                                                       */
/* ------------------------------------------------------------------------------------------------ */

/** True when the item has an approved version anyone may read. */
export function isPublicGear(item: Pick<GearItem, 'approvedAt'>): boolean {
  return item.approvedAt !== null;
}

/** Who may see an item (and its latest version): everyone once approved; before, its author, editors and admins. */
export function canViewGear(viewer: Actor | null | undefined, item: Pick<GearItem, 'approvedAt' | 'ownerId'>): boolean {
  return isPublicGear(item) || canSeeWorkingCopy(viewer, item);
}

/** Author, editors and admins see the latest (possibly pending) version. */
export function canSeeWorkingCopy(viewer: Actor | null | undefined, item: Pick<GearItem, 'ownerId'>): boolean {
  return !!viewer && (viewer.id === item.ownerId || hasRole(viewer, 'editor'));
}

/** Reviewers change only their own items; editors and admins any. */
export function canEditGear(viewer: Actor | null | undefined, item: Pick<GearItem, 'ownerId'>): boolean {
  return !!viewer && hasRole(viewer, 'reviewer') && (viewer.id === item.ownerId || hasRole(viewer, 'editor'));
}

/**
 * The item a viewer may see, or AppError 404 (unknown slug, or a draft the viewer may not see: the same
 * answer, so a draft's existence does not leak). Use for pages, routes and photos of gear items.
 */
export function findVisibleGear(db: Q, slug: string, viewer: Actor | null | undefined): GearItem {
  const item = typeof slug === 'string' && slug.length <= 200 ? db.select().from(gearItems).where(eq(gearItems.slug, slug)).get() : undefined;
  if (!item || !canViewGear(viewer, item)) {
    throw new AppError('not_found', 'No gear item here, or you may not see it.');
  }
  return item;
}

/** The item a user may change: 404 when not visible, 403 when visible but not theirs (and not an editor). */
export function findEditableGear(db: Q, slug: string, actor: Actor): GearItem {
  const item = findVisibleGear(db, slug, actor);
  if (!canEditGear(actor, item)) throw new AppError('forbidden', 'Only the author or an editor may change this gear item.');
  return item;
}

/* ------------------------------------------------------------------------------------------------ */
/* Working copy                                                                                     */
/* ------------------------------------------------------------------------------------------------ */

export interface WorkingCopy extends Omit<GearPendingData, 'claims' | 'ports' | 'alsoServesAs' | 'features'> {
  category: Category;
  claims: ClaimRow[];
  ports: PortClaim[];
  /** Other categories the item also serves as (lib/gear/roles.ts). */
  alsoServesAs: Category[];
  /** Feature checklist answers (lib/gear/features.ts). */
  features: FeatureClaim[];
}

function typedFeatures(features: NonNullable<GearPendingData['features']>): FeatureClaim[] {
  return features.filter((f) => isFeatureName(f.name)) as FeatureClaim[];
}

function typedClaims(claims: GearPendingData['claims']): ClaimRow[] {
  return claims.filter((c) => isSpecKey(c.key)) as ClaimRow[];
}

function liveClaims(db: Q, itemId: string): ClaimRow[] {
  return db
    .select()
    .from(specs)
    .where(and(eq(specs.gearItemId, itemId), eq(specs.basis, 'claimed')))
    .orderBy(asc(specs.key), asc(specs.mode))
    .all()
    .filter((r) => isSpecKey(r.key))
    .map((r) => ({ key: r.key as SpecKey, mode: r.mode, value: r.value, source: (r.claimSource ?? 'packaging') as ClaimRow['source'] }));
}

/** The columns of an item that an author edits (shared by the live row, a pending change and every write). */
type EditableColumns = Pick<GearItem, 'name' | 'maker' | 'kind' | 'modelYear' | 'priceMinor' | 'priceCurrency' | 'pricePaidOn' | 'notes' | 'chemistry' | 'waterRating'>;

function editableColumns(source: EditableColumns): EditableColumns {
  return {
    name: source.name,
    maker: source.maker,
    kind: source.kind,
    modelYear: source.modelYear,
    priceMinor: source.priceMinor,
    priceCurrency: source.priceCurrency,
    pricePaidOn: source.pricePaidOn,
    notes: source.notes,
    chemistry: source.chemistry,
    waterRating: source.waterRating,
  };
}

function liveCopy(db: Q, item: GearItem): WorkingCopy {
  return {
    category: item.category as Category,
    ...editableColumns(item),
    changeNote: '',
    claims: liveClaims(db, item.id),
    ports: livePorts(db, item.id),
    alsoServesAs: alsoServesAsOf(item),
    features: liveFeatures(db, item.id),
  };
}

function pendingOf(db: Q, itemId: string): GearPendingData | null {
  return db.select().from(gearPendingChanges).where(eq(gearPendingChanges.gearItemId, itemId)).get()?.data ?? null;
}

/** The latest version: the pending change when there is one, else the item's own columns and specs. */
export function workingCopy(db: Q, item: GearItem): WorkingCopy {
  const pending = pendingOf(db, item.id);
  if (!pending) return liveCopy(db, item);
  // A change saved before ports existed leaves the ports as they are.
  const ports = pending.ports ? (pending.ports as PortClaim[]) : livePorts(db, item.id);
  // Likewise roles and features saved before they existed.
  const alsoServesAs = pending.alsoServesAs ? cleanAlsoServes(item.category, pending.alsoServesAs) : alsoServesAsOf(item);
  const features = pending.features ? typedFeatures(pending.features) : liveFeatures(db, item.id);
  return { ...pending, claims: typedClaims(pending.claims), ports, alsoServesAs, features, category: item.category as Category };
}

function dataToPending(data: GearData): Omit<WorkingCopy, 'category'> {
  return {
    name: data.name,
    maker: data.maker,
    kind: data.kind,
    modelYear: data.modelYear,
    priceMinor: data.price?.amountMinor ?? null,
    priceCurrency: data.price?.currency ?? null,
    pricePaidOn: data.pricePaidOn,
    notes: data.notes,
    chemistry: data.chemistry,
    waterRating: data.waterRating,
    changeNote: data.changeNote,
    claims: claimRows(data),
    ports: portClaims(data),
    alsoServesAs: data.alsoServesAs,
    features: data.features,
  };
}

/** The working copy as raw input for the schemas (numbers in canonical units; price in major units). */
export function workingCopyAsInput(copy: WorkingCopy): Record<string, unknown> {
  const specsIn: Record<string, { value: number; source: string }> = {};
  const modes = new Map<string, Record<string, unknown>>();
  for (const c of copy.claims) {
    if (c.mode === '') specsIn[c.key] = { value: c.value, source: c.source };
    else {
      const m = modes.get(c.mode) ?? { name: c.mode };
      m[c.key] = c.value;
      modes.set(c.mode, m);
    }
  }
  return {
    name: copy.name,
    maker: copy.maker,
    kind: copy.kind,
    modelYear: copy.modelYear,
    price:
      copy.priceMinor !== null && copy.priceCurrency
        ? { amount: majorText({ amountMinor: copy.priceMinor, currency: copy.priceCurrency }), currency: copy.priceCurrency }
        : null,
    pricePaidOn: copy.pricePaidOn,
    notes: copy.notes,
    chemistry: copy.chemistry,
    waterRating: copy.waterRating,
    claimSource: mostCommonSource(copy.claims),
    specs: specsIn,
    modes: [...modes.values()],
    ports: copy.ports.map((p) => ({ ...p })),
    alsoServesAs: [...copy.alsoServesAs],
    features: featuresAsInput(copy.features),
    changeNote: '',
  };
}

function majorText(money: Money): string {
  return formatMoney(money).split(' ')[0]!.replace(/,/g, '');
}

function mostCommonSource(claims: ClaimRow[]): string {
  const counts = new Map<string, number>();
  for (const c of claims) counts.set(c.source, (counts.get(c.source) ?? 0) + 1);
  let best = 'packaging';
  let n = 0;
  for (const [s, k] of counts) if (k > n) [best, n] = [s, k];
  return best;
}

/* ------------------------------------------------------------------------------------------------ */
/* Spec history and ratios                                                                          */
/* ------------------------------------------------------------------------------------------------ */

interface SpecDiff {
  key: string;
  mode: string;
  oldValue: number | null;
  newValue: number | null;
  oldSource: string | null;
  newSource: string | null;
}

const sameValue = (a: number, b: number) => Math.abs(a - b) <= 1e-9 * Math.max(Math.abs(a), Math.abs(b));

function diffClaims(before: readonly ClaimRow[], after: readonly ClaimRow[]): SpecDiff[] {
  const id = (c: { key: string; mode: string }) => `${c.key}\u0000${c.mode}`;
  const old = new Map(before.map((c) => [id(c), c]));
  const next = new Map(after.map((c) => [id(c), c]));
  const out: SpecDiff[] = [];
  for (const [k, n] of next) {
    const o = old.get(k);
    if (!o || !sameValue(o.value, n.value) || o.source !== n.source) {
      out.push({ key: n.key, mode: n.mode, oldValue: o?.value ?? null, newValue: n.value, oldSource: o?.source ?? null, newSource: n.source });
    }
  }
  for (const [k, o] of old) {
    if (!next.has(k)) out.push({ key: o.key, mode: o.mode, oldValue: o.value, newValue: null, oldSource: o.source, newSource: null });
  }
  return out;
}

function logSpecChanges(tx: Tx, itemId: string, actorId: string, context: 'edit' | 'pending' | 'approval', diffs: SpecDiff[], at: Date) {
  if (diffs.length === 0) return;
  tx.insert(specChanges)
    .values(diffs.map((d) => ({ gearItemId: itemId, basis: 'claimed' as const, context, changedById: actorId, createdAt: at, ...d })))
    .run();
}

interface PortDiff {
  key: string;
  oldText: string | null;
  newText: string | null;
}

function portText(p: PortClaim): string {
  return `${describePort(p)} (${CLAIM_SOURCE_LABELS[p.source] ?? p.source})`;
}

/** Port changes by position, in words ("Port 2": old → new; added or removed ports have none on one side). */
function diffPorts(before: readonly PortClaim[], after: readonly PortClaim[]): PortDiff[] {
  const out: PortDiff[] = [];
  for (let i = 0; i < Math.max(before.length, after.length); i += 1) {
    const o = before[i] ? portText(before[i]!) : null;
    const n = after[i] ? portText(after[i]!) : null;
    if (o !== n) out.push({ key: `Port ${i + 1}`, oldText: o, newText: n });
  }
  return out;
}

function logPortChanges(tx: Tx, itemId: string, actorId: string, context: 'edit' | 'pending' | 'approval', diffs: PortDiff[], at: Date) {
  if (diffs.length === 0) return;
  tx.insert(specChanges)
    .values(diffs.map((d) => ({ gearItemId: itemId, basis: 'claimed' as const, context, changedById: actorId, createdAt: at, mode: '', ...d })))
    .run();
}

/** Role and feature changes in words ("Also serves as": none → power bank; "Feature: Red light mode": not stated → has). */
function diffRolesAndFeatures(before: Pick<WorkingCopy, 'alsoServesAs' | 'features'>, after: Pick<WorkingCopy, 'alsoServesAs' | 'features'>): PortDiff[] {
  const out: PortDiff[] = [];
  const roleText = (list: readonly Category[]) => (list.length ? list.map((c) => CATEGORY_DEFS[c].label).join(', ') : null);
  if (roleText(before.alsoServesAs) !== roleText(after.alsoServesAs)) {
    out.push({ key: 'Also serves as', oldText: roleText(before.alsoServesAs), newText: roleText(after.alsoServesAs) });
  }
  const old = new Map(before.features.map((f) => [f.name, f]));
  const next = new Map(after.features.map((f) => [f.name, f]));
  for (const name of new Set([...old.keys(), ...next.keys()])) {
    const o = featureText(old.get(name));
    const n = featureText(next.get(name));
    if (o !== n) out.push({ key: `Feature: ${FEATURE_DEFS[name].label}`, oldText: o, newText: n });
  }
  return out;
}

function writeLiveClaims(tx: Tx, itemId: string, claims: readonly ClaimRow[], at: Date) {
  tx.delete(specs).where(and(eq(specs.gearItemId, itemId), eq(specs.basis, 'claimed'))).run();
  if (claims.length === 0) return;
  tx.insert(specs)
    .values(claims.map((c) => ({ id: randomUUID(), gearItemId: itemId, key: c.key, mode: c.mode, basis: 'claimed' as const, value: c.value, claimSource: c.source, updatedAt: at })))
    .run();
}

/** Item-level figures (mode '') for lib/measure: claimed from `claims`, measured from the item's measured specs. */
function specsFor(db: Q, itemId: string, claims: readonly ClaimRow[]): Specs {
  const out: Specs = {};
  for (const c of claims) if (c.mode === '') out[c.key] = { ...out[c.key], claimed: c.value };
  const measured = db
    .select({ key: specs.key, value: specs.value })
    .from(specs)
    .where(and(eq(specs.gearItemId, itemId), eq(specs.basis, 'measured'), eq(specs.mode, '')))
    .all();
  for (const m of measured) if (isSpecKey(m.key)) out[m.key] = { ...out[m.key], measured: m.value };
  return out;
}

function priceOf(copy: Pick<WorkingCopy, 'priceMinor' | 'priceCurrency'>): Money | null {
  return copy.priceMinor !== null && copy.priceCurrency ? { amountMinor: copy.priceMinor, currency: copy.priceCurrency } : null;
}

/** Value ratios of a version (lib/measure `valueRatios`). */
export function ratiosFor(db: Q, itemId: string, copy: WorkingCopy): ValueRatio[] {
  return valueRatios(copy.category, specsFor(db, itemId, copy.claims), priceOf(copy));
}

/** Replaces the stored ratios of an approved item with those of its approved figures (inside a transaction). */
export function recomputeStoredRatios(tx: Tx, item: GearItem, at = new Date()): void {
  tx.delete(gearRatios).where(eq(gearRatios.gearItemId, item.id)).run();
  const copy = liveCopy(tx, item);
  const ratios = ratiosFor(tx, item.id, copy);
  if (ratios.length === 0) return;
  tx.insert(gearRatios)
    .values(
      ratios.map((r) => ({
        gearItemId: item.id,
        ratioId: r.id,
        value: r.value,
        unit: r.unit,
        basis: r.basis,
        currency: r.id.includes('money') ? (copy.priceCurrency ?? null) : null,
        higherIsBetter: r.higherIsBetter,
        computedAt: at,
      })),
    )
    .run();
}

/** Fills stored ratios for approved items that have none (e.g. items written by the demo seed). Returns how many items. */
export function backfillGearRatios(db: Db): number {
  return db.transaction(
    (tx) => {
      const withRatios = new Set(tx.selectDistinct({ id: gearRatios.gearItemId }).from(gearRatios).all().map((r) => r.id));
      const approved = tx.select().from(gearItems).where(isNotNull(gearItems.approvedAt)).all();
      let n = 0;
      for (const item of approved) {
        if (withRatios.has(item.id)) continue;
        recomputeStoredRatios(tx, item);
        n += 1;
      }
      return n;
    },
    { behavior: 'immediate' },
  );
}

/* ------------------------------------------------------------------------------------------------ */
/* Writes                                                                                           */
/* ------------------------------------------------------------------------------------------------ */

function parseInput(raw: unknown): GearData {
  const result = gearInputSchema.safeParse(raw);
  if (!result.success) throw new AppError('invalid', 'Some fields are not valid.', { fields: zodFieldErrors(result.error) });
  return result.data;
}

export function slugify(text: string): string {
  const base = text
    .normalize('NFKD')
    .replace(/[\u0300-\u036f]/g, '')
    .toLowerCase()
    .replace(/[^a-z0-9]+/g, '-')
    .replace(/^-+|-+$/g, '')
    .slice(0, 70)
    .replace(/-+$/g, '');
  return base || 'item';
}

function uniqueSlug(tx: Tx, base: string): string {
  const taken = new Set(
    tx
      .select({ slug: gearItems.slug })
      .from(gearItems)
      .all()
      .map((r) => r.slug)
      .filter((s) => s === base || s.startsWith(`${base}-`)),
  );
  if (!taken.has(base)) return base;
  for (let i = 2; ; i += 1) if (!taken.has(`${base}-${i}`)) return `${base}-${i}`;
}

function event(tx: Tx, itemId: string, from: RecordState | null, to: RecordState, actorId: string, at: Date, comment = '') {
  tx.insert(gearStateEvents).values({ gearItemId: itemId, fromState: from, toState: to, actorId, comment, createdAt: at }).run();
}

/** Creates a draft gear item from raw input (validated here with `gearInputSchema`). Reviewers and above. */
export function createGear(db: Db, actor: Actor, raw: unknown, now = new Date()): { id: string; slug: string } {
  if (!hasRole(actor, 'reviewer')) throw new AppError('forbidden', 'Only reviewers, editors and admins record gear items.');
  const data = parseInput(raw);
  return db.transaction(
    (tx) => {
      const id = randomUUID();
      const slug = uniqueSlug(tx, slugify(`${data.maker} ${data.name}`));
      tx.insert(gearItems)
        .values({
          id,
          slug,
          ownerId: actor.id,
          category: data.category,
          ...editableColumns(dataToPending(data)),
          status: 'draft',
          createdAt: now,
          updatedAt: now,
        })
        .run();
      const claims = claimRows(data);
      writeLiveClaims(tx, id, claims, now);
      logSpecChanges(tx, id, actor.id, 'edit', diffClaims([], claims), now);
      const ports = portClaims(data);
      writeLivePorts(tx, id, ports, now);
      logPortChanges(tx, id, actor.id, 'edit', diffPorts([], ports), now);
      writeLiveAlsoServes(tx, id, data.alsoServesAs);
      writeLiveFeatures(tx, id, data.features);
      logPortChanges(tx, id, actor.id, 'edit', diffRolesAndFeatures({ alsoServesAs: [], features: [] }, data), now);
      event(tx, id, null, 'draft', actor.id, now);
      return { id, slug };
    },
    { behavior: 'immediate' },
  );
}

/**
 * Changes a gear item with a raw patch (`gearPatchSchema`: any subset of the editable fields), merged
 * with the latest version and validated with `gearInputSchema`. 404/403 as `findEditableGear`; 409
 * while in review; 422 for invalid input. An approved item keeps its public figures: the change waits.
 */
export function updateGear(db: Db, actor: Actor, slug: string, rawPatch: unknown, now = new Date()): { slug: string; pending: boolean } {
  return db.transaction(
    (tx) => {
      const item = findEditableGear(tx, slug, actor);
      if (item.status === 'in-review') {
        throw new AppError('conflict', 'This item is in review and locked until an editor acts (or you withdraw it).');
      }
      const shape = gearPatchSchema.safeParse(rawPatch);
      if (!shape.success) throw new AppError('invalid', 'Some fields are not valid.', { fields: zodFieldErrors(shape.error) });
      const before = workingCopy(tx, item);
      const merged = { ...workingCopyAsInput(before), ...(rawPatch as Record<string, unknown>), category: item.category };
      const data = parseInput(merged);
      const next = dataToPending(data);

      if (!isPublicGear(item)) {
        tx.update(gearItems)
          .set({
            ...editableColumns(next),
            updatedAt: now,
          })
          .where(eq(gearItems.id, item.id))
          .run();
        writeLiveClaims(tx, item.id, next.claims, now);
        logSpecChanges(tx, item.id, actor.id, 'edit', diffClaims(before.claims, next.claims), now);
        writeLivePorts(tx, item.id, next.ports, now);
        logPortChanges(tx, item.id, actor.id, 'edit', diffPorts(before.ports, next.ports), now);
        writeLiveAlsoServes(tx, item.id, next.alsoServesAs);
        writeLiveFeatures(tx, item.id, next.features);
        logPortChanges(tx, item.id, actor.id, 'edit', diffRolesAndFeatures(before, next), now);
        return { slug: item.slug, pending: false };
      }

      tx.insert(gearPendingChanges)
        .values({ gearItemId: item.id, data: next, authorId: actor.id, createdAt: now, updatedAt: now })
        .onConflictDoUpdate({ target: gearPendingChanges.gearItemId, set: { data: next, authorId: actor.id, updatedAt: now } })
        .run();
      logSpecChanges(tx, item.id, actor.id, 'pending', diffClaims(before.claims, next.claims), now);
      logPortChanges(tx, item.id, actor.id, 'pending', diffPorts(before.ports, next.ports), now);
      logPortChanges(tx, item.id, actor.id, 'pending', diffRolesAndFeatures(before, next), now);
      if (item.status === 'approved') {
        tx.update(gearItems).set({ status: 'draft', updatedAt: now }).where(eq(gearItems.id, item.id)).run();
        event(tx, item.id, 'approved', 'draft', actor.id, now, 'Edited after approval; the approved figures stay public until this change is approved.');
      } else {
        tx.update(gearItems).set({ updatedAt: now }).where(eq(gearItems.id, item.id)).run();
      }
      return { slug: item.slug, pending: true };
    },
    { behavior: 'immediate' },
  );
}

/** The workflow decision (lib/workflow, kind `record`) for one action on an item, as an AppError when refused. */
function decideGear(item: GearItem, actor: Actor, action: GearAction, comment = '') {
  const decision = decide({ kind: 'record', state: item.status, action, actor, authorId: item.ownerId, comment });
  if (!decision.ok) {
    throw new AppError(decision.code, decision.message, decision.code === 'invalid' ? { fields: { comment: [decision.message] } } : {});
  }
  return decision;
}

/** Whether `viewer` may take `action` on the item now (for showing or hiding its button). */
function mayAct(item: GearItem, viewer: Actor | null, action: GearAction): boolean {
  if (!viewer) return false;
  // The comment is asked for in the form: the button shows before it is typed.
  return decide({ kind: 'record', state: item.status, action, actor: viewer, authorId: item.ownerId, comment: 'x' }).ok;
}

export type GearAction = Extract<WorkflowAction, 'submit' | 'withdraw' | 'request-changes' | 'approve'>;

/** 404 when not visible, then the workflow's 403/409/422, then `apply` and the event — in one immediate transaction. */
function transition(
  db: Db,
  slug: string,
  actor: Actor,
  action: GearAction,
  apply?: (tx: Tx, item: GearItem, now: Date) => void,
  comment = '',
  now = new Date(),
): { slug: string; status: RecordState } {
  return db.transaction(
    (tx) => {
      const item = findVisibleGear(tx, slug, actor);
      const decision = decideGear(item, actor, action, comment);
      const to = decision.to as RecordState;
      apply?.(tx, item, now);
      tx.update(gearItems).set({ status: to, updatedAt: now }).where(eq(gearItems.id, item.id)).run();
      event(tx, item.id, item.status, to, actor.id, now, decision.comment);
      return { slug: item.slug, status: to };
    },
    { behavior: 'immediate' },
  );
}

/** The author submits a draft or a returned item for review; every photo needs its alt text first (409). */
export function submitGear(db: Db, actor: Actor, slug: string, now = new Date()) {
  return transition(
    db,
    slug,
    actor,
    'submit',
    (tx, item) => {
      const missing = tx
        .select({ id: photos.id })
        .from(photos)
        .where(and(eq(photos.gearItemId, item.id), eq(photos.altText, '')))
        .all().length;
      if (missing > 0) throw new AppError('conflict', `Describe every photo first: ${missing} photo${missing === 1 ? ' has' : 's have'} no alt text.`);
    },
    '',
    now,
  );
}

/** The author takes a submitted item back before an editor acts. */
export function withdrawGear(db: Db, actor: Actor, slug: string, now = new Date()) {
  return transition(db, slug, actor, 'withdraw', undefined, '', now);
}

/** An editor other than the author returns an item in review with a comment. */
export function sendBackGear(db: Db, actor: Actor, slug: string, comment: string, now = new Date()) {
  return transition(db, slug, actor, 'request-changes', undefined, comment, now);
}

/**
 * An editor approves an item in review: a pending change is applied (spec changes logged, a dated
 * "figures updated" note added), and the stored value ratios are recomputed — in one transaction.
 */
export function approveGear(db: Db, actor: Actor, slug: string, now = new Date()) {
  return transition(
    db,
    slug,
    actor,
    'approve',
    (tx, item, at) => {
      const pending = pendingOf(tx, item.id);
      let current = item;
      if (pending) {
        const before = liveCopy(tx, item);
        const diffs = diffClaims(before.claims, typedClaims(pending.claims));
        tx.update(gearItems)
          .set(editableColumns(pending))
          .where(eq(gearItems.id, item.id))
          .run();
        writeLiveClaims(tx, item.id, typedClaims(pending.claims), at);
        logSpecChanges(tx, item.id, actor.id, 'approval', diffs, at);
        const portDiffs = pending.ports ? diffPorts(before.ports, pending.ports as PortClaim[]) : [];
        if (pending.ports) writeLivePorts(tx, item.id, pending.ports as PortClaim[], at);
        logPortChanges(tx, item.id, actor.id, 'approval', portDiffs, at);
        const after = workingCopy(tx, item);
        const roleDiffs = diffRolesAndFeatures(before, after);
        if (pending.alsoServesAs) writeLiveAlsoServes(tx, item.id, after.alsoServesAs);
        if (pending.features) writeLiveFeatures(tx, item.id, after.features);
        logPortChanges(tx, item.id, actor.id, 'approval', roleDiffs, at);
        portDiffs.push(...roleDiffs);
        const summary = figureSummary(diffs, priceOf(before), priceOf(pending), portDiffs);
        if (summary) tx.insert(gearFigureNotes).values({ gearItemId: item.id, note: pending.changeNote, summary, approvedById: actor.id, createdAt: at }).run();
        tx.delete(gearPendingChanges).where(eq(gearPendingChanges.gearItemId, item.id)).run();
        current = tx.select().from(gearItems).where(eq(gearItems.id, item.id)).get()!;
      }
      tx.update(gearItems).set({ approvedAt: at }).where(eq(gearItems.id, item.id)).run();
      recomputeStoredRatios(tx, { ...current, approvedAt: at }, at);
    },
    '',
    now,
  );
}

function figureSummary(diffs: SpecDiff[], oldPrice: Money | null, newPrice: Money | null, portDiffs: PortDiff[] = []): string {
  const parts = diffs
    .filter((d) => isSpecKey(d.key))
    .map((d) => {
      const key = d.key as SpecKey;
      const label = `${SPECS[key].label}${d.mode ? ` (${d.mode})` : ''}, claimed`;
      const o = d.oldValue === null ? 'none' : formatSpec(key, d.oldValue);
      const n = d.newValue === null ? 'removed' : formatSpec(key, d.newValue);
      return o === n ? `${label}: source ${d.oldSource ?? 'none'} → ${d.newSource ?? 'none'}` : `${label}: ${o} → ${n}`;
    });
  const priceText = (p: Money | null) => (p ? formatMoney(p) : 'none');
  if (priceText(oldPrice) !== priceText(newPrice)) parts.push(`Price paid: ${priceText(oldPrice)} → ${priceText(newPrice)}`);
  for (const d of portDiffs) parts.push(`${d.key}: ${d.oldText ?? 'none'} → ${d.newText ?? 'removed'}`);
  return parts.join('; ');
}

/* ------------------------------------------------------------------------------------------------ */
/* Reads                                                                                            */
/* ------------------------------------------------------------------------------------------------ */

export interface SpecLine {
  key: SpecKey;
  mode: string;
  claimed: { value: number; source: string } | null;
  measured: { value: number; sd: number | null; n: number | null; fieldTestId: string | null } | null;
}

export interface GearView {
  item: GearItem & { ownerName: string };
  /** Which version the figures below are: the approved one, or the latest (pending or never approved). */
  version: WorkingCopy;
  showing: 'approved' | 'latest';
  /** True when an approved item has a change waiting (shown to author and editors). */
  hasPendingChange: boolean;
  /** The viewer is the author, an editor or an admin (sees state, history and pending changes). */
  insider: boolean;
  lines: SpecLine[];
  ratios: ValueRatio[];
  airline: { wh: number; band: AirlineBand } | null;
  permissions: { canEdit: boolean; canSubmit: boolean; canWithdraw: boolean; canReview: boolean };
  events: { fromState: RecordState | null; toState: RecordState; comment: string; actorName: string | null; createdAt: Date }[];
  notes: { note: string; summary: string; createdAt: Date }[];
}

/** Everything the item page shows, for this viewer (404 AppError when the viewer may not see the item). */
export function getGearView(db: Db, slug: string, viewer: Actor | null): GearView {
  const item = findVisibleGear(db, slug, viewer);
  const owner = db.select({ name: users.name }).from(users).where(eq(users.id, item.ownerId)).get();
  const insider = canSeeWorkingCopy(viewer, item);
  const pending = pendingOf(db, item.id);
  const showLatest = insider || !isPublicGear(item);
  const version = showLatest ? workingCopy(db, item) : liveCopy(db, item);

  const measured = db
    .select()
    .from(specs)
    .where(and(eq(specs.gearItemId, item.id), eq(specs.basis, 'measured')))
    .all();
  const lines = new Map<string, SpecLine>();
  const line = (key: SpecKey, mode: string) => {
    const id = `${key}\u0000${mode}`;
    let l = lines.get(id);
    if (!l) {
      l = { key, mode, claimed: null, measured: null };
      lines.set(id, l);
    }
    return l;
  };
  for (const c of version.claims) line(c.key, c.mode).claimed = { value: c.value, source: c.source };
  for (const m of measured) if (isSpecKey(m.key)) line(m.key, m.mode).measured = { value: m.value, sd: m.sd, n: m.n, fieldTestId: m.fieldTestId };
  const def = CATEGORY_DEFS[version.category];
  const order = new Map<string, number>(def.specs.map((s, i) => [s.key, i]));
  const sorted = [...lines.values()].sort(
    (a, b) => (a.mode === '' ? 0 : 1) - (b.mode === '' ? 0 : 1) || a.mode.localeCompare(b.mode) || (order.get(a.key) ?? 99) - (order.get(b.key) ?? 99),
  );

  const ratios = ratiosFor(db, item.id, version);
  const rated = version.claims.find((c) => c.key === 'ratedEnergy' && c.mode === '')?.value;
  // Power banks are lithium unless stated otherwise; other categories only when their chemistry says so.
  const chemistry = (version.chemistry ?? (version.category === 'power-bank' ? 'li-ion' : null)) as Chemistry | null;
  const airline =
    rated !== undefined && (version.category === 'power-bank' || version.category === 'battery-12v' || version.category === 'light') && isLithium(chemistry)
      ? { wh: rated, band: airlineBand(rated) }
      : null;

  const events = insider
    ? db
        .select({ fromState: gearStateEvents.fromState, toState: gearStateEvents.toState, comment: gearStateEvents.comment, actorName: users.name, createdAt: gearStateEvents.createdAt })
        .from(gearStateEvents)
        .leftJoin(users, eq(users.id, gearStateEvents.actorId))
        .where(eq(gearStateEvents.gearItemId, item.id))
        .orderBy(desc(gearStateEvents.createdAt), desc(gearStateEvents.id))
        .all()
    : [];
  const notes = db
    .select({ note: gearFigureNotes.note, summary: gearFigureNotes.summary, createdAt: gearFigureNotes.createdAt })
    .from(gearFigureNotes)
    .where(eq(gearFigureNotes.gearItemId, item.id))
    .orderBy(desc(gearFigureNotes.createdAt))
    .all();

  const editable = canEditGear(viewer, item);
  return {
    item: { ...item, ownerName: owner?.name ?? 'Unknown' },
    version,
    showing: showLatest && (pending !== null || !isPublicGear(item)) ? 'latest' : 'approved',
    hasPendingChange: insider && pending !== null,
    insider,
    lines: sorted,
    ratios,
    airline,
    permissions: {
      canEdit: editable && item.status !== 'in-review',
      canSubmit: mayAct(item, viewer, 'submit'),
      canWithdraw: mayAct(item, viewer, 'withdraw'),
      canReview: mayAct(item, viewer, 'approve'),
    },
    events,
    notes,
  };
}

/** The latest version of an item for its edit form (404/403 as `findEditableGear`). */
export function getGearForEdit(db: Db, slug: string, actor: Actor): { item: GearItem; input: Record<string, unknown>; category: Category; locked: boolean } {
  const item = findEditableGear(db, slug, actor);
  const copy = workingCopy(db, item);
  return { item, input: workingCopyAsInput(copy), category: copy.category, locked: item.status === 'in-review' };
}

export interface LogbookGearRow {
  slug: string;
  name: string;
  maker: string;
  category: Category;
  status: RecordState;
  public: boolean;
  updatedAt: Date;
}

/** A user's own gear items, newest change first. */
export function listLogbookGear(db: Db, ownerId: string): LogbookGearRow[] {
  return db
    .select({ slug: gearItems.slug, name: gearItems.name, maker: gearItems.maker, category: gearItems.category, status: gearItems.status, approvedAt: gearItems.approvedAt, updatedAt: gearItems.updatedAt })
    .from(gearItems)
    .where(eq(gearItems.ownerId, ownerId))
    .orderBy(desc(gearItems.updatedAt))
    .all()
    .map(({ approvedAt, ...r }) => ({ ...r, category: r.category as Category, public: approvedAt !== null }));
}

/** Items waiting for an editor (until the review desk lists them). */
export function listGearInReview(db: Db): LogbookGearRow[] {
  return db
    .select({ slug: gearItems.slug, name: gearItems.name, maker: gearItems.maker, category: gearItems.category, status: gearItems.status, approvedAt: gearItems.approvedAt, updatedAt: gearItems.updatedAt })
    .from(gearItems)
    .where(eq(gearItems.status, 'in-review'))
    .orderBy(asc(gearItems.updatedAt))
    .all()
    .map(({ approvedAt, ...r }) => ({ ...r, category: r.category as Category, public: approvedAt !== null }));
}

export interface PublicGearRow {
  slug: string;
  name: string;
  maker: string;
  category: Category;
  kind: string | null;
  price: Money | null;
  massG: number | null;
}

/** Approved items (their approved figures only), by category then name. */
export function listPublicGear(db: Db): PublicGearRow[] {
  const items = db.select().from(gearItems).where(isNotNull(gearItems.approvedAt)).orderBy(asc(gearItems.category), asc(gearItems.name)).all();
  const ids = items.map((i) => i.id);
  const mass = new Map<string, { claimed?: number; measured?: number }>();
  if (ids.length) {
    for (const s of db
      .select({ id: specs.gearItemId, basis: specs.basis, value: specs.value })
      .from(specs)
      .where(and(inArray(specs.gearItemId, ids), eq(specs.key, 'mass'), eq(specs.mode, '')))
      .all()) {
      mass.set(s.id, { ...mass.get(s.id), [s.basis]: s.value });
    }
  }
  return items.map((i) => ({
    slug: i.slug,
    name: i.name,
    maker: i.maker,
    category: i.category as Category,
    kind: i.kind,
    price: priceOf(i),
    massG: mass.get(i.id)?.measured ?? mass.get(i.id)?.claimed ?? null,
  }));
}

/** Stored ratios of an approved item (what browse sorts on). */
export function storedRatios(db: Q, itemId: string) {
  return db.select().from(gearRatios).where(eq(gearRatios.gearItemId, itemId)).orderBy(asc(gearRatios.ratioId)).all();
}

/** Spec change history of an item, newest first (author and editors). */
export function specHistory(db: Db, slug: string, viewer: Actor) {
  const item = findVisibleGear(db, slug, viewer);
  if (!canSeeWorkingCopy(viewer, item)) throw new AppError('forbidden', 'Only the author and editors see the change history.');
  return db
    .select({
      key: specChanges.key,
      mode: specChanges.mode,
      oldValue: specChanges.oldValue,
      newValue: specChanges.newValue,
      oldText: specChanges.oldText,
      newText: specChanges.newText,
      context: specChanges.context,
      who: users.name,
      createdAt: specChanges.createdAt,
    })
    .from(specChanges)
    .leftJoin(users, eq(users.id, specChanges.changedById))
    .where(eq(specChanges.gearItemId, item.id))
    .orderBy(desc(specChanges.createdAt), desc(specChanges.id))
    .all();
}

export { gearPath, gearEditPath } from '@/lib/gear/paths';
