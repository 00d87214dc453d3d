/**
 * One zod schema per input, shared by the form (react-hook-form + zodResolver), the server actions
 * and the API route handlers.
 *
 * Spec values are typed text ("12.3 oz", "10 400 mAh at 3.6 V") or a number in the canonical unit;
 * both parse to the canonical unit of lib/measure. Every object is strict: unknown keys (ownerId,
 * role, status, id …) are refused with a field error, never silently stored.
 */
import { z } from 'zod';
import {
  CATEGORIES,
  CHEMISTRIES,
  isCurrencyCode,
  MeasureError,
  minorUnitDigits,
  moneyFromMajor,
  PD_MAX_AMPS,
  PD_MAX_VOLTS,
  PORT_DIRECTIONS,
  PORT_KIND_LABELS,
  PORT_KINDS,
  SPECS,
  validatePort,
  type Category,
  type Money,
  type Port,
  type SpecKey,
} from '@/lib/measure';
import { CATEGORY_DEFS, CLAIM_SOURCES, claimableSpecs, MODE_SPEC_KEYS, type ClaimSource } from './categories';
import { MAX_CANONICAL, parseQuantity, QuantityParseError, type TypedQuantity } from './parse-quantity';
import { MAX_PORTS, parsePdProfiles, PdProfileTextError } from './ports';
import { checkFeatures, featuresField, type FeatureClaim } from './features';
import { alsoServesAsField, checkRoles, roleSpecs, rolesOf } from './roles';

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

/* ---------------------------------------------------------------------------------------------- */
/* Ports (lib/measure `Port`, figures in V, A, W)                                                  */
/* ---------------------------------------------------------------------------------------------- */

const MAX_PORT_FIGURE = 1_000_000;

/** A port figure: a number, or text such as "12", "12 V", "2.4 A" (the unit, if typed, must be `unit`). '' or null: not given. */
function portFigure(unit: 'V' | 'A' | 'W', max = MAX_PORT_FIGURE, what = 'value') {
  return z
    .union([z.number(), z.string().max(30, 'Use at most 30 characters.')], { error: `Enter the ${what} as a number of ${unit}.` })
    .nullable()
    .optional()
    .transform((v, ctx): number | undefined => {
      if (v === null || v === undefined || (typeof v === 'string' && v.trim() === '')) return undefined;
      let n: number;
      if (typeof v === 'number') n = v;
      else {
        const m = new RegExp(`^(-?\\d+(?:\\.\\d+)?)\\s*(?:${unit})?$`, 'i').exec(v.trim());
        if (!m) {
          ctx.addIssue({ code: 'custom', message: `Enter the ${what} as a number of ${unit}, e.g. "${unit === 'V' ? '12' : unit === 'A' ? '2.4' : '18'}".` });
          return z.NEVER;
        }
        n = Number(m[1]);
      }
      if (!Number.isFinite(n)) ctx.addIssue({ code: 'custom', message: `The ${what} must be a finite number.` });
      else if (n <= 0) ctx.addIssue({ code: 'custom', message: `The ${what} must be greater than 0 ${unit}.` });
      else if (n > max) ctx.addIssue({ code: 'custom', message: `The ${what} must be at most ${max} ${unit}.` });
      else return n;
      return z.NEVER;
    });
}

const pdProfileField = z.strictObject({
  // USB PD fixed profiles reach 48 V (EPR, USB PD Rev 3.1) and 5 A (check-values §7).
  volts: z.number({ error: 'Enter the profile’s volts as a number.' }).positive('The profile’s volts must be greater than 0.').max(PD_MAX_VOLTS, `USB Power Delivery profiles go up to ${PD_MAX_VOLTS} V.`),
  amps: z.number({ error: 'Enter the profile’s amps as a number.' }).positive('The profile’s amps must be greater than 0.').max(PD_MAX_AMPS, `USB Power Delivery profiles carry at most ${PD_MAX_AMPS} A.`),
});

