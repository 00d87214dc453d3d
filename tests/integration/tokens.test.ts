import { beforeEach, describe, expect, it, vi } from 'vitest';
import { createSessionUser, dbMock, guardMock, type SessionUser } from '../support/integration-mocks';
import Database from 'better-sqlite3';
import { createHash } from 'node:crypto';
import { readFileSync } from 'node:fs';
import { fileURLToPath } from 'node:url';
import { createTestDb } from '@/db/test-db';
import type { Db } from '@/db/connection';
import { gearItems, type Role } from '@/db/schema';

/*
 * Personal API tokens and the write API (issue 7), through the real route handlers over a fresh database.
 * Drawn from ../shared/reference/security-tests.md: AC-02 (IDOR: another user's draft → 404, approved → 403),
 * AC-08 / SE-04 (role change and disabling take effect on the next request), CS-01 / CS-03 (cookie writes
 * need a same-origin proof; wrong media types → 415), IV-05 (413 from a byte count), DB-02 (SQLITE_BUSY → 503
 * with Retry-After), and the "denied: 401 / 404 / 403, nothing written" rule of the plan's preamble.
 */

const state = vi.hoisted(() => ({ db: null as unknown as Db, session: null as SessionUser | null }));
vi.mock('@/db', () => dbMock(() => state.db));
// The session cookie path: the signed-in user of this test (null = no cookie). Tokens go through the real code.
vi.mock('@/lib/auth/guard', () => guardMock(() => state.session));

const { changeUserRole, setUserDisabled } = await import('@/db/users');
const { authenticateApiToken, createApiToken, listApiTokens, revokeApiToken, LAST_USED_RESOLUTION_MS } = await import('@/db/api-tokens');
const { errorResponse, isSqliteBusy } = await import('@/lib/http/api');
const gearList = await import('@/app/api/v1/gear/route');
const gearOne = await import('@/app/api/v1/gear/[slug]/route');
const photos = await import('@/app/api/v1/gear/[slug]/photos/route');
const fieldTests = await import('@/app/api/v1/field-tests/route');
const fieldTestOne = await import('@/app/api/v1/field-tests/[id]/route');
const readings = await import('@/app/api/v1/field-tests/[id]/readings/route');
const trials = await import('@/app/api/v1/field-tests/[id]/trials/route');
const transitions = await import('@/app/api/v1/field-tests/[id]/transitions/route');
const kits = await import('@/app/api/v1/kits/route');
const kitOne = await import('@/app/api/v1/kits/[id]/route');
const me = await import('@/app/api/v1/me/route');

const ORIGIN = 'http://localhost:3000';
type Users = Record<'author' | 'other' | 'editor' | 'reader' | 'admin', SessionUser>;
let u: Users;
let file: string;

function req(method: string, path: string, opts: { body?: BodyInit; type?: string; token?: string; headers?: Record<string, string> } = {}) {
  const headers: Record<string, string> = { ...opts.headers };
  if (opts.type) headers['content-type'] = opts.type;
  if (opts.token) headers.authorization = `Bearer ${opts.token}`;
  return new Request(`${ORIGIN}${path}`, { method, headers, body: opts.body });
}
const json = (method: string, path: string, body: unknown, opts: { token?: string; headers?: Record<string, string> } = {}) =>
  req(method, path, { ...opts, type: 'application/json', body: JSON.stringify(body) });
const p = <T extends Record<string, string>>(params: T) => ({ params: Promise.resolve(params) });
// eslint-disable-next-line @typescript-eslint/no-explicit-any
const body = async (r: Response): Promise<any> => r.json();

const lantern = (name = 'Token Lantern 300') => ({
  category: 'light',
  name,
  maker: 'Northcairn',
  kind: 'lantern',
  price: { amount: '40.00', currency: 'USD' },
  chemistry: 'li-ion',
  specs: { mass: { value: '410 g' }, luminousFlux: { value: '300 lm' }, runtime: { value: '5 h' }, ratedEnergy: { value: '10 Wh', source: 'manual' } },
});
const record = (items: string[]) => ({ kind: 'light-runtime', testedAt: '2026-09-08T18:00', placeLabel: 'Lakeshore test bench', sky: 'indoor', ambientC: 19.5, instruments: [], methodNotes: 'Lantern on high in a closed box.', items });
const kit = () => ({ name: 'Token kit', purpose: '', tripDays: 2, entries: [{ gearItemId: null, freeName: 'Headlamp', quantity: 1, freeDrawW: 1, hoursPerDay: 2 }] });

