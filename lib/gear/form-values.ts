/**
 * The gear form's values (everything as typed text) and their conversion to and from the shared
 * schema's input. Pure: used by the client form and by server pages that prefill it.
 */
import { SPECS, type Category, type SpecKey } from '@/lib/measure';
import { CATEGORY_DEFS, MODE_SPEC_KEYS } from './categories';
import { formatForInput } from './format';
import { formatPdProfiles } from './ports';
import { FEATURE_DEFS, isFeatureName, statedChecklist } from './features';
import { cleanAlsoServes, roleSpecs, rolesOf } from './roles';

/** One port row of the form, as typed text. `pdProfiles` is text such as "5 V 3 A · 9 V 3 A". */
export type PortFormRow = {
  kind: string;
  direction: string;
  volts: string;
  amps: string;
  watts: string;
  pdProfiles: string;
  minVolts: string;
  maxVolts: string;
  label: string;
  efficiency: string;
  source: string;
};

export function emptyPortRow(): PortFormRow {
  return { kind: 'usb-c', direction: 'output', volts: '', amps: '', watts: '', pdProfiles: '', minVolts: '', maxVolts: '', label: '', efficiency: '', source: '' };
}

/** A port row as schema input: only the fields its kind and direction record (PD profiles on USB-C, a window on inputs). */
function cleanPort(row: PortFormRow): Record<string, unknown> {
  const out: Record<string, unknown> = { kind: row.kind, direction: row.direction, volts: row.volts, amps: row.amps, watts: row.watts };
  if (row.kind === 'usb-c' && row.pdProfiles.trim() !== '') out.pdProfiles = row.pdProfiles;
  if (row.direction !== 'output' && (row.minVolts.trim() !== '' || row.maxVolts.trim() !== '')) out.voltageWindow = { minVolts: row.minVolts, maxVolts: row.maxVolts };
  if (row.label.trim() !== '') out.label = row.label;
  if (row.efficiency.trim() !== '') out.efficiency = row.efficiency;
  if (row.source) out.source = row.source;
  return out;
}

/** Form values: everything as typed text; cleaned per category before validation (see `clean`). */
export type GearFormValues = {
  category: string;
  name: string;
  maker: string;
  kind: string;
  modelYear: string;
  price: { amount: string; currency: string };
  pricePaidOn: string;
  notes: string;
  chemistry: string;
  waterRating: string;
  claimSource: string;
  specs: Record<string, { value: string; source: string }>;
  modes: { name: string; luminousFlux: string; runtime: string; powerDraw: string }[];
  ports: PortFormRow[];
  /** Other categories the item also serves as (checkbox values). */
  alsoServesAs: string[];
  /** Checklist answers: present is 'yes', 'no' or '' (not stated); detail only for features that take one. */
  features: Record<string, { present: string; detail: string }>;
  changeNote: string;
};

/** The roles the form currently describes: the category, then the ticked also-serves categories. */
export function formRoles(values: Pick<GearFormValues, 'category' | 'alsoServesAs'>): Category[] {
  const category = values.category as Category;
  if (!CATEGORY_DEFS[category]) return [];
  return rolesOf(category, cleanAlsoServes(category, values.alsoServesAs ?? []));
}


/** Keeps only what the chosen category records, so switching category leaves no stray fields. */
export function clean(values: GearFormValues, withCategory: boolean): Record<string, unknown> {
  const category = values.category as Category;
  const def = CATEGORY_DEFS[category];
  const roles = formRoles(values);
  const roleDefs = roles.map((r) => CATEGORY_DEFS[r]);
  const specs: Record<string, { value: string; source?: string }> = {};
  if (def) {
    // Specs of every role (a lantern serving as a bank records the bank's figures too).
    for (const s of roleSpecs(roles).filter((x) => x.basis !== 'measured-only')) {
      const entry = values.specs?.[s.key];
      if (entry && entry.value.trim() !== '') specs[s.key] = entry.source ? { value: entry.value, source: entry.source } : { value: entry.value };
    }
  }
  const modeKeys: readonly string[] = def?.modes ? MODE_SPEC_KEYS[def.modes] : [];
  const modes = def?.modes
    ? values.modes
        .filter((m) => m.name.trim() !== '' || modeKeys.some((k) => m[k as 'powerDraw'].trim() !== ''))
        .map((m) => Object.fromEntries([['name', m.name], ...modeKeys.map((k) => [k, m[k as 'powerDraw']])]))
    : [];
  const out: Record<string, unknown> = {
    name: values.name,
    maker: values.maker,
    kind: def?.kinds.length ? values.kind : '',
    modelYear: values.modelYear,
    price: { amount: values.price.amount, currency: values.price.currency },
    pricePaidOn: values.pricePaidOn,
    notes: values.notes,
    chemistry: roleDefs.some((d) => d.chemistry.shown) ? values.chemistry : '',
    waterRating: roleDefs.some((d) => d.waterRating) ? values.waterRating : '',
    claimSource: values.claimSource,
    specs,
    modes,
    ports: (values.ports ?? []).map(cleanPort),
    alsoServesAs: roles.slice(1),
    features: cleanFeatures(values, roles),
    changeNote: values.changeNote,
  };
  if (withCategory) out.category = values.category;
  return out;
}

