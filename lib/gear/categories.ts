/**
 * The gear categories, defined once: label, kinds, the specs each shows (label, quantity, units a
 * reviewer may type, required or not, claimed and/or measured), its modes, the value ratios it shows
 * and its safety cautions. Adding a category or a spec is a change to this module only (plus a
 * migration if storage changes). Category ids and spec keys are those of lib/measure.
 */
import { CATEGORIES, SPECS, type Category, type Chemistry, type SpecKey } from '@/lib/measure';
import { TYPED_UNITS, type TypedQuantity } from './parse-quantity';

export type SpecBasisShown = 'claimed-and-measured' | 'measured-only';

export interface CategorySpec {
  key: SpecKey;
  /** Label in this category (e.g. "Battery energy" for a light's rated energy). */
  label: string;
  quantity: TypedQuantity;
  /** Units a reviewer may type, as hints (from parse-quantity). */
  units: readonly string[];
  /** A claimed figure is required before the item can be saved. */
  required: boolean;
  basis: SpecBasisShown;
  /** Example shown as a placeholder. */
  example: string;
}

/** How an item records its modes: a light's output/runtime/power draw, or a device's power draw. */
export type ModeStyle = 'light' | 'device' | null;

export type CautionKey = 'lithium' | 'lead-acid' | 'wiring-12v' | 'mains-charging' | 'radio-licence' | 'solar-heat';

export interface CategoryDef {
  id: Category;
  label: string;
  plural: string;
  kinds: readonly { id: string; label: string }[];
  specs: readonly CategorySpec[];
  modes: ModeStyle;
  /** Example mode names offered in the form. */
  modeExamples: readonly string[];
  /** Value ratio ids of lib/measure `valueRatios` this category shows (measured ÷ claimed is shown for every spec). */
  ratios: readonly string[];
  /** Whether the item records its cell chemistry, and the default. */
  chemistry: { shown: boolean; required: boolean; default: Chemistry | null };
  /** Whether the item records an IEC 60529 IP code. */
  waterRating: boolean;
  cautions: readonly CautionKey[];
}

const spec = (
  key: SpecKey,
  options: { label?: string; required?: boolean; example: string },
): CategorySpec => {
  const info = SPECS[key];
  return {
    key,
    label: options.label ?? info.label,
    quantity: info.quantity as TypedQuantity,
    units: TYPED_UNITS[info.quantity as TypedQuantity],
    required: options.required ?? false,
    basis: info.measuredOnly ? 'measured-only' : 'claimed-and-measured',
    example: options.example,
  };
};

/** Measured-only noise rise per S-meter range, from radio-noise field tests of anything powered that may switch. */
const RADIO_NOISE_SPECS = [spec('noiseRiseBelow30', { example: '' }), spec('noiseRiseAbove30', { example: '' })];

const STORAGE_RATIOS = ['wh-per-kg', 'wh-per-money', 'money-per-wh', 'delivered-wh-per-money', 'delivered-vs-rated'] as const;

