import { beforeAll, describe, expect, it, vi } from 'vitest';
import { dbMock, guardMock, type SessionUser } from '../support/integration-mocks';
import { and, eq, isNull } from 'drizzle-orm';
import { createTestDb } from '@/db/test-db';
import type { Db } from '@/db/connection';
import { gearItems, kits } from '@/db/schema';

/*
 * Kits API over a fresh database with the demo seed: round trip, ownership (404 to anyone else),
 * share links, and bad input (clear 4xx, nothing stored). Expected budget figures are worked in
 * tests/unit/kits-budget.test.ts; here the wiring is checked.
 */
const state = vi.hoisted(() => ({ db: null as unknown as Db, user: null as SessionUser | null }));
vi.mock('@/db', () => dbMock(() => state.db));
vi.mock('@/lib/auth/guard', () => guardMock(() => state.user));

const { seedDemo } = await import('@/db/seed');
const { readableCatalog } = await import('@/db/kits');
const list = await import('@/app/api/v1/kits/route');
const one = await import('@/app/api/v1/kits/[id]/route');
const share = await import('@/app/api/v1/kits/[id]/share/route');
const duplicate = await import('@/app/api/v1/kits/[id]/duplicate/route');
const shared = await import('@/app/api/v1/kits/shared/[token]/route');

const BASE = 'http://localhost:3000';
const json = (method: string, path: string, body?: unknown, headers: Record<string, string> = {}) =>
  new Request(`${BASE}${path}`, {
    method,
    headers: { 'content-type': 'application/json', origin: BASE, ...headers },
    body: body === undefined ? undefined : typeof body === 'string' ? body : JSON.stringify(body),
  });
const params = <T extends Record<string, string>>(p: T) => ({ params: Promise.resolve(p) });
const as = (who: 'reviewer' | 'reader' | 'reviewer2' | null) => {
  state.user = who ? { id: `demo-user-${who}`, email: `${who}@x.example`, name: who, role: who === 'reader' ? 'reader' : 'reviewer' } : null;
};
const counts = () => ['kits', 'kit_entries'].map((t) => (state.db.$client.prepare(`select count(*) as n from ${t}`).get() as { n: number }).n);
// eslint-disable-next-line @typescript-eslint/no-explicit-any
const body = async (r: Response): Promise<any> => r.json();

const campKit = () => ({
  name: 'Three-day camp',
  purpose: 'Course camp at the meadow',
  tripDays: 3,
  peakSunHours: 4,
  sky: 'overcast',
  skyShare: 0.25,
  entries: [
    { gearItemId: 'demo-gear-glowmere-hearthglow-400', quantity: 1, loadMode: 'high', hoursPerDay: 4 },
    { gearItemId: 'demo-gear-dunlow-ridgecall-h5', quantity: 1, loadMode: 'transmit', hoursPerDay: 8, dutyCycle: 0.1 },
    { gearItemId: null, freeName: 'Laptop (charged daily)', quantity: 1, freeDrawW: 60, hoursPerDay: 1.5 },
    { gearItemId: 'demo-gear-dunlow-campcore-20-lifepo4', quantity: 1, chemistry: 'lifepo4' },
    { gearItemId: 'demo-gear-brackenfold-heathray-60', quantity: 1 },
  ],
});

let draftOfReviewer2: string;

beforeAll(async () => {
  state.db = createTestDb().db;
  await seedDemo(state.db);
  const draft = state.db
    .select({ id: gearItems.id })
    .from(gearItems)
    .where(and(eq(gearItems.ownerId, 'demo-user-reviewer2'), eq(gearItems.status, 'draft'), isNull(gearItems.approvedAt)))
    .get();
  if (!draft) {
    // The seed has no draft of reviewer2: make one (invented).
    state.db.insert(gearItems).values({ id: 'test-draft', slug: 'test-draft', ownerId: 'demo-user-reviewer2', name: 'Draft lamp', maker: 'Glowmere', category: 'light', status: 'draft' }).run();
    draftOfReviewer2 = 'test-draft';
  } else draftOfReviewer2 = draft.id;
}, 120_000);