const TABLES = ['gear_items', 'specs', 'photos', 'field_tests', 'trials', 'readings', 'kits', 'kit_entries', 'api_tokens'];
const counts = () => Object.fromEntries(TABLES.map((t) => [t, (state.db.$client.prepare(`select count(*) as n from ${t}`).get() as { n: number }).n]));

function addItem(slug: string, ownerId: string, approved: boolean) {
  const at = new Date('2026-09-01T00:00:00Z');
  state.db
    .insert(gearItems)
    .values({ id: `item-${slug}`, slug, ownerId, name: slug, maker: 'Glowmere', category: 'light', status: approved ? 'approved' : 'draft', approvedAt: approved ? at : null, createdAt: at, updatedAt: at })
    .run();
}

const tokenFor = (who: keyof Users, scope: 'read' | 'write' = 'write') => createApiToken(state.db, u[who], { name: `${who} ${scope}`, scope }).token;

beforeEach(() => {
  const created = createTestDb();
  state.db = created.db;
  file = created.file;
  const make = (key: string, role: Role) => createSessionUser(state.db, key, role, 'cedar-hollow.example');
  u = { author: make('author', 'reviewer'), other: make('other', 'reviewer'), editor: make('editor', 'editor'), reader: make('reader', 'reader'), admin: make('admin', 'admin') };
  state.session = null;
  addItem('lantern', u.author.id, true);
  addItem('others-draft', u.other.id, false);
  addItem('others-public', u.other.id, true);
});

describe('creating tokens', () => {
  it('returns a 256-bit secret once and stores only its SHA-256 and a short prefix', () => {
    const { token, summary } = createApiToken(state.db, u.author, { name: 'Bench logger', scope: 'write' });
    expect(token).toMatch(/^tb_[A-Za-z0-9_-]{8}_[A-Za-z0-9_-]{43}$/); // 43 base64url chars = 32 bytes = 256 bits (RFC 4648 §5)
    expect(token.startsWith(summary.prefix)).toBe(true);
    const row = state.db.$client.prepare('select * from api_tokens').get() as Record<string, unknown>;
    // SHA-256 of the whole token (FIPS 180-4), hex.
    expect(row.token_hash).toBe(createHash('sha256').update(token).digest('hex'));
    const secret = token.slice(summary.prefix.length + 1);
    for (const value of Object.values(row)) expect(String(value)).not.toContain(secret);
    // The list (what the account page shows) carries no hash and no secret: it cannot be shown again.
    const [listed] = listApiTokens(state.db, u.author.id);
    expect(Object.keys(listed!).sort()).toEqual(['createdAt', 'id', 'lastUsedAt', 'name', 'prefix', 'revokedAt', 'scope']);
    expect(JSON.stringify(listed)).not.toContain(secret);
  });

  it('two tokens never share a secret or prefix; readers get 403', () => {
    const a = tokenFor('author');
    const b = tokenFor('author');
    expect(a).not.toBe(b);
    expect(a.slice(0, 11)).not.toBe(b.slice(0, 11));
    expect(() => createApiToken(state.db, u.reader, { name: 'x', scope: 'read' })).toThrow(expect.objectContaining({ status: 403 }));
  });

  it('revoking another user’s token is a 404 and leaves it working', () => {
    const token = tokenFor('other');
    const [row] = listApiTokens(state.db, u.other.id);
    expect(() => revokeApiToken(state.db, u.author.id, row!.id)).toThrow(expect.objectContaining({ status: 404 }));
    expect(authenticateApiToken(state.db, token)).not.toBeNull();
  });
});

