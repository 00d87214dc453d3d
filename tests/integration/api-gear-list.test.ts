/**
 * GET /api/v1/gear and /api/v1/gear/{slug} against a seeded catalog (tests/integration/api-seed.ts):
 * filters, sorts with ties and missing values, keyset paging, facets, currency exclusion, drafts,
 * imperial display values, caching headers and a table of malformed query strings.
 * Expected orders and counts are worked out by hand from the seed (values in its comment).
 */
import { beforeAll, beforeEach, describe, expect, it, vi } from 'vitest';
import { dbMock, guardMock, type SessionUser } from '../support/integration-mocks';
import type { Db } from '@/db/connection';
import { createTestDb } from '@/db/test-db';
import type { GearListResponse, GearSummary } from '@/lib/browse/contract';
import { encodeCursor } from '@/lib/browse/cursor';
import { seedCatalog, type Seeded, type SeedUser } from './api-seed';

const state = vi.hoisted(() => ({ db: null as unknown as Db, user: null as SessionUser | null }));
vi.mock('@/db', () => dbMock(() => state.db));
vi.mock('@/lib/auth/guard', () => guardMock(() => state.user));

const { GET } = await import('@/app/api/v1/gear/route');
const { GET: GET_ONE } = await import('@/app/api/v1/gear/[slug]/route');

let seed: Seeded;
const BASE = 'http://localhost:3000';

beforeAll(() => {
  state.db = createTestDb().db;
  seed = seedCatalog(state.db);
});
beforeEach(() => {
  state.user = null;
});

function as(user: SeedUser | null) {
  state.user = user;
}

async function list(query: string, headers: Record<string, string> = {}): Promise<{ status: number; body: GearListResponse; res: Response }> {
  const res = await GET(new Request(`${BASE}/api/v1/gear${query}`, { headers }));
  const text = await res.text();
  return { status: res.status, body: text ? JSON.parse(text) : null, res };
}
const slugs = (body: GearListResponse) => body.items.map((i) => i.slug);
const s = (...shorts: string[]) => shorts.map((short) => seed.slug[short]);

/** Every item of a query, page by page, following nextCursor. */
async function walk(query: string, limit: number): Promise<string[]> {
  const seen: string[] = [];
  let cursor: string | null = null;
  for (let page = 0; page < 50; page++) {
    const sep = query ? '&' : '?';
    const { status, body } = await list(`${query}${sep}limit=${limit}${cursor ? `&cursor=${cursor}` : ''}`);
    expect(status).toBe(200);
    seen.push(...slugs(body));
    cursor = body.nextCursor;
    if (!cursor) return seen;
  }
  throw new Error('paging did not end');
}