describe('kits API round trip', () => {
  it('creates, reads, changes, shares, revokes, duplicates and deletes an own kit', async () => {
    as('reader');
    const created = await list.POST(json('POST', '/api/v1/kits', campKit()));
    expect(created.status).toBe(201);
    const c = await body(created);
    const id: string = c.kit.id;
    expect(created.headers.get('Location')).toBe(`/kits/${id}`);
    expect(c.kit.entries).toHaveLength(5);
    // Budget wiring: fails on day 3 with one 60 W panel at sky share 0.25 (worked in the unit test,
    // here with the demo's claimed 3.8 W lantern draw: same day).
    expect(c.budget.result.closes).toBe(false);
    expect(c.budget.warnings.find((w: { code: string }) => w.code === 'does-not-close').day).toBe(3);
    expect(c.totals.prices.map((p: { currency: string }) => p.currency)).toEqual(['USD']);

    const got = await one.GET(json('GET', `/api/v1/kits/${id}`), params({ id }));
    expect(got.status).toBe(200);
    expect(got.headers.get('Cache-Control')).toBe('private, no-store');
    expect((await body(got)).kit.name).toBe('Three-day camp');

    const patched = await one.PATCH(
      json('PATCH', `/api/v1/kits/${id}`, { entries: campKit().entries.map((e, i) => (i === 4 ? { ...e, quantity: 2 } : e)) }),
      params({ id }),
    );
    expect(patched.status).toBe(200);
    expect((await body(patched)).budget.result.closes).toBe(true);

    const mine = await body(await list.GET(json('GET', '/api/v1/kits')));
    expect(mine.kits.map((k: { id: string }) => k.id)).toContain(id);
    expect(mine.kits.find((k: { id: string }) => k.id === id).entryCount).toBe(5);

    const s = await share.POST(json('POST', `/api/v1/kits/${id}/share`), params({ id }));
    expect(s.status).toBe(201);
    const { token } = await body(s);
    // 24 random bytes → 32 base64url characters (192 bits ≥ 128).
    expect(token).toMatch(/^[A-Za-z0-9_-]{32}$/);
    as('reviewer2');
    const view = await shared.GET(json('GET', `/api/v1/kits/shared/${token}`), params({ token }));
    expect(view.status).toBe(200);
    expect(view.headers.get('Cache-Control')).toBe('private, no-store');
    const v = await body(view);
    expect(v.kit.name).toBe('Three-day camp');
    expect(v.kit).not.toHaveProperty('shareToken');
    expect(v.kit).not.toHaveProperty('ownerId');
    as(null);
    expect((await shared.GET(json('GET', `/api/v1/kits/shared/${token}`), params({ token }))).status).toBe(200);

    as('reader');
    expect((await share.DELETE(json('DELETE', `/api/v1/kits/${id}/share`), params({ id }))).status).toBe(204);
    as('reviewer2');
    expect((await shared.GET(json('GET', `/api/v1/kits/shared/${token}`), params({ token }))).status).toBe(404);

    as('reader');
    const copy = await duplicate.POST(json('POST', `/api/v1/kits/${id}/duplicate`), params({ id }));
    expect(copy.status).toBe(201);
    const copyId: string = (await body(copy)).kit.id;
    const copied = await body(await one.GET(json('GET', `/api/v1/kits/${copyId}`), params({ id: copyId })));
    expect(copied.kit.name).toBe('Copy of Three-day camp');
    expect(copied.kit.entries).toHaveLength(5);
    expect(copied.kit.shareToken).toBeNull();

    expect((await one.DELETE(json('DELETE', `/api/v1/kits/${copyId}`), params({ id: copyId }))).status).toBe(204);
    expect((await one.GET(json('GET', `/api/v1/kits/${copyId}`), params({ id: copyId }))).status).toBe(404);
  });

  it('gives 404 to anyone but the owner and changes nothing', async () => {
    as('reader');
    const id: string = (await body(await list.POST(json('POST', '/api/v1/kits', campKit())))).kit.id;
    const before = counts();
    as('reviewer2');
    expect((await one.GET(json('GET', `/api/v1/kits/${id}`), params({ id }))).status).toBe(404);
    expect((await one.PATCH(json('PATCH', `/api/v1/kits/${id}`, { name: 'Mine now' }), params({ id }))).status).toBe(404);
    expect((await one.DELETE(json('DELETE', `/api/v1/kits/${id}`), params({ id }))).status).toBe(404);
    expect((await share.POST(json('POST', `/api/v1/kits/${id}/share`), params({ id }))).status).toBe(404);
    expect((await duplicate.POST(json('POST', `/api/v1/kits/${id}/duplicate`), params({ id }))).status).toBe(404);
    // The seeded base-camp kit belongs to the reviewer.
    expect((await one.GET(json('GET', '/api/v1/kits/demo-kit-base-camp'), params({ id: 'demo-kit-base-camp' }))).status).toBe(404);
    expect(counts()).toEqual(before);
    expect(state.db.select({ name: kits.name }).from(kits).where(eq(kits.id, id)).get()?.name).toBe('Three-day camp');
    as(null);
    expect((await list.GET(json('GET', '/api/v1/kits'))).status).toBe(401);
    expect((await list.POST(json('POST', '/api/v1/kits', campKit()))).status).toBe(401);
  });

  it('refuses a share token that is wrong, short or revoked with 404', async () => {
    for (const token of ['nope', 'A'.repeat(32), '../../etc']) {
      expect((await shared.GET(json('GET', `/api/v1/kits/shared/x`), params({ token }))).status).toBe(404);
    }
  });
});

