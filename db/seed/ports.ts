/*
 * Claimed ports of the demo gear (db/seed/demo-data.ts DEMO_GEAR). Invented, plausible figures: USB PD
 * profiles are the usual fixed voltages (5, 9, 12, 15, 20 V) at currents within 3 A, or 3.25 A for a
 * 65 W port (which needs a 5 A cable); 12 V LiFePO4 batteries at 12.8 V nominal.
 *
 * The two lights that run on replaceable AA cells list their cell holder as an `other` input (1.5 V per
 * alkaline AA cell, IEC 60086-2 LR6 nominal voltage, from memory): nothing in a kit joins it, so the planner says
 * plainly that no source can charge them, which is true in camp (they need spare cells).
 *
 * In the base-camp kit the lanterns have a charging path (battery 12 V socket → 12 V-to-USB-C adapter
 * → lantern), while the mobile radio's genderless DC input has none: the kit holds no lead from the
 * battery's binding posts or 12 V socket to a genderless DC connector.
 *
 * Idempotent: ports are added only to demo items that exist, have no ports and never had a port change
 * (so ports an author removed are not brought back); databases seeded before ports existed get them.
 */
import { and, eq, like } from 'drizzle-orm';
import type { Db } from '../connection';
import { gearItems, gearPorts, specChanges } from '../schema';
import type { PortClaim } from '@/lib/gear/schemas';
import { claimedPortRow } from '../gear-ports';
import { DEMO_GEAR } from './demo-data';

type DemoPort = Omit<PortClaim, 'source'> & { source?: PortClaim['source'] };

const pd = (...pairs: [number, number][]) => pairs.map(([volts, amps]) => ({ volts, amps }));
const PD_20W = pd([5, 3], [9, 2.22]);
const PD_45W = pd([5, 3], [9, 3], [15, 3], [20, 2.25]);
const PD_60W = pd([5, 3], [9, 3], [12, 3], [15, 3], [20, 3]);
const PD_65W = pd([5, 3], [9, 3], [15, 3], [20, 3.25]);

const usbCIn = (amps: number, watts: number): DemoPort => ({ kind: 'usb-c', direction: 'input', volts: 5, amps, watts });
const usbAOut = (amps: number, efficiency = 0.88): DemoPort => ({ kind: 'usb-a', direction: 'output', volts: 5, amps, watts: Number((5 * amps).toFixed(2)), efficiency });

