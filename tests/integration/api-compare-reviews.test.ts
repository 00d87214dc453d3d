/**
 * GET /api/v1/compare, /api/v1/reviews and /api/v1/reviews/{slug} against the seeded catalog
 * (tests/integration/api-seed.ts; figures in its comment, expected rows worked out by hand).
 */
import { beforeAll, beforeEach, describe, expect, it, vi } from 'vitest';
import { dbMock, guardMock, type SessionUser } from '../support/integration-mocks';
import type { Db } from '@/db/connection';
import { createTestDb } from '@/db/test-db';
import { createReviewDraft, transitionReview, updateReviewDraft } from '@/db/reviews';
import type { CompareResponse, CompareRow, ReviewDetail, ReviewListResponse } from '@/lib/browse/contract';
import { seedCatalog, type Seeded, type SeedUser } from './api-seed';

const state = vi.hoisted(() => ({ db: null as unknown as Db, user: null as SessionUser | null }));
vi.mock('@/db', () => dbMock(() => state.db));
vi.mock('@/lib/auth/guard', () => guardMock(() => state.user));

const { GET: COMPARE } = await import('@/app/api/v1/compare/route');
const { GET: REVIEWS } = await import('@/app/api/v1/reviews/route');
const { GET: REVIEW } = await import('@/app/api/v1/reviews/[slug]/route');

const BASE = 'http://localhost:3000';
let seed: Seeded;
let draftReviewSlug: string;
const publishedSlugs: string[] = [];

function publishReview(title: string, itemId: string): string {
  const { id, slug } = createReviewDraft(state.db, seed.users.author, { title, itemIds: [itemId] });
  updateReviewDraft(state.db, seed.users.author, id, {
    title,
    summary: 'Short.',
    verdict: 'Fine.',
    body: 'Body text.',
    disclosure: 'bought-retail',
    disclosureNote: '',
    correctionNote: '',
    itemIds: [itemId],
  });
  transitionReview(state.db, seed.users.author, id, 'submit');
  transitionReview(state.db, seed.users.editor, id, 'approve');
  transitionReview(state.db, seed.users.admin, id, 'publish');
  return slug;
}

beforeAll(() => {
  state.db = createTestDb().db;
  seed = seedCatalog(state.db);
  publishedSlugs.push(publishReview('Ember in the rain', seed.id.ember!), publishReview('Cell on a week out', seed.id.cell!), publishReview('Stack for the hut', seed.id.stack!));
  draftReviewSlug = createReviewDraft(state.db, seed.users.author, { title: 'Unfinished thoughts', itemIds: [seed.id.ember!] }).slug;
});
beforeEach(() => {
  state.user = null;
});
const as = (user: SeedUser | null) => (state.user = user);

async function compare(query: string) {
  const res = await COMPARE(new Request(`${BASE}/api/v1/compare${query}`));
  return { status: res.status, body: (await res.json()) as CompareResponse & { error?: { fields: Record<string, string[]> } }, res };
}
const rowOf = (body: CompareResponse, key: string): CompareRow => {
  const found = body.groups.flatMap((g) => g.rows).find((r) => r.key === key);
  if (!found) throw new Error(`no row ${key}`);
  return found;
};
const groupIds = (body: CompareResponse) => body.groups.map((g) => g.id);

