import {
  beamDistanceM,
  candelaFromLux,
  chargeTimeS,
  energyWh,
  isSpecKey,
  lightRuntime,
  MeasureError,
  solarOutput,
  SPECS,
  summarize,
  CHARGE_END_HOLD_S,
  CHARGE_END_SHARE,
  RUNTIME_REFERENCE_S,
  type SpecKey,
  type TrialSummary,
} from '@/lib/measure';
import type { Sample } from '@/lib/readings/types';
import { KINDS, type FieldTestKind } from './kinds';
import { portOutputFigures, portOutputNotes, portOutputReading, type PortFigureKey } from './port-output';

/*
 * Field-test analysis: maps a kind and its trials (readings series or typed values) to figures
 * through lib/measure, names the formula and standard used, and summarises repeated trials of
 * each item as mean ± sd (n). Pure: no database, clock or framework.
 */

/** One trial as stored: the item it belongs to, and a series or typed values (canonical units). */
export interface TrialInput {
  itemId: string;
  id?: string;
  label?: string;
  samples?: readonly Sample[];
  /** Typed values keyed by spec key (g, lm, cd, m, Wh, s …) or, for light output, `illuminanceLx` and `distanceM`. */
  typed?: Readonly<Record<string, number>> | null;
}

/** What the item claims, where a result is a share of it. */
export interface ItemContext {
  /** Rated energy in Wh (capacity × nominal voltage), for delivered ÷ rated. */
  ratedEnergyWh?: number | null;
  /** Rated power in W (at STC), for a panel's share of rating. */
  ratedW?: number | null;
}

export type FigureKey = SpecKey | 'deliveredVsRated' | 'referenceOutput' | 'meanPower' | 'peakPower' | 'shareOfRating' | PortFigureKey;

/** One result figure of a trial. `specKey` is set when the figure becomes a measured spec of the item. */
export interface Figure {
  key: FigureKey;
  label: string;
  value: number;
  /** Canonical unit ('' for a ratio; the log's own unit for the reference output). */
  unit: string;
  specKey?: SpecKey;
}

/** Which formula and standard produced a figure, for display beside it. */
export interface MethodNote {
  id: 'fl1-runtime' | 'inverse-square' | 'trapezoid-energy' | 'solar-output' | 'charge-time' | 'typed' | 'repeat-trials';
  text: string;
  /** Heading of lib/measure/README.md (and the method page) that explains it. */
  section: 'Light' | 'Energy' | 'Solar' | 'Repeat trials — `summarize(values)`' | 'Specs and categories';
}

/** Numbers the charts draw beside the series. */
export type ChartFacts =
  | { kind: 'light'; referenceValue: number; thresholdValue: number; runtimeS: number | null }
  | { kind: 'power'; deliveredWh: number; ratedEnergyWh: number | null }
  | { kind: 'solar'; meanW: number; peakW: number; ratedW: number | null }
  | { kind: 'charge'; chargeTimeS: number | null };

export type TrialAnalysis =
  | { ok: true; itemId: string; id?: string; label?: string; figures: Figure[]; methods: MethodNote[]; chart: ChartFacts | null; notes: string[] }
  | { ok: false; itemId: string; id?: string; label?: string; error: { code: string; message: string } };

