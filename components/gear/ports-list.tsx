import Link from 'next/link';
import type { MeasuredPort } from '@/db/measured-ports';
import { measuredFor } from '@/lib/field-tests/port-output';
import { CLAIM_SOURCE_LABELS } from '@/lib/gear/categories';
import { formatPdProfiles, PORT_DIRECTION_LABELS, PORT_KIND_HINTS } from '@/lib/gear/ports';
import type { PortClaim } from '@/lib/gear/schemas';
import { formatFigure, PD_STANDARD_CABLE_AMPS, portKindLabel, type PortKind } from '@/lib/measure';

const TWELVE_VOLT_KINDS: readonly PortKind[] = ['socket-12v', 'binding-posts', 'genderless-dc', 'dc-barrel', 'solar-input'];

/** Short reminders for the connectors this item has (the full cautions are in the Safety section). */
function connectorNotes(ports: readonly PortClaim[]): string[] {
  const kinds = new Set(ports.map((p) => p.kind));
  const notes: string[] = [];
  if (ports.some((p) => TWELVE_VOLT_KINDS.includes(p.kind))) {
    notes.push('12 V connectors: check polarity before you connect, and fuse the positive lead close to the battery, rated for the cable.');
  }
  if (kinds.has('dc-barrel')) notes.push('DC barrel plugs come in many sizes and both polarities: check the plug fits and the centre pin’s polarity matches.');
  if (ports.some((p) => p.pdProfiles?.some((x) => x.amps > PD_STANDARD_CABLE_AMPS))) {
    notes.push(`USB-C profiles above ${PD_STANDARD_CABLE_AMPS} A need a USB-C cable rated for 5 A; an ordinary cable carries 3 A at most.`);
  }
  if (kinds.has('usb-a') || kinds.has('usb-c')) {
    notes.push('USB ports give 5 V unless a device asks for more over USB Power Delivery; a device without it charges at 5 V only.');
  }
  if (kinds.has('solar-input')) notes.push('Keep a panel’s open-circuit voltage inside the solar input’s window, also on cold mornings.');
  return notes;
}

const capitalised = (text: string) => text.charAt(0).toUpperCase() + text.slice(1);

const figure = (value: number | undefined, unit: string) => (value === undefined ? '—' : `${formatFigure(value)} ${unit}`);

/** A measured output beside the claim: "Measured 26.8 W (9.00 V × 2.98 A)", linked to its field test. */
function MeasuredFigure({ m, index }: { m: MeasuredPort; index: number }) {
  const figures = m.volts !== null && m.amps !== null ? ` (${formatFigure(m.volts)} V × ${formatFigure(m.amps)} A)` : '';
  return (
    <li data-testid={`port-row-${index}-measured`}>
      <span className="font-semibold">Measured {m.watts !== null ? `${formatFigure(m.watts)} W` : ''}</span>
      <span className="figure font-mono">{figures}</span>{' '}
      {m.fieldTest ? (
        <Link href={`/field-tests/${encodeURIComponent(m.fieldTest.id)}`} className="underline">
          field test of {m.fieldTest.testedAt.toISOString().slice(0, 10)}
        </Link>
      ) : (
        <span className="text-slate">field test no longer listed</span>
      )}
    </li>
  );
}

/**
 * The item's ports as a table: number, direction, connector in words, V/A/W and the details a charging
 * path needs; a port measured by an approved port-output test shows the measured watts beside the claim.
 */
