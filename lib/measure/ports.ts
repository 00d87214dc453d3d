import { assertRange, MeasureError } from './errors';

/**
 * Connector kinds of a port. A port's kind names the connector it presents or mates with:
 * a device whose lead ends in a 12 V plug has a `socket-12v` input.
 */
export const PORT_KINDS = [
  'usb-a',
  'usb-c',
  'socket-12v',
  'dc-barrel',
  'binding-posts',
  'genderless-dc',
  'mains-input',
  'solar-input',
  'other',
] as const;
export type PortKind = (typeof PORT_KINDS)[number];

export const PORT_DIRECTIONS = ['input', 'output', 'both'] as const;
export type PortDirection = (typeof PORT_DIRECTIONS)[number];

/** Plain-language names of the port kinds (for messages; `other` uses the port's label). */
export const PORT_KIND_LABELS: Readonly<Record<PortKind, string>> = {
  'usb-a': 'USB-A',
  'usb-c': 'USB-C',
  'socket-12v': '12 V socket',
  'dc-barrel': 'DC barrel',
  'binding-posts': 'binding posts',
  'genderless-dc': 'genderless DC connector',
  'mains-input': 'mains charger input',
  'solar-input': 'solar input',
  other: 'other connector',
};

/** A USB Power Delivery fixed profile: a voltage and the most current at it. */
export interface PdProfile {
  volts: number;
  amps: number;
}

/** Voltages an input accepts, inclusive, in V. */
export interface VoltageWindow {
  minVolts: number;
  maxVolts: number;
}

/**
 * A port of a gear item. Figures in V, A, W.
 * For an output, `amps`/`watts` are the most it delivers; for an input, what it needs.
 * A port with direction `both` uses the same figures both ways (enter two ports when they differ).
 */
export interface Port {
  kind: PortKind;
  direction: PortDirection;
  /** Nominal voltage. USB ports without it are 5 V; a 12 V socket without it is 12 V. */
  volts?: number;
  amps?: number;
  watts?: number;
  /**
   * USB-C only: the USB Power Delivery fixed profiles the port offers (output) or can use (input;
   * any one of them is enough).
   */
  pdProfiles?: PdProfile[];
  /** Inputs only: the voltages the input accepts (a solar input's window, a radio's supply range). */
  voltageWindow?: VoltageWindow;
  /** Free-form name; required for `other` (two `other` connectors join when their labels match). */
  label?: string;
  /** Conversion efficiency inside the item at this port, (0, 1]; default 1. */
  efficiency?: number;
}

/** What stops a fit: the ports' directions, the connectors, the voltage (or an unstated one), the current. */
export type PortFitProblem = 'direction' | 'connector' | 'voltage' | 'current';

/** The result of `portFits`. */
export interface PortFit {
  fits: boolean;
  /** The first problem found; null when it fits. */
  problem: PortFitProblem | null;
  /** Why it does not fit (empty when it fits). */
  reasons: string[];
  /** Things to check by hand even when it fits (unstated figures, plug sizes, cable ratings). */
  cautions: string[];
}

/** Default tolerance on a nominal voltage when an input states no window: ±10 % (our own convention). */
export const NOMINAL_VOLTAGE_TOLERANCE = 0.1;
/** Highest USB PD fixed voltage (EPR, PD Rev 3.1) and highest PD current (check-values §7). */
export const PD_MAX_VOLTS = 48;
export const PD_MAX_AMPS = 5;
/** USB PD profiles above 3 A need a 5 A-rated cable (check-values §7). */
export const PD_STANDARD_CABLE_AMPS = 3;

const MAX_FIGURE = 1_000_000;
const MAX_PD_PROFILES = 16;
const MAX_LABEL = 100;
/** Kinds a panel's lead may present to a solar input (the plug itself is the user's to check). */
export const SOLAR_LEAD_KINDS: readonly PortKind[] = ['dc-barrel', 'genderless-dc', 'binding-posts', 'other'];

