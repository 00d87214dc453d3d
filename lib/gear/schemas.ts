/**
 * One zod schema per input, shared by the form (react-hook-form + zodResolver), the server actions
 * and the API route handlers.
 *
 * Spec values are typed text ("12.3 oz", "10 400 mAh at 3.6 V") or a number in the canonical unit;
 * both parse to the canonical unit of lib/measure. Every object is strict: unknown keys (ownerId,
 * role, status, id …) are refused with a field error, never silently stored.
 */
import { z } from 'zod';
import { CATEGORIES, CHEMISTRIES, isCurrencyCode, minorUnitDigits, moneyFromMajor, SPECS, type Category, type Money, type SpecKey } from '@/lib/measure';
import { CATEGORY_DEFS, CLAIM_SOURCES, claimableSpecs, MODE_SPEC_KEYS, type ClaimSource } from './categories';
import { MAX_CANONICAL, parseQuantity, QuantityParseError, type TypedQuantity } from './parse-quantity';

const blankToNull = (v: unknown) => (v === '' || v === undefined ? null : v);

/** A spec value: typed text with a unit, or a number in the canonical unit. '' or null means "not given". */
export function quantityValue(quantity: TypedQuantity) {
  return z
    .union([z.number(), z.string().max(60, 'Use at most 60 characters.')], { error: 'Enter a value with its unit, e.g. "450 g".' })
    .nullable()
    .optional()
    .transform((v, ctx): number | null => {
      if (v === null || v === undefined) return null;
      if (typeof v === 'string' && v.trim() === '') return null;
      if (typeof v === 'number') {
        if (!Number.isFinite(v)) ctx.addIssue({ code: 'custom', message: 'The value must be a finite number.' });
        else if (v < 0) ctx.addIssue({ code: 'custom', message: 'The value must not be negative.' });
        else if (v === 0) ctx.addIssue({ code: 'custom', message: 'The value must be greater than zero.' });
        else if (v > MAX_CANONICAL) ctx.addIssue({ code: 'custom', message: 'The value is too large.' });
        else return v;
        return z.NEVER;
      }
      try {
        return parseQuantity(v, quantity).value;
      } catch (error) {
        ctx.addIssue({ code: 'custom', message: error instanceof QuantityParseError ? error.message : 'The value could not be read.' });
        return z.NEVER;
      }
    });
}

const claimSourceField = z.enum(CLAIM_SOURCES, { error: 'Choose packaging, manual or maker’s site.' });

function specEntry(key: SpecKey) {
  return z.strictObject({ value: quantityValue(SPECS[key].quantity as TypedQuantity), source: claimSourceField.optional() }).optional();
}

const CLAIMABLE_KEYS = (Object.keys(SPECS) as SpecKey[]).filter((k) => !SPECS[k].measuredOnly);

const specsField = z.strictObject(Object.fromEntries(CLAIMABLE_KEYS.map((k) => [k, specEntry(k)])) as Record<SpecKey, ReturnType<typeof specEntry>>);

const modeField = z.strictObject({
  name: z
    .string()
    .trim()
    .min(1, 'Name the mode, e.g. "low".')
    .max(40, 'Use at most 40 characters.')
    .regex(/^[\p{L}\p{N} ._+-]+$/u, 'Use letters, digits, spaces and . _ + - only.'),
  luminousFlux: quantityValue('luminousFlux'),
  runtime: quantityValue('duration'),
  powerDraw: quantityValue('power'),
});

const priceField = z
  .strictObject({
    amount: z.union([z.number(), z.string().max(20)]).nullable().optional(),
    currency: z.string().trim().toUpperCase().max(3).optional(),
  })
  .nullable()
  .optional()
  .transform((p, ctx): Money | null => {
    const raw = p?.amount;
    if (raw === null || raw === undefined || (typeof raw === 'string' && raw.trim() === '')) return null;
    const text = typeof raw === 'number' ? String(raw) : raw.trim();
    const currency = p?.currency ?? '';
    if (!isCurrencyCode(currency)) {
      ctx.addIssue({ code: 'custom', path: ['currency'], message: 'Choose the currency you paid in (ISO 4217 code such as USD or EUR).' });
      return z.NEVER;
    }
    if (!/^\d+(\.\d+)?$/.test(text) || !Number.isFinite(Number(text))) {
      ctx.addIssue({ code: 'custom', path: ['amount'], message: 'Enter the price as a number such as 59.99 (no negative amounts).' });
      return z.NEVER;
    }
    const digits = minorUnitDigits(currency);
    const decimals = text.includes('.') ? text.split('.')[1]!.length : 0;
    if (decimals > digits) {
      ctx.addIssue({
        code: 'custom',
        path: ['amount'],
        message: digits === 0 ? `${currency} has no minor unit: enter a whole amount.` : `${currency} has ${digits} decimal places at most.`,
      });
      return z.NEVER;
    }
    const amount = Number(text);
    if (amount > 10_000_000) {
      ctx.addIssue({ code: 'custom', path: ['amount'], message: 'The price is too large.' });
      return z.NEVER;
    }
    return moneyFromMajor(amount, currency);
  });

