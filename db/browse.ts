/**
 * Browse reads of the public API (`GET /api/v1/gear`, `/gear/{slug}`): filters, sorts, keyset paging
 * and facets in SQL over gear_items, specs and the indexed gear_ratios.
 *
 * Visibility: items with an approved version (their approved figures: the `specs` rows and stored
 * ratios stay the approved ones while an edit is pending, see db/gear.ts) for everyone; a signed-in
 * caller also sees their own never-approved items, marked with `status`. Stored ratios exist only
 * for approved items, so a caller's own drafts have no ratios (they sort last on a ratio).
 *
 * Sorted values: a spec's headline figure (measured when there is one, else claimed; with
 * `measured=only` the measured one only), a stored ratio (with `measured=only` only measured-based
 * ones; measured ÷ claimed always qualifies) or the price in major units. Items without the value
 * come last in either order; ties are broken by slug (ascending) so paging is stable.
 */
import { and, asc, eq, inArray } from 'drizzle-orm';
import { sql, type SQL } from 'drizzle-orm';
import type { Db } from './connection';
import { radioQuietCondition } from './browse-radio-quiet';
import { categoryFacetQuery, featureConditions, servesAsCondition } from './browse-roles';
import { rolesAndFeaturesOf } from './gear-roles';
import { publicPortsOf } from './measured-ports';
import { gearItems, gearRatios, photos, specs, type GearItem, type Role } from './schema';
import type { Figure, GearListResponse, GearSummary } from '@/lib/browse/contract';
import { decodeGearCursor, encodeCursor } from '@/lib/browse/cursor';
import { figureKind, isMoneyKey, MEASURED_VS_CLAIMED, type GearListQuery, type RangeFilter } from '@/lib/browse/query';
import { CATEGORY_LIST } from '@/lib/gear/categories';
import { gearPath } from '@/lib/gear/paths';
import { AppError } from '@/lib/http/errors';
import { isSpecKey, minorUnitDigits, SPECS } from '@/lib/measure';
import { variantUrl } from '@/lib/photos/config';
import { withImperial } from '@/lib/units/display';

/** The signed-in caller of a read, or null for an anonymous one. */
export type Caller = { id: string; role: Role } | null;

/* ------------------------------------------------------------------------------------------------ */
/* SQL pieces                                                                                       */
/* ------------------------------------------------------------------------------------------------ */

function visibleTo(caller: Caller): SQL {
  return caller ? sql`(g.approved_at IS NOT NULL OR g.owner_id = ${caller.id})` : sql`g.approved_at IS NOT NULL`;
}

/** Has a review whose latest public revision is published (not retracted) — the rule of db/reviews.ts. */
const HAS_PUBLISHED_REVIEW = sql`EXISTS (
  SELECT 1 FROM review_items ri
  WHERE ri.gear_item_id = g.id
    AND (SELECT rr.state FROM review_revisions rr
         WHERE rr.review_id = ri.review_id AND rr.state IN ('published', 'retracted')
         ORDER BY rr.number DESC LIMIT 1) = 'published')`;

/** LIKE pattern for text anywhere in a column, with LIKE's wildcards taken literally (ESCAPE '\'). */
export function containsPattern(text: string): string {
  return `%${text.replace(/[\\%_]/g, (c) => `\\${c}`)}%`;
}

/** SQL value of a key for the item `g` (NULL when it has none). */
function valueOf(key: string, query: Pick<GearListQuery, 'measuredOnly' | 'currency'>): SQL {
  const kind = figureKind(key);
  if (kind === 'price') {
    const factor = 10 ** minorUnitDigits(query.currency!);
    return sql`(CASE WHEN g.price_currency = ${query.currency!} AND g.price_minor IS NOT NULL THEN g.price_minor * 1.0 / ${factor} END)`;
  }
  if (kind === 'spec') {
    // A measured-only spec (e.g. a noise rise) counts only as measured, whatever a row claims.
    const measured = query.measuredOnly || (isSpecKey(key) && SPECS[key].measuredOnly) ? sql` AND s.basis = 'measured'` : sql``;
    return sql`(SELECT s.value FROM specs s WHERE s.gear_item_id = g.id AND s.key = ${key} AND s.mode = ''${measured} ORDER BY s.basis DESC LIMIT 1)`;
  }
  const measured = query.measuredOnly && !key.startsWith(MEASURED_VS_CLAIMED) ? sql` AND r.basis = 'measured'` : sql``;
  const currency = isMoneyKey(key) ? sql` AND r.currency = ${query.currency!}` : sql``;
  return sql`(SELECT r.value FROM gear_ratios r WHERE r.gear_item_id = g.id AND r.ratio_id = ${key}${measured}${currency})`;
}

function rangeCondition(range: RangeFilter, query: GearListQuery): SQL {
  const value = valueOf(range.key, query);
  const parts = [sql`${value} IS NOT NULL`];
  if (range.min !== undefined) parts.push(sql`${value} >= ${range.min}`);
  if (range.max !== undefined) parts.push(sql`${value} <= ${range.max}`);
  return sql.join(parts, sql` AND `);
}