/** PD profiles as a list of { volts, amps }, or typed text "5 V 3 A · 9 V 3 A" (parsed by `parsePdProfiles`). */
const pdProfilesField = z
  .union([z.array(z.unknown()).max(16, 'List at most 16 Power Delivery profiles.'), z.string()], {
    error: 'Give the Power Delivery profiles as a list of { volts, amps } or as text such as "9 V 3 A · 15 V 3 A".',
  })
  .nullable()
  .optional()
  .transform((v, ctx): unknown[] | undefined => {
    if (v === null || v === undefined) return undefined;
    if (typeof v !== 'string') return v.length ? v : undefined;
    try {
      const list = parsePdProfiles(v);
      return list.length ? list : undefined;
    } catch (error) {
      ctx.addIssue({ code: 'custom', message: error instanceof PdProfileTextError ? error.message : 'The profiles could not be read.' });
      return z.NEVER;
    }
  })
  .pipe(z.array(pdProfileField).max(16, 'List at most 16 Power Delivery profiles.').optional());

const voltageWindowField = z
  .strictObject({
    minVolts: portFigure('V', MAX_PORT_FIGURE, 'lowest accepted voltage'),
    maxVolts: portFigure('V', MAX_PORT_FIGURE, 'highest accepted voltage'),
  })
  .nullable()
  .optional()
  .transform((w, ctx): { minVolts: number; maxVolts: number } | undefined => {
    if (!w || (w.minVolts === undefined && w.maxVolts === undefined)) return undefined;
    if (w.minVolts === undefined) ctx.addIssue({ code: 'custom', path: ['minVolts'], message: 'Give the lowest voltage the input accepts too.' });
    if (w.maxVolts === undefined) ctx.addIssue({ code: 'custom', path: ['maxVolts'], message: 'Give the highest voltage the input accepts too.' });
    if (w.minVolts === undefined || w.maxVolts === undefined) return z.NEVER;
    if (w.minVolts > w.maxVolts) {
      ctx.addIssue({ code: 'custom', path: ['maxVolts'], message: 'The highest accepted voltage must not be below the lowest.' });
      return z.NEVER;
    }
    return { minVolts: w.minVolts, maxVolts: w.maxVolts };
  });

const portField = z
  .strictObject({
    kind: z.enum(PORT_KINDS, { error: `Choose the connector: ${PORT_KINDS.join(', ')}.` }),
    direction: z.enum(PORT_DIRECTIONS, { error: 'Choose input, output or both.' }),
    volts: portFigure('V', MAX_PORT_FIGURE, 'voltage'),
    amps: portFigure('A', MAX_PORT_FIGURE, 'current'),
    watts: portFigure('W', MAX_PORT_FIGURE, 'power'),
    pdProfiles: pdProfilesField,
    voltageWindow: voltageWindowField,
    label: z.preprocess((v) => (typeof v === 'string' ? v.trim() || undefined : (v ?? undefined)), z.string().max(100, 'Use at most 100 characters.').optional()),
    efficiency: z.preprocess(
      (v) => (v === '' || v === null ? undefined : typeof v === 'string' ? Number(v) : v),
      z.number({ error: 'Enter the efficiency as a fraction such as 0.9.' }).positive('The efficiency must be greater than 0.').max(1, 'The efficiency is a fraction of at most 1.').optional(),
    ),
    source: claimSourceField.optional(),
  })
  .superRefine((p, ctx) => {
    // Field-level reasons first (each names its field), then lib/measure `validatePort` as the final word.
    let found = false;
    const issue = (i: { code: 'custom'; path: string[]; message: string }) => {
      found = true;
      ctx.addIssue(i);
    };
    const kindName = p.kind === 'other' ? 'this connector' : `a ${PORT_KIND_LABELS[p.kind]}`;
    if (p.pdProfiles && p.kind !== 'usb-c') {
      issue({ code: 'custom', path: ['pdProfiles'], message: `Only USB-C ports have USB Power Delivery profiles; ${kindName} has none.` });
    }
    if (p.voltageWindow && p.direction === 'output') {
      issue({ code: 'custom', path: ['voltageWindow'], message: 'Only an input has a window of accepted voltages.' });
    }
    if ((p.kind === 'mains-input' || p.kind === 'solar-input') && p.direction !== 'input') {
      issue({ code: 'custom', path: ['direction'], message: `A ${PORT_KIND_LABELS[p.kind]} is always an input.` });
    }
    if (p.kind === 'other' && !p.label) {
      issue({ code: 'custom', path: ['label'], message: 'Name the connector of an "other" port, e.g. "2-pin trailer plug".' });
    }
    // Nested fields already refused (a figure, a profile): validatePort would only repeat them without a field name.
    if (found || ctx.issues.length > 0) return;
    try {
      validatePort(portOf(p));
    } catch (error) {
      if (!(error instanceof MeasureError)) throw error;
      ctx.addIssue({ code: 'custom', message: error.message });
    }
  });