describe('GET /api/v1/gear: visibility, facets, totals', () => {
  it('lists public items only for anonymous callers, in slug order, with facets per category', async () => {
    const { status, body } = await list('');
    expect(status).toBe(200);
    expect(body.total).toBe(9);
    expect(slugs(body)).toEqual([...slugs(body)].sort());
    expect(slugs(body)).not.toContain(seed.slug.lamp);
    expect(slugs(body)).not.toContain(seed.slug.hidden);
    expect(body.items.every((i) => i.status === undefined)).toBe(true);
    expect(body.excludedOtherCurrency).toBe(0);
    expect(Object.fromEntries(body.facets.categories.map((c) => [c.id, c.count]))).toEqual({
      light: 4,
      'power-bank': 3,
      'battery-12v': 0,
      'solar-panel': 1,
      radio: 0,
      'cable-adapter': 1,
      other: 0,
    });
    expect(body.facets.categories.find((c) => c.id === 'light')?.label).toBe('Lights');
  });

  it('shows a signed-in caller their own drafts marked with status, never other people’s', async () => {
    as(seed.users.author);
    const mine = await list('?category=light');
    expect(mine.body.total).toBe(5);
    const lamp = mine.body.items.find((i) => i.slug === seed.slug.lamp);
    expect(lamp?.status).toBe('draft');
    expect(mine.body.items.find((i) => i.slug === seed.slug.ember)?.status).toBe('approved'); // own, public
    expect(mine.body.items.find((i) => i.slug === seed.slug.hidden)).toBeUndefined();
    expect(mine.res.headers.get('cache-control')).toBe('private, no-store');

    as(seed.users.other);
    const theirs = await list('?category=light');
    expect(slugs(theirs.body)).toContain(seed.slug.hidden);
    expect(slugs(theirs.body)).not.toContain(seed.slug.lamp);
    expect(theirs.body.items.find((i) => i.slug === seed.slug.ember)?.status).toBeUndefined(); // not theirs

    for (const user of [seed.users.reader, seed.users.editor, null]) {
      as(user);
      const { body } = await list('?category=light');
      expect(slugs(body)).not.toContain(seed.slug.lamp);
      expect(body.total).toBe(4);
    }
  });

  it('counts facets with every filter but the category', async () => {
    const { body } = await list('?category=light&max.mass=300');
    // mass ≤ 300 g: ember 250, beacon 300, pocket 100, trail 210 (measured); banks cell 200, stack 300.
    expect(slugs(body).sort()).toEqual(s('trail', 'beacon', 'ember', 'pocket').sort());
    expect(body.total).toBe(4);
    const facets = Object.fromEntries(body.facets.categories.map((c) => [c.id, c.count]));
    expect(facets).toMatchObject({ light: 4, 'power-bank': 2, 'solar-panel': 0, 'cable-adapter': 0 });
  });

  it('filters by kind and by text in the name or maker, with LIKE wildcards taken literally', async () => {
    expect(slugs((await list('?kind=headlamp')).body).sort()).toEqual(s('trail', 'beacon').sort());
    expect(slugs((await list('?q=NORTHCAIRN')).body).sort()).toEqual(s('ember', 'brick').sort());
    expect(slugs((await list('?q=_')).body)).toEqual(s('pocket'));
    expect(slugs((await list('?q=%25')).body)).toEqual(s('pocket'));
    expect(slugs((await list('?q=pocket_100%25')).body)).toEqual(s('pocket'));
    expect((await list('?q=b_ick')).body.total).toBe(0); // "_" is not a wildcard
    expect((await list('?q=%20%20')).body.total).toBe(9); // blank text: no text filter
  });

  it('keeps only items with a published review for reviewed=true', async () => {
    const { body } = await list('?reviewed=true');
    expect(slugs(body)).toEqual(s('beacon'));
    expect(body.items[0]!.reviewed).toBe(true);
    expect((await list('')).body.items.filter((i) => i.reviewed).map((i) => i.slug)).toEqual(s('beacon'));
  });
});

describe('GET /api/v1/gear: sorting with ties and missing values', () => {
  it('sorts by a spec, lower mass first by default, ties by slug, items without mass last', async () => {
    const { body } = await list('?sort=mass');
    // pocket 100, cell 200, trail 210 (measured beats claimed 200), ember 250, beacon 300 = stack 300, brick 400, sheet 2000; lead has no mass.
    expect(slugs(body)).toEqual(s('pocket', 'cell', 'trail', 'ember', 'beacon', 'stack', 'brick', 'sheet', 'lead'));
    expect(body.items.map((i) => i.sortValue)).toEqual([100, 200, 210, 250, 300, 300, 400, 2000, null]);
    const desc = await list('?sort=mass&order=desc');
    expect(slugs(desc.body)).toEqual(s('sheet', 'brick', 'beacon', 'stack', 'ember', 'trail', 'cell', 'pocket', 'lead'));
  });

  it('sorts by a stored ratio, higher lm/g first by default, ties by slug, items without it last', async () => {
    const { body } = await list('?sort=lm-per-g');
    // beacon 600/300 = 2, pocket 200/100 = 2 (tie), trail 380/210 (measured), ember 300/250 = 1.2.
    expect(slugs(body).slice(0, 4)).toEqual(s('beacon', 'pocket', 'trail', 'ember'));
    expect(body.items[2]!.sortValue).toBeCloseTo(380 / 210, 12);
    expect(slugs(body).slice(4)).toEqual([...slugs(body).slice(4)].sort());
    expect(body.items.slice(4).every((i) => i.sortValue === null)).toBe(true);
    const asc = await list('?sort=lm-per-g&order=asc');
    expect(slugs(asc.body).slice(0, 4)).toEqual(s('ember', 'trail', 'beacon', 'pocket'));
    expect(asc.body.items.slice(4).every((i) => i.sortValue === null)).toBe(true);
  });

  it('uses measured figures only with measured=only (claimed-only items count as missing)', async () => {
    const sorted = await list('?sort=mass&measured=only');
    expect(slugs(sorted.body)[0]).toBe(seed.slug.trail);
    expect(sorted.body.items.slice(1).every((i) => i.sortValue === null)).toBe(true);
    expect(slugs((await list('?measured=only&min.mass=0')).body)).toEqual(s('trail'));
    expect(slugs((await list('?measured=only&min.lm-per-g=1')).body)).toEqual(s('trail')); // only trail's lm/g is measured
    expect(slugs((await list('?measured=only&max.measured-vs-claimed:mass=2')).body)).toEqual(s('trail')); // 210 / 200 = 1.05
  });

  it('filters on ratios, inclusive at both ends', async () => {
    expect(slugs((await list('?min.lm-per-g=2')).body).sort()).toEqual(s('beacon', 'pocket').sort());
    expect(slugs((await list('?min.lm-per-g=1.2&max.lm-per-g=1.2')).body)).toEqual(s('ember'));
    expect(slugs((await list('?min.measured-vs-claimed:luminousFlux=0.9&max.measured-vs-claimed:luminousFlux=0.96')).body)).toEqual(s('trail')); // 380 / 400 = 0.95
  });
});

