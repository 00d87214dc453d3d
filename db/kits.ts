import { and, asc, count, desc, eq, inArray, isNotNull, or } from 'drizzle-orm';
import { randomBytes, randomUUID } from 'node:crypto';
import type { Db } from './connection';
import { portsOfGear } from './gear-ports';
import { alsoServesAsOf } from './gear-roles';
import { fieldTests, gearItems, kitEntries, kits, readings, specs, trials } from './schema';
import { AppError } from '@/lib/http/errors';
import { parseWith } from '@/lib/http/api';
import { CHEMISTRIES, isCategory, MeasureError, solarOutput, type Chemistry } from '@/lib/measure';
import { decodeSeries } from '@/lib/readings/encoding';
import { FREE_ROLES, kitInputSchema, kitPatchSchema, portSchema, type FreeRole, type KitEntryInput, type KitInput, type KitPort } from '@/lib/kits/schemas';
import { isSky, SKY_LABELS, type Sky } from '@/lib/kits/sky';
import type { KitCatalog, KitCatalogItem, PairedSkyShare } from '@/lib/kits/types';

/*
 * Kits: data access with the ownership rule checked here, where rows are read and written.
 * - Own kits only: every read or write looks the row up by (id, ownerId); anyone else gets 404.
 * - Catalog items: a kit shows only items the viewer may read (approved, or the viewer's own); the
 *   others appear as "unpublished item" with no details. Saving refuses an item id the owner may not
 *   read, unless that entry is already in the kit (an item unpublished after it was added stays).
 * - Share links carry 192 random bits (crypto.randomBytes(24), base64url); revoking clears the token at once.
 */

export interface KitViewer {
  id: string;
}

/** A kit entry as the API returns it; `hidden` entries are items the viewer may not read. */
export type KitEntryView = KitEntryInput & { hidden?: true };

export interface KitRecord extends Omit<KitInput, 'entries'> {
  id: string;
  entries: KitEntryView[];
  createdAt: string;
  updatedAt: string;
}

/** The owner's view adds the share token. */
export interface OwnKitRecord extends KitRecord {
  shareToken: string | null;
}

export interface KitSummary {
  id: string;
  name: string;
  purpose: string;
  tripDays: number;
  entryCount: number;
  shared: boolean;
  updatedAt: string;
}

type KitRow = typeof kits.$inferSelect;
type EntryRow = typeof kitEntries.$inferSelect;

const SHARE_TOKEN = /^[A-Za-z0-9_-]{22,128}$/;

function notFound(): AppError {
  return new AppError('not_found', 'No such kit, or it is not yours.');
}

/* -------------------------------------------------------------------------------------------- */
/* Catalog (read-only)                                                                          */
/* -------------------------------------------------------------------------------------------- */

function visibleTo(viewer: KitViewer | null) {
  const published = or(eq(gearItems.status, 'approved'), isNotNull(gearItems.approvedAt));
  return viewer ? or(published, eq(gearItems.ownerId, viewer.id)) : published;
}

/**
 * Catalog items the viewer may read, with their specs (and, for panels, sky shares from paired
 * field tests). `ids` limits the list; without it every readable item is returned (the picker).
 */
