/**
 * Demo checklists and multi-role lanterns (db/seed/features.ts): every demo item has answers that the
 * shared schema accepts for its roles; two lanterns serve as power banks with a rated energy and a USB
 * output port and appear when browsing banks; the seed is idempotent and never brings back answers an
 * author removed.
 */
import { describe, expect, it } from 'vitest';
import { createTestDb } from '@/db/test-db';
import { seedDemo } from '@/db/seed';
import { DEMO_GEAR } from '@/db/seed/demo-data';
import { DEMO_ALSO_SERVES, DEMO_FEATURES, demoFeatureClaims, seedDemoFeatures } from '@/db/seed/features';
import { livePorts } from '@/db/gear-ports';
import { liveFeatures, rolesOfItem } from '@/db/gear-roles';
import { getGearForEdit, updateGear } from '@/db/gear';
import { listGear } from '@/db/browse';
import { parseGearListQuery } from '@/lib/browse/query';
import { gearFeatures, gearItems, specs } from '@/db/schema';
import { checkFeatures } from '@/lib/gear/features';
import { gearInputSchema } from '@/lib/gear/schemas';
import { and, eq } from 'drizzle-orm';

const LANTERNS = ['glowmere-hearthglow-400', 'northcairn-tarn-collapsible-lantern'];

describe('demo feature checklists', () => {
  it('covers every demo item with answers valid for its roles; the seed runs once', async () => {
    const { db } = createTestDb();
    await seedDemo(db);
    for (const item of DEMO_GEAR) {
      expect(DEMO_FEATURES[item.slug], `${item.slug} has demo answers`).toBeDefined();
      const row = db.select().from(gearItems).where(eq(gearItems.id, item.id)).get()!;
      const issues: string[] = [];
      checkFeatures(rolesOfItem(row), demoFeatureClaims(item.slug), { addIssue: (i) => issues.push(`${i.path.join('.')}: ${i.message}`) });
      expect(issues, item.slug).toEqual([]);
      expect(liveFeatures(db, item.id)).toEqual([...demoFeatureClaims(item.slug)].sort((a, b) => a.name.localeCompare(b.name)));
    }
    const rows = db.select().from(gearFeatures).all().length;
    await seedDemo(db);
    expect(db.select().from(gearFeatures).all()).toHaveLength(rows);
  }, 60_000);

  it('has two lanterns serving as power banks, each with a rated energy, a chemistry and a USB output, listed under banks', async () => {
    const { db } = createTestDb();
    await seedDemo(db);
    expect(Object.keys(DEMO_ALSO_SERVES).sort()).toEqual([...LANTERNS].sort());
    for (const slug of LANTERNS) {
      const item = db.select().from(gearItems).where(eq(gearItems.slug, slug)).get()!;
      expect(item.kind).toBe('lantern');
      expect(rolesOfItem(item)).toEqual(['light', 'power-bank']);
      expect(item.chemistry).toBe('li-ion');
      const rated = db.select().from(specs).where(and(eq(specs.gearItemId, item.id), eq(specs.key, 'ratedEnergy'), eq(specs.basis, 'claimed'))).get();
      expect(rated?.value, slug).toBeGreaterThan(0);
      expect(livePorts(db, item.id).some((p) => p.direction !== 'input' && (p.kind === 'usb-a' || p.kind === 'usb-c')), slug).toBe(true);
      // The working copy passes the shared schema, so the author can edit the item as it stands.
      const edit = getGearForEdit(db, slug, { id: item.ownerId, role: 'reviewer' });
      expect(gearInputSchema.safeParse({ ...edit.input, category: edit.category }).success, slug).toBe(true);
    }
    const banks = listGear(db, parseGearListQuery(new URLSearchParams('category=power-bank&limit=100')), null);
    for (const slug of LANTERNS) expect(banks.items.map((i) => i.slug)).toContain(slug);
    const red = listGear(db, parseGearListQuery(new URLSearchParams('category=light&feature.red-mode=true&limit=100')), null);
    // Approved lights stated to have a red mode (db/seed/features.ts): Tarn, Bothy, Fellbeam, Scree.
    expect(red.items.map((i) => i.slug).sort()).toEqual(['dunlow-bothy-aa-lantern', 'glowmere-scree-600', 'northcairn-fellbeam-350', 'northcairn-tarn-collapsible-lantern']);
  }, 60_000);

  it('fills answers into an older demo database but not where an author changed them', async () => {
    const { db } = createTestDb();
    await seedDemo(db);
    db.delete(gearFeatures).run(); // as before checklists existed
    const fern = DEMO_GEAR.find((g) => g.slug === 'glowmere-fernlight-180')!;
    updateGear(db, { id: 'demo-user-reviewer', role: 'reviewer' }, fern.slug, { features: { 'red-mode': true } });
    db.delete(gearFeatures).run(); // the author's change is pending; the live rows are gone as in an old database
    expect(seedDemoFeatures(db)).toBeGreaterThan(0);
    expect(liveFeatures(db, fern.id)).toEqual([]);
    expect(liveFeatures(db, DEMO_GEAR.find((g) => g.slug === 'glowmere-scree-600')!.id).length).toBeGreaterThan(0);
  }, 60_000);
});