describe('GET /api/v1/gear: money needs a currency; other currencies are left out and counted', () => {
  it('sorts by Wh per USD, leaving out the GBP and EUR items', async () => {
    const { body } = await list('?sort=wh-per-money&currency=USD');
    // stack 50 Wh / 25 USD = 2, cell 37 / 25 = 1.48; brick (GBP) and pocket (EUR) left out.
    expect(slugs(body).slice(0, 2)).toEqual(s('stack', 'cell'));
    expect(body.items.map((i) => i.sortValue).slice(0, 2)).toEqual([2, 1.48]);
    expect(slugs(body)).not.toContain(seed.slug.brick);
    expect(slugs(body)).not.toContain(seed.slug.pocket);
    expect(body.excludedOtherCurrency).toBe(2);
    expect(body.total).toBe(7);
    const banks = await list('?category=power-bank&sort=wh-per-money&currency=USD');
    expect(banks.body.total).toBe(2);
    expect(banks.body.excludedOtherCurrency).toBe(1);
  });

  it('filters the price in major units of the currency', async () => {
    const { body } = await list('?max.price=30&currency=USD');
    expect(slugs(body).sort()).toEqual(s('cell', 'stack').sort());
    expect(body.excludedOtherCurrency).toBe(2);
    const eur = await list('?sort=price&currency=EUR&category=light');
    expect(slugs(eur.body)[0]).toBe(seed.slug.pocket);
    expect(eur.body.items[0]!.sortValue).toBe(30);
    expect(eur.body.excludedOtherCurrency).toBe(2); // ember and beacon in USD
  });

  it('reports no exclusion when nothing money-related is asked', async () => {
    expect((await list('?sort=mass&currency=USD')).body.excludedOtherCurrency).toBe(0);
  });
});

describe('GET /api/v1/gear: keyset paging', () => {
  const queries = ['', '?sort=mass', '?sort=mass&order=desc', '?sort=lm-per-g', '?sort=lm-per-g&order=asc', '?order=desc', '?sort=wh-per-money&currency=USD'];
  for (const query of queries) {
    it(`walks every item exactly once, in order, for "${query || '(no query)'}"`, async () => {
      const all = slugs((await list(query)).body);
      for (const limit of [1, 2, 4]) {
        const walked = await walk(query, limit);
        expect(walked).toEqual(all);
        expect(new Set(walked).size).toBe(walked.length);
      }
    });
  }

  it('pages the caller’s own drafts too', async () => {
    as(seed.users.author);
    const walked = await walk('?sort=lm-per-g', 3);
    expect(walked).toHaveLength(10);
    expect(walked.at(-1)).not.toBe(undefined);
  });

  it('refuses a tampered cursor or one from another sort with 400 naming cursor', async () => {
    const first = await list('?sort=mass&limit=2');
    const cursor = first.body.nextCursor!;
    const tampered = `${cursor.slice(0, -2)}${cursor.slice(-2) === 'AA' ? 'BB' : 'AA'}`;
    for (const query of [`?sort=mass&cursor=${tampered}`, `?sort=lm-per-g&cursor=${cursor}`, `?sort=mass&order=desc&cursor=${cursor}`]) {
      const { status, body } = await list(query);
      expect(status).toBe(400);
      expect(Object.keys((body as unknown as { error: { fields: object } }).error.fields)).toEqual(['cursor']);
    }
  });
});

