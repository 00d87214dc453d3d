/**
 * Measured port figures (issue 9): a port-output field test (lib/field-tests/port-output.ts) loads one
 * output port of an item and reads its volts and amps. On approval its mean figures become a
 * `gear_ports` row with basis 'measured' at the same position as the claimed port it measured, linked
 * to the test (`field_test_id`); the claimed row is never touched. The latest test by test date wins,
 * as for measured specs (db/field-tests.ts).
 *
 * The only module that writes measured port rows; db/gear-ports.ts keeps the claimed ones.
 */
import { randomUUID } from 'node:crypto';
import { and, asc, eq } from 'drizzle-orm';
import type { Q, Tx } from './field-tests-access';
import { livePortsOf } from './gear-ports';
import { fieldTests, gearFigureNotes, gearItems, gearPorts, type FieldTest, type GearItem, type Trial } from './schema';
import { AppError } from '@/lib/http/errors';
import type { FieldTestAnalysis } from '@/lib/field-tests/analysis';
import { measuredPortFigures, portOutputMismatch, portOutputReading, publicPorts, type PublicPort } from '@/lib/field-tests/port-output';
import { formatFigure, MeasureError, portKindLabel, PORT_KINDS, type PortDirection, type PortKind } from '@/lib/measure';

export const PORT_OUTPUT_KIND = 'port-output';

const itemName = (item: Pick<GearItem, 'maker' | 'name'>) => `${item.maker} ${item.name}`;

/**
 * A port-output trial must name one of the item's output ports (its number in the item's Ports table)
 * and carry readings in range: else a 422 naming the typed values, before anything is written.
 */
export function assertPortOutputTrial(db: Q, item: GearItem, typed: Readonly<Record<string, number>>): void {
  let portNumber: number;
  try {
    portNumber = portOutputReading(typed).portNumber;
  } catch (e) {
    if (e instanceof MeasureError) throw new AppError('invalid', e.message, { fields: { typedValues: [e.message] } });
    throw e;
  }
  const problem = portOutputMismatch(itemName(item), livePortsOf(db, item.id), portNumber);
  if (problem) throw new AppError('invalid', problem, { fields: { typedValues: [problem] } });
}

/** Why a port-output test cannot go to review or be approved (a port removed or changed since the trial), or null. */
export function portOutputReadinessProblem(db: Q, items: readonly GearItem[], list: readonly Trial[]): string | null {
  for (const t of list) {
    const item = items.find((i) => i.id === t.gearItemId);
    if (!item || !t.typedValues) continue;
    let portNumber: number;
    try {
      portNumber = portOutputReading(t.typedValues).portNumber;
    } catch {
      continue; // the analysis reports a bad reading itself
    }
    const problem = portOutputMismatch(itemName(item), livePortsOf(db, item.id), portNumber);
    if (problem) return `${t.label || 'A trial'}: ${problem}`;
  }
  return null;
}

/**
 * Writes the measured port rows of an approved port-output test: per item and port, the mean volts,
 * amps and watts over its trials, beside the claimed port (same position, kind, direction and label).
 * A row from a test carried out later is kept. Returns the rows written.
 */
export function applyMeasuredPorts(tx: Tx, test: FieldTest, analysis: FieldTestAnalysis, at: Date, approvedById: string | null = null): number {
  let written = 0;
  for (const { itemId, summaries } of analysis.items) {
    const claimed = livePortsOf(tx, itemId);
    const item = tx.select({ approvedAt: gearItems.approvedAt }).from(gearItems).where(eq(gearItems.id, itemId)).get();
    const changes: string[] = [];
    for (const m of measuredPortFigures(summaries)) {
      const position = m.portNumber - 1;
      const port = claimed[position];
      if (!port || port.direction === 'input') continue; // refused earlier by portOutputReadinessProblem
      const current = tx
        .select({ fieldTestId: gearPorts.fieldTestId, watts: gearPorts.watts, testedAt: fieldTests.testedAt, approvedAt: fieldTests.approvedAt })
        .from(gearPorts)
        .leftJoin(fieldTests, eq(fieldTests.id, gearPorts.fieldTestId))
        .where(and(eq(gearPorts.gearItemId, itemId), eq(gearPorts.basis, 'measured'), eq(gearPorts.position, position)))
        .get();
      if (current?.testedAt && current.approvedAt && current.fieldTestId !== test.id && current.testedAt.getTime() > test.testedAt.getTime()) continue;
      const figures = {
        kind: port.kind,
        direction: port.direction,
        label: port.label ?? null,
        volts: m.volts,
        amps: m.amps,
        watts: m.watts,
        pdProfiles: null,
        minVolts: null,
        maxVolts: null,
        efficiency: null,
        claimSource: null,
        fieldTestId: test.id,
        updatedAt: at,
      };
      tx.insert(gearPorts)
        .values({ id: randomUUID(), gearItemId: itemId, position, basis: 'measured', ...figures })
        .onConflictDoUpdate({ target: [gearPorts.gearItemId, gearPorts.basis, gearPorts.position], set: figures })
        .run();
      written += 1;
      // A public item whose measured figure changes gets a dated "figures updated" note, as for measured specs.
      if (item?.approvedAt && current?.watts != null && formatFigure(current.watts) !== formatFigure(m.watts)) {
        changes.push(`${portKindLabel(port)} ${port.direction === 'both' ? 'port' : 'output'} (port ${m.portNumber}), measured: ${formatFigure(current.watts)} W → ${formatFigure(m.watts)} W`);
      }
    }
    if (changes.length) {
      tx.insert(gearFigureNotes)
        .values({ gearItemId: itemId, note: `From the field test of ${test.testedAt.toISOString().slice(0, 10)}.`, summary: changes.join('; '), approvedById, createdAt: at })
        .run();
    }
  }
  return written;
}

/** A measured port figure with where it came from. */
export interface MeasuredPort {
  /** 0-based position of the claimed port it measured (the item page numbers ports from 1). */
  position: number;
  kind: PortKind;
  direction: PortDirection;
  label: string | null;
  volts: number | null;
  amps: number | null;
  watts: number | null;
  /** The approved port-output test; null when the test was deleted since. */
  fieldTest: { id: string; testedAt: Date } | null;
}

/** The measured port rows of an item, in port order. */
export function measuredPortsOf(db: Q, itemId: string): MeasuredPort[] {
  return db
    .select({ port: gearPorts, testedAt: fieldTests.testedAt })
    .from(gearPorts)
    .leftJoin(fieldTests, eq(fieldTests.id, gearPorts.fieldTestId))
    .where(and(eq(gearPorts.gearItemId, itemId), eq(gearPorts.basis, 'measured')))
    .orderBy(asc(gearPorts.position))
    .all()
    .filter(({ port }) => (PORT_KINDS as readonly string[]).includes(port.kind))
    .map(({ port, testedAt }) => ({
      position: port.position,
      kind: port.kind as PortKind,
      direction: port.direction,
      label: port.label,
      volts: port.volts,
      amps: port.amps,
      watts: port.watts,
      fieldTest: port.fieldTestId && testedAt ? { id: port.fieldTestId, testedAt } : null,
    }));
}

/** The item's claimed ports (approved ones for a public item), each followed by its measured figure: for the public API. */
export function publicPortsOf(db: Q, itemId: string): PublicPort[] {
  return publicPorts(livePortsOf(db, itemId), measuredPortsOf(db, itemId));
}