export const CATEGORY_DEFS: Record<Category, CategoryDef> = {
  light: {
    id: 'light',
    label: 'Light',
    plural: 'Lights',
    kinds: [
      { id: 'lantern', label: 'Lantern' },
      { id: 'headlamp', label: 'Headlamp' },
      { id: 'hand-torch', label: 'Hand torch' },
    ],
    specs: [
      spec('mass', { required: true, example: '12.3 oz' }),
      spec('luminousFlux', { label: 'Light output (highest mode)', required: true, example: '400 lm' }),
      spec('runtime', { label: 'Runtime (highest mode, to 10 %)', example: '5 h' }),
      spec('peakIntensity', { example: '2800 cd' }),
      spec('beamDistance', { example: '100 m' }),
      spec('ratedEnergy', { label: 'Battery energy', example: '5200 mAh at 3.7 V' }),
      spec('chargeTime', { example: '4 h' }),
      ...RADIO_NOISE_SPECS,
    ],
    modes: 'light',
    modeExamples: ['low', 'medium', 'high'],
    ratios: ['lm-per-g', 'lm-per-money', 'runtime-h-per-100g', 'wh-per-kg'],
    chemistry: { shown: true, required: false, default: 'li-ion' },
    waterRating: true,
    cautions: ['lithium', 'mains-charging'],
  },
  'power-bank': {
    id: 'power-bank',
    label: 'Power bank',
    plural: 'Power banks',
    kinds: [
      { id: 'pocket', label: 'Pocket bank' },
      { id: 'station', label: 'Portable power station' },
    ],
    specs: [
      spec('mass', { required: true, example: '1.1 lb' }),
      spec('ratedEnergy', { label: 'Capacity (rated energy)', required: true, example: '10 400 mAh at 3.6 V' }),
      spec('deliveredEnergy', { example: '' }),
      spec('continuousPower', { label: 'Output power (all ports)', example: '65 W' }),
      spec('rechargePower', { label: 'Recharge input power', example: '30 W' }),
      spec('chargeTime', { label: 'Time to recharge', example: '3 h 30 min' }),
      spec('cycleRating', { label: 'Cycle rating (to 80 % capacity)', example: '500 cycles' }),
      ...RADIO_NOISE_SPECS,
    ],
    modes: null,
    modeExamples: [],
    ratios: STORAGE_RATIOS,
    chemistry: { shown: true, required: true, default: 'li-ion' },
    waterRating: true,
    cautions: ['lithium', 'mains-charging'],
  },
  'battery-12v': {
    id: 'battery-12v',
    label: '12 V battery',
    plural: '12 V batteries',
    kinds: [],
    specs: [
      spec('mass', { required: true, example: '11.5 kg' }),
      spec('ratedEnergy', { label: 'Capacity (rated energy)', required: true, example: '100 Ah at 12.8 V' }),
      spec('deliveredEnergy', { example: '' }),
      spec('supplyVoltage', { label: 'Nominal voltage', example: '12.8 V' }),
      spec('continuousPower', { label: 'Continuous output power', example: '1280 W' }),
      spec('continuousCurrent', { label: 'Continuous discharge current', example: '100 A' }),
      spec('cycleRating', { label: 'Cycle rating (to 80 % capacity)', example: '4000 cycles' }),
      ...RADIO_NOISE_SPECS,
    ],
    modes: null,
    modeExamples: [],
    ratios: STORAGE_RATIOS,
    chemistry: { shown: true, required: true, default: 'lifepo4' },
    waterRating: false,
    cautions: ['lithium', 'lead-acid', 'wiring-12v'],
  },
  'solar-panel': {
    id: 'solar-panel',
    label: 'Solar panel',
    plural: 'Solar panels',
    kinds: [
      { id: 'folding', label: 'Folding panel' },
      { id: 'rigid', label: 'Rigid panel' },
    ],
    specs: [
      spec('mass', { required: true, example: '4.4 lb' }),
      spec('ratedPower', { label: 'Rated power (STC)', required: true, example: '100 W' }),
      spec('supplyVoltage', { label: 'Open-circuit voltage', example: '21.6 V' }),
      spec('foldedLength', { example: '53 cm' }),
      spec('foldedWidth', { example: '36 cm' }),
      spec('foldedDepth', { example: '4 cm' }),
      ...RADIO_NOISE_SPECS,
    ],
    modes: null,
    modeExamples: [],
    ratios: ['w-per-kg', 'w-per-money'],
    chemistry: { shown: false, required: false, default: null },
    waterRating: true,
    cautions: ['wiring-12v', 'solar-heat'],
  },
  radio: {
    id: 'radio',
    label: 'Radio transceiver',
    plural: 'Radios',
    kinds: [
      { id: 'handheld', label: 'Handheld' },
      { id: 'mobile', label: 'Mobile / base' },
      { id: 'receiver', label: 'Receiver only' },
    ],
    specs: [
      spec('mass', { required: true, example: '280 g' }),
      spec('transmitPower', { example: '5 W' }),
      spec('supplyVoltage', { label: 'Supply voltage', example: '13.8 V' }),
    ],
    modes: 'device',
    modeExamples: ['receive', 'transmit'],
    ratios: [],
    chemistry: { shown: false, required: false, default: null },
    waterRating: true,
    cautions: ['radio-licence', 'wiring-12v'],
  },
  'cable-adapter': {
    id: 'cable-adapter',
    label: 'Cable or adapter',
    plural: 'Cables and adapters',
    kinds: [
      { id: 'cable', label: 'Cable' },
      { id: 'adapter', label: 'Adapter' },
      { id: 'converter', label: 'Voltage converter' },
    ],
    specs: [
      spec('mass', { example: '45 g' }),
      spec('continuousPower', { label: 'Rated power', example: '3 A at 12 V' }),
      spec('ratedCurrent', { example: '10 A' }),
      spec('cableLength', { example: '1.5 m' }),
      spec('conversionEfficiency', { label: 'Conversion efficiency (converters)', example: '90 %' }),
      ...RADIO_NOISE_SPECS,
    ],
    modes: null,
    modeExamples: [],
    ratios: [],
    chemistry: { shown: false, required: false, default: null },
    waterRating: false,
    cautions: ['wiring-12v'],
  },
  other: {
    id: 'other',
    label: 'Other',
    plural: 'Other gear',
    kinds: [],
    specs: [spec('mass', { example: '300 g' }), spec('ratedEnergy', { example: '20 Wh' }), ...RADIO_NOISE_SPECS],
    modes: 'device',
    modeExamples: ['running'],
    ratios: [],
    chemistry: { shown: true, required: false, default: null },
    waterRating: true,
    cautions: [],
  },
};

