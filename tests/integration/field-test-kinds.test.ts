import { beforeEach, describe, expect, it } from 'vitest';
import { randomUUID } from 'node:crypto';
import { createTestDb } from '@/db/test-db';
import type { Db } from '@/db/connection';
import type { Actor } from '@/db/gear';
import { fieldTests, gearItems } from '@/db/schema';
import { createUser } from '@/db/users';
import { createFieldTest, updateFieldTest } from '@/db/field-tests';
import { handleCreateFieldTest, handleUpdateFieldTest } from '@/app/api/v1/field-tests/handlers';
import { AppError } from '@/lib/http/errors';

/* The kind ↔ category rule (lib/field-tests/kind-categories.ts) holds in the data layer for the API and the server action alike. */

const ORIGIN = 'http://localhost:3000';
let db: Db;
let author: Actor;

const json = (method: string, path: string, body: unknown) =>
  new Request(`${ORIGIN}${path}`, { method, headers: { 'content-type': 'application/json', origin: ORIGIN }, body: JSON.stringify(body) });

const record = (over: Record<string, unknown> = {}) => ({
  kind: 'solar-output',
  testedAt: '2026-09-08T12:00',
  placeLabel: 'Meadow bench',
  sky: 'clear',
  ambientC: 21,
  instruments: [{ name: 'USB power meter' }],
  methodNotes: 'Panel facing south.',
  items: ['panel'],
  ...over,
});

function addItem(slug: string, category: string, name: string) {
  db.insert(gearItems).values({ id: randomUUID(), slug, ownerId: author.id, name, maker: 'Voltmoth', category, status: 'approved', approvedAt: new Date() }).run();
}

beforeEach(() => {
  db = createTestDb().db;
  const u = createUser(db, { email: 'r@example.test', name: 'R', passwordHash: null, role: 'reviewer' });
  author = { id: u.id, role: 'reviewer' };
  addItem('panel', 'solar-panel', 'Heathray 28');
  addItem('bank', 'power-bank', 'Cell 20');
  addItem('lamp', 'light', 'Hearthglow');
});

describe('field test kind must fit the item category', () => {
  it('API: 422 naming the item and the kind, nothing stored', async () => {
    const res = await handleCreateFieldTest(db, author, json('POST', '/api/v1/field-tests', record({ items: ['panel', 'bank'] })));
    expect(res.status).toBe(422);
    const body = (await res.json()) as { error: { message: string; fields: Record<string, string[]> } };
    expect(body.error.message).toContain('solar output');
    expect(body.error.message).toContain('“Voltmoth Cell 20”');
    expect(body.error.fields.items).toHaveLength(1);
    expect(db.select().from(fieldTests).all()).toHaveLength(0);
  });

  it('API: a fitting test is created (201); a mass check takes any item', async () => {
    expect((await handleCreateFieldTest(db, author, json('POST', '/api/v1/field-tests', record()))).status).toBe(201);
    expect((await handleCreateFieldTest(db, author, json('POST', '/api/v1/field-tests', record({ kind: 'mass-check', items: ['panel', 'bank', 'lamp'] })))).status).toBe(201);
  });

  it('API update: changing the kind to one the items do not fit is refused and leaves the test as it was', async () => {
    const created = await handleCreateFieldTest(db, author, json('POST', '/api/v1/field-tests', record({ kind: 'charge-time', items: ['bank', 'lamp'] })));
    const id = ((await created.json()) as { fieldTest: { id: string } }).fieldTest.id;
    const res = await handleUpdateFieldTest(db, author, id, json('PATCH', `/api/v1/field-tests/${id}`, record({ kind: 'energy-delivered', items: ['bank', 'lamp'] })));
    expect(res.status).toBe(422);
    expect(((await res.json()) as { error: { message: string } }).error.message).toContain('“Voltmoth Hearthglow”');
    expect(db.select().from(fieldTests).get()?.kind).toBe('charge-time');
  });

  it('data layer (what the server action calls) refuses the same', () => {
    expect(() => createFieldTest(db, author, record({ kind: 'light-runtime', items: ['bank'] }))).toThrow(AppError);
    const { id } = createFieldTest(db, author, record({ kind: 'light-runtime', items: ['lamp'] }));
    try {
      updateFieldTest(db, author, id, record({ kind: 'light-runtime', items: ['lamp', 'panel'] }));
      expect.unreachable();
    } catch (e) {
      expect(e).toBeInstanceOf(AppError);
      expect((e as AppError).code).toBe('invalid');
      expect((e as AppError).message).toBe('A light runtime test measures a light; “Voltmoth Heathray 28” is not one. Choose another item or another kind of test.');
    }
  });
});