export function readableCatalog(db: Db, viewer: KitViewer | null, ids?: readonly string[]): KitCatalog {
  if (ids && ids.length === 0) return {};
  const where = ids ? and(visibleTo(viewer), inArray(gearItems.id, [...new Set(ids)])) : visibleTo(viewer);
  const rows = db
    .select({
      id: gearItems.id,
      slug: gearItems.slug,
      name: gearItems.name,
      maker: gearItems.maker,
      category: gearItems.category,
      chemistry: gearItems.chemistry,
      priceMinor: gearItems.priceMinor,
      priceCurrency: gearItems.priceCurrency,
      alsoServesAs: gearItems.alsoServesAs,
    })
    .from(gearItems)
    .where(where)
    .orderBy(asc(gearItems.category), asc(gearItems.maker), asc(gearItems.name))
    .all();
  if (rows.length === 0) return {};
  const itemIds = rows.map((r) => r.id);
  const specRows = db
    .select({ gearItemId: specs.gearItemId, key: specs.key, mode: specs.mode, basis: specs.basis, value: specs.value })
    .from(specs)
    .where(inArray(specs.gearItemId, itemIds))
    .all();
  const catalog: Record<string, KitCatalogItem> = {};
  for (const r of rows) {
    catalog[r.id] = {
      ...r,
      category: isCategory(r.category) ? r.category : 'other',
      chemistry: (CHEMISTRIES as readonly string[]).includes(r.chemistry ?? '') ? (r.chemistry as Chemistry) : null,
      specs: [],
      pairedSkyShares: [],
      alsoServesAs: alsoServesAsOf(r),
    };
  }
  for (const s of specRows) catalog[s.gearItemId]?.specs.push({ key: s.key, mode: s.mode, basis: s.basis, value: s.value });
  // Approved ports only (an owner's draft ports are not part of a kit's charging paths yet).
  const ports = portsOfGear(db, itemIds);
  for (const r of rows) {
    const list = ports[r.id] ?? [];
    if (list.length > 0) (catalog[r.id] as KitCatalogItem).ports = list;
  }
  const panels = Object.values(catalog).filter((i) => i.category === 'solar-panel');
  if (panels.length > 0) {
    const shares = pairedSkyShares(db, panels);
    for (const p of panels) p.pairedSkyShares = shares.get(p.id) ?? [];
  }
  return catalog;
}

/** A trial's {t, watts} samples: the encoded series (lib/readings TBS1), else the legacy readings rows. */
function trialPowerPoints(db: Db, trialId: string, series: Uint8Array | null): { t: number; watts: number }[] {
  const rows: { t: number; watts?: number | null }[] = [];
  if (series) {
    const decoded = decodeSeries(series);
    if (decoded.ok) rows.push(...decoded.samples);
  } else {
    rows.push(...db.select({ t: readings.t, watts: readings.watts }).from(readings).where(eq(readings.trialId, trialId)).orderBy(asc(readings.seq)).all());
  }
  return rows.filter((r): r is { t: number; watts: number } => typeof r.watts === 'number');
}

/**
 * Sky shares from approved solar-output field tests: for each panel, the mean share of its rating
 * under each sky ÷ the mean share under a clear sky (needs both; lib/measure solarOutput).
 */
function pairedSkyShares(db: Db, panels: KitCatalogItem[]): Map<string, PairedSkyShare[]> {
  const rated = new Map<string, number>();
  for (const p of panels) {
    const r = p.specs.find((s) => s.key === 'ratedPower' && s.basis === 'claimed') ?? p.specs.find((s) => s.key === 'ratedPower');
    if (r && r.value > 0) rated.set(p.id, r.value);
  }
  if (rated.size === 0) return new Map();
  const trialRows = db
    .select({ trialId: trials.id, gearItemId: trials.gearItemId, sky: fieldTests.sky, testedAt: fieldTests.testedAt, series: trials.series })
    .from(trials)
    .innerJoin(fieldTests, eq(fieldTests.id, trials.fieldTestId))
    .where(
      and(
        inArray(trials.gearItemId, [...rated.keys()]),
        eq(fieldTests.kind, 'solar-output'),
        or(eq(fieldTests.status, 'approved'), isNotNull(fieldTests.approvedAt)),
      ),
    )
    .all();
  const bySky = new Map<string, Map<string, { shares: number[]; dates: Set<string> }>>();
  for (const t of trialRows) {
    if (!t.sky || !(t.sky === 'clear' || isSky(t.sky))) continue;
    const points = trialPowerPoints(db, t.trialId, t.series);
    let share: number;
    try {
      share = solarOutput(points, rated.get(t.gearItemId) ?? 0).shareOfRating;
    } catch (error) {
      if (error instanceof MeasureError) continue;
      throw error;
    }
    const item = bySky.get(t.gearItemId) ?? new Map<string, { shares: number[]; dates: Set<string> }>();
    const slot = item.get(t.sky) ?? { shares: [], dates: new Set<string>() };
    slot.shares.push(share);
    slot.dates.add(t.testedAt.toISOString().slice(0, 10));
    item.set(t.sky, slot);
    bySky.set(t.gearItemId, item);
  }
  const mean = (xs: number[]) => xs.reduce((a, b) => a + b, 0) / xs.length;
  const out = new Map<string, PairedSkyShare[]>();
  for (const [itemId, skies] of bySky) {
    const clear = skies.get('clear');
    if (!clear) continue;
    const name = panels.find((p) => p.id === itemId)?.name ?? 'panel';
    const list: PairedSkyShare[] = [];
    for (const [sky, slot] of skies) {
      if (sky === 'clear' || !isSky(sky)) continue;
      const share = Math.min(1, mean(slot.shares) / mean(clear.shares));
      list.push({
        sky: sky as Sky,
        share,
        note: `${name}: ${SKY_LABELS[sky as Sky].toLowerCase()} (${[...slot.dates].join(', ')}) against clear sky (${[...clear.dates].join(', ')})`,
      });
    }
    out.set(itemId, list);
  }
  return out;
}

