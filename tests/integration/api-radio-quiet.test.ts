/**
 * Radio-quiet in the public read API: `GET /api/v1/gear?radioQuiet=…` keeps items whose measured worst
 * noise rise in the named S-meter range(s) is under 1 dB (our own threshold, RADIO_QUIET_THRESHOLDS_DB),
 * bad values are a 400 naming the parameter, the generic spec sort puts untested items last, and the
 * side-by-side shows a Radio noise group. Fixture rows are this file's own (measured noise-rise specs
 * written as an approved radio-noise field test writes them), on top of tests/integration/api-seed.ts.
 */
import { randomUUID } from 'node:crypto';
import { sql } from 'drizzle-orm';
import { beforeAll, beforeEach, describe, expect, it, vi } from 'vitest';
import { dbMock, guardMock, type SessionUser } from '../support/integration-mocks';
import type { Db } from '@/db/connection';
import { fieldTestItems, fieldTests, specs } from '@/db/schema';
import { createTestDb } from '@/db/test-db';
import type { CompareResponse, GearListResponse } from '@/lib/browse/contract';
import { seedCatalog, type Seeded } from './api-seed';

const state = vi.hoisted(() => ({ db: null as unknown as Db, user: null as SessionUser | null }));
vi.mock('@/db', () => dbMock(() => state.db));
vi.mock('@/lib/auth/guard', () => guardMock(() => state.user));

const { GET } = await import('@/app/api/v1/gear/route');
const { GET: COMPARE } = await import('@/app/api/v1/compare/route');

const BASE = 'http://localhost:3000';
let seed: Seeded;

/**
 * Worst rises (dB), measured unless marked claimed:
 *   ember  below 0.4  above 0      → quiet / quiet
 *   cell   below 0.8  above 7.5    → quiet / noisy
 *   brick  below 3    above 0.5    → slight / quiet
 *   stack  below 12   —            → noisy / not tested
 *   sheet  —          above 0.9    → not tested / quiet
 *   beacon below 0.1 CLAIMED only  → not tested (a claimed figure does not count)
 *   lamp   below 0.2  above 0.2    → quiet / quiet, but a draft of the author (visible to them only)
 * Threshold: quiet below 1 dB, slight below 6 dB, noisy from 6 dB (our convention, no source).
 */
const RISES: [short: string, below: number | null, above: number | null][] = [
  ['ember', 0.4, 0],
  ['cell', 0.8, 7.5],
  ['brick', 3, 0.5],
  ['stack', 12, null],
  ['sheet', null, 0.9],
  ['lamp', 0.2, 0.2],
];

beforeAll(() => {
  state.db = createTestDb().db;
  seed = seedCatalog(state.db);
  const testedAt = new Date('2026-11-14T19:30:00Z');
  const fieldTestId = randomUUID();
  state.db
    .insert(fieldTests)
    .values({ id: fieldTestId, ownerId: seed.users.author.id, kind: 'radio-noise', testedAt, placeLabel: 'Cedar Hollow Field School', sky: 'overcast', ambientC: 6, status: 'approved', approvedAt: testedAt })
    .run();
  for (const [short, below, above] of RISES) {
    state.db.insert(fieldTestItems).values({ fieldTestId, gearItemId: seed.id[short]! }).run();
    for (const [key, value] of [['noiseRiseBelow30', below], ['noiseRiseAbove30', above]] as const) {
      if (value === null) continue;
      state.db.insert(specs).values({ id: randomUUID(), gearItemId: seed.id[short]!, key, mode: '', basis: 'measured', value, sd: null, n: 1, fieldTestId }).run();
    }
  }
  state.db.insert(specs).values({ id: randomUUID(), gearItemId: seed.id.beacon!, key: 'noiseRiseBelow30', mode: '', basis: 'claimed', value: 0.1, sd: null, n: null, fieldTestId: null }).run();
});
beforeEach(() => {
  state.user = null;
});

async function list(query: string): Promise<{ status: number; body: GearListResponse & { error?: { code: string; message: string; fields?: Record<string, string[]> } } }> {
  const res = await GET(new Request(`${BASE}/api/v1/gear${query}`));
  return { status: res.status, body: await res.json() };
}
const slugs = (body: GearListResponse) => body.items.map((i) => i.slug);
const s = (...shorts: string[]) => shorts.map((short) => seed.slug[short]!);
const sorted = (list: string[]) => [...list].sort();