describe('GET /api/v1/gear: units=imperial adds display values only', () => {
  it('adds oz, lb and in beside the canonical figures and changes nothing else', async () => {
    const metric = await list('?sort=mass');
    const imperial = await list('?sort=mass&units=imperial');
    const strip = (items: GearSummary[]) =>
      JSON.parse(JSON.stringify(items, (key, value) => (key === 'imperial' ? undefined : value))) as GearSummary[];
    expect(strip(imperial.body.items)).toEqual(metric.body.items);
    const bySlug = new Map(imperial.body.items.map((i) => [i.slug, i]));
    // 1 oz = 28.349 523 125 g, 1 lb = 453.592 37 g, 1 in = 0.0254 m (international yard and pound agreement, 1959).
    expect(bySlug.get(seed.slug.ember!)!.specs.mass!.imperial).toEqual({ value: expect.closeTo(250 / 28.349523125, 12), unit: 'oz' });
    expect(bySlug.get(seed.slug.sheet!)!.specs.mass!.imperial).toEqual({ value: expect.closeTo(2000 / 453.59237, 12), unit: 'lb' });
    expect(bySlug.get(seed.slug.trail!)!.specs.beamDistance!.imperial).toEqual({ value: expect.closeTo(0.2 / 0.0254, 12), unit: 'in' });
    expect(bySlug.get(seed.slug.ember!)!.specs.luminousFlux!.imperial).toBeUndefined();
    expect(bySlug.get(seed.slug.ember!)!.ratios['lm-per-g']!.imperial).toBeUndefined();
  });
});

describe('GET /api/v1/gear: personal tokens', () => {
  it('reads as the token’s owner (own drafts, private caching) and refuses a bad token with 401', async () => {
    const { createApiToken, revokeApiToken } = await import('@/db/api-tokens');
    const { token, summary } = createApiToken(state.db, seed.users.author, { name: 'logger', scope: 'read' });
    const mine = await list('?category=light', { authorization: `Bearer ${token}` });
    expect(mine.status).toBe(200);
    expect(mine.body.items.find((i) => i.slug === seed.slug.lamp)?.status).toBe('draft');
    expect(mine.res.headers.get('cache-control')).toBe('private, no-store');
    revokeApiToken(state.db, seed.users.author.id, summary.id);
    expect((await list('?category=light', { authorization: `Bearer ${token}` })).status).toBe(401);
    expect((await list('', { authorization: 'Bearer not-a-token' })).status).toBe(401);
  });
});

describe('GET /api/v1/gear: caching', () => {
  it('sends public max-age=60 with a strong ETag to anonymous callers and 304 on a match', async () => {
    const first = await list('?sort=mass');
    expect(first.res.headers.get('cache-control')).toBe('public, max-age=60');
    expect(first.res.headers.get('vary')).toBe('Authorization, Cookie');
    const etag = first.res.headers.get('etag')!;
    expect(etag).toMatch(/^"[A-Za-z0-9_-]+"$/);
    for (const ifNoneMatch of [etag, `W/${etag}`, `"nope", ${etag}`, `W/"x",W/${etag}`, '*']) {
      const again = await list('?sort=mass', { 'if-none-match': ifNoneMatch });
      expect(again.status).toBe(304);
      expect(again.body).toBeNull();
      expect(again.res.headers.get('etag')).toBe(etag);
      expect(again.res.headers.get('cache-control')).toBe('public, max-age=60');
    }
    expect((await list('?sort=mass', { 'if-none-match': '"other"' })).status).toBe(200);
    expect((await list('?sort=mass&order=desc', { 'if-none-match': etag })).status).toBe(200); // another body, another tag
  });

  it('sends private, no-store and no ETag to a signed-in caller, even with If-None-Match', async () => {
    const etag = (await list('')).res.headers.get('etag')!;
    as(seed.users.reader);
    const { status, res } = await list('', { 'if-none-match': etag });
    expect(status).toBe(200);
    expect(res.headers.get('cache-control')).toBe('private, no-store');
    expect(res.headers.get('vary')).toBe('Authorization, Cookie');
    expect(res.headers.get('etag')).toBeNull();
  });
});

