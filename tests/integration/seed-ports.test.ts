/**
 * Demo ports (db/seed/ports.ts): every powered demo item has ports that pass lib/measure validatePort,
 * the seed is idempotent and fills ports into a database seeded before ports existed, and the base-camp
 * kit has one device with a charging path and one that lacks a cable (checked with lib/measure portFits).
 */
import { describe, expect, it } from 'vitest';
import { eq } from 'drizzle-orm';
import { createTestDb } from '@/db/test-db';
import { seedDemo } from '@/db/seed';
import { DEMO_GEAR, DEMO_KITS } from '@/db/seed/demo-data';
import { DEMO_PORTS, seedDemoPorts } from '@/db/seed/ports';
import { livePorts, portsOfGear } from '@/db/gear-ports';
import { updateGear } from '@/db/gear';
import { gearPorts } from '@/db/schema';
import { portFits, validatePort, type Port } from '@/lib/measure';

const idOf = (slug: string) => DEMO_GEAR.find((g) => g.slug === slug)!.id;

describe('demo ports', () => {
  it('gives every demo item ports (the AA lights their cell holder), each a valid lib/measure Port', async () => {
    const { db } = createTestDb();
    const first = await seedDemo(db);
    expect(first.inserted.gearPorts).toBe(Object.values(DEMO_PORTS).reduce((n, list) => n + list.length, 0));
    for (const item of DEMO_GEAR) {
      const ports = livePorts(db, item.id);
      expect(ports.length, `${item.slug} has ports`).toBeGreaterThan(0);
      for (const p of ports) expect(() => validatePort(p, item.slug)).not.toThrow();
    }
    // Only public items come back from portsOfGear.
    const ids = DEMO_GEAR.map((g) => g.id);
    const approved = portsOfGear(db, ids);
    for (const item of DEMO_GEAR) {
      expect(approved[item.id]!.length > 0, item.slug).toBe(item.approvedAt !== null);
    }

    const again = await seedDemo(db);
    expect(again.inserted.gearPorts).toBe(0);
  }, 60_000);

  it('fills ports into an older demo database but does not bring back ports an author removed', async () => {
    const { db } = createTestDb();
    await seedDemo(db);
    db.delete(gearPorts).run(); // as before ports existed
    const lantern = idOf('glowmere-hearthglow-400');
    const author = { id: 'demo-user-reviewer', role: 'reviewer' as const };
    expect(seedDemoPorts(db)).toBeGreaterThan(0);
    expect(livePorts(db, lantern)).toHaveLength(2);
    // The author removes the lantern's ports (a pending change, logged in the history); once its rows are gone the seed leaves it alone.
    updateGear(db, author, 'glowmere-hearthglow-400', { ports: [] });
    db.delete(gearPorts).where(eq(gearPorts.gearItemId, lantern)).run();
    expect(seedDemoPorts(db)).toBe(0);
    expect(livePorts(db, lantern)).toEqual([]);
  }, 60_000);

  it('base camp: the lantern has a charging path, the radio lacks a cable (lib/measure portFits)', async () => {
    const { db } = createTestDb();
    await seedDemo(db);
    const kit = DEMO_KITS.find((k) => k.id === 'demo-kit-base-camp')!;
    const slugs = kit.entries.map((e) => e.item).filter((s): s is string => s !== null);
    const ports = portsOfGear(db, slugs.map(idOf));
    const of = (slug: string) => ports[idOf(slug)]!;
    const outputs = (slug: string) => of(slug).filter((p) => p.direction !== 'input');
    const inputs = (slug: string) => of(slug).filter((p) => p.direction !== 'output');
    const anyFit = (outs: Port[], ins: Port[]) => outs.some((o) => ins.some((i) => portFits(o, i).fits));

    // Battery 12 V socket (12.8 V) → adapter's socket input (11–16 V window) → adapter USB-C (PD 5 V 3 A) → lantern USB-C (5 V 2 A).
    expect(anyFit(outputs('dunlow-campcore-20-lifepo4'), inputs('dunlow-socket-to-usbc-60'))).toBe(true);
    expect(anyFit(outputs('dunlow-socket-to-usbc-60'), inputs('glowmere-hearthglow-400'))).toBe(true);
    // Panel genderless DC (18 V) → extension lead → battery's solar input (12–28 V window).
    expect(inputs('dunlow-campcore-20-lifepo4').some((i) => i.kind === 'solar-input')).toBe(true);

    // The radio's genderless DC input joins nothing the kit's battery, adapter or lanterns offer: every join fails on the
    // connector. (The panel's genderless DC output, direct or through the lead, gives 18 V: above the radio's 15.2 V.)
    const radioIn = inputs('northcairn-valecaster-m25');
    expect(radioIn.map((p) => p.kind)).toEqual(['genderless-dc']);
    for (const slug of slugs.filter((s) => s !== 'brackenfold-heathray-60' && s !== 'brackenfold-panel-extension-lead')) {
      for (const o of outputs(slug)) for (const i of radioIn) expect(portFits(o, i).problem, `${slug} → radio`).toBe('connector');
    }
  }, 60_000);
});