describe('GET /api/v1/gear?radioQuiet=', () => {
  it('below-30mhz: only items measured under 1 dB below 30 MHz (a claimed figure does not count)', async () => {
    const { status, body } = await list('?radioQuiet=below-30mhz');
    expect(status).toBe(200);
    expect(slugs(body)).toEqual(sorted(s('ember', 'cell')));
    expect(body.total).toBe(2);
    for (const item of body.items) {
      expect(item.specs.noiseRiseBelow30).toMatchObject({ basis: 'measured', unit: 'dB' });
      expect(item.specs.noiseRiseBelow30!.value).toBeLessThan(1);
    }
  });

  it('above-30mhz and both', async () => {
    expect(slugs((await list('?radioQuiet=above-30mhz')).body)).toEqual(sorted(s('ember', 'brick', 'sheet')));
    expect(slugs((await list('?radioQuiet=both')).body)).toEqual(s('ember'));
  });

  it('combines with the other filters, and the facets count the quiet items per category', async () => {
    const { body } = await list('?radioQuiet=below-30mhz&category=power-bank');
    expect(slugs(body)).toEqual(s('cell'));
    const facets = Object.fromEntries(body.facets.categories.map((c) => [c.id, c.count]));
    expect(facets).toMatchObject({ light: 1, 'power-bank': 1, 'solar-panel': 0 });
    expect(slugs((await list('?radioQuiet=above-30mhz&max.mass=1000')).body)).toEqual(sorted(s('ember', 'brick')));
  });

  it("shows a caller's own draft to them only", async () => {
    expect(slugs((await list('?radioQuiet=both')).body)).not.toContain(seed.slug.lamp);
    state.user = seed.users.author;
    expect(slugs((await list('?radioQuiet=both')).body)).toEqual(sorted(s('ember', 'lamp')));
  });

  it.each(['yes', 'BOTH', '', 'below-30mhz,above-30mhz', '<script>', 'x'.repeat(5000)])('refuses radioQuiet=%j with a 400 naming it, and changes nothing', async (value) => {
    const before = state.db.get<{ n: number; sum: number }>(sql`SELECT count(*) AS n, total(value) AS sum FROM specs`);
    const { status, body } = await list(`?radioQuiet=${encodeURIComponent(value)}`);
    expect(status).toBe(400);
    expect(body.error!.code).toBe('bad_request');
    expect(body.error!.message).toContain('"radioQuiet"');
    expect(body.error!.fields).toHaveProperty('radioQuiet');
    expect(state.db.get(sql`SELECT count(*) AS n, total(value) AS sum FROM specs`)).toEqual(before);
  });

  it('refuses radioQuiet given twice', async () => {
    const { status, body } = await list('?radioQuiet=both&radioQuiet=below-30mhz');
    expect(status).toBe(400);
    expect(body.error!.fields).toEqual({ radioQuiet: ['Is given more than once.'] });
  });
});

describe('sorting by noise rise (generic spec sort)', () => {
  it('lowest rise first by default (lower is better), untested items last in either order', async () => {
    const { body } = await list('?sort=noiseRiseBelow30&limit=100');
    const tested = s('ember', 'cell', 'brick', 'stack'); // 0.4, 0.8, 3, 12 dB
    expect(slugs(body).slice(0, 4)).toEqual(tested);
    expect(body.items.slice(0, 4).map((i) => i.sortValue)).toEqual([0.4, 0.8, 3, 12]);
    const rest = slugs(body).slice(4);
    expect(rest).toEqual(sorted(rest)); // missing values: slug order
    expect(rest).toContain(seed.slug.beacon); // a claimed figure of a measured-only spec is not sorted on
    const desc = await list('?sort=noiseRiseBelow30&order=desc&limit=100');
    expect(slugs(desc.body).slice(0, 4)).toEqual([...tested].reverse());
    expect(slugs(desc.body).slice(4)).toEqual(rest);
  });

  it('pages through the sort with a cursor without losing or repeating items', async () => {
    const seen: string[] = [];
    let cursor: string | null = null;
    for (let page = 0; page < 20; page++) {
      const { status, body } = await list(`?sort=noiseRiseAbove30&limit=2${cursor ? `&cursor=${cursor}` : ''}`);
      expect(status).toBe(200);
      seen.push(...slugs(body));
      cursor = body.nextCursor;
      if (!cursor) break;
    }
    const all = slugs((await list('?sort=noiseRiseAbove30&limit=100')).body);
    expect(seen).toEqual(all);
    expect(all.slice(0, 4)).toEqual(s('ember', 'brick', 'sheet', 'cell')); // 0, 0.5, 0.9, 7.5 dB
  });
});

describe('GET /api/v1/compare: Radio noise group', () => {
  it('shows each item\'s verdict and worst rise per range, best = lowest rise, from the measured specs only', async () => {
    const res = await COMPARE(new Request(`${BASE}/api/v1/compare?items=${s('cell', 'brick', 'beacon').join(',')}`));
    expect(res.status).toBe(200);
    const body = (await res.json()) as CompareResponse;
    const group = body.groups.find((g) => g.id === 'radio-noise')!;
    expect(group.label).toBe('Radio noise');
    const row = (key: string) => group.rows.find((r) => r.key === key)!;
    // cell 0.8 / 7.5 dB, brick 3 / 0.5 dB, beacon only a claimed 0.1 dB (not shown).
    expect(row('radio-noise-verdict:below-30mhz').cells.map((c) => c.value)).toEqual(['quiet', 'slight', null]);
    expect(row('noiseRiseBelow30').cells.map((c) => c.value)).toEqual([0.8, 3, null]);
    expect(row('noiseRiseBelow30').cells.map((c) => c.best)).toEqual([true, false, false]);
    expect(row('radio-noise-verdict:above-30mhz').cells.map((c) => c.value)).toEqual(['noisy', 'quiet', null]);
    expect(row('noiseRiseAbove30').cells.map((c) => c.best)).toEqual([false, true, false]);
    expect(row('noiseRiseAbove30').cells[0]!.provenance).toMatch(/^\/field-tests\//);
    // Not repeated in Specs.
    const specRows = body.groups.find((g) => g.id === 'specs')!.rows.map((r) => r.key);
    expect(specRows).not.toContain('noiseRiseBelow30');
    expect(specRows).not.toContain('noiseRiseAbove30');
    expect(body.groups.map((g) => g.id).indexOf('radio-noise')).toBe(body.groups.map((g) => g.id).indexOf('specs') + 1);
  });

  it('has no Radio noise group when none of the items was checked', async () => {
    const body = (await (await COMPARE(new Request(`${BASE}/api/v1/compare?items=${s('pocket', 'beacon').join(',')}`))).json()) as CompareResponse;
    expect(body.groups.map((g) => g.id)).not.toContain('radio-noise');
  });
});
