/**
 * Port-output field tests (issue 9: "a measured USB output wattage comes from a field test"): each
 * trial loads one output port of the item, named by its number in the item's ports list, and records
 * the volts and amps a USB or DC meter reads (and, optionally, the current the load was set to).
 * Power is P = V × I. Approval writes a measured port row beside the claimed one (db/measured-ports.ts).
 *
 * Pure: no database, clock or framework.
 */
import { MeasureError, portKindLabel, type Port } from '@/lib/measure';

/** Typed values of a port-output trial. */
export const PORT_OUTPUT_KEYS = ['portNumber', 'portVolts', 'portAmps', 'loadAmps'] as const;
export type PortOutputKey = (typeof PORT_OUTPUT_KEYS)[number];

/** Form labels and units of the typed values. */
export const PORT_OUTPUT_LABELS: Readonly<Record<PortOutputKey, [string, string]>> = {
  portNumber: ['Port number', 'as in the item’s Ports table'],
  portVolts: ['Voltage the meter reads at the port', 'V'],
  portAmps: ['Current the meter reads', 'A'],
  loadAmps: ['Load set to, optional', 'A'],
};

/** Our own sanity limits on typed readings (no source): beyond them a figure is a typing slip. */
export const PORT_OUTPUT_LIMITS = { maxPortNumber: 16, maxVolts: 100, maxAmps: 200 } as const;

/** Figure keys of a port's measured output: one set per port number, so trials of two ports never mix. */
export type PortFigureKey = `port${number}Volts` | `port${number}Amps` | `port${number}Watts`;

const FIGURE_KEY = /^port(\d+)(Volts|Amps|Watts)$/;

export interface PortOutputReading {
  /** 1-based, as the item page numbers its ports. */
  portNumber: number;
  volts: number;
  amps: number;
  /** volts × amps. */
  watts: number;
  loadAmps: number | null;
}

function reading(typed: Readonly<Record<string, number>>, key: PortOutputKey, max: number, label: string): number {
  const v = typed[key];
  if (v === undefined) throw new MeasureError('bad-sample', `Give the ${label}.`);
  if (!Number.isFinite(v)) throw new MeasureError('not-finite', `The ${label} must be a finite number.`);
  if (v <= 0 || v > max) throw new MeasureError('out-of-range', `The ${label} must be above 0 and at most ${max}; got ${v}.`);
  return v;
}

/** The reading of one trial; throws `MeasureError` naming the figure that is missing or out of range. */
export function portOutputReading(typed: Readonly<Record<string, number>>): PortOutputReading {
  const unknown = Object.keys(typed).filter((k) => !(PORT_OUTPUT_KEYS as readonly string[]).includes(k));
  if (unknown.length) throw new MeasureError('bad-sample', `A port output test does not record ${unknown.join(', ')}.`);
  const portNumber = reading(typed, 'portNumber', PORT_OUTPUT_LIMITS.maxPortNumber, 'port number');
  if (!Number.isInteger(portNumber)) throw new MeasureError('not-integer', `The port number is a whole number (1, 2, …); got ${portNumber}.`);
  const volts = reading(typed, 'portVolts', PORT_OUTPUT_LIMITS.maxVolts, 'measured voltage (V)');
  const amps = reading(typed, 'portAmps', PORT_OUTPUT_LIMITS.maxAmps, 'measured current (A)');
  const loadAmps = typed.loadAmps === undefined ? null : reading(typed, 'loadAmps', PORT_OUTPUT_LIMITS.maxAmps, 'load current (A)');
  return { portNumber, volts, amps, watts: volts * amps, loadAmps };
}

export interface PortFigure {
  key: PortFigureKey;
  label: string;
  value: number;
  unit: 'V' | 'A' | 'W';
}

/** The figures of one trial: the port's volts, amps and watts (P = V × I), keyed by its number. */
export function portOutputFigures(r: PortOutputReading): PortFigure[] {
  const n = r.portNumber;
  return [
    { key: `port${n}Watts`, label: `Port ${n} output power`, value: r.watts, unit: 'W' },
    { key: `port${n}Volts`, label: `Port ${n} voltage`, value: r.volts, unit: 'V' },
    { key: `port${n}Amps`, label: `Port ${n} current`, value: r.amps, unit: 'A' },
  ];
}

/** Notes shown with a trial: the load used, when given. */
export function portOutputNotes(r: PortOutputReading): string[] {
  return r.loadAmps === null ? [] : [`Load set to ${r.loadAmps} A; the port delivered ${Number(r.amps.toPrecision(4))} A.`];
}

