/**
 * Multi-role gear and feature checklists (issue 9): stored through the gear service, schema, API and
 * actions like ports; a draft's answers change live, an approved item's wait with its pending change
 * and show in the spec history; bad feature names or roles → 4xx naming the field, nothing stored;
 * the public API and browse show approved answers and roles only.
 */
import { beforeEach, describe, expect, it, vi } from 'vitest';
import { createSessionUser, dbMock, guardMock, navigationMock, type SessionUser } from '../support/integration-mocks';
import { getTableName } from 'drizzle-orm';
import { createTestDb } from '@/db/test-db';
import type { Db } from '@/db/connection';
import { gearFeatures, gearItems, gearPendingChanges, specChanges, specs, type Role } from '@/db/schema';
import { AppError } from '@/lib/http/errors';

const state = vi.hoisted(() => ({ db: null as unknown as Db, user: null as SessionUser | null }));
vi.mock('@/db', () => dbMock(() => state.db));
vi.mock('next/navigation', () => navigationMock());
vi.mock('@/lib/auth/guard', () => guardMock(() => state.user));

const { approveGear, createGear, getGearView, specHistory, submitGear, updateGear } = await import('@/db/gear');
const { featuresOfGear, rolesOfItem, alsoServesAsOf, itemServesAs } = await import('@/db/gear-roles');
const { GET: GET_ONE, PATCH } = await import('@/app/api/v1/gear/[slug]/route');
const { GET: GET_LIST } = await import('@/app/api/v1/gear/route');
const { GET: GET_COMPARE } = await import('@/app/api/v1/compare/route');
const { POST } = await import('@/app/api/v1/gear/route');
const { updateGearAction } = await import('@/lib/gear/actions');

type U = SessionUser;
let author: U;
let editor: U;

const tables = [gearItems, specs, specChanges, gearPendingChanges, gearFeatures];
const counts = () => tables.map((t) => (state.db.$client.prepare(`select count(*) as n from ${getTableName(t)}`).get() as { n: number }).n);
const gearRow = (slug: string) => state.db.select().from(gearItems).all().find((g) => g.slug === slug)!;

const lantern = (extra: Record<string, unknown> = {}) => ({
  category: 'light',
  name: 'Test Lantern',
  maker: 'Glowmere',
  kind: 'lantern',
  chemistry: 'li-ion',
  waterRating: 'IPX4',
  specs: { mass: { value: '400 g' }, luminousFlux: { value: '300 lm' }, ratedEnergy: { value: '18.5 Wh' } },
  ...extra,
});

const BASE = 'http://localhost:3000';
const json = (method: string, path: string, body: unknown) =>
  new Request(`${BASE}${path}`, { method, headers: { 'content-type': 'application/json', origin: BASE }, body: typeof body === 'string' ? body : JSON.stringify(body) });
const params = (slug: string) => ({ params: Promise.resolve({ slug }) });

function approve(slug: string) {
  submitGear(state.db, author, slug);
  approveGear(state.db, editor, slug);
}

beforeEach(() => {
  state.db = createTestDb().db;
  const make = (key: string, role: Role) => createSessionUser(state.db, key, role);
  author = make('author', 'reviewer');
  editor = make('editor', 'editor');
  state.user = null;
});