interface Leave {
  category?: boolean;
  currency?: boolean;
  moneyRanges?: boolean;
}

/** Every filter of the query as SQL conditions on `g`, optionally leaving some out (facets, exclusion count). */
function conditions(query: GearListQuery, caller: Caller, leave: Leave = {}): SQL {
  const parts: SQL[] = [visibleTo(caller)];
  if (query.category && !leave.category) parts.push(servesAsCondition(query.category));
  if (query.kind) parts.push(sql`g.kind = ${query.kind}`);
  if (query.q) {
    const pattern = containsPattern(query.q);
    parts.push(sql`(g.name LIKE ${pattern} ESCAPE '\\' OR g.maker LIKE ${pattern} ESCAPE '\\')`);
  }
  if (query.reviewedOnly) parts.push(HAS_PUBLISHED_REVIEW);
  if (query.radioQuiet) parts.push(radioQuietCondition(query.radioQuiet));
  parts.push(...featureConditions(query.features ?? []));
  if (usesMoney(query) && !leave.currency) parts.push(sql`(g.price_currency IS NULL OR g.price_currency = ${query.currency!})`);
  for (const range of query.ranges) {
    if (leave.moneyRanges && isMoneyKey(range.key)) continue;
    parts.push(rangeCondition(range, query));
  }
  return sql.join(parts, sql` AND `);
}

function usesMoney(query: GearListQuery): boolean {
  return (!!query.sort && isMoneyKey(query.sort)) || query.ranges.some((r) => isMoneyKey(r.key));
}

/* ------------------------------------------------------------------------------------------------ */
/* Summaries                                                                                        */
/* ------------------------------------------------------------------------------------------------ */

const PHOTO_WIDTH = 480;

interface SummaryOptions {
  caller: Caller;
  imperial: boolean;
  sortValues?: Map<string, number | null>;
}

/** Public-API summaries of the given items, in the given order. */
function summaries(db: Db, items: GearItem[], options: SummaryOptions): GearSummary[] {
  if (items.length === 0) return [];
  const ids = items.map((i) => i.id);
  const specRows = db
    .select()
    .from(specs)
    .where(and(inArray(specs.gearItemId, ids), eq(specs.mode, '')))
    .all();
  const ratioRows = db.select().from(gearRatios).where(inArray(gearRatios.gearItemId, ids)).orderBy(asc(gearRatios.ratioId)).all();
  const photoRows = db.select().from(photos).where(inArray(photos.gearItemId, ids)).orderBy(asc(photos.position), asc(photos.createdAt)).all();
  const reviewed = new Set(
    db
      .all<{ id: string }>(sql`SELECT g.id AS id FROM gear_items g WHERE g.id IN (${sql.join(ids.map((id) => sql`${id}`), sql`, `)}) AND ${HAS_PUBLISHED_REVIEW}`)
      .map((r) => r.id),
  );
  const figure = (f: Figure): Figure => (options.imperial ? withImperial(f) : f);
  const roles = rolesAndFeaturesOf(db, items);

  return items.map((item) => {
    const itemSpecs: Record<string, Figure> = {};
    for (const row of specRows) {
      if (row.gearItemId !== item.id || !isSpecKey(row.key)) continue;
      const current = itemSpecs[row.key];
      if (current && current.basis === 'measured') continue; // measured is the headline figure
      itemSpecs[row.key] = figure({
        value: row.value,
        unit: SPECS[row.key].unit,
        basis: row.basis,
        provenance: row.basis === 'measured' && row.fieldTestId ? `/field-tests/${row.fieldTestId}` : null,
      });
    }
    const ratios: Record<string, Figure> = {};
    for (const row of ratioRows) {
      if (row.gearItemId !== item.id) continue;
      ratios[row.ratioId] = { value: row.value, unit: row.unit, basis: row.basis, provenance: null };
    }
    const photo = photoRows.find((p) => p.gearItemId === item.id);
    const width = photo ? Math.min(PHOTO_WIDTH, photo.width) : 0;
    const summary: GearSummary = {
      slug: item.slug,
      name: item.name,
      maker: item.maker,
      category: item.category,
      kind: item.kind,
      path: gearPath(item.slug),
      photo: photo
        ? { src: variantUrl(photo.storageKey, PHOTO_WIDTH), alt: photo.altText || `${item.maker} ${item.name}`, width, height: Math.round((photo.height * width) / photo.width) }
        : null,
      price: item.priceMinor !== null && item.priceCurrency ? { minor: item.priceMinor, currency: item.priceCurrency } : null,
      specs: itemSpecs,
      ratios,
      sortValue: options.sortValues?.get(item.id) ?? null,
      reviewed: reviewed.has(item.id),
      ...roles.get(item.id)!,
    };
    if (options.caller && item.ownerId === options.caller.id) summary.status = item.status;
    return summary;
  });
}

