/**
 * Query parameters of the public read API (`GET /api/v1/gear`, `/compare`, `/reviews`): one zod schema
 * each (they also feed the OpenAPI document) and a parser from URLSearchParams that throws
 * AppError('bad_request') naming every bad or unknown parameter. Pure: no framework imports.
 */
import { z } from 'zod';
import { CATEGORIES, isCurrencyCode, SPEC_KEYS, SPECS, type SpecKey } from '@/lib/measure';
import { CATEGORY_DEFS, RATIO_LABELS } from '@/lib/gear/categories';
import { AppError, type FieldErrors } from '@/lib/http/errors';
import { radioQuietParam, type RadioQuietFilter } from './radio-quiet';
import { featureFiltersOf, featureParamShape, unknownFeatureParamMessage } from './feature-filters';
import type { FeatureName } from '@/lib/gear/features';

/* ------------------------------------------------------------------------------------------------ */
/* Keys one may filter and sort by                                                                  */
/* ------------------------------------------------------------------------------------------------ */

export const MEASURED_VS_CLAIMED = 'measured-vs-claimed:';

/** Value ratio ids of lib/measure `valueRatios` (the stored gear_ratios), incl. measured ÷ claimed per spec. */
export const RATIO_IDS: readonly string[] = [...Object.keys(RATIO_LABELS), ...SPEC_KEYS.map((key) => `${MEASURED_VS_CLAIMED}${key}`)];

/** Every key of `sort`, `min.<key>` and `max.<key>`: spec keys (canonical units), ratio ids and `price` (major units). */
export const FIGURE_KEYS: readonly string[] = [...SPEC_KEYS, ...RATIO_IDS, 'price'];

export type FigureKind = 'spec' | 'ratio' | 'price';

export function figureKind(key: string): FigureKind {
  if (key === 'price') return 'price';
  return (SPEC_KEYS as readonly string[]).includes(key) ? 'spec' : 'ratio';
}

/** Keys whose value depends on a price, so a `currency` must be named (per-money ratios and the price itself). */
export function isMoneyKey(key: string): boolean {
  return key === 'price' || (figureKind(key) === 'ratio' && key.includes('money'));
}

/**
 * Whether a larger value of a key is better for the reader: specs from lib/measure SPECS, ratios from
 * lib/measure valueRatios (every ratio is higher-better except the cost per Wh; measured ÷ claimed
 * follows its spec), a lower price is better. Null: neither direction.
 */
export function higherIsBetter(key: string): boolean | null {
  if (key === 'price' || key === 'money-per-wh') return false;
  if (key.startsWith(MEASURED_VS_CLAIMED)) return SPECS[key.slice(MEASURED_VS_CLAIMED.length) as SpecKey]?.higherIsBetter ?? null;
  if (figureKind(key) === 'spec') return SPECS[key as SpecKey].higherIsBetter;
  return true;
}

/* ------------------------------------------------------------------------------------------------ */
/* Parameter schemas                                                                                */
/* ------------------------------------------------------------------------------------------------ */

const DECIMAL = /^-?(?:\d+\.?\d*|\.\d+)(?:[eE][-+]?\d+)?$/;

/** A finite decimal number written out in full (no `0x`, `Infinity`, blanks or empty strings). */
const numberParam = (description: string) =>
  z
    .string()
    .regex(DECIMAL, 'Must be a decimal number such as 300 or 2.5.')
    .transform(Number)
    .pipe(z.number().refine(Number.isFinite, 'Must be a finite number.'))
    .meta({ description });

const integerParam = (min: number, max: number, description: string) =>
  z
    .string()
    .regex(/^\d{1,4}$/, `Must be a whole number from ${min} to ${max}.`)
    .transform(Number)
    .pipe(z.number().int().min(min, `Must be a whole number from ${min} to ${max}.`).max(max, `Must be a whole number from ${min} to ${max}.`))
    .meta({ description });

const ALL_KINDS = [...new Set(Object.values(CATEGORY_DEFS).flatMap((def) => def.kinds.map((k) => k.id)))];

export const DEFAULT_LIMIT = 24;
export const MAX_LIMIT = 100;
const CURSOR_MAX = 600;

const cursorParam = z
  .string()
  .min(1, 'Must not be empty.')
  .max(CURSOR_MAX, 'Is too long to be a cursor of this API.')
  .regex(/^[A-Za-z0-9_-]+$/, 'Must be a cursor exactly as a previous response gave it (base64url).')
  .meta({ description: 'Opaque: the `nextCursor` of the previous page, unchanged. Valid only with the same sort and order.' });

const limitParam = integerParam(1, MAX_LIMIT, `Items per page, 1–${MAX_LIMIT} (default ${DEFAULT_LIMIT}).`).optional();

const unitsParam = z
  .enum(['metric', 'imperial'], { message: 'Must be metric or imperial.' })
  .optional()
  .meta({ description: '`imperial` adds imperial display values (`imperial`) to masses, lengths and temperatures; values and filters stay in canonical metric units.' });