const thisYear = new Date().getUTCFullYear();

/** The fields a reviewer edits, without the category (fixed at creation). */
const editableShape = {
  name: z.string().trim().min(2, 'Give the item’s name (at least 2 characters).').max(120, 'Use at most 120 characters.'),
  maker: z.string().trim().min(1, 'Give the maker’s name.').max(80, 'Use at most 80 characters.'),
  kind: z.preprocess(blankToNull, z.string().max(40).nullable()),
  modelYear: z.preprocess(
    (v) => (typeof v === 'string' ? (v.trim() === '' ? null : Number(v)) : (v ?? null)),
    z
      .number({ error: 'Enter a year such as 2026.' })
      .int('Enter a whole year such as 2026.')
      .min(1950, 'Enter a year from 1950.')
      .max(thisYear + 1, `Enter a year up to ${thisYear + 1}.`)
      .nullable(),
  ),
  price: priceField,
  pricePaidOn: z.preprocess(
    blankToNull,
    z
      .string()
      .regex(/^\d{4}-\d{2}-\d{2}$/, 'Enter the date as YYYY-MM-DD.')
      .refine((s) => !Number.isNaN(Date.parse(`${s}T00:00:00Z`)), 'Enter a real date.')
      .nullable(),
  ),
  notes: z.string().max(5000, 'Use at most 5000 characters.').optional().default(''),
  chemistry: z.preprocess(blankToNull, z.enum(CHEMISTRIES, { error: 'Choose one of the listed chemistries.' }).nullable()),
  waterRating: z.preprocess(
    (v) => (typeof v === 'string' ? (v.trim() === '' ? null : v.trim().toUpperCase()) : (v ?? null)),
    z
      .string()
      .regex(/^IP[0-6X][0-9X]$/, 'Give an IEC 60529 IP code such as IPX4 or IP67.')
      .refine((s) => s !== 'IPXX', 'Give at least one digit, such as IPX4.')
      .nullable(),
  ),
  claimSource: claimSourceField.optional().default('packaging'),
  specs: specsField.optional().default({}),
  modes: z.array(modeField).max(12, 'Record at most 12 modes.').optional().default([]),
  /** Why the figures change (shown in the dated "figures updated" note once approved). */
  changeNote: z.string().trim().max(500, 'Use at most 500 characters.').optional().default(''),
};

interface Checked {
  category: Category;
  kind: string | null;
  chemistry: string | null;
  waterRating: string | null;
  specs: Partial<Record<SpecKey, { value: number | null; source?: ClaimSource } | undefined>>;
  modes: { name: string; luminousFlux: number | null; runtime: number | null; powerDraw: number | null }[];
}