describe('Bearer tokens on the write routes', () => {
  it('a write token creates a gear item as its owner; a read token is refused with 403 and writes nothing', async () => {
    const write = tokenFor('author', 'write');
    const read = tokenFor('author', 'read');
    const before = counts();
    const refused = await gearList.POST(json('POST', '/api/v1/gear', lantern(), { token: read }));
    expect(refused.status).toBe(403);
    expect((await body(refused)).error.message).toMatch(/read-only/);
    expect(counts()).toEqual(before);
    const created = await gearList.POST(json('POST', '/api/v1/gear', lantern(), { token: write }));
    expect(created.status).toBe(201);
    const slug = (await body(created)).item.slug;
    expect(state.db.$client.prepare('select owner_id as o from gear_items where slug = ?').get(slug)).toEqual({ o: u.author.id });
  });

  it('a read token reads its owner’s own kits (GET), but cannot create one', async () => {
    const write = tokenFor('author', 'write');
    const read = tokenFor('author', 'read');
    expect((await kits.POST(json('POST', '/api/v1/kits', kit(), { token: write }))).status).toBe(201);
    const mine = await kits.GET(req('GET', '/api/v1/kits', { token: read }));
    expect(mine.status).toBe(200);
    expect((await body(mine)).kits).toHaveLength(1);
    expect((await kits.POST(json('POST', '/api/v1/kits', kit(), { token: read }))).status).toBe(403);
    expect(counts().kits).toBe(1);
  });

  it('a read token of an editor sees only public data and the editor’s own drafts', async () => {
    const draft = await fieldTests.POST(json('POST', '/api/v1/field-tests', record(['others-public']), { token: tokenFor('other') }));
    expect(draft.status).toBe(201);
    const id = (await body(draft)).fieldTest.id;
    // With the session (or a write token) the editor sees the draft; a read token does not.
    expect((await fieldTestOne.GET(req('GET', `/api/v1/field-tests/${id}`, { token: tokenFor('editor', 'write') }), p({ id }))).status).toBe(200);
    expect((await fieldTestOne.GET(req('GET', `/api/v1/field-tests/${id}`, { token: tokenFor('editor', 'read') }), p({ id }))).status).toBe(404);
    expect((await fieldTestOne.GET(req('GET', `/api/v1/field-tests/${id}`, { token: tokenFor('other', 'read') }), p({ id }))).status).toBe(200);
  });

  it('posts a logger CSV as text/csv with the fields in the query string (the curl example)', async () => {
    const token = tokenFor('author');
    const created = await fieldTests.POST(json('POST', '/api/v1/field-tests', record(['lantern']), { token }));
    expect(created.status).toBe(201);
    const id = (await body(created)).fieldTest.id;
    const csv = readFileSync(fileURLToPath(new URL('../fixtures/readings/lantern-fade.csv', import.meta.url)));
    const res = await readings.POST(req('POST', `/api/v1/field-tests/${id}/readings?item=lantern&label=Trial%201`, { token, type: 'text/csv; charset=utf-8', body: csv }), p({ id }));
    expect(res.status).toBe(201);
    // 38 data rows: the fixture's 40 lines less the comment and the header (tests/integration/field-tests.test.ts counts the same).
    expect((await body(res)).trial.rows).toBe(38);
    // A bad query field is a 422 naming it, with nothing stored.
    const before = counts();
    const bad = await readings.POST(req('POST', `/api/v1/field-tests/${id}/readings?label=Trial%202`, { token, type: 'text/csv', body: csv }), p({ id }));
    expect(bad.status).toBe(422);
    expect(Object.keys((await body(bad)).error.fields)).toContain('item');
    expect(counts()).toEqual(before);
  });

  it('a token of user X gets 404 for user Y’s draft and 403 for Y’s public item (status order 404 before 403)', async () => {
    const token = tokenFor('author');
    const before = counts();
    expect((await gearOne.PATCH(json('PATCH', '/api/v1/gear/others-draft', { name: 'Taken over' }, { token }), p({ slug: 'others-draft' }))).status).toBe(404);
    expect((await gearOne.PATCH(json('PATCH', '/api/v1/gear/others-public', { name: 'Taken over' }, { token }), p({ slug: 'others-public' }))).status).toBe(403);
    const form = new FormData();
    form.set('file', new Blob([new Uint8Array([0xff, 0xd8, 0xff])]), 'x.jpg');
    expect((await photos.POST(req('POST', '/api/v1/gear/others-draft/photos', { token, body: form }), p({ slug: 'others-draft' }))).status).toBe(404);
    const theirs = await fieldTests.POST(json('POST', '/api/v1/field-tests', record(['others-public']), { token: tokenFor('other') }));
    const id = (await body(theirs)).fieldTest.id;
    const mid = counts();
    expect((await readings.POST(req('POST', `/api/v1/field-tests/${id}/readings?item=others-public&label=x`, { token, type: 'text/csv', body: 'elapsed_s,lux\n0,1\n30,1\n60,1\n' }), p({ id }))).status).toBe(404);
    expect((await fieldTestOne.PATCH(json('PATCH', `/api/v1/field-tests/${id}`, record(['others-public']), { token }), p({ id }))).status).toBe(404);
    expect(counts()).toEqual(mid);
    expect(mid.gear_items).toBe(before.gear_items);
  });
});

