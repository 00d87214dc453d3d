/**
 * Feature checklists: per category, the yes/no features a reviewer states for an item (a light's red
 * mode, a bank's 12 V output, a panel's kickstand …), some with a short detail (a hanging hook's
 * material). An item's checklist is the union of its primary category's and its also-serves
 * categories' lists. An answer is "has", "has not" or, when absent, "not stated".
 *
 * The IP rating is not stored here: it is derived from the item's IEC 60529 water rating (a code means
 * "has", with the code as its detail; no code means "not stated", never "has not").
 *
 * Pure: no framework or database imports. Shared by the form, the server action, the API and browse.
 */
import { z } from 'zod';
import { CATEGORIES, type Category } from '@/lib/measure';

export interface FeatureDef {
  name: string;
  /** Short label for checklists and filters. */
  label: string;
  /** One line saying what counts, for the form and the item page. */
  hint: string;
  /** Features that take a short detail text (e.g. a hook's material): its label and an example. */
  detail?: { label: string; example: string };
  /** Derived from another field (the water rating), never typed or stored. */
  derived?: 'water-rating';
}

const FEATURE_LIST = [
  { name: 'red-mode', label: 'Red light mode', hint: 'A red output that keeps night vision.' },
  { name: 'flashing-modes', label: 'Flashing or signal modes', hint: 'Strobe, beacon or SOS modes.' },
  { name: 'lock-out', label: 'Lock-out', hint: 'A lock that keeps it from switching on in a pack.' },
  { name: 'hanging-hook', label: 'Hanging hook', hint: 'A hook or loop to hang it from a tent or branch.', detail: { label: 'Hook material', example: 'steel' } },
  { name: 'magnet', label: 'Magnetic base', hint: 'Sticks to a vehicle or a steel post.' },
  { name: 'usb-output', label: 'USB output', hint: 'Charges other devices from its own battery.' },
  { name: 'pass-through-charging', label: 'Pass-through charging', hint: 'Powers its outputs while it is being charged.' },
  { name: 'charge-display', label: 'Charge display', hint: 'Shows the remaining charge as a number or bars.' },
  { name: 'output-12v', label: '12 V output', hint: 'A 12 V socket or DC output for 12 V devices.' },
  { name: 'wireless-charging', label: 'Wireless charging pad', hint: 'Charges a phone laid on it.' },
  { name: 'built-in-light', label: 'Built-in light', hint: 'A light of its own for camp use.' },
  { name: 'battery-management', label: 'Battery management system', hint: 'Built-in protection against over-charge, over-discharge and short circuits.' },
  { name: 'low-temperature-cutoff', label: 'Low-temperature charge cut-off', hint: 'Stops charging below freezing, as lithium cells need.' },
  { name: 'bluetooth-monitoring', label: 'Bluetooth monitoring', hint: 'Reports charge and health to a phone.' },
  { name: 'terminal-covers', label: 'Terminal covers', hint: 'Insulating covers over the terminals.' },
  { name: 'kickstand', label: 'Kickstand', hint: 'Legs or a stand that angle it toward the sun.' },
  { name: 'junction-box-protection', label: 'Weather-protected junction box', hint: 'A sealed box where the leads leave the panel.' },
  { name: 'built-in-controller', label: 'Built-in charge controller', hint: 'Regulates its output for charging a battery directly.' },
  { name: 'mounting-grommets', label: 'Mounting grommets', hint: 'Eyelets to tie or clip it down.' },
  { name: 'dual-watch', label: 'Dual watch', hint: 'Listens to two channels at once.' },
  { name: 'battery-saver', label: 'Battery saver', hint: 'Sleeps between checks for a signal to save power.' },
  { name: 'external-antenna', label: 'External antenna connector', hint: 'Takes a separate antenna.', detail: { label: 'Connector', example: 'BNC' } },
  { name: 'gps-receiver', label: 'GPS receiver', hint: 'Knows and can send its position.' },
  { name: 'inline-fuse', label: 'Inline fuse', hint: 'A fuse in the lead protects the wiring.', detail: { label: 'Fuse rating', example: '10 A' } },
  { name: 'strain-relief', label: 'Strain relief', hint: 'Moulded or sprung ends that keep the lead from breaking at the plug.' },
  { name: 'polarity-marked', label: 'Polarity marked', hint: 'Positive and negative are marked on the ends.' },
  { name: 'ip-rating', label: 'IP rating', hint: 'An IEC 60529 water rating (from the item’s water rating field).', derived: 'water-rating' },
] as const satisfies readonly FeatureDef[];

export type FeatureName = (typeof FEATURE_LIST)[number]['name'];

export const FEATURE_NAMES: readonly FeatureName[] = FEATURE_LIST.map((f) => f.name);

