/**
 * Bench: GET /api/v1/gear (listGear) with multi-role items and feature filters over N generated
 * approved items (default 5 000; every 5th light also serves as a power bank; each item has four
 * checklist answers). Run: npx tsx --conditions=react-server scripts/bench-browse-features.ts
 * Prints ms per first page (mean of 20) — figures to read, not to assert.
 */
import { randomUUID } from 'node:crypto';
import { createTestDb } from '@/db/test-db';
import { gearFeatures, gearItems, specs, users } from '@/db/schema';
import { backfillGearRatios } from '@/db/gear';
import { listGear } from '@/db/browse';
import { parseGearListQuery } from '@/lib/browse/query';
import { CATEGORY_FEATURES } from '@/lib/gear/features';

const N = Number(process.env.N ?? 5000);
const { db } = createTestDb();
const owner = randomUUID();
db.insert(users).values({ id: owner, email: 'b@example.org', name: 'b', role: 'reviewer' }).run();
const cats = ['light', 'power-bank', 'solar-panel'] as const;
db.transaction((tx) => {
  for (let i = 0; i < N; i++) {
    const id = randomUUID();
    const category = cats[i % 3]!;
    const alsoServesAs = category === 'light' && i % 5 === 0 ? ['power-bank'] : [];
    tx.insert(gearItems)
      .values({ id, slug: `item-${String(i).padStart(6, '0')}`, ownerId: owner, name: `Item ${i}`, maker: 'Glowmere', category, alsoServesAs, status: 'approved', approvedAt: new Date(), waterRating: i % 4 === 0 ? 'IPX4' : null })
      .run();
    tx.insert(specs).values({ id: randomUUID(), gearItemId: id, key: 'mass', basis: 'claimed', value: 100 + ((i * 37) % 900) }).run();
    const list = CATEGORY_FEATURES[category].filter((n) => n !== 'ip-rating');
    for (let k = 0; k < 4; k++) tx.insert(gearFeatures).values({ gearItemId: id, name: list[(i + k) % list.length]!, present: (i + k) % 2 === 0 }).onConflictDoNothing().run();
  }
});
backfillGearRatios(db);
const queries = ['', '?category=light', '?category=power-bank', '?category=power-bank&sort=mass', '?category=light&feature.red-mode=true', '?feature.red-mode=true&feature.magnet=true', '?category=light&feature.ip-rating=true&sort=mass', '?sort=mass&limit=100'];
for (const q of queries) {
  const query = parseGearListQuery(new URLSearchParams(q));
  listGear(db, query, null);
  const runs = 20;
  const t0 = performance.now();
  let total = 0;
  for (let r = 0; r < runs; r++) total = listGear(db, query, null).total;
  const ms = (performance.now() - t0) / runs;
  console.log(`${N} items  ${(q || '(none)').padEnd(50)} total ${String(total).padStart(5)}  first page ${ms.toFixed(1)} ms`);
}