const rangeShape = Object.fromEntries(
  FIGURE_KEYS.flatMap((key) => {
    const unit = key === 'price' ? 'major units of `currency`' : figureKind(key) === 'spec' ? SPECS[key as SpecKey].unit : 'the ratio’s unit';
    return [
      [`min.${key}`, numberParam(`Keep items whose ${key} is at least this (${unit}).`).optional()],
      [`max.${key}`, numberParam(`Keep items whose ${key} is at most this (${unit}).`).optional()],
    ];
  }),
) as Record<string, z.ZodOptional<ReturnType<typeof numberParam>>>;

/** `GET /api/v1/gear`: every parameter optional; unknown ones refused. */
export const gearListQuerySchema = z
  .strictObject({
    category: z.enum(CATEGORIES, { message: `Must be one of ${CATEGORIES.join(', ')}.` }).optional().meta({ description: 'Category id.' }),
    kind: z.enum(ALL_KINDS as [string, ...string[]], { message: `Must be a kind id such as ${ALL_KINDS.slice(0, 3).join(', ')}.` }).optional().meta({ description: 'Kind id within the category (e.g. `lantern`).' }),
    q: z.string().max(100, 'Must be at most 100 characters.').optional().meta({ description: 'Text in the name or maker (case-insensitive; `%` and `_` match themselves).' }),
    measured: z.literal('only', { message: 'The only value is `only`.' }).optional().meta({ description: '`only`: range filters and the sort use measured figures only.' }),
    reviewed: z.literal('true', { message: 'The only value is `true`.' }).optional().meta({ description: '`true`: only items with a published review.' }),
    currency: z
      .string()
      .refine(isCurrencyCode, 'Must be an upper-case ISO 4217 code such as USD or EUR.')
      .optional()
      .meta({ description: 'ISO 4217 code; required when the price or a per-money ratio is filtered or sorted. Items priced in another currency are left out and counted in `excludedOtherCurrency`.' }),
    sort: z.enum(FIGURE_KEYS as [string, ...string[]], { message: 'Must be a spec key, a ratio id or `price`.' }).optional().meta({ description: 'Spec key, ratio id or `price`. Items without the value come last. Without it, items are in slug order.' }),
    order: z.enum(['asc', 'desc'], { message: 'Must be asc or desc.' }).optional().meta({ description: 'Default: the better value first (e.g. lowest mass, highest lm/g).' }),
    limit: limitParam,
    cursor: cursorParam.optional(),
    units: unitsParam,
    radioQuiet: radioQuietParam,
    ...featureParamShape,
    ...rangeShape,
  })
  .superRefine((query, ctx) => {
    const q = query as Record<string, unknown>;
    if (query.kind && query.category && !CATEGORY_DEFS[query.category].kinds.some((k) => k.id === query.kind)) {
      ctx.addIssue({ code: 'custom', path: ['kind'], message: `Is not a kind of ${query.category}.` });
    }
    for (const key of FIGURE_KEYS) {
      const min = q[`min.${key}`] as number | undefined;
      const max = q[`max.${key}`] as number | undefined;
      if (min !== undefined && max !== undefined && min > max) {
        ctx.addIssue({ code: 'custom', path: [`min.${key}`], message: `Is greater than max.${key}.` });
      }
    }
    const moneyKeys = [query.sort, ...FIGURE_KEYS.filter((k) => q[`min.${k}`] !== undefined || q[`max.${k}`] !== undefined)].filter(
      (k): k is string => !!k && isMoneyKey(k),
    );
    if (moneyKeys.length && !query.currency) {
      ctx.addIssue({ code: 'custom', path: ['currency'], message: `Is required with ${moneyKeys[0]}: name the currency to compare prices in (e.g. USD).` });
    }
  });

export interface RangeFilter {
  key: string;
  min?: number;
  max?: number;
}

export interface GearListQuery {
  category?: (typeof CATEGORIES)[number];
  kind?: string;
  q?: string;
  measuredOnly: boolean;
  reviewedOnly: boolean;
  currency?: string;
  sort?: string;
  order: 'asc' | 'desc';
  limit: number;
  cursor?: string;
  imperial: boolean;
  ranges: RangeFilter[];
  /** Measured worst noise rise under the quiet threshold in these S-meter ranges (lib/browse/radio-quiet.ts). */
  radioQuiet?: RadioQuietFilter;
  /** `feature.<name>=true`: items stated to have each feature (lib/browse/feature-filters.ts). */
  features: FeatureName[];
}

/** `GET /api/v1/gear/{slug}`. */
export const gearItemQuerySchema = z.strictObject({ units: unitsParam });

/** `GET /api/v1/compare?items=a,b,c`. */
export const COMPARE_MIN = 2;
export const COMPARE_MAX = 6;
const SLUG = /^[a-z0-9](?:[a-z0-9-]{0,198}[a-z0-9])?$/;