export const DEMO_PORTS: Readonly<Record<string, readonly DemoPort[]>> = {
  // Lights
  'dunlow-bothy-aa-lantern': [{ kind: 'other', direction: 'input', volts: 6, label: 'AA cell holder (4 × AA)' }],
  'dunlow-trailwarden-torch': [{ kind: 'other', direction: 'input', volts: 3, label: 'AA cell holder (2 × AA)' }],
  'glowmere-hearthglow-400': [usbCIn(2, 10), { ...usbAOut(1, 0.85), label: 'phone top-up' }],
  // Also serves as a power bank (db/seed/features.ts): a USB-A output for a phone top-up.
  'northcairn-tarn-collapsible-lantern': [usbCIn(2, 10), { ...usbAOut(1, 0.85), label: 'phone top-up' }],
  'northcairn-fellbeam-350': [usbCIn(1, 5)],
  'glowmere-fernlight-180': [usbCIn(1, 5)],
  'glowmere-scree-600': [usbCIn(2, 10), { ...usbAOut(1, 0.85), label: 'on the battery box' }],
  'northcairn-cairnlight-900': [usbCIn(2, 10), usbAOut(1.5, 0.85)],
  // Power banks
  'voltmoth-cellhive-20': [
    { kind: 'usb-c', direction: 'output', watts: 45, pdProfiles: PD_45W, efficiency: 0.88, label: 'also the charging input' },
    { kind: 'usb-c', direction: 'input', watts: 45, pdProfiles: PD_45W, label: 'same port as the USB-C output' },
    usbAOut(2.4),
    usbAOut(2.4),
  ],
  'northcairn-pocketcell-10': [
    { kind: 'usb-c', direction: 'output', watts: 20, pdProfiles: PD_20W, efficiency: 0.88 },
    { kind: 'usb-c', direction: 'input', watts: 18, pdProfiles: pd([5, 3], [9, 2]) },
    usbAOut(2.4),
  ],
  'voltmoth-cellhive-27-pd': [
    { kind: 'usb-c', direction: 'output', watts: 65, pdProfiles: PD_65W, efficiency: 0.9, label: 'USB-C 1' },
    { kind: 'usb-c', direction: 'output', watts: 20, pdProfiles: PD_20W, efficiency: 0.9, label: 'USB-C 2' },
    { kind: 'usb-c', direction: 'input', watts: 60, pdProfiles: pd([5, 3], [9, 3], [15, 3], [20, 3]), label: 'USB-C 1' },
  ],
  'glowmere-lumenbank-5': [
    { kind: 'usb-c', direction: 'output', volts: 5, amps: 2.4, watts: 12, efficiency: 0.85 },
    usbCIn(2, 10),
  ],
  // 12 V batteries
  'dunlow-campcore-20-lifepo4': [
    { kind: 'binding-posts', direction: 'both', volts: 12.8, amps: 20, watts: 256, label: 'M6 terminals' },
    { kind: 'socket-12v', direction: 'output', volts: 12.8, amps: 10, watts: 128 },
    { kind: 'solar-input', direction: 'input', amps: 10, watts: 120, voltageWindow: { minVolts: 12, maxVolts: 28 }, efficiency: 0.95, label: 'built-in charge controller' },
  ],
  'voltmoth-deepwell-50': [
    { kind: 'binding-posts', direction: 'both', volts: 12.8, amps: 50, watts: 640, label: 'M8 terminals' },
    { kind: 'genderless-dc', direction: 'output', volts: 12.8, amps: 30, watts: 384 },
    { kind: 'socket-12v', direction: 'output', volts: 12.8, amps: 10, watts: 128 },
    { kind: 'usb-c', direction: 'output', watts: 60, pdProfiles: PD_60W, efficiency: 0.9 },
    usbAOut(2.4, 0.9),
  ],
  'dunlow-stoneway-35-agm': [{ kind: 'binding-posts', direction: 'both', volts: 12, amps: 35, watts: 420, label: 'M6 terminals' }],
  // Solar panels (the DC output's volts are the maximum-power voltage at standard test conditions)
  'brackenfold-heathray-60': [
    { kind: 'genderless-dc', direction: 'output', volts: 18, amps: 3.33, watts: 60 },
    { kind: 'usb-a', direction: 'output', volts: 5, amps: 2.4, watts: 12, efficiency: 0.85 },
    { kind: 'usb-c', direction: 'output', watts: 18, pdProfiles: pd([5, 3], [9, 2]), efficiency: 0.85 },
  ],
  'brackenfold-heathray-28': [usbAOut(2.4, 0.85), usbAOut(2.4, 0.85), { kind: 'usb-c', direction: 'output', volts: 5, amps: 3, watts: 15, efficiency: 0.85 }],
  'brackenfold-heathray-120': [{ kind: 'genderless-dc', direction: 'output', volts: 19.5, amps: 6.15, watts: 120 }],
  // Radios (supply windows as the manuals would state them)
  'dunlow-ridgecall-h5': [{ kind: 'dc-barrel', direction: 'input', volts: 12, amps: 1, voltageWindow: { minVolts: 10, maxVolts: 16 }, label: 'charging cradle, 5.5 × 2.1 mm' }],
  'northcairn-valecaster-m25': [{ kind: 'genderless-dc', direction: 'input', volts: 13.8, amps: 6, voltageWindow: { minVolts: 11.7, maxVolts: 15.2 }, label: 'fused power lead' }],
  'voltmoth-stormlark-r1': [usbCIn(1, 5), { ...usbAOut(0.5, 0.8), label: 'phone top-up' }],
  // Cables and adapters: the end that plugs into a source is an input, the end that feeds a device an output.
  'voltmoth-pd-trigger-12v-cable': [
    { kind: 'usb-c', direction: 'input', pdProfiles: pd([12, 3]), label: 'asks the source for 12 V' },
    { kind: 'dc-barrel', direction: 'output', volts: 12, amps: 3, watts: 36, label: '5.5 × 2.1 mm plug' },
  ],
  'dunlow-socket-to-usbc-60': [
    { kind: 'socket-12v', direction: 'input', amps: 6, voltageWindow: { minVolts: 11, maxVolts: 16 } },
    { kind: 'usb-c', direction: 'output', watts: 60, pdProfiles: PD_60W, efficiency: 0.9 },
    usbAOut(2.4, 0.9),
  ],
  'brackenfold-panel-extension-lead': [
    { kind: 'genderless-dc', direction: 'input', amps: 30, label: 'panel end' },
    { kind: 'genderless-dc', direction: 'output', amps: 30, label: 'battery end' },
  ],
  // Other powered gear
  'dunlow-coolcrate-25': [{ kind: 'socket-12v', direction: 'input', volts: 12, amps: 4, watts: 45, voltageWindow: { minVolts: 10.4, maxVolts: 15 } }],
  'glowmere-eddy-tent-fan': [usbCIn(2, 10)],
};

type Q = Pick<Db, 'select' | 'insert'>;

/** Adds the demo ports to each demo item that exists, has none and never had a port change. Returns rows inserted. */
export function seedDemoPorts(tx: Q, now = new Date()): number {
  let inserted = 0;
  for (const item of DEMO_GEAR) {
    const ports = DEMO_PORTS[item.slug];
    if (!ports?.length) continue;
    const exists = tx.select({ id: gearItems.id }).from(gearItems).where(eq(gearItems.id, item.id)).get();
    if (!exists) continue;
    const hasPorts = tx.select({ id: gearPorts.id }).from(gearPorts).where(eq(gearPorts.gearItemId, item.id)).get();
    const touched = tx
      .select({ id: specChanges.id })
      .from(specChanges)
      .where(and(eq(specChanges.gearItemId, item.id), like(specChanges.key, 'Port %')))
      .get();
    if (hasPorts || touched) continue;
    inserted += tx
      .insert(gearPorts)
      .values(
        ports.map((p, position) => claimedPortRow(item.id, p, position, { id: `${item.id}-port-${position + 1}`, source: p.source ?? item.claimSource, at: now })),
      )
      .onConflictDoNothing()
      .run().changes;
  }
  return inserted;
}