export const METHODS = {
  fl1Runtime: {
    id: 'fl1-runtime',
    text: `ANSI/PLATO FL 1 runtime: from switch-on to 10 % of the output at ${RUNTIME_REFERENCE_S} s, both found by linear interpolation between readings.`,
    section: 'Light',
  },
  inverseSquare: {
    id: 'inverse-square',
    text: 'Intensity from illuminance by the inverse-square law, I = E × d²; beam distance to 0.25 lx, d = 2√I (ANSI/PLATO FL 1).',
    section: 'Light',
  },
  trapezoidEnergy: {
    id: 'trapezoid-energy',
    text: 'Energy delivered by the trapezoidal rule over the logged power (P = V × A when volts and amps are logged): E = Σ (Pᵢ + Pᵢ₊₁)/2 × Δt ÷ 3600; delivered ÷ rated uses the rated energy, capacity × nominal voltage (49 CFR 171.8).',
    section: 'Energy',
  },
  solarOutput: {
    id: 'solar-output',
    text: 'Time-weighted mean power (trapezoidal integral ÷ duration) and peak reading; share of the rating at standard test conditions (1000 W/m², 25 °C cell), so a field share below 1 is normal.',
    section: 'Solar',
  },
  chargeTime: {
    id: 'charge-time',
    text: `Charge time: from the first reading until input power falls below ${CHARGE_END_SHARE * 100} % of its peak and stays below for ${CHARGE_END_HOLD_S / 60} minutes (common practice, no source).`,
    section: 'Energy',
  },
  typed: { id: 'typed', text: 'Figures as typed in from the instrument, in canonical units.', section: 'Specs and categories' },
  repeatTrials: {
    id: 'repeat-trials',
    text: 'Repeated trials: mean and sample standard deviation (divisor n − 1) over the trials of each item.',
    section: 'Repeat trials — `summarize(values)`',
  },
} as const satisfies Record<string, MethodNote>;

function specFigure(key: SpecKey, value: number): Figure {
  return { key, label: SPECS[key].label, value, unit: SPECS[key].unit, specKey: key };
}

/** Power of a sample: watts, else volts × amps. */
export function powerOf(s: Sample): number | undefined {
  if (s.watts !== undefined) return s.watts;
  if (s.volts !== undefined && s.amps !== undefined) return s.volts * s.amps;
  return undefined;
}

function powerSeries(samples: readonly Sample[]): { t: number; watts: number }[] {
  return samples.map((s, i) => {
    const watts = powerOf(s);
    if (watts === undefined) throw new MeasureError('bad-sample', `Reading ${i + 1} needs watts, or volts and amps.`);
    return { t: s.t, watts };
  });
}

function lightSeries(samples: readonly Sample[]): { t: number; value: number }[] {
  return samples.map((s, i) => {
    if (s.value === undefined) throw new MeasureError('bad-sample', `Reading ${i + 1} has no light output value.`);
    return { t: s.t, value: s.value };
  });
}

function positive(x: number | null | undefined): x is number {
  return typeof x === 'number' && Number.isFinite(x) && x > 0;
}

type Ok = Extract<TrialAnalysis, { ok: true }>;
type Body = Pick<Ok, 'figures' | 'methods' | 'chart' | 'notes'>;

/** Typed figures for spec keys of the kind (or any spec key for `other`). */
function typedFigures(kind: FieldTestKind, typed: Readonly<Record<string, number>>): Body {
  const allowed = kind === 'other' ? null : new Set<string>(KINDS[kind].specKeys);
  const figures: Figure[] = [];
  for (const [key, value] of Object.entries(typed)) {
    if (!isSpecKey(key) || (allowed && !allowed.has(key))) continue;
    if (!Number.isFinite(value) || value < 0) throw new MeasureError('out-of-range', `${SPECS[key].label} must be a number ≥ 0, got ${value}.`);
    figures.push(specFigure(key, value));
  }
  return { figures, methods: [METHODS.typed], chart: null, notes: [] };
}

function analyzeLightOutput(typed: Readonly<Record<string, number>>): Body {
  const body = typedFigures('light-output', typed);
  const lux = typed.illuminanceLx;
  const d = typed.distanceM;
  if (lux !== undefined || d !== undefined) {
    if (lux === undefined || d === undefined) throw new MeasureError('bad-sample', 'An illuminance reading needs both the lux value and the distance in m.');
    const cd = candelaFromLux(lux, d);
    body.figures = body.figures.filter((f) => f.key !== 'peakIntensity' && f.key !== 'beamDistance');
    body.figures.push(specFigure('peakIntensity', cd), specFigure('beamDistance', beamDistanceM(cd)));
    body.methods.push(METHODS.inverseSquare);
  } else if (typed.peakIntensity !== undefined && typed.beamDistance === undefined) {
    body.figures.push(specFigure('beamDistance', beamDistanceM(typed.peakIntensity)));
    body.methods.push(METHODS.inverseSquare);
  }
  return body;
}

