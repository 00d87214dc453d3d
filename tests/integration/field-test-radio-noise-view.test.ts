import { beforeEach, describe, expect, it } from 'vitest';
import { createTestDb } from '@/db/test-db';
import type { Db } from '@/db/connection';
import type { Actor } from '@/db/gear';
import { gearItems } from '@/db/schema';
import { createUser } from '@/db/users';
import { handleCreateFieldTest, handleGetFieldTest, handleTransition } from '@/app/api/v1/field-tests/handlers';
import { handlePutRadioNoise } from '@/app/api/v1/field-tests/radio-noise-handlers';
import { fieldTestViewSchema } from '@/lib/openapi/paths/field-tests';

/*
 * GET /api/v1/field-tests/{id} carries a radio-noise check's band readings (`radioNoise`) under the same
 * visibility rule as the test itself (security-tests.md AC-02: a record the caller may not see is a 404,
 * the same as an unknown id). dBm from IARU Region 1 Rec. R.1 (check-values.md §12): HF S9 = −73 dBm,
 * 6 dB per S-unit, so S3 = −109 dBm and S5 = −97 dBm.
 */

const ORIGIN = 'http://localhost:3000';
let db: Db;
let u: Record<'author' | 'other' | 'editor', Actor>;

const json = (method: string, path: string, body: unknown) =>
  new Request(`${ORIGIN}${path}`, { method, headers: { 'content-type': 'application/json', origin: ORIGIN }, body: JSON.stringify(body) });

function addItem(slug: string, category: string, ownerId: string) {
  const at = new Date('2026-09-01T00:00:00Z');
  db.insert(gearItems)
    .values({ id: `item-${slug}`, slug, ownerId, name: slug, maker: 'Voltmoth', category, status: 'approved', approvedAt: at, priceMinor: 4000, priceCurrency: 'USD', createdAt: at, updatedAt: at })
    .run();
}

async function newTest(kind: string) {
  const res = await handleCreateFieldTest(
    db,
    u.author,
    json('POST', '/api/v1/field-tests', { kind, testedAt: '2026-10-03T20:00', placeLabel: 'Upper Meadow camp', sky: 'clear', ambientC: 8, instruments: [{ name: 'HF receiver, S-meter' }], methodNotes: 'Reference supply: a 12 V lead-acid battery.', items: ['bank'] }),
  );
  expect(res.status).toBe(201);
  return ((await res.json()) as { fieldTest: { id: string } }).fieldTest.id;
}

const band = { item: 'bank', band: '40 m', frequencyMHz: 7.1, mode: 'ssb', bandwidthHz: 2400, antenna: 'End-fed wire, 10 m', distanceM: 1, baseline: { scale: 's-meter', sUnits: 3 }, withItem: { scale: 's-meter', sUnits: 5 } };

async function read(user: Actor | null, id: string) {
  const res = await handleGetFieldTest(db, user, id);
  return { status: res.status, body: (await res.json()) as { fieldTest?: Record<string, unknown> & { radioNoise?: { readings: Record<string, unknown>[]; summaries: { item: string }[] } }; error?: { code: string; message: string } } };
}

beforeEach(() => {
  db = createTestDb().db;
  const make = (key: string, role: Actor['role']) => {
    const user = createUser(db, { email: `${key}@example.org`, name: key, passwordHash: null, role });
    return { id: user.id, role: user.role };
  };
  u = { author: make('author', 'reviewer'), other: make('other', 'reviewer'), editor: make('editor', 'editor') };
  addItem('bank', 'power-bank', u.author.id);
});

describe('GET /api/v1/field-tests/{id} with band readings', () => {
  it('the owner sees a draft’s readings; another user and a guest get the same 404 as for the test', async () => {
    const id = await newTest('radio-noise');
    expect((await handlePutRadioNoise(db, u.author, id, json('PUT', `/api/v1/field-tests/${id}/radio-noise`, { readings: [band] }))).status).toBe(200);

    const own = await read(u.author, id);
    expect(own.status).toBe(200);
    expect(fieldTestViewSchema.safeParse(own.body).success).toBe(true);
    // IARU R.1: S3 = −109 dBm, S5 = −97 dBm → a 12 dB rise, "noisy" by our thresholds (lib/measure, our own convention).
    expect(own.body.fieldTest!.radioNoise!.readings).toEqual([
      expect.objectContaining({ item: 'bank', band: '40 m', range: 'below-30mhz', baselineDbm: -109, withItemDbm: -97, riseDb: 12, verdict: 'noisy' }),
    ]);
    expect(own.body.fieldTest!.radioNoise!.summaries.map((s) => s.item)).toEqual(['bank']);

    const unknown = await read(u.other, 'no-such-test');
    for (const viewer of [u.other, null]) {
      const hidden = await read(viewer, id);
      expect(hidden.status).toBe(404);
      expect(hidden.body).toEqual(unknown.body);
      expect(JSON.stringify(hidden.body)).not.toMatch(/40 m|-97/);
    }
  });

  it('a guest sees an approved test’s readings, identical to the radio-noise route’s', async () => {
    const id = await newTest('radio-noise');
    await handlePutRadioNoise(db, u.author, id, json('PUT', `/api/v1/field-tests/${id}/radio-noise`, { readings: [band] }));
    expect((await handleTransition(db, u.author, id, json('POST', `/api/v1/field-tests/${id}/transitions`, { action: 'submit' }))).status).toBe(200);
    expect((await handleTransition(db, u.editor, id, json('POST', `/api/v1/field-tests/${id}/transitions`, { action: 'approve' }))).status).toBe(200);

    const guest = await read(null, id);
    expect(guest.status).toBe(200);
    expect(guest.body.fieldTest!.public).toBe(true);
    expect(guest.body.fieldTest!.radioNoise!.readings).toHaveLength(1);
    expect(guest.body.fieldTest!.radioNoise!.readings[0]).toMatchObject({ riseDb: 12, verdict: 'noisy' });
    expect((await read(u.other, id)).body.fieldTest!.radioNoise).toEqual(guest.body.fieldTest!.radioNoise);
  });

  it('other kinds carry no radioNoise key', async () => {
    const id = await newTest('mass-check');
    const own = await read(u.author, id);
    expect(own.status).toBe(200);
    expect(own.body.fieldTest).not.toHaveProperty('radioNoise');
  });
});