/* -------------------------------------------------------------------------------------------- */
/* Kits                                                                                         */
/* -------------------------------------------------------------------------------------------- */

function entryFromRow(row: EntryRow): KitEntryInput {
  const entry: KitEntryInput = { gearItemId: row.gearItemId, quantity: row.quantity };
  if (row.gearItemId === null) {
    entry.freeName = row.freeName ?? 'Unnamed entry';
    entry.freeMassG = row.freeMassG;
    entry.freePrice = row.freePriceMinor !== null && row.freePriceCurrency ? { amountMinor: row.freePriceMinor, currency: row.freePriceCurrency } : null;
    entry.freeDrawW = row.freeDrawW;
    entry.freeRole = (FREE_ROLES as readonly string[]).includes(row.freeRole ?? '') ? (row.freeRole as FreeRole) : null;
    entry.freePorts = storedPorts(row.freePorts);
    entry.freeEfficiency = row.freeEfficiency;
    entry.freeEnergyWh = row.freeEnergyWh;
    entry.freeRatedW = row.freeRatedW;
  }
  entry.loadMode = row.loadMode;
  entry.hoursPerDay = row.hoursPerDay;
  entry.dutyCycle = row.dutyCycle;
  entry.chemistry = (CHEMISTRIES as readonly string[]).includes(row.chemistry ?? '') ? (row.chemistry as Chemistry) : null;
  entry.depthOfDischarge = row.depthOfDischarge;
  return entry;
}

/** Ports as stored, checked again on the way out: a row that no longer passes is read as "no ports". */
function storedPorts(value: unknown): KitPort[] | null {
  if (value === null || value === undefined) return null;
  const parsed = portSchema.array().max(16).safeParse(value);
  return parsed.success ? parsed.data : null;
}

function recordFromRows(kit: KitRow, entries: EntryRow[]): OwnKitRecord {
  return {
    id: kit.id,
    name: kit.name,
    purpose: kit.purpose,
    tripDays: kit.tripDays,
    peakSunHours: kit.peakSunHours,
    sky: kit.sky,
    skyShare: kit.skyShare,
    lossFraction: kit.lossFraction,
    conversionEfficiency: kit.conversionEfficiency,
    entries: entries.map(entryFromRow),
    shareToken: kit.shareToken,
    createdAt: kit.createdAt.toISOString(),
    updatedAt: kit.updatedAt.toISOString(),
  };
}

function entryRows(db: Db, kitId: string): EntryRow[] {
  return db.select().from(kitEntries).where(eq(kitEntries.kitId, kitId)).orderBy(asc(kitEntries.position)).all();
}

function ownKitRow(db: Db, owner: KitViewer, id: string): KitRow {
  const row = db.select().from(kits).where(and(eq(kits.id, id), eq(kits.ownerId, owner.id))).get();
  if (!row) throw notFound();
  return row;
}

/** Marks entries whose item the viewer may not read; `redact` also drops their ids (for anyone but the owner). */
function markHidden(entries: KitEntryInput[], catalog: KitCatalog, redact: boolean): KitEntryView[] {
  return entries.map((e) => {
    if (typeof e.gearItemId !== 'string' || Object.hasOwn(catalog, e.gearItemId)) return e;
    return redact ? { gearItemId: null, quantity: e.quantity, hidden: true } : { ...e, hidden: true };
  });
}

export interface KitWithCatalog<K> {
  kit: K;
  /** The readable catalog items of the kit's entries. */
  catalog: KitCatalog;
}