function isObject(value: unknown): value is Record<string, unknown> {
  return value !== null && typeof value === 'object' && !Array.isArray(value);
}

function optionalPositive(value: unknown, what: string): number | undefined {
  if (value === undefined || value === null) return undefined;
  return assertRange(value as number, what, { min: 0, minExclusive: true, max: MAX_FIGURE });
}

function oneOf<T extends string>(value: unknown, list: readonly T[], what: string): T {
  if (typeof value !== 'string' || !(list as readonly string[]).includes(value)) {
    throw new MeasureError('out-of-range', `${what} must be one of ${list.join(', ')}, got "${String(value)}".`);
  }
  return value as T;
}

function validatePdProfile(value: unknown, what: string): PdProfile {
  if (!isObject(value)) throw new MeasureError('out-of-range', `${what} must be an object with volts and amps.`);
  return {
    // Fixed PD voltages reach 48 V and currents 5 A (USB PD Rev 3.1 EPR; check-values §7).
    volts: assertRange(value.volts as number, `${what}: volts`, { min: 0, minExclusive: true, max: PD_MAX_VOLTS }),
    amps: assertRange(value.amps as number, `${what}: amps`, { min: 0, minExclusive: true, max: PD_MAX_AMPS }),
  };
}

/**
 * Checks a port and returns a clean copy holding only the known fields.
 * Throws `MeasureError` (`out-of-range`, `not-finite`) with a message naming `what`.
 */
export function validatePort(value: unknown, what = 'Port'): Port {
  if (!isObject(value)) throw new MeasureError('out-of-range', `${what} must be an object with a kind and a direction.`);
  const kind = oneOf(value.kind, PORT_KINDS, `${what}: kind`);
  const direction = oneOf(value.direction, PORT_DIRECTIONS, `${what}: direction`);
  const port: Port = { kind, direction };
  if ((kind === 'mains-input' || kind === 'solar-input') && direction !== 'input') {
    throw new MeasureError('out-of-range', `${what}: a ${PORT_KIND_LABELS[kind]} is always an input.`);
  }
  const volts = optionalPositive(value.volts, `${what}: volts`);
  const amps = optionalPositive(value.amps, `${what}: amps`);
  const watts = optionalPositive(value.watts, `${what}: watts`);
  if (volts !== undefined) port.volts = volts;
  if (amps !== undefined) port.amps = amps;
  if (watts !== undefined) port.watts = watts;

  if (value.pdProfiles !== undefined && value.pdProfiles !== null) {
    if (kind !== 'usb-c') {
      throw new MeasureError('out-of-range', `${what}: only USB-C ports have USB Power Delivery profiles.`);
    }
    if (!Array.isArray(value.pdProfiles) || value.pdProfiles.length === 0 || value.pdProfiles.length > MAX_PD_PROFILES) {
      throw new MeasureError('out-of-range', `${what}: Power Delivery profiles must be a list of 1 to ${MAX_PD_PROFILES} profiles.`);
    }
    port.pdProfiles = value.pdProfiles.map((p, i) => validatePdProfile(p, `${what}: profile ${i + 1}`));
  }

  if (value.voltageWindow !== undefined && value.voltageWindow !== null) {
    if (direction === 'output') {
      throw new MeasureError('out-of-range', `${what}: only an input has a window of accepted voltages.`);
    }
    const w = value.voltageWindow;
    if (!isObject(w)) throw new MeasureError('out-of-range', `${what}: the voltage window needs minVolts and maxVolts.`);
    const minVolts = assertRange(w.minVolts as number, `${what}: lowest accepted voltage`, { min: 0, minExclusive: true, max: MAX_FIGURE });
    const maxVolts = assertRange(w.maxVolts as number, `${what}: highest accepted voltage`, { min: minVolts, max: MAX_FIGURE });
    port.voltageWindow = { minVolts, maxVolts };
  }

  if (value.label !== undefined && value.label !== null) {
    if (typeof value.label !== 'string' || value.label.trim().length > MAX_LABEL) {
      throw new MeasureError('out-of-range', `${what}: the label must be text of at most ${MAX_LABEL} characters.`);
    }
    if (value.label.trim()) port.label = value.label.trim();
  }
  if (kind === 'other' && !port.label) {
    throw new MeasureError('out-of-range', `${what}: an "other" port needs a label naming its connector.`);
  }

  if (value.efficiency !== undefined && value.efficiency !== null) {
    port.efficiency = assertRange(value.efficiency as number, `${what}: efficiency`, { min: 0, minExclusive: true, max: 1 });
  }
  return port;
}