describe('roles and features on create and edit', () => {
  it('stores what a lantern also serves as and its answers, logged in words', () => {
    const { id, slug } = createGear(state.db, author, lantern({ alsoServesAs: ['power-bank'], features: { 'red-mode': true, magnet: false, 'hanging-hook': { present: true, detail: 'steel' } } }));
    const item = gearRow(slug);
    expect(alsoServesAsOf(item)).toEqual(['power-bank']);
    expect(rolesOfItem(item)).toEqual(['light', 'power-bank']);
    expect(itemServesAs(item, 'power-bank')).toBe(true);
    expect(itemServesAs(item, 'radio')).toBe(false);
    expect(state.db.select().from(gearFeatures).all().map((r) => [r.name, r.present, r.detail]).sort()).toEqual([
      ['hanging-hook', true, 'steel'],
      ['magnet', false, null],
      ['red-mode', true, null],
    ]);
    const history = specHistory(state.db, slug, author).filter((h) => h.key.startsWith('Feature') || h.key === 'Also serves as');
    expect(history.map((h) => [h.key, h.oldText, h.newText]).sort()).toEqual([
      ['Also serves as', null, 'Power bank'],
      ['Feature: Hanging hook', null, 'has (steel)'],
      ['Feature: Magnetic base', null, 'has not'],
      ['Feature: Red light mode', null, 'has'],
    ]);
    // A draft is not public.
    expect(featuresOfGear(state.db, [id])).toEqual({ [id]: [] });
  });

  it('changes a draft live; a patch without features keeps them', () => {
    const { slug } = createGear(state.db, author, lantern({ features: { 'red-mode': true } }));
    updateGear(state.db, author, slug, { features: { 'red-mode': false, 'lock-out': true } });
    expect(count()).toBe(0);
    expect(state.db.select().from(gearFeatures).all().map((r) => `${r.name}=${r.present}`).sort()).toEqual(['lock-out=true', 'red-mode=false']);
    updateGear(state.db, author, slug, { name: 'Renamed lantern' });
    expect(state.db.select().from(gearFeatures).all()).toHaveLength(2);
    function count() {
      return state.db.select().from(gearPendingChanges).all().length;
    }
  });

  it('keeps an approved item’s answers and roles public until its edit is approved, then applies and notes it', () => {
    const { id, slug } = createGear(state.db, author, lantern({ features: { 'red-mode': false } }));
    approve(slug);
    expect(featuresOfGear(state.db, [id])[id]).toEqual([{ name: 'red-mode', present: false }]);

    const result = updateGear(state.db, author, slug, { alsoServesAs: ['power-bank'], features: { 'red-mode': true, 'output-12v': false }, changeNote: 'Maker’s manual lists a red mode' });
    expect(result.pending).toBe(true);
    // Readers still see the approved answers and a single role; the author sees the pending ones.
    expect(featuresOfGear(state.db, [id])[id]).toEqual([{ name: 'red-mode', present: false }]);
    expect(rolesOfItem(gearRow(slug))).toEqual(['light']);
    expect(getGearView(state.db, slug, null).version.features).toEqual([{ name: 'red-mode', present: false }]);
    expect(getGearView(state.db, slug, author).version.alsoServesAs).toEqual(['power-bank']);
    expect(getGearView(state.db, slug, author).version.features.map((f) => f.name)).toEqual(['red-mode', 'output-12v']);
    const pending = specHistory(state.db, slug, author).filter((h) => h.context === 'pending');
    expect(pending.map((h) => [h.key, h.oldText, h.newText]).sort()).toEqual([
      ['Also serves as', null, 'Power bank'],
      ['Feature: 12 V output', null, 'has not'],
      ['Feature: Red light mode', 'has not', 'has'],
    ]);

    approve(slug);
    expect(featuresOfGear(state.db, [id])[id]!.map((f) => `${f.name}=${f.present}`).sort()).toEqual(['output-12v=false', 'red-mode=true']);
    expect(rolesOfItem(gearRow(slug))).toEqual(['light', 'power-bank']);
    expect(specHistory(state.db, slug, editor).filter((h) => h.context === 'approval').map((h) => h.key).sort()).toEqual(['Also serves as', 'Feature: 12 V output', 'Feature: Red light mode']);
    const note = getGearView(state.db, slug, null).notes[0];
    expect(note?.summary).toContain('Feature: Red light mode: has not → has');
    expect(note?.summary).toContain('Also serves as: none → Power bank');
  });

  it('an edit that leaves out roles or features keeps the approved ones on approval', () => {
    const { id, slug } = createGear(state.db, author, lantern({ alsoServesAs: ['power-bank'], features: { magnet: true } }));
    approve(slug);
    updateGear(state.db, author, slug, { name: 'Test Lantern mk2' });
    approve(slug);
    expect(rolesOfItem(gearRow(slug))).toEqual(['light', 'power-bank']);
    expect(featuresOfGear(state.db, [id])[id]).toEqual([{ name: 'magnet', present: true }]);
  });
});