function analyzeSeries(kind: FieldTestKind, samples: readonly Sample[], ctx: ItemContext): Body {
  switch (kind) {
    case 'light-runtime': {
      const { referenceValue, runtimeS } = lightRuntime(lightSeries(samples));
      const figures: Figure[] = [{ key: 'referenceOutput', label: `Output at ${RUNTIME_REFERENCE_S} s`, value: referenceValue, unit: '' }];
      const notes: string[] = [];
      if (runtimeS === null) notes.push('The log ends before the output fell to 10 % of the output at 30 s, so it gives no runtime.');
      else figures.unshift(specFigure('runtime', runtimeS));
      return { figures, methods: [METHODS.fl1Runtime], chart: { kind: 'light', referenceValue, thresholdValue: referenceValue / 10, runtimeS }, notes };
    }
    case 'energy-delivered': {
      const wh = energyWh(powerSeries(samples));
      const figures = [specFigure('deliveredEnergy', wh)];
      const notes: string[] = [];
      const rated = positive(ctx.ratedEnergyWh) ? ctx.ratedEnergyWh : null;
      if (rated !== null) figures.push({ key: 'deliveredVsRated', label: 'Delivered ÷ rated', value: wh / rated, unit: '' });
      else notes.push('The item has no rated energy, so delivered ÷ rated is not shown.');
      return { figures, methods: [METHODS.trapezoidEnergy], chart: { kind: 'power', deliveredWh: wh, ratedEnergyWh: rated }, notes };
    }
    case 'solar-output': {
      const rated = positive(ctx.ratedW) ? ctx.ratedW : null;
      const r = solarOutput(powerSeries(samples), rated ?? 1);
      const figures: Figure[] = [
        { key: 'meanPower', label: 'Mean output', value: r.meanW, unit: 'W' },
        { key: 'peakPower', label: 'Peak output', value: r.peakW, unit: 'W' },
      ];
      const notes: string[] = [];
      if (rated !== null) figures.push({ key: 'shareOfRating', label: 'Mean ÷ rating', value: r.shareOfRating, unit: '' });
      else notes.push('The panel has no rated power, so its share of the rating is not shown.');
      return { figures, methods: [METHODS.solarOutput], chart: { kind: 'solar', meanW: r.meanW, peakW: r.peakW, ratedW: rated }, notes };
    }
    case 'charge-time': {
      const s = chargeTimeS(powerSeries(samples));
      const notes = s === null ? ['Input power never stayed below 5 % of its peak for 5 minutes in this log, so it gives no charge time.'] : [];
      return { figures: s === null ? [] : [specFigure('chargeTime', s)], methods: [METHODS.chargeTime], chart: { kind: 'charge', chargeTimeS: s }, notes };
    }
    case 'other':
      return { figures: [], methods: [], chart: null, notes: ['Readings are kept with the test; this kind computes no figure from them.'] };
    default:
      throw new MeasureError('bad-sample', `A ${KINDS[kind].label.toLowerCase()} test takes typed values, not a readings log.`);
  }
}

/**
 * Analyses one trial of a field test of `kind` through lib/measure. A trial with readings is
 * analysed from them; typed values give the kind's spec figures directly (light output also
 * derives intensity and beam distance from lux at a distance). Bad input comes back as
 * `{ ok: false, error }` with lib/measure's code and message; never throws for bad data.
 */