/** Categories in display order. */
export const CATEGORY_LIST: readonly CategoryDef[] = CATEGORIES.map((id) => CATEGORY_DEFS[id]);

export function categoryDef(id: Category): CategoryDef {
  return CATEGORY_DEFS[id];
}

/** Specs a reviewer may claim in a category (measured-only specs come from field tests). */
export function claimableSpecs(id: Category): CategorySpec[] {
  return CATEGORY_DEFS[id].specs.filter((s) => s.basis !== 'measured-only');
}

export function kindLabel(category: Category, kind: string | null | undefined): string | null {
  if (!kind) return null;
  return CATEGORY_DEFS[category].kinds.find((k) => k.id === kind)?.label ?? kind;
}

/** Spec keys a mode row may carry. */
export const MODE_SPEC_KEYS = { light: ['luminousFlux', 'runtime', 'powerDraw'], device: ['powerDraw'] } as const satisfies Record<
  Exclude<ModeStyle, null>,
  readonly SpecKey[]
>;

export const CHEMISTRY_LABELS: Record<Chemistry, string> = {
  'li-ion': 'Lithium-ion',
  lifepo4: 'Lithium iron phosphate (LiFePO4)',
  'lead-acid': 'Lead-acid (flooded)',
  agm: 'Lead-acid (AGM)',
  nimh: 'Nickel-metal hydride (NiMH)',
};

/** Lithium chemistries: the airline watt-hour bands apply to these. */
export function isLithium(chemistry: Chemistry | null | undefined): boolean {
  return chemistry === 'li-ion' || chemistry === 'lifepo4';
}

export const CLAIM_SOURCES = ['packaging', 'manual', 'makers-site'] as const;
export type ClaimSource = (typeof CLAIM_SOURCES)[number];
export const CLAIM_SOURCE_LABELS: Record<ClaimSource, string> = {
  packaging: 'Packaging',
  manual: 'Manual',
  'makers-site': "Maker's site",
};

/** Labels and units of the value ratios, for tables. */
export const RATIO_LABELS: Record<string, string> = {
  'lm-per-g': 'Light output per gram',
  'lm-per-money': 'Light output per unit of money',
  'runtime-h-per-100g': 'Runtime per 100 g',
  'wh-per-kg': 'Energy per kilogram',
  'wh-per-money': 'Energy per unit of money',
  'money-per-wh': 'Cost per watt-hour',
  'delivered-wh-per-money': 'Delivered energy per unit of money',
  'delivered-vs-rated': 'Delivered ÷ rated energy',
  'w-per-kg': 'Solar watts per kilogram',
  'w-per-money': 'Solar watts per unit of money',
};

export function ratioLabel(id: string): string {
  if (id.startsWith('measured-vs-claimed:')) {
    const key = id.slice('measured-vs-claimed:'.length) as SpecKey;
    return `${SPECS[key]?.label ?? key}: measured ÷ claimed`;
  }
  return RATIO_LABELS[id] ?? id;
}