export const compareQuerySchema = z.strictObject({
  items: z
    .string({ message: 'Is required: 2 to 6 item slugs separated by commas.' })
    .transform((text) => text.split(','))
    .pipe(
      z
        .array(z.string().regex(SLUG, 'Each item must be a slug such as northcairn-ember-300.'))
        .min(COMPARE_MIN, `Name at least ${COMPARE_MIN} items.`)
        .max(COMPARE_MAX, `Name at most ${COMPARE_MAX} items.`)
        .refine((slugs) => new Set(slugs).size === slugs.length, 'Name each item once.'),
    )
    .meta({
      description: `${COMPARE_MIN}–${COMPARE_MAX} gear slugs separated by commas, in column order.`,
      example: 'northcairn-cairnlight-900,glowmere-scree-600',
    }),
  units: unitsParam,
});

export interface CompareQuery {
  items: string[];
  imperial: boolean;
}

/** `GET /api/v1/reviews`. */
export const reviewListQuerySchema = z.strictObject({
  gear: z.string().regex(SLUG, 'Must be a gear slug.').optional().meta({ description: 'Only reviews covering this gear item (slug).' }),
  limit: limitParam,
  cursor: cursorParam.optional(),
});

/** `GET /api/v1/reviews/{slug}`: no parameters. */
export const reviewItemQuerySchema = z.strictObject({});

export interface ReviewListQuery {
  gear?: string;
  limit: number;
  cursor?: string;
}

/* ------------------------------------------------------------------------------------------------ */
/* Parsing                                                                                          */
/* ------------------------------------------------------------------------------------------------ */

/** The message of a 400 naming the parameters. */
function badRequest(fields: FieldErrors): AppError {
  const names = Object.keys(fields);
  const first = names[0]!;
  const more = names.length > 1 ? ` (and ${names.slice(1).join(', ')})` : '';
  return new AppError('bad_request', `Query parameter "${first}": ${fields[first]![0]}${more}`, { fields });
}

/** Plain object of the parameters; a parameter given twice is refused (its meaning would be unclear). */
function singleValued(params: URLSearchParams): Record<string, string> {
  const out: Record<string, string> = {};
  const fields: FieldErrors = {};
  for (const [name, value] of params) {
    if (Object.prototype.hasOwnProperty.call(out, name)) fields[name] = ['Is given more than once.'];
    out[name] = value;
  }
  if (Object.keys(fields).length) throw badRequest(fields);
  return out;
}

function parseParams<S extends z.ZodType>(schema: S, params: URLSearchParams): z.output<S> {
  const result = schema.safeParse(singleValued(params));
  if (result.success) return result.data;
  const fields: FieldErrors = {};
  for (const issue of result.error.issues) {
    if (issue.code === 'unrecognized_keys') {
      for (const key of issue.keys) (fields[key] ??= []).push(unknownFeatureParamMessage(key) ?? 'Is not a parameter of this route.');
      continue;
    }
    const name = String(issue.path[0] ?? '_');
    (fields[name] ??= []).push(issue.message);
  }
  throw badRequest(fields);
}

/** Parses the query of `GET /api/v1/gear`; AppError 400 naming each bad or unknown parameter. */
export function parseGearListQuery(params: URLSearchParams): GearListQuery {
  const parsed = parseParams(gearListQuerySchema, params) as Record<string, unknown> & z.output<typeof gearListQuerySchema>;
  const ranges: RangeFilter[] = [];
  for (const key of FIGURE_KEYS) {
    const min = parsed[`min.${key}`] as number | undefined;
    const max = parsed[`max.${key}`] as number | undefined;
    if (min !== undefined || max !== undefined) ranges.push({ key, min, max });
  }
  const sort = parsed.sort;
  const better = sort ? higherIsBetter(sort) : null;
  const q = parsed.q?.trim();
  return {
    category: parsed.category,
    kind: parsed.kind,
    q: q ? q : undefined,
    measuredOnly: parsed.measured === 'only',
    reviewedOnly: parsed.reviewed === 'true',
    currency: parsed.currency,
    sort,
    order: parsed.order ?? (better === true ? 'desc' : 'asc'),
    limit: parsed.limit ?? DEFAULT_LIMIT,
    cursor: parsed.cursor,
    imperial: parsed.units === 'imperial',
    ranges,
    radioQuiet: parsed.radioQuiet,
    features: featureFiltersOf(parsed),
  };
}

export function parseGearItemQuery(params: URLSearchParams): { imperial: boolean } {
  return { imperial: parseParams(gearItemQuerySchema, params).units === 'imperial' };
}

export function parseCompareQuery(params: URLSearchParams): CompareQuery {
  const parsed = parseParams(compareQuerySchema, params);
  return { items: parsed.items, imperial: parsed.units === 'imperial' };
}

export function parseReviewListQuery(params: URLSearchParams): ReviewListQuery {
  const parsed = parseParams(reviewListQuerySchema, params);
  return { gear: parsed.gear, limit: parsed.limit ?? DEFAULT_LIMIT, cursor: parsed.cursor };
}

export function parseReviewItemQuery(params: URLSearchParams): void {
  parseParams(reviewItemQuerySchema, params);
}