/** Port number and quantity of a figure key (`port2Watts` → 2, 'Watts'), or null for other keys. */
export function parsePortFigureKey(key: string): { portNumber: number; quantity: 'Volts' | 'Amps' | 'Watts' } | null {
  const m = FIGURE_KEY.exec(key);
  return m ? { portNumber: Number(m[1]), quantity: m[2] as 'Volts' | 'Amps' | 'Watts' } : null;
}

/**
 * Why the reading cannot belong to the item's port `portNumber`, or null: the number must name one of
 * the item's ports, and that port must be an output (or both ways).
 */
export function portOutputMismatch(itemName: string, ports: readonly Port[], portNumber: number): string | null {
  if (ports.length === 0) return `“${itemName}” lists no ports yet: add its ports before measuring one.`;
  const port = ports[portNumber - 1];
  if (!port) {
    return `“${itemName}” lists ${ports.length} ${ports.length === 1 ? 'port' : 'ports'}; there is no port ${portNumber}. Use the number in the Ports table on its page.`;
  }
  if (port.direction === 'input') {
    return `Port ${portNumber} of “${itemName}” is an input (${portKindLabel(port)} input); a port output test measures an output.`;
  }
  return null;
}

/** Mean volts, amps and watts of each measured port of an item, from the analysis summaries. */
export interface MeasuredPortFigures {
  portNumber: number;
  volts: number;
  amps: number;
  /** Mean of each trial's V × I (not mean V × mean I). */
  watts: number;
  n: number;
}

export function measuredPortFigures(summaries: readonly { key: string; summary: { mean: number; n: number } }[]): MeasuredPortFigures[] {
  const byPort = new Map<number, Partial<MeasuredPortFigures>>();
  for (const s of summaries) {
    const k = parsePortFigureKey(s.key);
    if (!k) continue;
    const entry = byPort.get(k.portNumber) ?? { portNumber: k.portNumber };
    if (k.quantity === 'Volts') entry.volts = s.summary.mean;
    if (k.quantity === 'Amps') entry.amps = s.summary.mean;
    if (k.quantity === 'Watts') {
      entry.watts = s.summary.mean;
      entry.n = s.summary.n;
    }
    byPort.set(k.portNumber, entry);
  }
  return [...byPort.values()]
    .filter((e): e is MeasuredPortFigures => e.volts !== undefined && e.amps !== undefined && e.watts !== undefined && e.n !== undefined)
    .sort((a, b) => a.portNumber - b.portNumber);
}

/**
 * The measured figure that belongs to claimed port `index` (0-based): same position, connector,
 * direction and label. A measurement of a port that was changed or moved since is not shown beside it.
 */
export function measuredFor<M extends { position: number; kind: string; direction: string; label: string | null }>(
  claimed: Pick<Port, 'kind' | 'direction' | 'label'>,
  index: number,
  measured: readonly M[],
): M | undefined {
  return measured.find((m) => m.position === index && m.kind === claimed.kind && m.direction === claimed.direction && (m.label ?? null) === (claimed.label ?? null));
}

/** A port as the public API gives it: claimed figures, or a measured figure with the test it comes from. */
export type PublicPort = Port & {
  /** 1-based number of the port in the item's list (a measured figure carries the number of the port it measured). */
  number: number;
  basis: 'claimed' | 'measured';
  /** Page of the approved port-output test a measured figure comes from; null for a claim. */
  provenance: string | null;
};

type MeasuredRow = { position: number; kind: string; direction: string; label: string | null; volts: number | null; amps: number | null; watts: number | null; fieldTest: { id: string } | null };

/** Claimed ports in order, each followed by its measured figure when a port-output test measured it. */
export function publicPorts(claimed: readonly Port[], measured: readonly MeasuredRow[]): PublicPort[] {
  return claimed.flatMap((port, index) => {
    const out: PublicPort[] = [{ ...port, number: index + 1, basis: 'claimed', provenance: null }];
    const m = measuredFor(port, index, measured);
    if (m) {
      const row: PublicPort = { kind: port.kind, direction: port.direction, number: index + 1, basis: 'measured', provenance: m.fieldTest ? `/field-tests/${encodeURIComponent(m.fieldTest.id)}` : null };
      if (port.label) row.label = port.label;
      if (m.volts !== null) row.volts = m.volts;
      if (m.amps !== null) row.amps = m.amps;
      if (m.watts !== null) row.watts = m.watts;
      out.push(row);
    }
    return out;
  });
}