export const FEATURE_DEFS: Record<FeatureName, FeatureDef> = Object.fromEntries(FEATURE_LIST.map((f) => [f.name, f])) as Record<FeatureName, FeatureDef>;

export function isFeatureName(value: string): value is FeatureName {
  return Object.prototype.hasOwnProperty.call(FEATURE_DEFS, value);
}

/** Each category's checklist, in display order. */
export const CATEGORY_FEATURES: Record<Category, readonly FeatureName[]> = {
  light: ['red-mode', 'flashing-modes', 'lock-out', 'hanging-hook', 'magnet', 'usb-output', 'pass-through-charging', 'ip-rating'],
  'power-bank': ['pass-through-charging', 'charge-display', 'output-12v', 'wireless-charging', 'built-in-light', 'ip-rating'],
  'battery-12v': ['battery-management', 'low-temperature-cutoff', 'charge-display', 'bluetooth-monitoring', 'terminal-covers'],
  'solar-panel': ['kickstand', 'junction-box-protection', 'built-in-controller', 'usb-output', 'mounting-grommets', 'ip-rating'],
  radio: ['dual-watch', 'battery-saver', 'external-antenna', 'gps-receiver', 'ip-rating'],
  'cable-adapter': ['inline-fuse', 'strain-relief', 'polarity-marked'],
  other: ['usb-output', 'pass-through-charging', 'ip-rating'],
};

/** The checklist of an item serving as `roles` (primary first): the union of their lists, in first-seen order. */
export function checklistFor(roles: readonly Category[]): FeatureName[] {
  const out: FeatureName[] = [];
  for (const role of roles) for (const name of CATEGORY_FEATURES[role] ?? []) if (!out.includes(name)) out.push(name);
  return out;
}

/** Features a reviewer states (the checklist without derived ones). */
export function statedChecklist(roles: readonly Category[]): FeatureName[] {
  return checklistFor(roles).filter((n) => !FEATURE_DEFS[n].derived);
}

/** A stated answer: the item has (with an optional detail) or has not the feature. */
export interface FeatureClaim {
  name: FeatureName;
  present: boolean;
  detail?: string;
}

export type FeatureState = 'has' | 'has-not' | 'not-stated';

export interface ChecklistLine {
  name: FeatureName;
  label: string;
  state: FeatureState;
  detail: string | null;
}

/**
 * The checklist of an item as lines: stated answers, the IP rating from the water rating, and "not
 * stated" for the rest. Answers for features outside the checklist are left out.
 */
export function checklistLines(roles: readonly Category[], claims: readonly FeatureClaim[], waterRating: string | null): ChecklistLine[] {
  const byName = new Map(claims.map((c) => [c.name, c]));
  return checklistFor(roles).map((name) => {
    const def = FEATURE_DEFS[name];
    if (def.derived === 'water-rating') {
      return { name, label: def.label, state: waterRating ? 'has' : 'not-stated', detail: waterRating ?? null };
    }
    const claim = byName.get(name);
    if (!claim) return { name, label: def.label, state: 'not-stated', detail: null };
    return { name, label: def.label, state: claim.present ? 'has' : 'has-not', detail: claim.present ? (claim.detail ?? null) : null };
  });
}

export const FEATURE_STATE_LABELS: Record<FeatureState, string> = { has: 'Has', 'has-not': 'Has not', 'not-stated': 'Not stated' };

/** One checklist answer in words, e.g. "Hanging hook: has (steel)". */
export function featureText(claim: FeatureClaim | null | undefined): string | null {
  if (!claim) return null;
  if (!claim.present) return 'has not';
  return claim.detail ? `has (${claim.detail})` : 'has';
}

/* ---------------------------------------------------------------------------------------------- */
/* Input schema (shared by the form, the server action and the API)                                */
/* ---------------------------------------------------------------------------------------------- */

export const FEATURE_DETAIL_MAX = 40;

/** "yes"/"no" from a form select, a boolean from JSON; '' or null mean "not stated". */
const presentValue = z
  .union([z.boolean(), z.enum(['yes', 'no', '']), z.null()], { error: 'Answer yes, no or leave it unstated.' })
  .transform((v): boolean | null => (v === 'yes' ? true : v === 'no' ? false : v === '' ? null : v));

const featureAnswer = z.union(
  [
    presentValue,
    z.strictObject({
      present: presentValue,
      detail: z.preprocess(
        (v) => (typeof v === 'string' ? v.trim() || undefined : (v ?? undefined)),
        z
          .string()
          .max(FEATURE_DETAIL_MAX, `Use at most ${FEATURE_DETAIL_MAX} characters.`)
          .regex(/^[\p{L}\p{N} .,/+()%-]+$/u, 'Use letters, digits, spaces and . , / + ( ) % - only.')
          .optional(),
      ),
    }),
  ],
  { error: 'Answer with true, false, null or { present, detail }.' },
);