describe('GET /api/v1/compare', () => {
  it('aligns rows by spec and marks the best cell, lower mass and higher output, ties all best', async () => {
    const { status, body, res } = await compare(`?items=${seed.slug.ember},${seed.slug.beacon},${seed.slug.pocket}`);
    expect(status).toBe(200);
    expect(res.headers.get('cache-control')).toBe('public, max-age=60');
    expect(body.items.map((i) => i.slug)).toEqual([seed.slug.ember, seed.slug.beacon, seed.slug.pocket]);
    expect(groupIds(body)).toEqual(['specs', 'ratios']);
    // Lights: the category's spec order (mass, light output).
    expect(body.groups[0]!.rows.map((r) => r.key)).toEqual(['mass', 'luminousFlux']);
    const mass = rowOf(body, 'mass');
    expect(mass).toMatchObject({ unit: 'g', direction: 'lower', allEqual: false });
    expect(mass.cells.map((c) => c.value)).toEqual([250, 300, 100]);
    expect(mass.cells.map((c) => c.best)).toEqual([false, false, true]);
    expect(rowOf(body, 'luminousFlux').cells.map((c) => c.best)).toEqual([false, true, false]);
    // lm/g: 1.2, 2, 2 — the tie is best twice.
    const lmPerG = rowOf(body, 'lm-per-g');
    expect(lmPerG).toMatchObject({ unit: 'lm/g', direction: 'higher', label: 'Light output per gram' });
    expect(lmPerG.cells.map((c) => c.best)).toEqual([false, true, true]);
    // lm per money: USD and EUR prices cannot be ranked against each other.
    const perMoney = rowOf(body, 'lm-per-money');
    expect(perMoney.cells.map((c) => c.unit)).toEqual(['lm/USD', 'lm/USD', 'lm/EUR']);
    expect(perMoney.direction).toBeNull();
    expect(perMoney.cells.every((c) => !c.best)).toBe(true);
  });

  it('marks equal rows and keeps ties best across categories', async () => {
    const { body } = await compare(`?items=${seed.slug.beacon},${seed.slug.stack}`);
    const mass = rowOf(body, 'mass'); // 300 g and 300 g
    expect(mass.allEqual).toBe(true);
    expect(mass.cells.map((c) => c.best)).toEqual([true, true]);
    expect(rowOf(body, 'luminousFlux').cells.map((c) => c.value)).toEqual([600, null]);
    expect(rowOf(body, 'luminousFlux').cells.map((c) => c.best)).toEqual([false, false]); // one value: nothing to compare
    expect(rowOf(body, 'ratedEnergy').cells.map((c) => c.value)).toEqual([null, 50]);
  });

  it('shows measured figures with provenance, measured ÷ claimed and the test conditions (°F with units=imperial)', async () => {
    const { body } = await compare(`?items=${seed.slug.trail},${seed.slug.ember}&units=imperial`);
    expect(groupIds(body)).toEqual(['specs', 'ratios', 'measured-vs-claimed', 'test-conditions']);
    const mass = rowOf(body, 'mass');
    expect(mass.cells[0]).toMatchObject({ value: 210, basis: 'measured', provenance: `/field-tests/${seed.fieldTestId}`, best: true });
    expect(mass.cells[1]).toMatchObject({ value: 250, basis: 'claimed', provenance: null, best: false });
    // 210 g = 7.407 oz (1 oz = 28.349 523 125 g, 1959 international yard and pound agreement).
    expect(mass.cells[0]!.imperial).toEqual({ value: expect.closeTo(210 / 28.349523125, 12), unit: 'oz' });
    const mvc = rowOf(body, 'measured-vs-claimed:mass');
    expect(mvc).toMatchObject({ direction: 'lower', label: 'Mass: measured ÷ claimed' });
    expect(mvc.cells.map((c) => c.value)).toEqual([1.05, null]);
    expect(rowOf(body, 'tested-on').cells.map((c) => c.value)).toEqual(['2026-10-03', null]);
    const ambient = rowOf(body, 'ambient-temperature');
    expect(ambient.cells[0]).toMatchObject({ value: 12.5, unit: '°C', provenance: `/field-tests/${seed.fieldTestId}`, best: false });
    // °F = °C × 9/5 + 32 (NIST SP 811 B.9; quoted from memory): 12.5 °C = 54.5 °F.
    expect(ambient.cells[0]!.imperial).toEqual({ value: 54.5, unit: '°F' });
    expect(rowOf(body, 'sky').cells[0]!.value).toBe('Clear');
  });

  it('404s for an unknown item or someone else’s draft, and shows the owner their own', async () => {
    expect((await compare(`?items=${seed.slug.ember},no-such-item`)).status).toBe(404);
    expect((await compare(`?items=${seed.slug.ember},${seed.slug.lamp}`)).status).toBe(404);
    as(seed.users.other);
    expect((await compare(`?items=${seed.slug.ember},${seed.slug.lamp}`)).status).toBe(404);
    as(seed.users.author);
    const own = await compare(`?items=${seed.slug.ember},${seed.slug.lamp}`);
    expect(own.status).toBe(200);
    expect(own.res.headers.get('cache-control')).toBe('private, no-store');
  });

  const bad: [string, string][] = [
    ['', 'items'],
    [`?items=${'a'}`, 'items'],
    ['?items=a,b,c,d,e,f,g', 'items'],
    ['?items=a,a', 'items'],
    ['?items=Ember!,b', 'items'],
    ['?items=a,,b', 'items'],
    ['?items=a,b&sort=mass', 'sort'],
    ['?items=a,b&units=cubits', 'units'],
  ];
  for (const [query, parameter] of bad) {
    it(`${query || '(no query)'} → 400 naming ${parameter}`, async () => {
      const { status, body } = await compare(query);
      expect(status).toBe(400);
      expect(Object.keys(body.error!.fields)).toContain(parameter);
    });
  }
});

