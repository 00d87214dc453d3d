/**
 * Radio-quiet in browse and the side-by-side: the measured worst noise rise per S-meter range (the
 * measured-only specs `noiseRiseBelow30` / `noiseRiseAbove30`, written when a radio-noise field test is
 * approved), the `radioQuiet` filter parameter and the verdict word per range. Verdicts and thresholds
 * are lib/measure's (`radioQuietVerdict`, RADIO_QUIET_THRESHOLDS_DB: our own convention, documented on
 * the method page). Pure: no framework imports.
 */
import { z } from 'zod';
import { RADIO_QUIET_THRESHOLDS_DB, radioQuietVerdict, S_METER_RANGES, type RadioQuietVerdict, type SMeterRange, type SpecKey } from '@/lib/measure';

/** The spec holding an item's measured worst noise rise (dB) in each S-meter range. */
export const NOISE_RISE_SPEC: Readonly<Record<SMeterRange, SpecKey>> = {
  'below-30mhz': 'noiseRiseBelow30',
  'above-30mhz': 'noiseRiseAbove30',
};

export const RANGE_LABELS: Readonly<Record<SMeterRange, string>> = {
  'below-30mhz': 'below 30 MHz',
  'above-30mhz': 'above 30 MHz',
};

/** Values of the `radioQuiet` parameter of `GET /api/v1/gear`. */
export const RADIO_QUIET_FILTERS = ['below-30mhz', 'above-30mhz', 'both'] as const;
export type RadioQuietFilter = (typeof RADIO_QUIET_FILTERS)[number];

/** The rise an item must stay under, in every range the filter names, to count as radio-quiet. */
export const RADIO_QUIET_BELOW_DB = RADIO_QUIET_THRESHOLDS_DB.quietBelow;

export const radioQuietParam = z
  .enum(RADIO_QUIET_FILTERS, { message: `Must be one of ${RADIO_QUIET_FILTERS.join(', ')}.` })
  .optional()
  .meta({
    description:
      `Radio-quiet items only: the measured worst noise rise in that S-meter range (spec \`noiseRiseBelow30\` / ` +
      `\`noiseRiseAbove30\`, dB, from an approved radio-noise field test) is under ${RADIO_QUIET_BELOW_DB} dB; \`both\`: ` +
      'in both ranges. Items never checked in the range are left out. Thresholds are our own convention (see /how-we-test).',
  });

/** The S-meter ranges a filter value requires to be quiet. */
export function radioQuietRanges(filter: RadioQuietFilter): SMeterRange[] {
  return filter === 'both' ? [...S_METER_RANGES] : [filter];
}

/** The spec keys a filter value requires to be measured and under the quiet threshold. */
export function radioQuietSpecKeys(filter: RadioQuietFilter): SpecKey[] {
  return radioQuietRanges(filter).map((range) => NOISE_RISE_SPEC[range]);
}

export interface RangeVerdict {
  range: SMeterRange;
  /** "below 30 MHz" */
  rangeLabel: string;
  /** Worst band's rise, dB. */
  riseDb: number;
  verdict: RadioQuietVerdict;
}

/**
 * An item's verdict per tested range, from its specs (only measured figures count: the spec is
 * measured-only, a claimed figure of it is ignored). Ranges never tested are left out.
 */
export function rangeVerdicts(specs: Readonly<Partial<Record<string, { value: number; basis: string } | undefined>>>): RangeVerdict[] {
  const out: RangeVerdict[] = [];
  for (const range of S_METER_RANGES) {
    const figure = specs[NOISE_RISE_SPEC[range]];
    if (!figure || figure.basis !== 'measured' || !Number.isFinite(figure.value)) continue;
    out.push({ range, rangeLabel: RANGE_LABELS[range], riseDb: figure.value, verdict: radioQuietVerdict(figure.value) });
  }
  return out;
}
