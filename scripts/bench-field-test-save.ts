/*
 * Bench (not a test): parse a generated 100 000-row bank-discharge log, save it as a trial (TBS1 series) of a field
 * test in a fresh temporary database, then approve the test (analysis over every row, measured specs, stored ratios).
 * Run: npx tsx --conditions=react-server scripts/bench-field-test-save.ts [rows]   (the condition lets server-only modules load)
 * Prints each step's time and the peak memory. Timings on shared machines are noisy: compare ratios within one run.
 */
import { eq } from 'drizzle-orm';
import { createTestDb } from '../db/test-db';
import { gearItems, specs, trials } from '../db/schema';
import { createUser } from '../db/users';
import { createFieldTest, saveTrialSeries, transitionFieldTest } from '../db/field-tests';
import { parseReadings } from '../lib/readings';

async function main() {
  const rows = Number(process.argv[2] ?? 100_000);
  let peakRss = 0;
  const sample = () => void (peakRss = Math.max(peakRss, process.memoryUsage().rss));
  const ms = (t0: number) => `${(performance.now() - t0).toFixed(0)} ms`;

  const { db, file } = createTestDb();
  const author = createUser(db, { email: 'bench-author@example.org', name: 'Bench author', passwordHash: null, role: 'reviewer' });
  const editor = createUser(db, { email: 'bench-editor@example.org', name: 'Bench editor', passwordHash: null, role: 'editor' });
  const at = new Date('2026-09-01T00:00:00Z');
  db.insert(gearItems)
    .values({ id: 'item-bank', slug: 'bench-bank', ownerId: author.id, name: 'Bench bank', maker: 'Voltmoth', category: 'power-bank', chemistry: 'li-ion', status: 'approved', approvedAt: at, priceMinor: 4000, priceCurrency: 'USD', createdAt: at, updatedAt: at })
    .run();
  db.insert(specs).values({ id: 'item-bank-rated', gearItemId: 'item-bank', key: 'ratedEnergy', mode: '', basis: 'claimed', value: 72, claimSource: 'packaging' }).run();

  // Invented discharge: about 10 W for the whole log, one row per second.
  const lines = ['elapsed_s,volts_V,current_mA'];
  for (let i = 0; i < rows; i++) lines.push(`${i},${(5.1 - (0.2 * i) / rows).toFixed(3)},${1950 + ((i * 104729) % 21)}`);
  const bytes = new TextEncoder().encode(lines.join('\n'));
  console.log(`rows ${rows}, file ${(bytes.length / 1e6).toFixed(2)} MB, database ${file}`);

  let t0 = performance.now();
  const parsed = parseReadings(bytes, { onProgress: sample });
  if (!parsed.ok) throw new Error(parsed.error.message);
  console.log(`parse: ${ms(t0)}`);
  sample();

  const actorA = { id: author.id, role: author.role };
  const { id } = createFieldTest(db, actorA, {
    kind: 'energy-delivered',
    testedAt: '2026-09-08T18:00',
    placeLabel: 'Lakeshore test bench',
    sky: 'indoor',
    ambientC: 20,
    instruments: [{ name: 'USB power meter', accuracy: '±1 %' }],
    methodNotes: 'Bench run into a constant load.',
    items: ['bench-bank'],
  });
  t0 = performance.now();
  const saved = saveTrialSeries(db, actorA, id, { item: 'bench-bank', label: 'Trial 1', samples: parsed.samples, meta: parsed.meta, source: { kind: 'csv', fileName: 'bench.csv', fileBytes: bytes.length } });
  console.log(`save (encode + one row in one transaction): ${ms(t0)}, ${saved.bytes} bytes stored (${(saved.bytes / rows).toFixed(2)} bytes/row)`);
  sample();

  transitionFieldTest(db, actorA, id, 'submit');
  t0 = performance.now();
  const approved = transitionFieldTest(db, { id: editor.id, role: editor.role }, id, 'approve');
  console.log(`approve (decode, analyse every row, measured specs, ratios): ${ms(t0)}, ${approved.measured} measured spec(s)`);
  sample();

  const stored = db.select({ n: trials.seriesLength }).from(trials).where(eq(trials.fieldTestId, id)).get();
  console.log(`stored series length ${stored?.n}; peak RSS ${(peakRss / 1e6).toFixed(0)} MB`);
  db.$client.close();
}

main().catch((error: unknown) => {
  console.error(error);
  process.exit(1);
});