describe('a token acts as its owner now', () => {
  it('revoked → 401 with a Bearer challenge, at once', async () => {
    const token = tokenFor('author');
    const [row] = listApiTokens(state.db, u.author.id);
    expect((await kits.GET(req('GET', '/api/v1/kits', { token }))).status).toBe(200);
    revokeApiToken(state.db, u.author.id, row!.id);
    const res = await kits.GET(req('GET', '/api/v1/kits', { token }));
    expect(res.status).toBe(401);
    // RFC 9110 §11.6.1: a 401 carries WWW-Authenticate.
    expect(res.headers.get('www-authenticate')).toMatch(/^Bearer /);
    expect((await kits.POST(json('POST', '/api/v1/kits', kit(), { token }))).status).toBe(401);
    expect(counts().kits).toBe(0);
  });

  it('disabled owner → 401; enabled again → works (SE-04)', async () => {
    const token = tokenFor('author');
    setUserDisabled(state.db, { userId: u.author.id, disabled: true, actorId: u.admin.id });
    expect((await kits.POST(json('POST', '/api/v1/kits', kit(), { token }))).status).toBe(401);
    setUserDisabled(state.db, { userId: u.author.id, disabled: false, actorId: u.admin.id });
    expect((await kits.POST(json('POST', '/api/v1/kits', kit(), { token }))).status).toBe(201);
  });

  it('a role change applies to the next request (AC-08): demoted to reader → 403 on gear, promoted back → 201', async () => {
    const token = tokenFor('author');
    expect((await gearList.POST(json('POST', '/api/v1/gear', lantern('First'), { token }))).status).toBe(201);
    changeUserRole(state.db, { userId: u.author.id, role: 'reader', actorId: u.admin.id });
    const before = counts();
    expect((await gearList.POST(json('POST', '/api/v1/gear', lantern('Second'), { token }))).status).toBe(403);
    expect(counts()).toEqual(before);
    changeUserRole(state.db, { userId: u.author.id, role: 'reviewer', actorId: u.admin.id });
    expect((await gearList.POST(json('POST', '/api/v1/gear', lantern('Third'), { token }))).status).toBe(201);
  });

  it('unknown, malformed or non-Bearer credentials → 401, never a silent fallback to the session', async () => {
    state.session = u.author;
    const real = tokenFor('author');
    const flipped = real.slice(0, -1) + (real.endsWith('A') ? 'B' : 'A');
    for (const authorization of [`Bearer ${flipped}`, 'Bearer tb_short', 'Bearer ', 'Basic YXV0aG9yOnNlY3JldA==', `Token ${real}`, `Bearer ${real} extra`]) {
      const res = await kits.GET(req('GET', '/api/v1/kits', { headers: { authorization } }));
      expect(res.status, authorization).toBe(401);
      expect(JSON.stringify(await body(res))).not.toContain('tb_');
    }
  });

  it('marks last used on first use, and writes it again only after a minute', () => {
    const token = tokenFor('author');
    const lastUsed = () => listApiTokens(state.db, u.author.id)[0]!.lastUsedAt?.getTime() ?? null;
    expect(lastUsed()).toBeNull();
    const t0 = Date.UTC(2026, 11, 2, 8, 0, 0);
    authenticateApiToken(state.db, token, t0);
    expect(lastUsed()).toBe(t0);
    authenticateApiToken(state.db, token, t0 + LAST_USED_RESOLUTION_MS - 1);
    expect(lastUsed()).toBe(t0);
    authenticateApiToken(state.db, token, t0 + LAST_USED_RESOLUTION_MS + 1);
    expect(lastUsed()).toBe(t0 + LAST_USED_RESOLUTION_MS + 1);
  });
});