/* ------------------------------------------------------------------------------------------------ */
/* Reads                                                                                            */
/* ------------------------------------------------------------------------------------------------ */

/** `GET /api/v1/gear`: one page of items with total, facets and the other-currency count. */
export function listGear(db: Db, query: GearListQuery, caller: Caller): GearListResponse {
  const sortKey = query.sort ?? null;
  const cursor = query.cursor ? decodeGearCursor(query.cursor, sortKey, query.order) : null;
  const where = conditions(query, caller);
  const sortValue = sortKey ? valueOf(sortKey, query) : sql`NULL`;

  const dir = query.order === 'asc' ? sql`ASC` : sql`DESC`;
  const orderBy = sortKey ? sql`(sv IS NULL) ASC, sv ${dir}, slug ASC` : sql`slug ${dir}`;
  let after = sql`1`;
  if (cursor && sortKey) {
    const beyond = query.order === 'asc' ? sql`sv > ${cursor.v}` : sql`sv < ${cursor.v}`;
    after =
      cursor.v === null
        ? sql`(sv IS NULL AND slug > ${cursor.s})`
        : sql`(sv IS NULL OR ${beyond} OR (sv = ${cursor.v} AND slug > ${cursor.s}))`;
  } else if (cursor) {
    after = query.order === 'asc' ? sql`slug > ${cursor.s}` : sql`slug < ${cursor.s}`;
  }

  const rows = db.all<{ id: string; slug: string; sv: number | null }>(sql`
    SELECT id, slug, sv FROM (SELECT g.id AS id, g.slug AS slug, ${sortValue} AS sv FROM gear_items g WHERE ${where})
    WHERE ${after}
    ORDER BY ${orderBy}
    LIMIT ${query.limit + 1}`);
  const page = rows.slice(0, query.limit);
  const last = page.at(-1);
  const nextCursor =
    rows.length > query.limit && last ? encodeCursor({ k: sortKey, o: query.order, v: sortKey ? last.sv : null, s: last.slug }) : null;

  const items = page.length ? db.select().from(gearItems).where(inArray(gearItems.id, page.map((r) => r.id))).all() : [];
  const byId = new Map(items.map((i) => [i.id, i]));
  const ordered = page.map((r) => byId.get(r.id)!);

  const total = db.get<{ n: number }>(sql`SELECT count(*) AS n FROM gear_items g WHERE ${where}`)?.n ?? 0;
  // An item counts under its primary category and each category it also serves as.
  const facetRows = db.all<{ category: string; n: number }>(categoryFacetQuery(conditions(query, caller, { category: true })));
  const facetCount = new Map(facetRows.map((r) => [r.category, r.n]));
  const excludedOtherCurrency = usesMoney(query)
    ? (db.get<{ n: number }>(
        sql`SELECT count(*) AS n FROM gear_items g WHERE ${conditions(query, caller, { currency: true, moneyRanges: true })}
            AND g.price_currency IS NOT NULL AND g.price_currency <> ${query.currency!}`,
      )?.n ?? 0)
    : 0;

  return {
    items: summaries(db, ordered, { caller, imperial: query.imperial, sortValues: new Map(page.map((r) => [r.id, r.sv])) }),
    nextCursor,
    total,
    excludedOtherCurrency,
    facets: {
      categories: CATEGORY_LIST.map((def) => ({ id: def.id, label: def.plural, count: facetCount.get(def.id) ?? 0 })),
      all: db.get<{ n: number }>(sql`SELECT count(*) AS n FROM gear_items g WHERE ${conditions(query, caller, { category: true })}`)?.n ?? 0,
    },
  };
}

/** Items a caller may read through the public API: approved ones, and their own; else 404. */
export function findReadableGear(db: Db, slugs: readonly string[], caller: Caller): GearItem[] {
  const rows = slugs.length ? db.select().from(gearItems).where(inArray(gearItems.slug, [...slugs])).all() : [];
  const bySlug = new Map(rows.map((r) => [r.slug, r]));
  return slugs.map((slug) => {
    const item = bySlug.get(slug);
    if (!item || !(item.approvedAt !== null || (caller && caller.id === item.ownerId))) {
      throw new AppError('not_found', `No gear item "${slug}", or you may not see it.`);
    }
    return item;
  });
}

/** `GET /api/v1/gear/{slug}`: the summary of one item (404 for an unknown or hidden slug). */
export function getGearSummary(db: Db, slug: string, caller: Caller, options: { imperial?: boolean } = {}): GearSummary {
  const [item] = findReadableGear(db, [slug], caller);
  const summary = summaries(db, [item!], { caller, imperial: options.imperial ?? false })[0]!;
  // The live port rows are the approved ones of a public item (an edit waits in its pending change).
  return { ...summary, ports: publicPortsOf(db, item!.id) };
}

export { summaries as gearSummaries };
