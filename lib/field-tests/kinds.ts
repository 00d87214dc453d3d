import type { SpecKey } from '@/lib/measure';
import type { ValueField } from '@/lib/readings/types';

/** Kinds of field test (stored in field_tests.kind). */
export const FIELD_TEST_KINDS = ['light-runtime', 'light-output', 'energy-delivered', 'solar-output', 'charge-time', 'mass-check', 'port-output', 'radio-noise', 'other'] as const;
export type FieldTestKind = (typeof FIELD_TEST_KINDS)[number];

export function isFieldTestKind(x: unknown): x is FieldTestKind {
  return typeof x === 'string' && (FIELD_TEST_KINDS as readonly string[]).includes(x);
}

/** Sky during a field test (stored in field_tests.sky). */
export const SKIES = ['clear', 'thin-cloud', 'broken-cloud', 'overcast', 'rain', 'indoor'] as const;
export type Sky = (typeof SKIES)[number];

export const SKY_LABELS: Record<Sky, string> = {
  clear: 'Clear',
  'thin-cloud': 'Thin cloud',
  'broken-cloud': 'Broken cloud',
  overcast: 'Overcast',
  rain: 'Rain',
  indoor: 'Indoors',
};

/** What a kind needs from each trial: a readings series, typed values, or either. */
export type TrialInputKind = 'series' | 'typed' | 'either';

export interface KindInfo {
  label: string;
  /** One line for the form: what the reviewer logs. */
  description: string;
  input: TrialInputKind;
  /** Value fields a readings series may use, in order of preference ([['value']] or [['watts'], ['volts', 'amps']]). */
  seriesFields: readonly (readonly ValueField[])[];
  /** Spec keys the kind's results become on the item (mean ± sd over trials); empty when none. */
  specKeys: readonly SpecKey[];
  /** The trial records a switch-on time (t = 0 for clock-stamped logs). */
  needsSwitchOn: boolean;
  /** Sky and temperature matter for the result (shown beside it). */
  weatherMatters: boolean;
}

export const KINDS: Record<FieldTestKind, KindInfo> = {
  'light-runtime': {
    label: 'Light runtime',
    description: 'Switch the light on and log its output (lux at a fixed spot, or relative output) until it fades.',
    input: 'series',
    seriesFields: [['value']],
    specKeys: ['runtime'],
    needsSwitchOn: true,
    weatherMatters: false,
  },
  'light-output': {
    label: 'Light output and intensity',
    description: 'Type in a luminous flux (lm), or an illuminance (lx) read at a measured distance on the beam axis.',
    input: 'typed',
    seriesFields: [],
    specKeys: ['luminousFlux', 'peakIntensity', 'beamDistance'],
    needsSwitchOn: false,
    weatherMatters: false,
  },
  'energy-delivered': {
    label: 'Energy delivered',
    description: 'Discharge a battery or bank into a load and log watts, or volts and amps, until it cuts off.',
    input: 'series',
    seriesFields: [['watts'], ['volts', 'amps']],
    specKeys: ['deliveredEnergy'],
    needsSwitchOn: true,
    weatherMatters: false,
  },
  'solar-output': {
    label: 'Solar output',
    description: 'Log a panel’s output in watts (or volts and amps) under a recorded sky and temperature.',
    input: 'series',
    seriesFields: [['watts'], ['volts', 'amps']],
    // A field share of the STC rating depends on sky and season: shown on the test, not made a spec.
    specKeys: [],
    needsSwitchOn: false,
    weatherMatters: true,
  },
  'charge-time': {
    label: 'Charge time',
    description: 'Log the charger’s input power from plugging in until the charge ends.',
    input: 'series',
    seriesFields: [['watts'], ['volts', 'amps']],
    specKeys: ['chargeTime'],
    needsSwitchOn: true,
    weatherMatters: false,
  },
  'mass-check': {
    label: 'Mass check',
    description: 'Weigh the item as carried and type in the scale reading (g).',
    input: 'typed',
    seriesFields: [],
    specKeys: ['mass'],
    needsSwitchOn: false,
    weatherMatters: false,
  },
  'port-output': {
    label: 'Port output',
    description: 'Load one output port (by its number in the item’s ports list) and type in the volts and amps a USB or DC meter reads.',
    input: 'typed',
    seriesFields: [],
    // Measured port figures go into gear_ports (basis 'measured'), not the specs table: lib/field-tests/port-output.ts.
    specKeys: [],
    needsSwitchOn: false,
    weatherMatters: false,
  },
  'radio-noise': {
    label: 'Radio-noise check',
    description: 'Read a receiver’s noise floor per band on a quiet reference supply, then with the item powering it or running nearby (S-units or dBm).',
    // Band readings live in radio_noise_readings (db/radio-noise.ts), not in trials; the noise-rise specs are written there on approval.
    input: 'typed',
    seriesFields: [],
    specKeys: [],
    needsSwitchOn: false,
    weatherMatters: false,
  },
  other: {
    label: 'Other',
    description: 'Any other measurement: type in figures for the item’s specs, or attach a readings log for the record.',
    input: 'either',
    seriesFields: [['value'], ['watts'], ['volts', 'amps']],
    specKeys: [],
    needsSwitchOn: false,
    weatherMatters: false,
  },
};