describe('bad input: clear 4xx, nothing stored', () => {
  const bad: [string, unknown, string][] = [
    ['negative hours', { ...campKit(), entries: [{ ...campKit().entries[0], hoursPerDay: -2 }] }, 'entries.0.hoursPerDay'],
    ['duty above 1', { ...campKit(), entries: [{ ...campKit().entries[1], dutyCycle: 1.2 }] }, 'entries.0.dutyCycle'],
    ['depth of discharge 0', { ...campKit(), entries: [{ ...campKit().entries[3], depthOfDischarge: 0 }] }, 'entries.0.depthOfDischarge'],
    ['a trip of 0 days', { ...campKit(), tripDays: 0 }, 'tripDays'],
    ['a trip of 10 000 days', { ...campKit(), tripDays: 10000 }, 'tripDays'],
    ['an unknown item id', { ...campKit(), entries: [{ gearItemId: 'no-such-item', quantity: 1 }] }, 'entries.0.gearItemId'],
    ['mass assignment', { ...campKit(), ownerId: 'demo-user-reviewer', shareToken: 'x' }, '_'],
    ['a string for a number', { ...campKit(), tripDays: '3' }, 'tripDays'],
  ];
  it.each(bad)('POST with %s → 422 naming the field', async (_what, input, field) => {
    as('reader');
    const before = counts();
    const r = await list.POST(json('POST', '/api/v1/kits', input));
    expect(r.status).toBe(422);
    const b = await body(r);
    expect(b.error.code).toBe('invalid');
    expect(Object.keys(b.error.fields)).toContain(field);
    expect(counts()).toEqual(before);
  });

  it("refuses another reviewer's unpublished item (422), also on PATCH", async () => {
    as('reader');
    const before = counts();
    const r = await list.POST(json('POST', '/api/v1/kits', { ...campKit(), entries: [{ gearItemId: draftOfReviewer2, quantity: 1 }] }));
    expect(r.status).toBe(422);
    expect((await body(r)).error.fields).toHaveProperty(['entries.0.gearItemId']);
    expect(counts()).toEqual(before);
    const id: string = (await body(await list.POST(json('POST', '/api/v1/kits', campKit())))).kit.id;
    const afterCreate = counts();
    const p = await one.PATCH(json('PATCH', `/api/v1/kits/${id}`, { entries: [{ gearItemId: draftOfReviewer2, quantity: 1 }] }), params({ id }));
    expect(p.status).toBe(422);
    expect(counts()).toEqual(afterCreate);
    // Its owner may put it in a kit, and a viewer of the shared kit sees only "unpublished item".
    as('reviewer2');
    const own = await body(await list.POST(json('POST', '/api/v1/kits', { ...campKit(), entries: [{ gearItemId: draftOfReviewer2, quantity: 1 }] })));
    const token = (await body(await share.POST(json('POST', `/api/v1/kits/${own.kit.id}/share`), params({ id: own.kit.id })))).token;
    as('reader');
    const v = await body(await shared.GET(json('GET', `/api/v1/kits/shared/${token}`), params({ token })));
    expect(v.kit.entries[0]).toEqual({ gearItemId: null, quantity: 1, hidden: true });
    expect(JSON.stringify(v)).not.toContain(draftOfReviewer2);
  });

  it('answers malformed JSON with 400, another media type with 415, a cross-site origin with 403', async () => {
    as('reader');
    const before = counts();
    expect((await list.POST(json('POST', '/api/v1/kits', '{"name":'))).status).toBe(400);
    expect((await list.POST(new Request(`${BASE}/api/v1/kits`, { method: 'POST', headers: { 'content-type': 'text/plain', origin: BASE }, body: '{}' }))).status).toBe(415);
    expect((await list.POST(json('POST', '/api/v1/kits', campKit(), { origin: 'https://evil.example' }))).status).toBe(403);
    expect(counts()).toEqual(before);
  });

  it('PATCH with bad fields is 422 and leaves the kit as it was', async () => {
    as('reader');
    const id: string = (await body(await list.POST(json('POST', '/api/v1/kits', campKit())))).kit.id;
    const r = await one.PATCH(json('PATCH', `/api/v1/kits/${id}`, { name: 'New', tripDays: 10000 }), params({ id }));
    expect(r.status).toBe(422);
    expect(state.db.select({ name: kits.name, tripDays: kits.tripDays }).from(kits).where(eq(kits.id, id)).get()).toEqual({ name: 'Three-day camp', tripDays: 3 });
  });
});

describe('readableCatalog', () => {
  it('derives the overcast sky share of the 60 W panel from the paired demo field tests', () => {
    const catalog = readableCatalog(state.db, null, ['demo-gear-brackenfold-heathray-60']);
    const overcast = catalog['demo-gear-brackenfold-heathray-60']?.pairedSkyShares.find((s) => s.sky === 'overcast');
    // The demo's generated logs average about 0.17 (overcast) and 0.76 (clear) of the rating
    // (db/seed/demo-data.ts, invented): 0.17 ÷ 0.76 ≈ 0.22.
    expect(overcast?.share).toBeGreaterThan(0.18);
    expect(overcast?.share).toBeLessThan(0.27);
  });

  it('shows a guest only approved items', () => {
    const all = readableCatalog(state.db, null);
    expect(Object.keys(all)).not.toContain(draftOfReviewer2);
    expect(Object.keys(readableCatalog(state.db, { id: 'demo-user-reviewer2' }))).toContain(draftOfReviewer2);
  });
});