describe('bad features and roles: 4xx naming the field, nothing stored', () => {
  const cases: [string, Record<string, unknown>, string, RegExp][] = [
    ['an unknown feature', { features: { 'laser-sight': true } }, 'features.laser-sight', /no feature "laser-sight"/],
    ['a feature of another category', { features: { kickstand: true } }, 'features.kickstand', /not on the checklist/],
    ['the derived IP rating', { features: { 'ip-rating': true } }, 'features.ip-rating', /water rating/],
    ['a detail where none is taken', { features: { magnet: { present: true, detail: 'strong' } } }, 'features.magnet.detail', /takes no detail/],
    ['a value other than yes/no', { features: { magnet: 'sometimes' } }, 'features.magnet', /.+/],
    ['the primary category as a second role', { alsoServesAs: ['light'] }, 'alsoServesAs.0', /already its primary/],
    ['an unknown category', { alsoServesAs: ['toaster'] }, 'alsoServesAs.0', /Choose categories/],
    ['a role whose required spec is missing', { alsoServesAs: ['solar-panel'] }, 'specs.ratedPower.value', /required for a light serving as solar panel/],
  ];

  it.each(cases)('refuses %s on create and on an approved item’s edit', (_what, extra, field, message) => {
    const before = counts();
    let error: unknown;
    try {
      createGear(state.db, author, lantern(extra));
    } catch (e) {
      error = e;
    }
    expect(error).toBeInstanceOf(AppError);
    expect((error as AppError).status).toBe(422);
    expect((error as AppError).fields?.[field]?.[0]).toMatch(message);
    expect(counts()).toEqual(before);

    const { slug } = createGear(state.db, author, lantern());
    approve(slug);
    const afterApproval = counts();
    expect(() => updateGear(state.db, author, slug, extra)).toThrow(AppError);
    expect(counts()).toEqual(afterApproval);
  });

  it('answers 422 through the API with the field named and stores nothing', async () => {
    state.user = author;
    const before = counts();
    const res = await POST(json('POST', '/api/v1/gear', lantern({ features: { 'laser-sight': true } })));
    expect(res.status).toBe(422);
    const body = (await res.json()) as { error: { fields: Record<string, string[]> } };
    expect(Object.keys(body.error.fields)).toContain('features.laser-sight');
    expect(counts()).toEqual(before);

    const { slug } = createGear(state.db, author, lantern());
    const mid = counts();
    const patch = await PATCH(json('PATCH', `/api/v1/gear/${slug}`, { features: { 'red-mode': true, 'lock-out': 'perhaps' } }), params(slug));
    expect(patch.status).toBe(422);
    expect(counts()).toEqual(mid);
  });

  it('the server action refuses with field errors and saves nothing', async () => {
    const { slug } = createGear(state.db, author, lantern());
    state.user = author;
    const before = counts();
    const result = await updateGearAction(slug, { features: { kickstand: 'yes' } });
    expect(result.fields?.['features.kickstand']?.[0]).toMatch(/not on the checklist/);
    expect(counts()).toEqual(before);
  });
});

