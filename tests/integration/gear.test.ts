import { beforeEach, describe, expect, it, vi } from 'vitest';
import { createSessionUser, dbMock, guardMock, navigationMock, type SessionUser } from '../support/integration-mocks';
import { getTableName } from 'drizzle-orm';
import { createTestDb } from '@/db/test-db';
import type { Db } from '@/db/connection';
import fc from 'fast-check';
import { gearFigureNotes, gearItems, gearPendingChanges, gearRatios, photos, specChanges, specs, type Role } from '@/db/schema';
import { createUser } from '@/db/users';
import { AppError } from '@/lib/http/errors';
import { convert, chargeToWh, valueRatios } from '@/lib/measure';

// The route handlers and actions read the shared connection and the session: point both at this test.
const state = vi.hoisted(() => ({ db: null as unknown as Db, user: null as SessionUser | null }));
vi.mock('@/db', () => dbMock(() => state.db));
vi.mock('next/navigation', () => navigationMock());
vi.mock('@/lib/auth/guard', () => guardMock(() => state.user));

const { approveGear, backfillGearRatios, createGear, findVisibleGear, getGearView, sendBackGear, storedRatios, submitGear, updateGear, withdrawGear } = await import('@/db/gear');
const { POST } = await import('@/app/api/v1/gear/route');
const { PATCH } = await import('@/app/api/v1/gear/[slug]/route');
const { createGearAction, updateGearAction } = await import('@/lib/gear/actions');

type Users = Record<'author' | 'other' | 'editor' | 'reader', SessionUser>;
let users: Users;

const count = (table: typeof gearItems | typeof specs | typeof specChanges | typeof gearPendingChanges | typeof gearRatios | typeof gearFigureNotes) =>
  (state.db.$client.prepare(`select count(*) as n from ${getTableName(table)}`).get() as { n: number }).n;
const counts = () => [gearItems, specs, specChanges, gearPendingChanges, gearRatios, gearFigureNotes].map(count);

const lantern = () => ({
  category: 'light',
  name: 'Test Lantern 300',
  maker: 'Northcairn',
  kind: 'lantern',
  price: { amount: '40.00', currency: 'USD' },
  chemistry: 'li-ion',
  specs: { mass: { value: '12.3 oz' }, luminousFlux: { value: '300 lm' }, runtime: { value: '5 h' }, ratedEnergy: { value: '10 400 mAh at 3.6 V', source: 'manual' } },
  modes: [{ name: 'low', luminousFlux: '40 lm', runtime: '30 h' }],
});

const BASE = 'http://localhost:3000';
function jsonRequest(method: string, path: string, body: unknown, headers: Record<string, string> = {}) {
  return new Request(`${BASE}${path}`, {
    method,
    headers: { 'content-type': 'application/json', origin: BASE, ...headers },
    body: typeof body === 'string' ? body : JSON.stringify(body),
  });
}
const params = (slug: string) => ({ params: Promise.resolve({ slug }) });

beforeEach(() => {
  state.db = createTestDb().db;
  const make = (key: string, role: Role) => createSessionUser(state.db, key, role);
  users = { author: make('author', 'reviewer'), other: make('other', 'reviewer'), editor: make('editor', 'editor'), reader: make('reader', 'reader') };
  state.user = null;
});

describe('gear review by another editor (issue 6: authors never approve their own work)', () => {
  it('refuses an editor approving or sending back their own item, and lets another editor approve it', () => {
    const own = createGear(state.db, users.editor, lantern());
    submitGear(state.db, users.editor, own.slug);
    const before = counts();
    expect(() => approveGear(state.db, users.editor, own.slug)).toThrow(expect.objectContaining({ code: 'forbidden' }));
    expect(() => sendBackGear(state.db, users.editor, own.slug, 'Fix it')).toThrow(expect.objectContaining({ code: 'forbidden' }));
    expect(counts()).toEqual(before);
    const admin = createUser(state.db, { email: 'admin@example.org', name: 'admin', passwordHash: null, role: 'admin' });
    expect(approveGear(state.db, { id: admin.id, role: admin.role }, own.slug).status).toBe('approved');
  });
});