describe('GET /api/v1/reviews', () => {
  const reviews = async (query: string) => {
    const res = await REVIEWS(new Request(`${BASE}/api/v1/reviews${query}`));
    return { status: res.status, body: (await res.json()) as ReviewListResponse & { error?: { fields: Record<string, string[]> } }, res };
  };

  it('lists published reviews only, newest first, and filters by gear item', async () => {
    const { body, res } = await reviews('');
    expect(body.total).toBe(4);
    expect(body.items.map((r) => r.slug)).not.toContain(draftReviewSlug);
    const times = body.items.map((r) => r.updatedAt!);
    expect(times).toEqual([...times].sort().reverse());
    expect(res.headers.get('cache-control')).toBe('public, max-age=60');
    const ember = await reviews(`?gear=${seed.slug.ember}`);
    expect(ember.body.items.map((r) => r.slug)).toEqual([publishedSlugs[0]]);
    expect(ember.body.items[0]).toMatchObject({ title: 'Ember in the rain', author: 'author', disclosure: 'bought-retail', path: `/reviews/${publishedSlugs[0]}` });
    expect(ember.body.items[0]!.items).toEqual([{ slug: seed.slug.ember, name: 'Ember 300', path: `/gear/${seed.slug.ember}` }]);
    expect((await reviews(`?gear=${seed.slug.sheet}`)).body.total).toBe(0);
  });

  it('pages with a cursor, each review exactly once', async () => {
    const all = (await reviews('')).body.items.map((r) => r.slug);
    const seen: string[] = [];
    let cursor: string | null = null;
    do {
      const page: { body: ReviewListResponse } = await reviews(`?limit=1${cursor ? `&cursor=${cursor}` : ''}`);
      seen.push(...page.body.items.map((r) => r.slug));
      cursor = page.body.nextCursor;
    } while (cursor && seen.length < 10);
    expect(seen).toEqual(all);
  });

  for (const [query, parameter] of [
    ['?limit=0', 'limit'],
    ['?limit=x', 'limit'],
    ['?cursor=nope', 'cursor'],
    ['?gear=Not A Slug', 'gear'],
    ['?status=draft', 'status'],
  ] as const) {
    it(`${query} → 400 naming ${parameter}`, async () => {
      const { status, body } = await reviews(query);
      expect(status).toBe(400);
      expect(Object.keys(body.error!.fields)).toContain(parameter);
    });
  }
});

describe('GET /api/v1/reviews/{slug}', () => {
  const review = async (slug: string, query = '') => {
    const res = await REVIEW(new Request(`${BASE}/api/v1/reviews/${slug}${query}`), { params: Promise.resolve({ slug }) });
    return { status: res.status, body: (await res.json()) as ReviewDetail, res };
  };

  it('answers the published revision with its Markdown body', async () => {
    const { status, body } = await review(publishedSlugs[1]!);
    expect(status).toBe(200);
    expect(body).toMatchObject({ slug: publishedSlugs[1], state: 'published', body: 'Body text.', revision: 1, retraction: null });
    expect(body.history).toHaveLength(1);
  });

  it('404s for a draft, even for its author, and for an unknown slug; 400 for parameters', async () => {
    expect((await review(draftReviewSlug)).status).toBe(404);
    as(seed.users.author);
    expect((await review(draftReviewSlug)).status).toBe(404);
    expect((await review('no-such-review')).status).toBe(404);
    expect((await review(publishedSlugs[1]!, '?revision=1')).status).toBe(400);
  });
});
