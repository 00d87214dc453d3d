/**
 * Bench: one page of GET /api/v1/gear (listGear) over N generated approved items (default 5 000).
 * Run: npx tsx --conditions=react-server scripts/bench-browse.ts   (N=20000 for more). Prints ms per query.
 */
import { randomUUID } from 'node:crypto';
import { createTestDb } from '@/db/test-db';
import { gearItems, specs, users } from '@/db/schema';
import { backfillGearRatios } from '@/db/gear';
import { listGear } from '@/db/browse';
import { parseGearListQuery } from '@/lib/browse/query';

const N = Number(process.env.N ?? 5000);
const { db } = createTestDb();
const owner = randomUUID();
db.insert(users).values({ id: owner, email: 'b@example.org', name: 'b', role: 'reviewer' }).run();
const cats = ['light', 'power-bank', 'solar-panel'] as const;
db.transaction((tx) => {
  for (let i = 0; i < N; i++) {
    const id = randomUUID();
    const category = cats[i % 3]!;
    tx.insert(gearItems).values({ id, slug: `item-${String(i).padStart(6, '0')}`, ownerId: owner, name: `Item ${i}`, maker: ['Northcairn', 'Glowmere', 'Voltmoth'][i % 3]!, category, status: 'approved', approvedAt: new Date(), priceMinor: 1000 + (i % 97) * 100, priceCurrency: i % 5 === 0 ? 'EUR' : 'USD' }).run();
    const mass = 100 + ((i * 37) % 900);
    tx.insert(specs).values({ id: randomUUID(), gearItemId: id, key: 'mass', basis: 'claimed', value: mass }).run();
    if (i % 7 === 0) tx.insert(specs).values({ id: randomUUID(), gearItemId: id, key: 'mass', basis: 'measured', value: mass * 1.03 }).run();
    const key = category === 'light' ? 'luminousFlux' : category === 'power-bank' ? 'ratedEnergy' : 'ratedPower';
    // Radio-noise checks on every 4th item: worst rises 0–11.9 dB below and 0–7.9 dB above 30 MHz (measured only).
    if (i % 4 === 0) {
      tx.insert(specs).values({ id: randomUUID(), gearItemId: id, key: 'noiseRiseBelow30', basis: 'measured', value: (i % 120) / 10 }).run();
      tx.insert(specs).values({ id: randomUUID(), gearItemId: id, key: 'noiseRiseAbove30', basis: 'measured', value: (i % 80) / 10 }).run();
    }
    if (i % 11 !== 0) tx.insert(specs).values({ id: randomUUID(), gearItemId: id, key, basis: 'claimed', value: 50 + ((i * 53) % 950) }).run();
  }
});
backfillGearRatios(db);
const queries = ['', '?sort=mass', '?category=light&sort=lm-per-g', '?category=light&max.mass=300&sort=lm-per-g', '?sort=wh-per-money&currency=USD', '?q=glow&sort=mass&measured=only', '?sort=mass&limit=100', '?radioQuiet=both', '?category=power-bank&radioQuiet=below-30mhz&sort=mass', '?sort=noiseRiseBelow30'];
for (const q of queries) {
  const query = parseGearListQuery(new URLSearchParams(q));
  listGear(db, query, null);
  const runs = 20;
  const t0 = performance.now();
  let total = 0;
  for (let r = 0; r < runs; r++) total = listGear(db, query, null).total;
  const ms = (performance.now() - t0) / runs;
  // page 10 via cursor
  let cursor: string | null = null;
  let page = 0;
  const t1 = performance.now();
  do {
    const res = listGear(db, { ...query, cursor: cursor ?? undefined }, null);
    cursor = res.nextCursor;
    page++;
  } while (cursor && page < 10);
  const pageMs = (performance.now() - t1) / page;
  console.log(`${N} items  ${(q || '(none)').padEnd(45)} total ${String(total).padStart(5)}  first page ${ms.toFixed(1)} ms  mean of ${page} pages ${pageMs.toFixed(1)} ms`);
}