describe('gear service', () => {
  it('stores typed units in canonical units and logs each claimed spec', () => {
    const { slug } = createGear(state.db, users.author, lantern());
    expect(slug).toBe('northcairn-test-lantern-300');
    const view = getGearView(state.db, slug, users.author);
    const claimed = (key: string, mode = '') => view.lines.find((l) => l.key === key && l.mode === mode)?.claimed?.value;
    // 1 oz = 28.349 523 125 g (international yard and pound agreement, 1959); Wh = Ah × V (49 CFR 171.8).
    expect(claimed('mass')).toBeCloseTo(12.3 * 28.349523125, 9);
    expect(claimed('ratedEnergy')).toBeCloseTo(37.44, 9);
    expect(claimed('runtime', 'low')).toBe(30 * 3600);
    expect(view.item.status).toBe('draft');
    expect(count(specChanges)).toBe(6);
    // Ratios are lib/measure's for the same figures.
    const expected = valueRatios('light', { mass: { claimed: convert(12.3, 'oz', 'g') }, luminousFlux: { claimed: 300 }, runtime: { claimed: 18_000 }, ratedEnergy: { claimed: chargeToWh(10_400, 'mAh', 3.6) } }, { amountMinor: 4000, currency: 'USD' });
    expect(view.ratios).toEqual(expected);
    expect(view.airline).toEqual({ wh: expect.closeTo(37.44, 9), band: 'no-approval' }); // IATA: ≤ 100 Wh
    // A second item with the same maker and name gets its own slug.
    expect(createGear(state.db, users.other, lantern()).slug).toBe('northcairn-test-lantern-300-2');
  });

  it('hides drafts from other reviewers, readers and guests (404) and shows them to editors (AC-02)', () => {
    const { slug } = createGear(state.db, users.author, lantern());
    for (const viewer of [users.other, users.reader, null]) {
      expect(() => findVisibleGear(state.db, slug, viewer)).toThrow(expect.objectContaining({ code: 'not_found' }));
    }
    expect(findVisibleGear(state.db, slug, users.editor).slug).toBe(slug);
    const before = counts();
    expect(() => updateGear(state.db, users.other, slug, { name: 'Taken over' })).toThrow(expect.objectContaining({ code: 'not_found' }));
    expect(() => submitGear(state.db, users.other, slug)).toThrow(expect.objectContaining({ code: 'not_found' }));
    expect(counts()).toEqual(before);
  });

  it('routes transitions through lib/workflow: only the author submits or withdraws, a send-back needs a comment, no send-back once public', () => {
    const { slug } = createGear(state.db, users.author, lantern());
    const before = counts();
    // Issue 6, second table: submit and withdraw are the author's; an editor sees the draft but may not submit it.
    expect(() => submitGear(state.db, users.editor, slug)).toThrow(expect.objectContaining({ code: 'forbidden' }));
    expect(getGearView(state.db, slug, users.editor).permissions).toMatchObject({ canSubmit: false, canReview: false });
    expect(getGearView(state.db, slug, users.author).permissions).toMatchObject({ canSubmit: true, canWithdraw: false });
    submitGear(state.db, users.author, slug);
    expect(() => withdrawGear(state.db, users.editor, slug)).toThrow(expect.objectContaining({ code: 'forbidden' }));
    expect(() => sendBackGear(state.db, users.editor, slug, '   ')).toThrow(expect.objectContaining({ code: 'invalid' }));
    expect(getGearView(state.db, slug, users.editor).permissions).toMatchObject({ canReview: true, canWithdraw: false });
    expect(() => submitGear(state.db, users.author, slug)).toThrow(expect.objectContaining({ code: 'conflict' }));
    approveGear(state.db, users.editor, slug);
    expect(() => sendBackGear(state.db, users.editor, slug, 'Too late')).toThrow(expect.objectContaining({ code: 'conflict' }));
    expect(() => approveGear(state.db, users.editor, slug)).toThrow(expect.objectContaining({ code: 'conflict' }));
    expect(count(gearItems)).toBe(before[0]);
  });

  it('runs draft → in review → changes requested → in review → approved, locking edits in review', () => {
    const { slug } = createGear(state.db, users.author, lantern());
    submitGear(state.db, users.author, slug);
    expect(() => updateGear(state.db, users.author, slug, { name: 'Renamed' })).toThrow(expect.objectContaining({ code: 'conflict' }));
    expect(() => approveGear(state.db, users.author, slug)).toThrow(expect.objectContaining({ code: 'forbidden' }));
    sendBackGear(state.db, users.editor, slug, 'Add the claim source for the runtime.');
    expect(getGearView(state.db, slug, users.author).events[0]).toMatchObject({ toState: 'changes-requested', comment: 'Add the claim source for the runtime.' });
    updateGear(state.db, users.author, slug, { notes: 'Runtime from the manual.' });
    submitGear(state.db, users.author, slug);
    approveGear(state.db, users.editor, slug);
    const item = findVisibleGear(state.db, slug, null);
    expect(item.status).toBe('approved');
    // Stored ratios are valueRatios of the approved figures.
    const view = getGearView(state.db, slug, null);
    const stored = storedRatios(state.db, item.id).map((r) => [r.ratioId, r.value]).sort();
    expect(stored).toEqual(view.ratios.map((r) => [r.id, r.value]).sort());
    expect(storedRatios(state.db, item.id).find((r) => r.ratioId === 'lm-per-money')).toMatchObject({ unit: 'lm/USD', currency: 'USD' });
  });

  it('keeps an approved item public with its approved figures until an edit is approved, then notes it', () => {
    const { slug } = createGear(state.db, users.author, lantern());
    submitGear(state.db, users.author, slug);
    approveGear(state.db, users.editor, slug);
    expect(() => updateGear(state.db, users.other, slug, { name: 'x' })).toThrow(expect.objectContaining({ code: 'forbidden' }));

    const result = updateGear(state.db, users.author, slug, { specs: { ...lantern().specs, mass: { value: '350 g' } }, changeNote: 'Re-weighed the label claim.' });
    expect(result.pending).toBe(true);
    const publicView = getGearView(state.db, slug, null);
    expect(publicView.showing).toBe('approved');
    expect(publicView.lines.find((l) => l.key === 'mass')!.claimed!.value).toBeCloseTo(348.6991344375, 9);
    const authorView = getGearView(state.db, slug, users.author);
    expect(authorView.hasPendingChange).toBe(true);
    expect(authorView.lines.find((l) => l.key === 'mass')!.claimed!.value).toBe(350);
    expect(findVisibleGear(state.db, slug, users.other).slug).toBe(slug); // still public

    submitGear(state.db, users.author, slug);
    approveGear(state.db, users.editor, slug);
    const after = getGearView(state.db, slug, null);
    expect(after.lines.find((l) => l.key === 'mass')!.claimed!.value).toBe(350);
    expect(after.notes).toHaveLength(1);
    expect(after.notes[0]!.summary).toContain('348.7 g → 350 g');
    expect(after.notes[0]!.note).toBe('Re-weighed the label claim.');
    expect(count(gearPendingChanges)).toBe(0);
    const history = state.db.select().from(specChanges).all().filter((c) => c.key === 'mass');
    expect(history.map((h) => h.context)).toEqual(['edit', 'pending', 'approval']);
    expect(history[2]).toMatchObject({ oldValue: expect.closeTo(348.6991344375, 9), newValue: 350, changedById: users.editor.id });
  });

  it('refuses to submit while a photo has no alt text (issue 4: alt text before review)', () => {
    const { id, slug } = createGear(state.db, users.author, lantern());
    state.db.insert(photos).values({ id: 'p1', ownerId: users.author.id, gearItemId: id, storageKey: 'k', width: 1, height: 1, bytes: 1, altText: '' }).run();
    expect(() => submitGear(state.db, users.author, slug)).toThrow(expect.objectContaining({ code: 'conflict' }));
    expect(findVisibleGear(state.db, slug, users.author).status).toBe('draft');
  });

  it('backfills stored ratios for approved items that have none', () => {
    const { slug } = createGear(state.db, users.author, lantern());
    submitGear(state.db, users.author, slug);
    approveGear(state.db, users.editor, slug);
    state.db.delete(gearRatios).run();
    expect(backfillGearRatios(state.db)).toBe(1);
    expect(count(gearRatios)).toBeGreaterThan(0);
  });
});