/** Rules that depend on the category: kinds, required and allowed specs, modes, chemistry. */
function checkCategory(input: Checked, ctx: z.RefinementCtx): void {
  const def = CATEGORY_DEFS[input.category];
  if (!def) return;
  if (input.kind !== null && !def.kinds.some((k) => k.id === input.kind)) {
    ctx.addIssue({
      code: 'custom',
      path: ['kind'],
      message: def.kinds.length ? `Choose one of: ${def.kinds.map((k) => k.label).join(', ')}.` : `A ${def.label.toLowerCase()} has no kinds.`,
    });
  }
  const allowed = new Set(claimableSpecs(input.category).map((s) => s.key));
  for (const [key, entry] of Object.entries(input.specs)) {
    if (entry && entry.value !== null && !allowed.has(key as SpecKey)) {
      ctx.addIssue({ code: 'custom', path: ['specs', key, 'value'], message: `A ${def.label.toLowerCase()} has no ${SPECS[key as SpecKey].label.toLowerCase()} spec.` });
    }
  }
  for (const s of def.specs) {
    if (s.required && (input.specs[s.key]?.value ?? null) === null) {
      ctx.addIssue({ code: 'custom', path: ['specs', s.key, 'value'], message: `The claimed ${s.label.toLowerCase()} is required for a ${def.label.toLowerCase()}.` });
    }
  }
  if (def.chemistry.required && input.chemistry === null) {
    ctx.addIssue({ code: 'custom', path: ['chemistry'], message: `Choose the cell chemistry of this ${def.label.toLowerCase()}.` });
  }
  if (!def.chemistry.shown && input.chemistry !== null) {
    ctx.addIssue({ code: 'custom', path: ['chemistry'], message: `A ${def.label.toLowerCase()} records no chemistry.` });
  }
  if (!def.waterRating && input.waterRating !== null) {
    ctx.addIssue({ code: 'custom', path: ['waterRating'], message: `A ${def.label.toLowerCase()} records no water rating.` });
  }
  const names = new Set<string>();
  input.modes.forEach((mode, i) => {
    if (def.modes === null) {
      ctx.addIssue({ code: 'custom', path: ['modes', i, 'name'], message: `A ${def.label.toLowerCase()} has no modes.` });
      return;
    }
    const key = mode.name.toLowerCase();
    if (names.has(key)) ctx.addIssue({ code: 'custom', path: ['modes', i, 'name'], message: 'Each mode needs its own name.' });
    names.add(key);
    const keys: readonly string[] = MODE_SPEC_KEYS[def.modes];
    for (const k of ['luminousFlux', 'runtime', 'powerDraw'] as const) {
      if (mode[k] !== null && !keys.includes(k)) {
        ctx.addIssue({ code: 'custom', path: ['modes', i, k], message: `A ${def.label.toLowerCase()} mode records only its power draw.` });
      }
    }
    if (keys.every((k) => mode[k as 'luminousFlux' | 'runtime' | 'powerDraw'] === null)) {
      ctx.addIssue({ code: 'custom', path: ['modes', i, 'name'], message: 'Give at least one figure for this mode, or remove it.' });
    }
  });
}

/** Create a gear item (form, action, POST /api/v1/gear). */
export const gearInputSchema = z
  .strictObject({
    category: z.enum(CATEGORIES, { error: `Choose a category: ${CATEGORIES.join(', ')}.` }),
    ...editableShape,
  })
  .superRefine((input, ctx) => checkCategory(input, ctx));

export type GearInput = z.input<typeof gearInputSchema>;
export type GearData = z.output<typeof gearInputSchema>;

/**
 * Change a gear item (action, PATCH /api/v1/gear/{slug}): any subset of the editable top-level
 * fields; each given field replaces the current one (specs and modes as a whole). The category is
 * fixed at creation. The merged result is validated with `gearInputSchema`.
 */
export const gearPatchSchema = z.strictObject(editableShape).partial();
export type GearPatch = z.input<typeof gearPatchSchema>;

/** Send back with a comment (editor). */
export const sendBackSchema = z.strictObject({
  comment: z.string().trim().min(3, 'Say what the author should change.').max(2000, 'Use at most 2000 characters.'),
});
export type SendBackInput = z.input<typeof sendBackSchema>;

export interface ClaimRow {
  key: SpecKey;
  mode: string;
  value: number;
  source: ClaimSource;
}

/** The claimed spec rows of validated input: item-level specs (mode '') and each mode's figures. */
export function claimRows(data: Pick<GearData, 'specs' | 'modes' | 'claimSource'>): ClaimRow[] {
  const rows: ClaimRow[] = [];
  for (const [key, entry] of Object.entries(data.specs ?? {})) {
    if (entry && entry.value !== null) rows.push({ key: key as SpecKey, mode: '', value: entry.value, source: entry.source ?? data.claimSource });
  }
  for (const mode of data.modes ?? []) {
    for (const k of ['luminousFlux', 'runtime', 'powerDraw'] as const) {
      const v = mode[k];
      if (v !== null) rows.push({ key: k, mode: mode.name, value: v, source: data.claimSource });
    }
  }
  return rows;
}