/** Numbers in messages: at most 4 significant digits, no locale data. */
export function formatFigure(x: number): string {
  return String(Number(x.toPrecision(4)));
}

/** "USB-C", "12 V socket", or the label of an `other` port. */
export function portKindLabel(port: Pick<Port, 'kind' | 'label'>): string {
  return port.kind === 'other' ? (port.label ?? PORT_KIND_LABELS.other) : PORT_KIND_LABELS[port.kind];
}

/** The nominal voltage of a port, with the kind's convention when none is stated (USB 5 V, 12 V socket 12 V). */
export function nominalVolts(port: Port): number | undefined {
  if (port.volts !== undefined) return port.volts;
  if (port.kind === 'usb-a' || port.kind === 'usb-c') return 5;
  if (port.kind === 'socket-12v') return 12;
  return undefined;
}

/**
 * USB Power Delivery fixed-profile matching, as issue 9 words it: true when one of the source
 * port's fixed profiles gives the sink's voltage at at least the sink's current. A port without
 * PD profiles offers none (its plain 5 V output is `portFits`'s business).
 */
export function pdProfileSatisfies(sourcePort: Port, sinkNeed: PdProfile): boolean {
  const source = validatePort(sourcePort, 'Source port');
  if (source.direction === 'input') {
    throw new MeasureError('out-of-range', 'Source port is an input; Power Delivery profiles are offered by an output.');
  }
  const need = validatePdProfile(sinkNeed, 'Sink need');
  return (source.pdProfiles ?? []).some((p) => sameVolts(p.volts, need.volts) && p.amps >= need.amps);
}

/** PD voltages are discrete values: equal within 1 mV. */
function sameVolts(a: number, b: number): boolean {
  return Math.abs(a - b) <= 1e-3;
}

function describeProfile(p: { volts: number; amps?: number }): string {
  return p.amps === undefined ? `${formatFigure(p.volts)} V` : `${formatFigure(p.volts)} V at ${formatFigure(p.amps)} A`;
}

interface Offer {
  volts: number;
  /** Most current at `volts`, after any watts cap; undefined when neither amps nor watts is stated. */
  amps?: number;
  pd: boolean;
}

/** What an output offers: its PD profiles, or one nominal voltage. Each capped by the port's watts. */
function offersOf(port: Port): Offer[] | null {
  const cap = (volts: number, amps: number | undefined): number | undefined => {
    const byWatts = port.watts === undefined ? undefined : port.watts / volts;
    if (amps === undefined) return byWatts;
    return byWatts === undefined ? amps : Math.min(amps, byWatts);
  };
  if (port.pdProfiles) return port.pdProfiles.map((p) => ({ volts: p.volts, amps: cap(p.volts, p.amps), pd: true }));
  const volts = nominalVolts(port);
  if (volts === undefined) return null;
  return [{ volts, amps: cap(volts, port.amps), pd: false }];
}