describe('GET /api/v1/me', () => {
  it('names the caller with the role and scope in force now, and nothing more', async () => {
    expect((await me.GET(req('GET', '/api/v1/me'))).status).toBe(401);
    const res = await me.GET(req('GET', '/api/v1/me', { token: tokenFor('editor', 'read') }));
    expect(res.status).toBe(200);
    expect(res.headers.get('cache-control')).toBe('private, no-store');
    expect(await body(res)).toEqual({ caller: { id: u.editor.id, name: 'editor', role: 'reviewer', via: 'token', scope: 'read' } });
    state.session = u.author;
    expect((await body(await me.GET(req('GET', '/api/v1/me')))).caller).toMatchObject({ role: 'reviewer', via: 'session', scope: 'write' });
  });
});

describe('session cookie writes need a same-origin proof (CS-01)', () => {
  it('403 without Origin or Sec-Fetch-Site, or with a cross-site one; accepted with either proof; a token needs none', async () => {
    state.session = u.author;
    const before = counts();
    const attempts: Record<string, string>[] = [{}, { 'sec-fetch-site': 'cross-site' }, { 'sec-fetch-site': 'same-site' }, { origin: 'https://evil.example' }, { origin: 'null' }, { origin: 'https://evil.example', 'sec-fetch-site': 'same-origin' }];
    for (const headers of attempts) {
      const res = await kits.POST(json('POST', '/api/v1/kits', kit(), { headers }));
      expect(res.status, JSON.stringify(headers)).toBe(403);
    }
    expect((await gearOne.PATCH(json('PATCH', '/api/v1/gear/lantern', { name: 'x' }), p({ slug: 'lantern' }))).status).toBe(403);
    expect(counts()).toEqual(before);
    expect((await kits.POST(json('POST', '/api/v1/kits', kit(), { headers: { origin: ORIGIN } }))).status).toBe(201);
    expect((await kits.POST(json('POST', '/api/v1/kits', kit(), { headers: { 'sec-fetch-site': 'same-origin' } }))).status).toBe(201);
    // Reads with a cookie need no proof.
    expect((await kits.GET(req('GET', '/api/v1/kits'))).status).toBe(200);
    state.session = null;
    expect((await kits.POST(json('POST', '/api/v1/kits', kit(), { token: tokenFor('author') }))).status).toBe(201);
    expect((await kits.POST(json('POST', '/api/v1/kits', kit()))).status).toBe(401);
  });
});