export function analyzeTrial(kind: FieldTestKind, trial: TrialInput, ctx: ItemContext = {}): TrialAnalysis {
  const head = { itemId: trial.itemId, ...(trial.id !== undefined && { id: trial.id }), ...(trial.label !== undefined && { label: trial.label }) };
  try {
    let body: Body;
    const hasSeries = (trial.samples?.length ?? 0) > 0;
    if (hasSeries && KINDS[kind].input !== 'typed') body = analyzeSeries(kind, trial.samples!, ctx);
    else if (trial.typed && Object.keys(trial.typed).length > 0) {
      if (kind === 'port-output') {
        const r = portOutputReading(trial.typed);
        body = { figures: portOutputFigures(r), methods: [METHODS.typed], chart: null, notes: portOutputNotes(r) };
      } else body = kind === 'light-output' ? analyzeLightOutput(trial.typed) : typedFigures(kind, trial.typed);
      if (kind === 'energy-delivered') {
        const wh = body.figures.find((f) => f.key === 'deliveredEnergy')?.value;
        if (wh !== undefined && positive(ctx.ratedEnergyWh)) body.figures.push({ key: 'deliveredVsRated', label: 'Delivered ÷ rated', value: wh / ctx.ratedEnergyWh, unit: '' });
      }
      if (body.figures.length === 0) throw new MeasureError('empty', `None of the typed values is a figure a ${KINDS[kind].label.toLowerCase()} test records.`);
    } else if (hasSeries) throw new MeasureError('bad-sample', `A ${KINDS[kind].label.toLowerCase()} test takes typed values, not a readings log.`);
    else throw new MeasureError('empty', 'This trial has no readings and no typed values.');
    return { ok: true, ...head, ...body };
  } catch (e) {
    if (e instanceof MeasureError) return { ok: false, ...head, error: { code: e.code, message: e.message } };
    throw e;
  }
}

/** Mean ± sd (n) of one figure over an item's trials. */
export interface FigureSummary {
  key: FigureKey;
  label: string;
  unit: string;
  specKey?: SpecKey;
  summary: TrialSummary;
}

export interface FieldTestAnalysis {
  kind: FieldTestKind;
  trials: TrialAnalysis[];
  /** Per item, in order of first appearance: each figure summarised over the item's good trials. */
  items: { itemId: string; summaries: FigureSummary[] }[];
  methods: MethodNote[];
}

/** Analyses every trial and summarises each item's figures over its trials (mean, sample sd, n) with `summarize`. */
export function analyzeFieldTest(kind: FieldTestKind, trials: readonly TrialInput[], context: Readonly<Record<string, ItemContext>> = {}): FieldTestAnalysis {
  const results = trials.map((t) => analyzeTrial(kind, t, context[t.itemId] ?? {}));
  const items: FieldTestAnalysis['items'] = [];
  const methods = new Map<string, MethodNote>();
  for (const itemId of [...new Set(trials.map((t) => t.itemId))]) {
    const byKey = new Map<FigureKey, { figure: Figure; values: number[] }>();
    for (const r of results) {
      if (!r.ok || r.itemId !== itemId) continue;
      r.methods.forEach((m) => methods.set(m.id, m));
      for (const f of r.figures) {
        const entry = byKey.get(f.key) ?? { figure: f, values: [] };
        entry.values.push(f.value);
        byKey.set(f.key, entry);
      }
    }
    const summaries = [...byKey.values()].map(({ figure, values }) => ({
      key: figure.key,
      label: figure.label,
      unit: figure.unit,
      ...(figure.specKey && { specKey: figure.specKey }),
      summary: summarize(values),
    }));
    if (summaries.some((s) => s.summary.n > 1)) methods.set(METHODS.repeatTrials.id, METHODS.repeatTrials);
    items.push({ itemId, summaries });
  }
  return { kind, trials: results, items, methods: [...methods.values()] };
}

/** The measured specs a field test gives its items (for the specs table, on approval). */
export function measuredSpecs(analysis: FieldTestAnalysis): { itemId: string; key: SpecKey; value: number; sd: number | null; n: number }[] {
  return analysis.items.flatMap(({ itemId, summaries }) =>
    summaries.filter((s) => s.specKey !== undefined).map((s) => ({ itemId, key: s.specKey!, value: s.summary.mean, sd: s.summary.sd, n: s.summary.n })),
  );
}