export function PortsList({ ports, measured = [] }: { ports: readonly PortClaim[]; measured?: readonly MeasuredPort[] }) {
  if (ports.length === 0) return null;
  const notes = connectorNotes(ports);
  return (
    <section aria-labelledby="ports-heading" className="space-y-3">
      <h2 id="ports-heading" className="text-xl font-bold">
        Ports
      </h2>
      <p className="text-sm text-slate">
        Inputs charge or power the item; outputs power other things. Figures are the most an output delivers, or what an input needs, as claimed by
        the maker; where we measured an output under load, the measured watts stand beside the claim with a link to the test.
      </p>
      <div className="overflow-x-auto rounded-lg border border-rule">
        <table className="w-full text-left text-sm" data-testid="ports-table">
          <caption className="sr-only">Ports: inputs and outputs with their volts, amps and watts</caption>
          <thead className="bg-card text-xs uppercase tracking-wide text-slate">
            <tr>
              <th scope="col" className="px-3 py-2">
                <abbr title="Port number" className="no-underline">#</abbr>
              </th>
              <th scope="col" className="px-3 py-2">Connector</th>
              <th scope="col" className="px-3 py-2">Direction</th>
              <th scope="col" className="px-3 py-2">Volts</th>
              <th scope="col" className="px-3 py-2">Amps</th>
              <th scope="col" className="px-3 py-2">Watts</th>
              <th scope="col" className="px-3 py-2">Details</th>
            </tr>
          </thead>
          <tbody>
            {ports.map((p, i) => {
              const m = measuredFor(p, i, measured);
              return (
                <tr key={i} className="border-t border-rule align-top" data-testid={`port-row-${i}`}>
                  <td className="px-3 py-2 figure font-mono text-slate">{i + 1}</td>
                  <th scope="row" className="px-3 py-2">
                    <span className="font-semibold">{capitalised(portKindLabel(p))}</span>
                    {p.label && p.kind !== 'other' ? <span className="block text-xs text-slate">{p.label}</span> : null}
                    <span className="block text-xs font-normal text-slate">{PORT_KIND_HINTS[p.kind]}</span>
                  </th>
                  <td className="px-3 py-2">{PORT_DIRECTION_LABELS[p.direction]}</td>
                  <td className="whitespace-nowrap px-3 py-2 figure font-mono">{figure(p.volts, 'V')}</td>
                  <td className="whitespace-nowrap px-3 py-2 figure font-mono">{figure(p.amps, 'A')}</td>
                  <td className="whitespace-nowrap px-3 py-2 figure font-mono">
                    {figure(p.watts, 'W')}
                    {m?.watts != null ? <span className="block text-xs font-semibold text-lichen-dark">{formatFigure(m.watts)} W measured</span> : null}
                  </td>
                  <td className="px-3 py-2">
                    <ul className="space-y-1">
                      {p.pdProfiles?.length ? (
                        <li data-testid={`port-row-${i}-pd`}>
                          <span className="text-slate">USB Power Delivery: </span>
                          <span className="figure font-mono">{formatPdProfiles(p.pdProfiles)}</span>
                        </li>
                      ) : null}
                      {p.voltageWindow ? (
                        <li>
                          <span className="text-slate">Accepts </span>
                          <span className="figure font-mono">
                            {formatFigure(p.voltageWindow.minVolts)}–{formatFigure(p.voltageWindow.maxVolts)} V
                          </span>
                        </li>
                      ) : null}
                      {p.efficiency !== undefined ? (
                        <li>
                          <span className="text-slate">Conversion efficiency </span>
                          <span className="figure font-mono">{formatFigure(p.efficiency * 100)} %</span>
                        </li>
                      ) : null}
                      <li className="text-xs text-slate">Claimed · {CLAIM_SOURCE_LABELS[p.source] ?? p.source}</li>
                      {m ? <MeasuredFigure m={m} index={i} /> : null}
                    </ul>
                  </td>
                </tr>
              );
            })}
          </tbody>
        </table>
      </div>
      {notes.length ? (
        <ul className="list-disc space-y-1 pl-5 text-sm" data-testid="ports-notes">
          {notes.map((n) => (
            <li key={n}>{n}</li>
          ))}
          <li>See the Safety section below, and follow the maker’s instructions and local wiring codes.</li>
        </ul>
      ) : null}
    </section>
  );
}