describe('each write route accepts only its documented media types (CS-03)', () => {
  it('415 for the wrong type on every write route, with nothing stored', async () => {
    const token = tokenFor('author');
    const ft = await fieldTests.POST(json('POST', '/api/v1/field-tests', record(['lantern']), { token }));
    const id = (await body(ft)).fieldTest.id;
    const k = await kits.POST(json('POST', '/api/v1/kits', kit(), { token }));
    const kitId = (await body(k)).kit.id;
    const jsonBody = JSON.stringify({ name: 'x' });
    const wrong: [string, string | undefined][] = [
      ['text/plain', jsonBody],
      ['application/x-www-form-urlencoded', 'name=x'],
      ['multipart/form-data; boundary=x', '--x--'],
      ['application/json-patch+json', jsonBody],
      ['', jsonBody],
    ];
    const jsonRoutes: [string, (r: Request) => Promise<Response>][] = [
      ['POST /gear', (r) => gearList.POST(r)],
      ['PATCH /gear/{slug}', (r) => gearOne.PATCH(r, p({ slug: 'lantern' }))],
      ['POST /field-tests', (r) => fieldTests.POST(r)],
      ['PATCH /field-tests/{id}', (r) => fieldTestOne.PATCH(r, p({ id }))],
      ['POST /field-tests/{id}/trials', (r) => trials.POST(r, p({ id }))],
      ['POST /field-tests/{id}/transitions', (r) => transitions.POST(r, p({ id }))],
      ['POST /kits', (r) => kits.POST(r)],
      ['PATCH /kits/{id}', (r) => kitOne.PATCH(r, p({ id: kitId }))],
    ];
    const before = counts();
    for (const [name, call] of jsonRoutes) {
      for (const [type, payload] of wrong) {
        const res = await call(req('POST', '/x', { token, type: type || undefined, body: payload }));
        expect(res.status, `${name} with “${type}”`).toBe(415);
        expect((await body(res)).error.code).toBe('unsupported_media_type');
      }
    }
    // Readings: text/csv, multipart/form-data or JSON only.
    for (const type of ['text/plain', 'application/xml', 'application/octet-stream', 'text/tab-separated-values']) {
      const res = await readings.POST(req('POST', `/api/v1/field-tests/${id}/readings?item=lantern&label=x`, { token, type, body: 'elapsed_s,lux\n0,1\n' }), p({ id }));
      expect(res.status, `readings with ${type}`).toBe(415);
    }
    // Photos: multipart/form-data only.
    for (const type of ['application/json', 'image/jpeg', 'text/plain']) {
      const res = await photos.POST(req('POST', '/api/v1/gear/lantern/photos', { token, type, body: '{}' }), p({ slug: 'lantern' }));
      expect(res.status, `photos with ${type}`).toBe(415);
    }
    expect(counts()).toEqual(before);
  });

  it('kits JSON above 256 KB → 413, from the declared length and from the bytes received (IV-05)', async () => {
    const token = tokenFor('author');
    const huge = JSON.stringify({ ...kit(), purpose: 'x'.repeat(300 * 1024) });
    const declared = await kits.POST(req('POST', '/api/v1/kits', { token, type: 'application/json', body: huge, headers: { 'content-length': String(huge.length) } }));
    expect(declared.status).toBe(413);
    const stream = new ReadableStream<Uint8Array>({
      start(controller) {
        controller.enqueue(new TextEncoder().encode(huge));
        controller.close();
      },
    });
    const chunked = await kits.POST(new Request(`${ORIGIN}/api/v1/kits`, { method: 'POST', body: stream, headers: { 'content-type': 'application/json', authorization: `Bearer ${token}` }, duplex: 'half' } as RequestInit));
    expect(chunked.status).toBe(413);
    expect(counts().kits).toBe(0);
  });
});

describe('SQLITE_BUSY → 503 with Retry-After (DB-02)', () => {
  it('a write that waits out the lock answers 503 busy, stores nothing, and succeeds when sent again', async () => {
    const token = tokenFor('author');
    state.db.$client.pragma('busy_timeout = 50');
    const other = new Database(file);
    other.exec('BEGIN IMMEDIATE'); // another writer holds the lock past our busy timeout
    try {
      const res = await kits.POST(json('POST', '/api/v1/kits', kit(), { token }));
      expect(res.status).toBe(503);
      expect(res.headers.get('retry-after')).toBe('2');
      const error = (await body(res)).error;
      expect(error.code).toBe('busy');
      expect(error.message).not.toMatch(/SQLITE|SqliteError/);
    } finally {
      other.exec('ROLLBACK');
      other.close();
    }
    expect(counts().kits).toBe(0);
    expect((await kits.POST(json('POST', '/api/v1/kits', kit(), { token }))).status).toBe(201);
  });

  it('recognises SQLITE_BUSY and its extended codes only', () => {
    // Extended result codes: sqlite.org/rescode.html (SQLITE_BUSY_RECOVERY, SQLITE_BUSY_SNAPSHOT, SQLITE_BUSY_TIMEOUT).
    for (const code of ['SQLITE_BUSY', 'SQLITE_BUSY_SNAPSHOT', 'SQLITE_BUSY_TIMEOUT']) expect(isSqliteBusy(Object.assign(new Error('x'), { code }))).toBe(true);
    for (const code of ['SQLITE_LOCKED', 'SQLITE_CONSTRAINT', 'SQLITE_BUSYNESS', undefined]) expect(isSqliteBusy(Object.assign(new Error('x'), { code }))).toBe(false);
    expect(errorResponse(Object.assign(new Error('database is locked'), { code: 'SQLITE_BUSY' })).status).toBe(503);
    const logged = vi.spyOn(console, 'error').mockImplementation(() => {});
    expect(errorResponse(Object.assign(new Error('UNIQUE'), { code: 'SQLITE_CONSTRAINT' })).status).toBe(500);
    expect(logged).toHaveBeenCalledOnce();
    logged.mockRestore();
  });
});
