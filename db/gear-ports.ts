/**
 * Ports of gear items: the only module that queries gear_ports. Claimed ports follow the item's workflow
 * (db/gear.ts): before the first approval they are written live; after it the rows here are the approved
 * (public) ports and an edit waits in the pending change until approved.
 */
import { randomUUID } from 'node:crypto';
import { and, asc, eq, inArray, isNotNull } from 'drizzle-orm';
import type { Db } from './connection';
import { gearItems, gearPorts } from './schema';
import { PORT_KINDS, type Port, type PortKind } from '@/lib/measure';
import { CLAIM_SOURCES, type ClaimSource } from '@/lib/gear/categories';
import type { PortClaim } from '@/lib/gear/schemas';

type Tx = Parameters<Parameters<Db['transaction']>[0]>[0];
type Q = Db | Tx;

type PortRow = typeof gearPorts.$inferSelect;

function isPortKind(kind: string): kind is PortKind {
  return (PORT_KINDS as readonly string[]).includes(kind);
}

/** A stored row as a lib/measure `Port` (only the fields it states). */
function rowToPort(r: PortRow): Port {
  const port: Port = { kind: r.kind as PortKind, direction: r.direction };
  if (r.volts !== null) port.volts = r.volts;
  if (r.amps !== null) port.amps = r.amps;
  if (r.watts !== null) port.watts = r.watts;
  if (r.pdProfiles && r.pdProfiles.length) port.pdProfiles = r.pdProfiles.map((p) => ({ volts: p.volts, amps: p.amps }));
  if (r.minVolts !== null && r.maxVolts !== null) port.voltageWindow = { minVolts: r.minVolts, maxVolts: r.maxVolts };
  if (r.label !== null) port.label = r.label;
  if (r.efficiency !== null) port.efficiency = r.efficiency;
  return port;
}

function claimSourceOf(r: PortRow): ClaimSource {
  return (CLAIM_SOURCES as readonly string[]).includes(r.claimSource ?? '') ? (r.claimSource as ClaimSource) : 'packaging';
}

function claimedRows(db: Q, itemId: string): PortRow[] {
  return db
    .select()
    .from(gearPorts)
    .where(and(eq(gearPorts.gearItemId, itemId), eq(gearPorts.basis, 'claimed')))
    .orderBy(asc(gearPorts.position))
    .all()
    .filter((r) => isPortKind(r.kind));
}

/** The claimed ports stored for an item with their sources (live rows: the approved ones once the item is public), in order. */
export function livePorts(db: Q, itemId: string): PortClaim[] {
  return claimedRows(db, itemId).map((r) => ({ ...rowToPort(r), source: claimSourceOf(r) }));
}

/** The live claimed ports of one item as lib/measure `Port`s (no claim source): the approved ones of a public item. */
export function livePortsOf(db: Q, itemId: string): Port[] {
  return claimedRows(db, itemId).map(rowToPort);
}

/** One `gear_ports` row of a claimed port (shared by edits and the demo seed). */
export function claimedPortRow(
  itemId: string,
  p: Omit<PortClaim, 'source'>,
  position: number,
  row: { id: string; source: ClaimSource; at: Date },
): typeof gearPorts.$inferInsert {
  return {
    id: row.id,
    gearItemId: itemId,
    position,
    basis: 'claimed',
    kind: p.kind,
    direction: p.direction,
    volts: p.volts ?? null,
    amps: p.amps ?? null,
    watts: p.watts ?? null,
    pdProfiles: p.pdProfiles ?? null,
    minVolts: p.voltageWindow?.minVolts ?? null,
    maxVolts: p.voltageWindow?.maxVolts ?? null,
    label: p.label ?? null,
    efficiency: p.efficiency ?? null,
    claimSource: row.source,
    updatedAt: row.at,
  };
}

/** Replaces an item's claimed ports (inside the caller's transaction). */
export function writeLivePorts(tx: Tx, itemId: string, ports: readonly PortClaim[], at: Date): void {
  tx.delete(gearPorts).where(and(eq(gearPorts.gearItemId, itemId), eq(gearPorts.basis, 'claimed'))).run();
  if (ports.length === 0) return;
  tx.insert(gearPorts)
    .values(ports.map((p, position) => claimedPortRow(itemId, p, position, { id: randomUUID(), source: p.source, at })))
    .run();
}

/**
 * The approved (public) ports of each item, keyed by gear item id, in the order their author listed
 * them. Items that are not public, unknown ids and items without ports get an empty list.
 */
export function portsOfGear(db: Db, gearItemIds: readonly string[]): Record<string, Port[]> {
  const out: Record<string, Port[]> = {};
  const ids = [...new Set(gearItemIds.filter((id) => typeof id === 'string'))];
  for (const id of ids) out[id] = [];
  if (ids.length === 0) return out;
  // SQLite limits bound parameters; batches of 500 stay far below it.
  for (let i = 0; i < ids.length; i += 500) {
    const batch = ids.slice(i, i + 500);
    const rows = db
      .select({ port: gearPorts })
      .from(gearPorts)
      .innerJoin(gearItems, eq(gearItems.id, gearPorts.gearItemId))
      .where(and(inArray(gearPorts.gearItemId, batch), eq(gearPorts.basis, 'claimed'), isNotNull(gearItems.approvedAt)))
      .orderBy(asc(gearPorts.gearItemId), asc(gearPorts.position))
      .all();
    for (const { port } of rows) if (isPortKind(port.kind)) out[port.gearItemId]!.push(rowToPort(port));
  }
  return out;
}