export function listOwnKits(db: Db, owner: KitViewer): KitSummary[] {
  const rows = db.select().from(kits).where(eq(kits.ownerId, owner.id)).orderBy(desc(kits.updatedAt), asc(kits.name)).all();
  const counts = new Map(
    rows.length === 0
      ? []
      : db
          .select({ kitId: kitEntries.kitId, n: count() })
          .from(kitEntries)
          .where(inArray(kitEntries.kitId, rows.map((k) => k.id)))
          .groupBy(kitEntries.kitId)
          .all()
          .map((r) => [r.kitId, r.n] as const),
  );
  return rows.map((k) => ({
    id: k.id,
    name: k.name,
    purpose: k.purpose,
    tripDays: k.tripDays,
    entryCount: counts.get(k.id) ?? 0,
    shared: k.shareToken !== null,
    updatedAt: k.updatedAt.toISOString(),
  }));
}

/** The owner's kit with the readable catalog items it uses; 404 for anyone else. */
export function getOwnKit(db: Db, owner: KitViewer, id: string): KitWithCatalog<OwnKitRecord> {
  const record = recordFromRows(ownKitRow(db, owner, id), entryRows(db, id));
  const catalog = readableCatalog(db, owner, itemIds(record.entries));
  return { kit: { ...record, entries: markHidden(record.entries, catalog, false) }, catalog };
}

/** A kit behind a share link, read-only, for anyone holding the link; 404 for a wrong or revoked token. */
export function getSharedKit(db: Db, viewer: KitViewer | null, token: string): KitWithCatalog<KitRecord> & { ownerIsViewer: boolean } {
  if (typeof token !== 'string' || !SHARE_TOKEN.test(token)) throw new AppError('not_found', 'This share link is not valid or has been revoked.');
  const row = db.select().from(kits).where(eq(kits.shareToken, token)).get();
  if (!row) throw new AppError('not_found', 'This share link is not valid or has been revoked.');
  const { shareToken: _token, ...record } = recordFromRows(row, entryRows(db, row.id));
  void _token;
  const ownerIsViewer = viewer?.id === row.ownerId;
  const catalog = readableCatalog(db, viewer, itemIds(record.entries));
  return { kit: { ...record, entries: markHidden(record.entries, catalog, !ownerIsViewer) }, catalog, ownerIsViewer };
}

function itemIds(entries: readonly KitEntryInput[]): string[] {
  return entries.map((e) => e.gearItemId).filter((id): id is string => typeof id === 'string');
}

/** 422 naming each entry whose item the owner may not read (unless `allowed` already holds it). */
function assertReadableItems(db: Db, owner: KitViewer, entries: readonly KitEntryInput[], allowed: ReadonlySet<string> = new Set()): void {
  const ids = itemIds(entries).filter((id) => !allowed.has(id));
  if (ids.length === 0) return;
  const readable = readableCatalog(db, owner, ids);
  const fields: Record<string, string[]> = {};
  entries.forEach((e, i) => {
    if (typeof e.gearItemId === 'string' && !allowed.has(e.gearItemId) && !Object.hasOwn(readable, e.gearItemId)) {
      fields[`entries.${i}.gearItemId`] = ['No catalog item with this id that you can read.'];
    }
  });
  if (Object.keys(fields).length > 0) throw new AppError('invalid', 'Some entries name a catalog item you cannot read.', { fields });
}

function entryValues(kitId: string, entries: readonly KitEntryInput[]) {
  return entries.map((e, position) => ({
    id: randomUUID(),
    kitId,
    position,
    gearItemId: e.gearItemId ?? null,
    quantity: e.quantity,
    freeName: e.gearItemId ? null : (e.freeName ?? null),
    freeMassG: e.gearItemId ? null : (e.freeMassG ?? null),
    freePriceMinor: e.gearItemId ? null : (e.freePrice?.amountMinor ?? null),
    freePriceCurrency: e.gearItemId ? null : (e.freePrice?.currency ?? null),
    freeDrawW: e.gearItemId ? null : (e.freeDrawW ?? null),
    freeRole: e.gearItemId ? null : (e.freeRole ?? null),
    freePorts: e.gearItemId ? null : (e.freePorts ?? null),
    freeEfficiency: e.gearItemId ? null : (e.freeEfficiency ?? null),
    freeEnergyWh: e.gearItemId ? null : (e.freeEnergyWh ?? null),
    freeRatedW: e.gearItemId ? null : (e.freeRatedW ?? null),
    loadMode: e.loadMode ?? null,
    hoursPerDay: e.hoursPerDay ?? null,
    dutyCycle: e.dutyCycle ?? null,
    chemistry: e.chemistry ?? null,
    depthOfDischarge: e.depthOfDischarge ?? null,
  }));
}