describe('POST /api/v1/gear and PATCH /api/v1/gear/{slug}', () => {
  const errorOf = async (res: Response) => (await res.json()) as { error: { code: string; message: string; fields?: Record<string, string[]> } };

  it('creates with 201 for a reviewer session', async () => {
    state.user = users.author;
    const res = await POST(jsonRequest('POST', '/api/v1/gear', lantern()));
    expect(res.status).toBe(201);
    const body = (await res.json()) as { item: { slug: string; path: string } };
    expect(body.item.path).toBe('/gear/northcairn-test-lantern-300');
    expect(res.headers.get('location')).toBe(body.item.path);
  });

  it('refuses bad input with 4xx, field errors and nothing stored (IV-01, IV-02, CS-01, CS-03)', async () => {
    const before = counts();
    state.user = null;
    expect((await POST(jsonRequest('POST', '/api/v1/gear', lantern()))).status).toBe(401);
    state.user = users.reader;
    expect((await POST(jsonRequest('POST', '/api/v1/gear', lantern()))).status).toBe(403);
    state.user = users.author;

    const cases: [unknown, string][] = [
      [{ ...lantern(), specs: { ...lantern().specs, mass: { value: '12 stone' } } }, 'specs.mass.value'],
      [{ ...lantern(), specs: { ...lantern().specs, mass: { value: '-12 oz' } } }, 'specs.mass.value'],
      [{ ...lantern(), specs: { ...lantern().specs, mass: { value: -12 } } }, 'specs.mass.value'],
      [{ ...lantern(), specs: { mass: { value: '300 g' } } }, 'specs.luminousFlux.value'],
      [{ ...lantern(), price: { amount: '12.345', currency: 'USD' } }, 'price.amount'],
      [{ ...lantern(), price: { amount: '12', currency: 'usd dollars' } }, 'price.currency'],
      [{ ...lantern(), ownerId: users.other.id, role: 'admin', status: 'approved', id: 1, createdAt: 0 }, '_'],
      [{ ...lantern(), specs: { ...lantern().specs, mass: { value: '300 g', ownerId: 'x' } } }, 'specs.mass'],
    ];
    for (const [body, field] of cases) {
      const res = await POST(jsonRequest('POST', '/api/v1/gear', body));
      expect(res.status, JSON.stringify(body)).toBe(422);
      const { error } = await errorOf(res);
      expect(Object.keys(error.fields ?? {})).toContain(field);
    }
    expect((await POST(jsonRequest('POST', '/api/v1/gear', '{"name":'))).status).toBe(400);
    expect((await POST(jsonRequest('POST', '/api/v1/gear', lantern(), { 'content-type': 'text/plain' }))).status).toBe(415);
    expect((await POST(jsonRequest('POST', '/api/v1/gear', lantern(), { 'content-type': 'application/x-www-form-urlencoded' }))).status).toBe(415);
    expect((await POST(jsonRequest('POST', '/api/v1/gear', lantern(), { origin: 'https://evil.example' }))).status).toBe(403);
    expect(counts()).toEqual(before);
  });

  it('answers 404 for another reviewer’s draft, 403 once approved, 409 in review, 422 for bad fields (AC-02)', async () => {
    const { slug } = createGear(state.db, users.author, lantern());
    const before = counts();
    state.user = users.other;
    const hidden = await PATCH(jsonRequest('PATCH', `/api/v1/gear/${slug}`, { name: 'Mine now' }), params(slug));
    expect(hidden.status).toBe(404);
    // 404 comes before 415 (status table order), so a wrong content type reveals nothing either.
    expect((await PATCH(jsonRequest('PATCH', `/api/v1/gear/${slug}`, 'x', { 'content-type': 'text/plain' }), params(slug))).status).toBe(404);
    expect(counts()).toEqual(before);

    state.user = users.author;
    const bad = await PATCH(jsonRequest('PATCH', `/api/v1/gear/${slug}`, { specs: { mass: { value: '3 parsecs' } }, status: 'approved' }), params(slug));
    expect(bad.status).toBe(422);
    expect(Object.keys((await errorOf(bad)).error.fields ?? {})).toContain('_');
    const missing = await PATCH(jsonRequest('PATCH', `/api/v1/gear/${slug}`, { specs: { mass: { value: '300 g' } } }), params(slug));
    expect(missing.status).toBe(422);
    expect(Object.keys((await errorOf(missing)).error.fields ?? {})).toContain('specs.luminousFlux.value');
    expect(counts()).toEqual(before);

    const ok = await PATCH(jsonRequest('PATCH', `/api/v1/gear/${slug}`, { name: 'Test Lantern 300 (2026)' }), params(slug));
    expect(ok.status).toBe(200);
    expect(findVisibleGear(state.db, slug, users.author).name).toBe('Test Lantern 300 (2026)');

    submitGear(state.db, users.author, slug);
    expect((await PATCH(jsonRequest('PATCH', `/api/v1/gear/${slug}`, { name: 'x' }), params(slug))).status).toBe(409);
    approveGear(state.db, users.editor, slug);
    state.user = users.other;
    const after = counts();
    expect((await PATCH(jsonRequest('PATCH', `/api/v1/gear/${slug}`, { name: 'Mine now' }), params(slug))).status).toBe(403);
    expect(counts()).toEqual(after);
  });
});