/**
 * The features field: `{ "<name>": true | false | null | { present, detail } }` (null or absent: not
 * stated). Unknown names are refused naming them; whether a name is on the item's checklist and
 * whether it takes a detail are checked with the item's roles (`checkFeatures`).
 */
export const featuresField = z
  .record(z.string().max(60), featureAnswer)
  .superRefine((answers, ctx) => {
    const unknown = Object.keys(answers).filter((k) => !isFeatureName(k));
    for (const name of unknown.slice(0, 10)) {
      ctx.addIssue({ code: 'custom', path: [name], message: `There is no feature "${name.slice(0, 60)}". Known features: ${FEATURE_NAMES.join(', ')}.` });
    }
    if (Object.keys(answers).length > FEATURE_NAMES.length) ctx.addIssue({ code: 'custom', message: 'Too many features.' });
  })
  .meta({
    description:
      'Feature checklist answers by feature name: `true` (has it), `false` (has not), `null` or absent (not stated), or `{ present, detail }` for a feature that takes a detail (a hanging hook’s material). Names must be on the checklist of the item’s primary or also-serves categories; `ip-rating` comes from `waterRating` and is never stated here.',
  })
  .transform((answers): FeatureClaim[] => {
    const out: FeatureClaim[] = [];
    for (const name of FEATURE_NAMES) {
      const answer = answers[name];
      if (answer === undefined) continue;
      const present = typeof answer === 'object' && answer !== null ? answer.present : answer;
      if (present === null) continue;
      const detail = typeof answer === 'object' && answer !== null && present ? answer.detail : undefined;
      out.push(detail ? { name, present, detail } : { name, present });
    }
    return out;
  });

/** Rules that depend on the item's roles: each answer on its checklist, derived ones never stated, details only where taken. */
export function checkFeatures(
  roles: readonly Category[],
  claims: readonly FeatureClaim[],
  ctx: { addIssue: (issue: { code: 'custom'; path: (string | number)[]; message: string }) => void },
): void {
  const list = new Set(checklistFor(roles));
  for (const c of claims) {
    const def = FEATURE_DEFS[c.name];
    if (def.derived === 'water-rating') {
      ctx.addIssue({ code: 'custom', path: ['features', c.name], message: 'The IP rating comes from the water rating field; set it there.' });
    } else if (!list.has(c.name)) {
      ctx.addIssue({ code: 'custom', path: ['features', c.name], message: `“${def.label}” is not on the checklist of this item’s categories.` });
    } else if (c.detail && !def.detail) {
      ctx.addIssue({ code: 'custom', path: ['features', c.name, 'detail'], message: `“${def.label}” takes no detail.` });
    }
  }
}

/** A feature claim list as schema input (`{ name: true | { present, detail } }`). */
export function featuresAsInput(claims: readonly FeatureClaim[]): Record<string, boolean | { present: boolean; detail: string }> {
  return Object.fromEntries(claims.map((c) => [c.name, c.detail ? { present: c.present, detail: c.detail } : c.present]));
}

/* ---------------------------------------------------------------------------------------------- */
/* Browse filters: `feature.<name>=true`                                                           */
/* ---------------------------------------------------------------------------------------------- */

export const FEATURE_PARAM_PREFIX = 'feature.';

export class FeatureFilterError extends Error {
  constructor(
    message: string,
    readonly fields: Record<string, string[]>,
  ) {
    super(message);
    this.name = 'FeatureFilterError';
  }
}

/**
 * The features a browse query asks for, from its `feature.<name>` parameters (only `true` is
 * accepted). Unknown names or other values throw a FeatureFilterError naming each bad parameter.
 */
export function parseFeatureFilters(params: Iterable<[string, string]>): FeatureName[] {
  const out: FeatureName[] = [];
  const fields: Record<string, string[]> = {};
  for (const [key, value] of params) {
    if (!key.startsWith(FEATURE_PARAM_PREFIX)) continue;
    const name = key.slice(FEATURE_PARAM_PREFIX.length);
    const shown = key.slice(0, 80);
    if (!isFeatureName(name)) {
      fields[shown] = [`Unknown feature "${name.slice(0, 60)}". Known features: ${FEATURE_NAMES.join(', ')}.`];
    } else if (value !== 'true') {
      fields[shown] = [`A feature filter takes only "true" (got "${value.slice(0, 20)}").`];
    } else if (!out.includes(name)) out.push(name);
  }
  const bad = Object.keys(fields);
  if (bad.length) throw new FeatureFilterError(`Not a valid feature filter: ${bad.join(', ')}.`, fields);
  return out;
}

/** Every category id, for callers that list checklists of all categories. */
export const ALL_CATEGORIES: readonly Category[] = CATEGORIES;
