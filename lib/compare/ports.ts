/**
 * The side-by-side's "Ports" group: one row per connector and direction any of the items has, from the
 * claimed ports and the measured figures of port-output tests (GET /api/v1/gear/{slug} `ports`):
 * "USB-C out, most W", "USB-C out, measured W", "USB-C out, Power Delivery levels", "12 V socket out,
 * most W", "Solar input window", "Solar input, most W", "USB-C in, most W" …
 *
 * More output power is better (higher marked best). An input's figure says what the item takes, which is
 * not better or worse in itself, so input rows mark nothing — except a solar input, where a higher limit
 * lets a bigger panel charge it faster. Pure: no framework or database.
 */
import type { CompareCell, CompareGroup, CompareResponse, CompareRow, GearSummary } from '@/lib/browse/contract';
import { formatFigure, nominalVolts, PORT_KIND_LABELS, PORT_KINDS, type Port, type PortKind } from '@/lib/measure';
import { allEqual, bestFlags } from './index';

export type ComparePort = NonNullable<GearSummary['ports']>[number];

/** The most power a port states: its watts, else its best USB PD level (V × A), else nominal volts × amps. */
export function portMostWatts(port: Port): number | null {
  if (port.watts !== undefined) return port.watts;
  if (port.pdProfiles?.length) return Math.max(...port.pdProfiles.map((p) => p.volts * p.amps));
  const volts = nominalVolts(port);
  return volts !== undefined && port.amps !== undefined ? volts * port.amps : null;
}

const isOut = (p: ComparePort) => p.direction !== 'input';
const isIn = (p: ComparePort) => p.direction !== 'output';
const label = (kind: PortKind) => {
  const l = PORT_KIND_LABELS[kind];
  return l.charAt(0).toUpperCase() + l.slice(1);
};

type Cell = Omit<CompareCell, 'best'>;
const EMPTY_W: Cell = { value: null, unit: 'W', basis: null, provenance: null };
const EMPTY_TEXT: Cell = { value: null, unit: '', basis: null, provenance: null };

function rowOf(key: string, rowLabel: string, unit: string, direction: CompareRow['direction'], cells: Cell[]): CompareRow {
  const values = cells.map((c) => c.value);
  const best = bestFlags(values, direction);
  return { key, label: rowLabel, unit, direction, cells: cells.map((c, i) => ({ ...c, best: best[i]! })), allEqual: allEqual(values) };
}

/** The most-W cell of the ports of one item that match, claimed or measured; empty when it has none. */
function mostWatts(ports: readonly ComparePort[], basis: 'claimed' | 'measured'): Cell {
  let best: Cell = EMPTY_W;
  for (const p of ports) {
    if (p.basis !== basis) continue;
    const w = portMostWatts(p);
    if (w !== null && (best.value === null || w > (best.value as number))) best = { value: w, unit: 'W', basis, provenance: p.provenance };
  }
  return best;
}

/** "5 / 9 / 15 / 20 V (up to 20 V × 3 A)": the USB PD levels an item's USB-C outputs offer. */
function pdLevels(ports: readonly ComparePort[]): Cell {
  const profiles = ports.filter((p) => p.basis === 'claimed').flatMap((p) => p.pdProfiles ?? []);
  if (profiles.length === 0) return EMPTY_TEXT;
  const volts = [...new Set(profiles.map((p) => p.volts))].sort((a, b) => a - b);
  const power = (x: { volts: number; amps: number }) => x.volts * x.amps;
  // The most powerful level; between equal powers, the higher voltage (20 V × 2.25 A over 15 V × 3 A).
  const top = profiles.reduce((a, b) => (power(b) > power(a) + 1e-9 || (Math.abs(power(b) - power(a)) <= 1e-9 && b.volts > a.volts) ? b : a));
  return { value: `${volts.map(formatFigure).join(' / ')} V (up to ${formatFigure(top.volts)} V × ${formatFigure(top.amps)} A)`, unit: '', basis: 'claimed', provenance: null };
}

/** "12–28 V": the widest accepted window of an item's solar inputs. */
function solarWindow(ports: readonly ComparePort[]): Cell {
  const windows = ports.filter((p) => p.basis === 'claimed' && p.voltageWindow).map((p) => p.voltageWindow!);
  if (windows.length === 0) return EMPTY_TEXT;
  const min = Math.min(...windows.map((w) => w.minVolts));
  const max = Math.max(...windows.map((w) => w.maxVolts));
  return { value: `${formatFigure(min)}–${formatFigure(max)} V`, unit: '', basis: 'claimed', provenance: null };
}

/** The Ports group of the given items (their ports in column order), or null when none lists a port. */
export function portsGroup(itemsPorts: readonly (readonly ComparePort[])[]): CompareGroup | null {
  const rows: CompareRow[] = [];
  const has = (test: (p: ComparePort) => boolean) => itemsPorts.some((ports) => ports.some(test));
  for (const kind of PORT_KINDS) {
    if (kind === 'other' || kind === 'mains-input' || kind === 'solar-input') continue;
    const of = (ports: readonly ComparePort[]) => ports.filter((p) => p.kind === kind && isOut(p));
    if (!has((p) => p.kind === kind && isOut(p))) continue;
    rows.push(rowOf(`ports:out:${kind}:watts`, `${label(kind)} out, most W`, 'W', 'higher', itemsPorts.map((ports) => mostWatts(of(ports), 'claimed'))));
    if (has((p) => p.kind === kind && isOut(p) && p.basis === 'measured')) {
      rows.push(rowOf(`ports:out:${kind}:measured-watts`, `${label(kind)} out, measured W`, 'W', 'higher', itemsPorts.map((ports) => mostWatts(of(ports), 'measured'))));
    }
    if (kind === 'usb-c' && has((p) => p.kind === 'usb-c' && isOut(p) && !!p.pdProfiles?.length)) {
      rows.push(rowOf('ports:out:usb-c:pd', 'USB-C out, Power Delivery levels', '', null, itemsPorts.map((ports) => pdLevels(of(ports)))));
    }
  }
  if (has((p) => p.kind === 'solar-input')) {
    const solar = (ports: readonly ComparePort[]) => ports.filter((p) => p.kind === 'solar-input');
    rows.push(rowOf('ports:in:solar-input:window', 'Solar input window', '', null, itemsPorts.map((ports) => solarWindow(solar(ports)))));
    rows.push(rowOf('ports:in:solar-input:watts', 'Solar input, most W', 'W', 'higher', itemsPorts.map((ports) => mostWatts(solar(ports), 'claimed'))));
  }
  for (const kind of PORT_KINDS) {
    if (kind === 'other' || kind === 'solar-input') continue;
    if (!has((p) => p.kind === kind && isIn(p) && p.basis === 'claimed')) continue;
    const name = kind === 'mains-input' ? 'Mains charger input' : `${label(kind)} in`;
    rows.push(rowOf(`ports:in:${kind}:watts`, `${name}, W it takes`, 'W', null, itemsPorts.map((ports) => mostWatts(ports.filter((p) => p.kind === kind && isIn(p)), 'claimed'))));
  }
  return rows.length ? { id: 'ports', label: 'Ports', rows } : null;
}

/** A built side-by-side with the Ports group added after the spec groups (before ratios). */
export function withPorts(response: CompareResponse, itemsPorts: readonly (readonly ComparePort[])[]): CompareResponse {
  const group = portsGroup(itemsPorts);
  if (!group) return response;
  const groups = [...response.groups];
  const ratios = groups.findIndex((g) => g.id === 'ratios');
  groups.splice(ratios < 0 ? groups.length : ratios, 0, group);
  return { ...response, groups };
}