/** Creates a kit from untrusted input (kitInputSchema); 422 with field errors and nothing stored on bad input. */
export function createKit(db: Db, owner: KitViewer, body: unknown): OwnKitRecord {
  const input = parseWith(kitInputSchema, body);
  assertReadableItems(db, owner, input.entries);
  const id = randomUUID();
  db.transaction(
    (tx) => {
      tx.insert(kits)
        .values({
          id,
          ownerId: owner.id,
          name: input.name,
          purpose: input.purpose,
          tripDays: input.tripDays,
          peakSunHours: input.peakSunHours ?? null,
          sky: input.sky ?? null,
          skyShare: input.skyShare ?? null,
          lossFraction: input.lossFraction ?? null,
          conversionEfficiency: input.conversionEfficiency ?? null,
        })
        .run();
      if (input.entries.length > 0) tx.insert(kitEntries).values(entryValues(id, input.entries)).run();
    },
    { behavior: 'immediate' },
  );
  return getOwnKit(db, owner, id).kit;
}

/** Changes the owner's kit (kitPatchSchema); `entries` replaces the list. 404 for anyone else. */
export function updateKit(db: Db, owner: KitViewer, id: string, body: unknown): OwnKitRecord {
  ownKitRow(db, owner, id);
  const patch = parseWith(kitPatchSchema, body);
  if (patch.entries) {
    const already = new Set(itemIds(entryRows(db, id).map(entryFromRow)));
    assertReadableItems(db, owner, patch.entries, already);
  }
  const { entries, ...fields } = patch;
  db.transaction(
    (tx) => {
      const set = Object.fromEntries(Object.entries(fields).filter(([, v]) => v !== undefined));
      tx.update(kits)
        .set({ ...set, updatedAt: new Date() })
        .where(and(eq(kits.id, id), eq(kits.ownerId, owner.id)))
        .run();
      if (entries) {
        tx.delete(kitEntries).where(eq(kitEntries.kitId, id)).run();
        if (entries.length > 0) tx.insert(kitEntries).values(entryValues(id, entries)).run();
      }
    },
    { behavior: 'immediate' },
  );
  return getOwnKit(db, owner, id).kit;
}

export function deleteKit(db: Db, owner: KitViewer, id: string): void {
  const result = db.delete(kits).where(and(eq(kits.id, id), eq(kits.ownerId, owner.id))).run();
  if (result.changes === 0) throw notFound();
}

/** A private copy of the owner's kit ("Copy of …"), without the share link. */
export function duplicateKit(db: Db, owner: KitViewer, id: string): OwnKitRecord {
  const source = ownKitRow(db, owner, id);
  const entries = entryRows(db, id);
  const copyId = randomUUID();
  db.transaction(
    (tx) => {
      tx.insert(kits)
        .values({ ...source, id: copyId, name: `Copy of ${source.name}`.slice(0, 120), shareToken: null, createdAt: new Date(), updatedAt: new Date() })
        .run();
      if (entries.length > 0) tx.insert(kitEntries).values(entries.map((e) => ({ ...e, id: randomUUID(), kitId: copyId }))).run();
    },
    { behavior: 'immediate' },
  );
  return getOwnKit(db, owner, copyId).kit;
}

/** A new share token of 192 random bits; any earlier link stops working at once. */
export function shareKit(db: Db, owner: KitViewer, id: string): string {
  ownKitRow(db, owner, id);
  const token = randomBytes(24).toString('base64url');
  db.update(kits).set({ shareToken: token }).where(and(eq(kits.id, id), eq(kits.ownerId, owner.id))).run();
  return token;
}

export function revokeShare(db: Db, owner: KitViewer, id: string): void {
  ownKitRow(db, owner, id);
  db.update(kits).set({ shareToken: null }).where(and(eq(kits.id, id), eq(kits.ownerId, owner.id))).run();
}