type PortInputData = z.output<typeof portField>;

/** The lib/measure `Port` of a validated port entry (without its claim source). */
function portOf(p: Omit<PortInputData, 'source'> & { source?: unknown }): Port {
  const port: Port = { kind: p.kind, direction: p.direction };
  if (p.volts !== undefined) port.volts = p.volts;
  if (p.amps !== undefined) port.amps = p.amps;
  if (p.watts !== undefined) port.watts = p.watts;
  if (p.pdProfiles) port.pdProfiles = p.pdProfiles.map((x) => ({ volts: x.volts, amps: x.amps }));
  if (p.voltageWindow) port.voltageWindow = { ...p.voltageWindow };
  if (p.label) port.label = p.label;
  if (p.efficiency !== undefined) port.efficiency = p.efficiency;
  return port;
}

const portsField = z.array(portField).max(MAX_PORTS, `List at most ${MAX_PORTS} ports.`);

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
  /** Claimed ports (inputs and outputs); each without a source takes `claimSource`. */
  ports: portsField.optional().default([]),
  /** Other categories the item also serves as (never its primary one); their specs and checklists apply too. */
  alsoServesAs: alsoServesAsField.optional().default([]),
  /** Feature checklist answers (lib/gear/features.ts): `{ "<name>": true | false | null | { present, detail } }`. */
  features: featuresField.optional().default([]),
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
  alsoServesAs: Category[];
  features: FeatureClaim[];
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
  // A refused roles or features field reaches here untransformed (zod runs object refinements anyway): check only lists.
  const alsoServesAs = Array.isArray(input.alsoServesAs) ? input.alsoServesAs.filter((c) => typeof c === 'string' && c in CATEGORY_DEFS) : [];
  checkRoles(input.category, alsoServesAs, ctx);
  // Specs, chemistry and water rating follow every role the item serves as (a lantern serving as a bank records its rated energy).
  const roles = rolesOf(input.category, alsoServesAs);
  const roleDefs = roles.map((r) => CATEGORY_DEFS[r]);
  const what = roles.length > 1 ? `${def.label.toLowerCase()} serving as ${roles.slice(1).map((r) => CATEGORY_DEFS[r].label.toLowerCase()).join(' and ')}` : def.label.toLowerCase();
  const allowed = new Set(roles.flatMap((r) => claimableSpecs(r)).map((s) => s.key));
  for (const [key, entry] of Object.entries(input.specs)) {
    if (entry && entry.value !== null && !allowed.has(key as SpecKey)) {
      ctx.addIssue({ code: 'custom', path: ['specs', key, 'value'], message: `A ${what} has no ${SPECS[key as SpecKey].label.toLowerCase()} spec.` });
    }
  }
  for (const s of roleSpecs(roles)) {
    if (roleDefs.some((d) => d.specs.some((x) => x.key === s.key && x.required)) && (input.specs[s.key]?.value ?? null) === null) {
      ctx.addIssue({ code: 'custom', path: ['specs', s.key, 'value'], message: `The claimed ${s.label.toLowerCase()} is required for a ${what}.` });
    }
  }
  if (roleDefs.some((d) => d.chemistry.required) && input.chemistry === null) {
    ctx.addIssue({ code: 'custom', path: ['chemistry'], message: `Choose the cell chemistry of this ${what}.` });
  }
  if (!roleDefs.some((d) => d.chemistry.shown) && input.chemistry !== null) {
    ctx.addIssue({ code: 'custom', path: ['chemistry'], message: `A ${what} records no chemistry.` });
  }
  if (!roleDefs.some((d) => d.waterRating) && input.waterRating !== null) {
    ctx.addIssue({ code: 'custom', path: ['waterRating'], message: `A ${what} records no water rating.` });
  }
  if (Array.isArray(input.features)) checkFeatures(roles, input.features, ctx);
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

export type { FeatureClaim };

/** A claimed port: a lib/measure `Port` with where the claim came from. */
export type PortClaim = Port & { source: ClaimSource };

/** The claimed ports of validated input, in the order given; each without a source takes the item's claim source. */
export function portClaims(data: Pick<GearData, 'ports' | 'claimSource'>): PortClaim[] {
  return (data.ports ?? []).map((p) => ({ ...portOf(p), source: p.source ?? data.claimSource }));
}
