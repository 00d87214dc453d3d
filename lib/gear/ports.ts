/**
 * Ports of gear items in words, and the USB Power Delivery profile text field. Pure: used by the form,
 * the schema, the item page and the spec history.
 */
import { formatFigure, portKindLabel, type PdProfile, type Port, type PortDirection, type PortKind } from '@/lib/measure';

/** The most ports one item lists. */
export const MAX_PORTS = 24;

export const PORT_DIRECTION_LABELS: Readonly<Record<PortDirection, string>> = {
  input: 'Input',
  output: 'Output',
  both: 'Input and output',
};

/** What each connector is, for someone new to 12 V systems (form hints and the item page). */
export const PORT_KIND_HINTS: Readonly<Record<PortKind, string>> = {
  'usb-a': 'The older rectangular USB plug; 5 V.',
  'usb-c': 'The small oval USB plug; may offer higher voltages by USB Power Delivery.',
  'socket-12v': 'The round 12 V accessory socket (car-lighter size).',
  'dc-barrel': 'A round plug with a centre pin; sizes and polarity vary.',
  'binding-posts': 'Screw terminals or banana-plug posts for bare wire or ring terminals.',
  'genderless-dc': 'A high-current DC connector where both halves are the same.',
  'mains-input': 'Charges from a wall outlet through its charger.',
  'solar-input': 'Takes a solar panel’s lead within a voltage window.',
  other: 'Name the connector in the label.',
};

/** "9 V 3 A" */
export function formatPdProfile(p: PdProfile): string {
  return `${formatFigure(p.volts)} V ${formatFigure(p.amps)} A`;
}

/** "5 V 3 A · 9 V 3 A · 15 V 3 A · 20 V 3.25 A" */
export function formatPdProfiles(profiles: readonly PdProfile[]): string {
  return profiles.map(formatPdProfile).join(' · ');
}

export class PdProfileTextError extends Error {}

const PROFILE = /^(\d+(?:\.\d+)?)\s*v\s*(?:at|@|\/|x|×|,)?\s*(\d+(?:\.\d+)?)\s*a$/i;

/**
 * Parses typed USB PD profiles: "5 V 3 A · 9 V 3 A", "9V 3A, 15V 3A", "20 V @ 3.25 A; 15 V / 3 A".
 * Profiles are separated by ·, comma, semicolon, "+" or a new line. Blank text gives an empty list.
 * Throws `PdProfileTextError` naming the piece that could not be read. Ranges are checked by the schema.
 */
export function parsePdProfiles(text: string): PdProfile[] {
  if (text.length > 400) throw new PdProfileTextError('Use at most 400 characters for the profiles.');
  const pieces = text
    .split(/[·•,;+\n]/)
    .map((s) => s.trim())
    .filter(Boolean);
  return pieces.map((piece) => {
    const m = PROFILE.exec(piece);
    if (!m) throw new PdProfileTextError(`Could not read "${piece}": write each profile as volts and amps, e.g. "9 V 3 A".`);
    return { volts: Number(m[1]), amps: Number(m[2]) };
  });
}

/** `parsePdProfiles` without throwing, for echoing as the user types. */
export function tryParsePdProfiles(text: string): { ok: true; profiles: PdProfile[] } | { ok: false; message: string } {
  try {
    return { ok: true, profiles: parsePdProfiles(text) };
  } catch (error) {
    if (error instanceof PdProfileTextError) return { ok: false, message: error.message };
    throw error;
  }
}

/** "5 V, 2.4 A, 12 W" — the figures a port states (empty when none). */
export function portFiguresText(port: Pick<Port, 'volts' | 'amps' | 'watts'>): string {
  const parts: string[] = [];
  if (port.volts !== undefined) parts.push(`${formatFigure(port.volts)} V`);
  if (port.amps !== undefined) parts.push(`${formatFigure(port.amps)} A`);
  if (port.watts !== undefined) parts.push(`${formatFigure(port.watts)} W`);
  return parts.join(', ');
}

/** One line for the spec history and "figures updated" notes: "USB-C output: 5 V 3 A · 9 V 3 A; 27 W". */
export function describePort(port: Port): string {
  const head = `${portKindLabel(port)} ${port.direction === 'both' ? 'input and output' : port.direction}`;
  const details: string[] = [];
  const figures = portFiguresText(port);
  if (figures) details.push(figures);
  if (port.pdProfiles?.length) details.push(`PD ${formatPdProfiles(port.pdProfiles)}`);
  if (port.voltageWindow) details.push(`accepts ${formatFigure(port.voltageWindow.minVolts)}–${formatFigure(port.voltageWindow.maxVolts)} V`);
  if (port.label && port.kind !== 'other') details.push(port.label);
  if (port.efficiency !== undefined) details.push(`${formatFigure(port.efficiency * 100)} % efficient`);
  return details.length ? `${head}: ${details.join('; ')}` : head;
}