/** Stated answers on the current checklist only (switching roles leaves no stray answers); a detail only where taken. */
function cleanFeatures(values: Pick<GearFormValues, 'features'>, roles: readonly Category[]): Record<string, unknown> {
  const out: Record<string, unknown> = {};
  for (const name of statedChecklist(roles)) {
    const answer = values.features?.[name];
    if (!answer || answer.present === '') continue;
    const detail = answer.detail?.trim() ?? '';
    out[name] = FEATURE_DEFS[name].detail && answer.present === 'yes' && detail ? { present: answer.present, detail } : answer.present;
  }
  return out;
}

export function emptyGearValues(category: Category = 'light'): GearFormValues {
  return {
    category,
    name: '',
    maker: '',
    kind: '',
    modelYear: '',
    price: { amount: '', currency: 'USD' },
    pricePaidOn: '',
    notes: '',
    chemistry: CATEGORY_DEFS[category].chemistry.default ?? '',
    waterRating: '',
    claimSource: 'packaging',
    specs: {},
    modes: [],
    ports: [],
    alsoServesAs: [],
    features: {},
    changeNote: '',
  };
}


/** Prefills the form from the service's working copy input (numbers in canonical units). */
export function toFormValues(input: Record<string, unknown>, category: Category): GearFormValues {
  const base = emptyGearValues(category);
  const text = (v: unknown) => (v === null || v === undefined ? '' : String(v));
  const specsIn = (input.specs ?? {}) as Record<string, { value: number; source?: string }>;
  const specs: GearFormValues['specs'] = {};
  for (const [key, entry] of Object.entries(specsIn)) {
    specs[key] = { value: formatForInput(entry.value, SPECS[key as SpecKey].quantity), source: entry.source === input.claimSource ? '' : (entry.source ?? '') };
  }
  const modesIn = (input.modes ?? []) as Record<string, unknown>[];
  const modes = modesIn.map((m) => ({
    name: text(m.name),
    luminousFlux: typeof m.luminousFlux === 'number' ? formatForInput(m.luminousFlux, 'luminousFlux') : '',
    runtime: typeof m.runtime === 'number' ? formatForInput(m.runtime, 'duration') : '',
    powerDraw: typeof m.powerDraw === 'number' ? formatForInput(m.powerDraw, 'power') : '',
  }));
  const num = (v: unknown) => (typeof v === 'number' ? String(v) : '');
  const portsIn = (input.ports ?? []) as Record<string, unknown>[];
  const ports: PortFormRow[] = portsIn.map((p) => {
    const window = p.voltageWindow as { minVolts: number; maxVolts: number } | undefined;
    const profiles = p.pdProfiles as { volts: number; amps: number }[] | undefined;
    return {
      kind: text(p.kind),
      direction: text(p.direction),
      volts: num(p.volts),
      amps: num(p.amps),
      watts: num(p.watts),
      pdProfiles: profiles?.length ? formatPdProfiles(profiles) : '',
      minVolts: num(window?.minVolts),
      maxVolts: num(window?.maxVolts),
      label: text(p.label),
      efficiency: num(p.efficiency),
      source: p.source === input.claimSource ? '' : text(p.source),
    };
  });
  const features: GearFormValues['features'] = {};
  for (const [name, answer] of Object.entries((input.features ?? {}) as Record<string, boolean | { present: boolean; detail?: string }>)) {
    if (!isFeatureName(name)) continue;
    const present = typeof answer === 'boolean' ? answer : answer.present;
    features[name] = { present: present ? 'yes' : 'no', detail: typeof answer === 'object' ? (answer.detail ?? '') : '' };
  }
  const price = input.price as { amount: string; currency: string } | null;
  return {
    ...base,
    name: text(input.name),
    maker: text(input.maker),
    kind: text(input.kind),
    modelYear: text(input.modelYear),
    price: price ? { amount: price.amount, currency: price.currency } : base.price,
    pricePaidOn: text(input.pricePaidOn),
    notes: text(input.notes),
    chemistry: text(input.chemistry),
    waterRating: text(input.waterRating),
    claimSource: text(input.claimSource) || 'packaging',
    specs,
    modes,
    ports,
    alsoServesAs: Array.isArray(input.alsoServesAs) ? (input.alsoServesAs as string[]) : [],
    features,
  };
}