function connectorReason(output: Port, input: Port, outName: string, inName: string): { reason?: string; caution?: string } {
  const outLabel = portKindLabel(output);
  const inLabel = portKindLabel(input);
  if (input.kind === 'mains-input') {
    return { reason: `${inName}'s mains charger input needs a mains outlet; kits here run from 12 V, USB and solar only` };
  }
  if (input.kind === 'solar-input') {
    if (SOLAR_LEAD_KINDS.includes(output.kind)) {
      return { caution: `check that ${outName}'s ${outLabel} plug fits ${inName}'s solar input (plugs and polarity vary)` };
    }
    return { reason: `${outName}'s ${outLabel} does not join ${inName}'s solar input without an adapter` };
  }
  if (output.kind !== input.kind) {
    return { reason: `${outName}'s ${outLabel} does not join ${inName}'s ${inLabel} directly` };
  }
  if (output.kind === 'other' && (output.label ?? '').toLowerCase() !== (input.label ?? '').toLowerCase()) {
    return { reason: `${outName}'s ${outLabel} does not join ${inName}'s ${inLabel} directly` };
  }
  if (output.kind === 'dc-barrel') {
    return { caution: `check that the DC barrel plug of ${inName} fits ${outName} (sizes and centre polarity vary)` };
  }
  return {};
}

/** Whether the connectors of an output and an input join directly (same kind, matching `other` labels; solar leads). */
export function connectorsJoin(output: Port, input: Port): boolean {
  const o = validatePort(output, 'Output');
  const i = validatePort(input, 'Input');
  return connectorReason(o, i, 'the output', 'the input').reason === undefined;
}

/**
 * Whether an output can feed an input directly: the connectors join, the output's voltage is
 * one the input takes (its window; else its nominal voltage ±10 %; USB PD profiles exactly),
 * and the output delivers at least the current (or power) the input needs at that voltage.
 * `names` are used in the plain-language reasons ("the laptop needs 20 V at 2.25 A over
 * USB-C; the bank offers at most 9 V at 2 A"). Unstated currents give cautions, not failures;
 * an unstated voltage is a failure (it cannot be checked).
 */
export function portFits(output: Port, input: Port, names: { output?: string; input?: string } = {}): PortFit {
  return fitValidatedPorts(validatePort(output, 'Output'), validatePort(input, 'Input'), names);
}