describe('fuzzing the write endpoints (IV-01)', () => {
  it('never answers 5xx and stores nothing for refused bodies', async () => {
    state.user = users.author;
    const { slug } = createGear(state.db, users.author, lantern());
    const near = fc.record({
      category: fc.oneof(fc.constant('light'), fc.string()),
      name: fc.oneof(fc.string(), fc.integer()),
      maker: fc.string(),
      specs: fc.oneof(fc.jsonValue(), fc.record({ mass: fc.record({ value: fc.oneof(fc.string(), fc.double(), fc.constant('12.3 oz')) }) })),
      price: fc.oneof(fc.jsonValue(), fc.record({ amount: fc.oneof(fc.string(), fc.double()), currency: fc.string() })),
      modes: fc.oneof(fc.jsonValue(), fc.array(fc.record({ name: fc.string(), powerDraw: fc.oneof(fc.string(), fc.double()) }))),
    }, { requiredKeys: [] });
    await fc.assert(
      fc.asyncProperty(fc.oneof(fc.jsonValue(), near), async (body) => {
        const before = counts();
        const created = await POST(jsonRequest('POST', '/api/v1/gear', body));
        expect(created.status).toBeLessThan(500);
        const patched = await PATCH(jsonRequest('PATCH', `/api/v1/gear/${slug}`, body), params(slug));
        expect(patched.status).toBeLessThan(500);
        if (created.status >= 400 && patched.status >= 400) expect(counts()).toEqual(before);
      }),
      { numRuns: 300, seed: Number(process.env.FC_SEED ?? 4) },
    );
  });
});

describe('server actions', () => {
  it('return field errors for bad input and store nothing; redirect to the item page on success', async () => {
    state.user = users.author;
    const before = counts();
    const result = await createGearAction({ ...lantern(), specs: { ...lantern().specs, mass: { value: '12 furlongs' } } });
    expect(result.fields?.['specs.mass.value']?.[0]).toMatch(/Unknown unit "furlongs"/);
    expect(counts()).toEqual(before);
    await expect(createGearAction(lantern())).rejects.toMatchObject({ redirectTo: '/gear/northcairn-test-lantern-300' });

    state.user = users.other;
    const denied = await updateGearAction('northcairn-test-lantern-300', { name: 'Mine' });
    expect(denied.message).toMatch(/No gear item here/);
    state.user = null;
    expect((await createGearAction(lantern())).message).toBe('Sign in to do this.');
    expect(AppError).toBeDefined();
  });
});