describe('browse and the public API', () => {
  /** Two lights (one serving as a bank), one bank, one panel; all approved. One pending edit, one draft. */
  function catalog() {
    const both = createGear(state.db, author, lantern({ name: 'Bank Lantern', alsoServesAs: ['power-bank'], features: { 'red-mode': true, 'hanging-hook': { present: true, detail: 'steel' } } }));
    const red = createGear(state.db, author, lantern({ name: 'Red Lantern', waterRating: null, features: { 'red-mode': true, magnet: true } }));
    const plain = createGear(state.db, author, lantern({ name: 'Plain Lantern', features: { 'red-mode': false } }));
    const bank = createGear(state.db, author, { category: 'power-bank', name: 'Plain Bank', maker: 'Voltmoth', chemistry: 'li-ion', specs: { mass: { value: '300 g' }, ratedEnergy: { value: '37 Wh' } }, features: { 'pass-through-charging': true } });
    const panel = createGear(state.db, author, { category: 'solar-panel', name: 'Plain Panel', maker: 'Brackenfold', specs: { mass: { value: '2 kg' }, ratedPower: { value: '40 W' } }, features: { kickstand: true } });
    for (const x of [both, red, plain, bank, panel]) approve(x.slug);
    // Pending after approval: the plain lantern claims a red mode and a bank role; readers must not see either yet.
    updateGear(state.db, author, plain.slug, { alsoServesAs: ['power-bank'], features: { 'red-mode': true } });
    // A never-approved draft with a red mode: hidden from guests.
    const draft = createGear(state.db, author, lantern({ name: 'Draft Lantern', features: { 'red-mode': true } }));
    return { both, red, plain, bank, panel, draft };
  }

  async function list(query: string) {
    const res = await GET_LIST(new Request(`${BASE}/api/v1/gear${query}`));
    return { status: res.status, body: (await res.json()) as { items: { slug: string; alsoServesAs: string[]; features: { name: string; state: string; detail: string | null }[] }[]; total: number; facets: { categories: { id: string; count: number }[]; all?: number }; error?: { message: string; fields: Record<string, string[]> } } };
  }

  it('category=power-bank includes items that also serve as a bank; facets count them under both', async () => {
    const c = catalog();
    const banks = await list('?category=power-bank');
    expect(banks.status).toBe(200);
    // The approved bank and the lantern approved as a bank; not the plain lantern whose bank role is still pending.
    expect(banks.body.items.map((i) => i.slug).sort()).toEqual([c.both.slug, c.bank.slug].sort());
    expect(banks.body.items.find((i) => i.slug === c.both.slug)!.alsoServesAs).toEqual(['power-bank']);
    const facets = Object.fromEntries(banks.body.facets.categories.map((f) => [f.id, f.count]));
    // Lights: 3 approved lanterns; banks: 1 bank + 1 lantern serving as one; panels: 1.
    expect(facets).toMatchObject({ light: 3, 'power-bank': 2, 'solar-panel': 1, radio: 0 });
    // Five items, each counted once under "all" although the bank lantern counts under two categories.
    expect(banks.body.facets.all).toBe(5);
    expect((await list('?category=light')).body.total).toBe(3);
  });

  it('feature.red-mode=true keeps only items stated to have it, by approved answers only', async () => {
    const c = catalog();
    const red = await list('?category=light&feature.red-mode=true');
    expect(red.status).toBe(200);
    expect(red.body.items.map((i) => i.slug).sort()).toEqual([c.both.slug, c.red.slug].sort());
    const both = await list('?feature.red-mode=true&feature.magnet=true');
    expect(both.body.items.map((i) => i.slug)).toEqual([c.red.slug]);
    // IP rating comes from the water rating: the red lantern has none.
    const ip = await list('?category=light&feature.ip-rating=true');
    expect(ip.body.items.map((i) => i.slug).sort()).toEqual([c.both.slug, c.plain.slug].sort());
    // Facets follow the feature filter too (every filter but category).
    const facets = Object.fromEntries(red.body.facets.categories.map((f) => [f.id, f.count]));
    expect(facets).toMatchObject({ light: 2, 'power-bank': 1 });
    expect((await list('?feature.kickstand=true')).body.items.map((i) => i.slug)).toEqual([c.panel.slug]);
  });

  it('refuses unknown feature names and values other than true with a 400 naming them', async () => {
    const unknown = await list('?feature.laser-sight=true');
    expect(unknown.status).toBe(400);
    expect(unknown.body.error!.fields['feature.laser-sight']![0]).toMatch(/not a feature.*red-mode/);
    const value = await list('?feature.red-mode=yes');
    expect(value.status).toBe(400);
    expect(value.body.error!.fields['feature.red-mode']![0]).toMatch(/only value is `true`/);
    const twice = await list('?feature.red-mode=true&feature.red-mode=true');
    expect(twice.status).toBe(400);
  });

  it('GET /api/v1/gear/{slug} gives the approved roles and checklist lines', async () => {
    const c = catalog();
    const res = await GET_ONE(new Request(`${BASE}/api/v1/gear/${c.both.slug}`), params(c.both.slug));
    expect(res.status).toBe(200);
    const body = (await res.json()) as { alsoServesAs: string[]; features: { name: string; state: string; detail: string | null }[] };
    expect(body.alsoServesAs).toEqual(['power-bank']);
    const by = Object.fromEntries(body.features.map((f) => [f.name, f]));
    expect(by['red-mode']).toMatchObject({ state: 'has', detail: null });
    expect(by['hanging-hook']).toMatchObject({ state: 'has', detail: 'steel' });
    expect(by['magnet']!.state).toBe('not-stated');
    expect(by['ip-rating']).toMatchObject({ state: 'has', detail: 'IPX4' });
    // The bank's checklist joins the light's.
    expect(by['output-12v']!.state).toBe('not-stated');

    const plain = (await (await GET_ONE(new Request(`${BASE}/api/v1/gear/${c.plain.slug}`), params(c.plain.slug))).json()) as typeof body;
    expect(plain.alsoServesAs).toEqual([]);
    expect(plain.features.find((f) => f.name === 'red-mode')!.state).toBe('has-not');
  });

  it('the side-by-side has a Features group with the approved answers in words', async () => {
    const c = catalog();
    const res = await GET_COMPARE(new Request(`${BASE}/api/v1/compare?items=${c.both.slug},${c.red.slug},${c.plain.slug}`));
    expect(res.status).toBe(200);
    const body = (await res.json()) as { groups: { id: string; rows: { key: string; cells: { value: unknown; best: boolean }[] }[] }[] };
    const group = body.groups.find((g) => g.id === 'features')!;
    const rows = Object.fromEntries(group.rows.map((r) => [r.key, r.cells.map((x) => x.value)]));
    expect(rows['also-serves-as']).toEqual(['Power bank', 'Only its own category', 'Only its own category']);
    // The plain lantern's pending red mode is not public: its approved answer is "has not".
    expect(rows['feature:red-mode']).toEqual(['Has', 'Has', 'Has not']);
    expect(rows['feature:hanging-hook']).toEqual(['Has (steel)', 'Not stated', 'Not stated']);
    expect(rows['feature:ip-rating']).toEqual(['Has (IPX4)', 'Not stated', 'Has (IPX4)']);
    expect(rows['feature:output-12v']).toBeUndefined();
  });
});