describe('GET /api/v1/gear: malformed query strings → 400 naming the parameter', () => {
  const cursorFor = (payload: unknown) => encodeCursor(payload);
  const cases: [query: string, parameter: string][] = [
    ['foo=1', 'foo'],
    ['category=lights', 'category'],
    ['category=', 'category'],
    ['kind=spaceship', 'kind'],
    ['category=light&kind=pocket', 'kind'],
    ['sort=weight', 'sort'],
    ['sort=', 'sort'],
    ['sort=mass&order=up', 'order'],
    ['limit=0', 'limit'],
    ['limit=101', 'limit'],
    ['limit=abc', 'limit'],
    ['limit=2.5', 'limit'],
    ['limit=-1', 'limit'],
    ['limit=5&limit=6', 'limit'],
    ['min.mass=abc', 'min.mass'],
    ['max.mass=', 'max.mass'],
    ['min.mass=1e999', 'min.mass'],
    ['min.mass=0x10', 'min.mass'],
    ['max.mass=Infinity', 'max.mass'],
    ['min.mass=NaN', 'min.mass'],
    ['min.mass=%201', 'min.mass'],
    ['min.mass=1%202', 'min.mass'],
    ['min.mass=300&max.mass=100', 'min.mass'],
    ['min.weight=3', 'min.weight'],
    ['max.lm-per-kg=3', 'max.lm-per-kg'],
    ['min.measured-vs-claimed:colour=1', 'min.measured-vs-claimed:colour'],
    ['MIN.mass=1', 'MIN.mass'],
    ['measured=yes', 'measured'],
    ['reviewed=1', 'reviewed'],
    ['currency=usd', 'currency'],
    ['currency=XYZ', 'currency'],
    ['sort=price', 'currency'],
    ['max.wh-per-money=2', 'currency'],
    ['sort=money-per-wh&currency=US', 'currency'],
    ['cursor=!!!', 'cursor'],
    ['cursor=', 'cursor'],
    ['cursor=abc', 'cursor'],
    [`cursor=${cursorFor({ k: 'mass', o: 'asc', v: 1, s: 'x' })}`, 'cursor'],
    [`sort=mass&cursor=${cursorFor({ k: 'mass', o: 'asc', v: 'x', s: 'a' })}`, 'cursor'],
    [`sort=mass&cursor=${cursorFor({ k: 'mass', o: 'asc', v: 1, s: 'a', extra: true })}`, 'cursor'],
    ['units=furlongs', 'units'],
    [`q=${'x'.repeat(101)}`, 'q'],
  ];

  it('has at least 40 cases', () => expect(cases.length).toBeGreaterThanOrEqual(40));

  for (const [query, parameter] of cases) {
    it(`?${query.length > 60 ? `${query.slice(0, 60)}…` : query} → 400 naming ${parameter}`, async () => {
      const { status, body } = await list(`?${query}`);
      expect(status).toBe(400);
      const error = (body as unknown as { error: { code: string; message: string; fields: Record<string, string[]> } }).error;
      expect(error.code).toBe('bad_request');
      expect(Object.keys(error.fields)).toContain(parameter);
      expect(error.message).toContain(`"${parameter}"`);
    });
  }
});

describe('GET /api/v1/gear/{slug}', () => {
  const one = async (slug: string, query = '') => {
    const res = await GET_ONE(new Request(`${BASE}/api/v1/gear/${slug}${query}`), { params: Promise.resolve({ slug }) });
    return { status: res.status, body: await res.json(), res };
  };

  it('answers the summary of a public item with public caching', async () => {
    const { status, body, res } = await one(seed.slug.trail!);
    expect(status).toBe(200);
    expect(body).toMatchObject({ slug: seed.slug.trail, category: 'light', path: `/gear/${seed.slug.trail}`, sortValue: null });
    expect(body.specs.mass).toEqual({ value: 210, unit: 'g', basis: 'measured', provenance: `/field-tests/${seed.fieldTestId}` });
    expect(res.headers.get('cache-control')).toBe('public, max-age=60');
  });

  it('404s for an unknown slug and for a draft unless the caller owns it', async () => {
    expect((await one('no-such-item')).status).toBe(404);
    expect((await one(seed.slug.lamp!)).status).toBe(404);
    as(seed.users.other);
    expect((await one(seed.slug.lamp!)).status).toBe(404);
    as(seed.users.author);
    const own = await one(seed.slug.lamp!);
    expect(own.status).toBe(200);
    expect(own.body.status).toBe('draft');
    expect(own.res.headers.get('cache-control')).toBe('private, no-store');
  });

  it('refuses unknown parameters and accepts units=imperial; 404 comes before 400, 401 before both', async () => {
    expect((await one(seed.slug.ember!, '?sort=mass')).status).toBe(400);
    expect((await one('no-such-item', '?sort=mass')).status).toBe(404); // lib/http/errors.ts status table order
    expect((await list('?limit=0', { authorization: 'Bearer not-a-token' })).status).toBe(401);
    const { body } = await one(seed.slug.ember!, '?units=imperial');
    expect(body.specs.mass.imperial.unit).toBe('oz');
  });
});