/** `portFits` for ports that `validatePort` has already checked (the path search calls it many times). */
export function fitValidatedPorts(out: Port, inp: Port, names: { output?: string; input?: string } = {}): PortFit {
  const outName = names.output ?? 'the output';
  const inName = names.input ?? 'the input';
  const reasons: string[] = [];
  const cautions: string[] = [];
  if (out.direction === 'input') reasons.push(`${outName}'s ${portKindLabel(out)} is an input, not an output`);
  if (inp.direction === 'output') reasons.push(`${inName}'s ${portKindLabel(inp)} is an output, not an input`);
  if (reasons.length) return { fits: false, problem: 'direction', reasons, cautions };

  const connector = connectorReason(out, inp, outName, inName);
  if (connector.reason) return { fits: false, problem: 'connector', reasons: [connector.reason], cautions };
  if (connector.caution) cautions.push(connector.caution);

  const offers = offersOf(out);
  if (!offers) {
    return { fits: false, problem: 'voltage', reasons: [`${outName}'s ${portKindLabel(out)} does not state its voltage`], cautions };
  }

  if (inp.pdProfiles) return fitPd(inp, offers, outName, inName, cautions);

  // One voltage need: a window, or the nominal voltage ± tolerance.
  const window = inp.voltageWindow;
  const inVolts = nominalVolts(inp);
  if (!window && inVolts === undefined) {
    return { fits: false, problem: 'voltage', reasons: [`${inName}'s ${portKindLabel(inp)} does not state the voltage it needs`], cautions };
  }
  const accepts = (v: number) =>
    window
      ? v >= window.minVolts && v <= window.maxVolts
      : Math.abs(v - (inVolts as number)) <= NOMINAL_VOLTAGE_TOLERANCE * (inVolts as number) + 1e-9;
  const needText = window
    ? `${formatFigure(window.minVolts)}–${formatFigure(window.maxVolts)} V`
    : `${formatFigure(inVolts as number)} V`;
  // A USB sink without PD profiles negotiates nothing: it gets the plain 5 V (PD sources list it).
  const usbWithoutPd = inp.kind === 'usb-c' || inp.kind === 'usb-a';
  const reachable = offers.filter((o) => !usbWithoutPd || !o.pd || sameVolts(o.volts, 5));
  const usable = reachable.filter((o) => accepts(o.volts));
  if (usable.length === 0) {
    const offered = reachable.length ? reachable.map((o) => `${formatFigure(o.volts)} V`).join(', ') : 'no 5 V profile';
    return {
      fits: false,
      problem: 'voltage',
      reasons: [`${inName} needs ${needText} at its ${portKindLabel(inp)}; ${outName} gives ${offered}`],
      cautions,
    };
  }
  // A solar input's amps and watts are the most its charge controller takes, not a need: a smaller
  // panel charges more slowly, it still charges.
  if (inp.kind === 'solar-input') return { fits: true, problem: null, reasons: [], cautions };
  const needAt = (o: Offer) => inp.amps ?? (inp.watts !== undefined ? inp.watts / o.volts : undefined);
  if (needAt(usable[0] as Offer) === undefined) {
    cautions.push(`${inName} does not state the current or power it draws; check ${outName} can supply it`);
    return { fits: true, problem: null, reasons: [], cautions };
  }
  // Any accepted voltage that carries enough current will do; an offer with no stated current is a caution.
  if (usable.some((o) => o.amps !== undefined && o.amps >= (needAt(o) as number) * (1 - 1e-9))) {
    return { fits: true, problem: null, reasons: [], cautions };
  }
  const unstated = usable.find((o) => o.amps === undefined);
  if (unstated) {
    cautions.push(
      `${outName} does not state the current its ${portKindLabel(out)} delivers; check it gives at least ${formatFigure(needAt(unstated) as number)} A`,
    );
    return { fits: true, problem: null, reasons: [], cautions };
  }
  // Report against the offer that comes closest (the most power).
  const best = usable.reduce((a, b) => ((b.amps as number) * b.volts > (a.amps as number) * a.volts ? b : a));
  return {
    fits: false,
    problem: 'current',
    reasons: [
      `${inName} needs ${describeProfile({ volts: best.volts, amps: needAt(best) as number })}; ${outName} delivers at most ${formatFigure(best.amps as number)} A`,
    ],
    cautions,
  };
}

function fitPd(inp: Port, offers: Offer[], outName: string, inName: string, cautions: string[]): PortFit {
  const needs = inp.pdProfiles as PdProfile[];
  for (const need of needs) {
    const match = offers.find(
      (o) => (o.pd || sameVolts(o.volts, 5)) && sameVolts(o.volts, need.volts) && (o.amps === undefined || o.amps >= need.amps * (1 - 1e-9)),
    );
    if (!match) continue;
    if (match.amps === undefined) {
      cautions.push(`${outName} does not state the current it delivers at ${formatFigure(need.volts)} V; check it gives ${formatFigure(need.amps)} A`);
    }
    if (need.amps > PD_STANDARD_CABLE_AMPS) {
      cautions.push(`${formatFigure(need.volts)} V at ${formatFigure(need.amps)} A needs a USB-C cable rated for 5 A`);
    }
    return { fits: true, problem: null, reasons: [], cautions };
  }
  const top = offers.reduce((a, b) => (b.volts > a.volts || (b.volts === a.volts && (b.amps ?? 0) > (a.amps ?? 0)) ? b : a));
  const needText = needs.map(describeProfile).join(' or ');
  const offerText = offers.length > 1 ? `at most ${describeProfile(top)}` : describeProfile(top);
  return {
    fits: false,
    problem: 'voltage',
    reasons: [`${inName} needs ${needText} over USB-C; ${outName} offers ${offerText}`],
    cautions,
  };
}
