import { beforeAll, describe, expect, it, vi } from 'vitest';
import { dbMock, guardMock, type SessionUser } from '../support/integration-mocks';
import fc from 'fast-check';
import { createTestDb } from '@/db/test-db';
import type { Db } from '@/db/connection';
import { kitInputSchema } from '@/lib/kits';

/*
 * IV-01/IV-02/IV-03 (docs security-tests): random and near-valid JSON never gives a 5xx; a body the
 * schema refuses gets 422 naming the field and stores nothing; a body it accepts gets 201.
 * Replay a failure with FC_SEED.
 */
const state = vi.hoisted(() => ({ db: null as unknown as Db, user: null as SessionUser | null }));
vi.mock('@/db', () => dbMock(() => state.db));
vi.mock('@/lib/auth/guard', () => guardMock(() => state.user));

const { createUser } = await import('@/db/users');
const { POST } = await import('@/app/api/v1/kits/route');

const seed = process.env.FC_SEED ? Number(process.env.FC_SEED) : undefined;
const post = (body: string) => POST(new Request('http://localhost:3000/api/v1/kits', { method: 'POST', headers: { 'content-type': 'application/json', origin: 'http://localhost:3000' }, body }));
const n = (table: string) => (state.db.$client.prepare(`select count(*) as n from ${table}`).get() as { n: number }).n;
const stored = () => n('kits') + n('kit_entries');

beforeAll(async () => {
  state.db = createTestDb().db;
  const user = await createUser(state.db, { email: 'fuzz@students.example', name: 'Fuzz', passwordHash: null });
  state.user = { id: user.id, email: user.email, name: user.name, role: 'reader' };
});

const nearValid = fc.record({
  name: fc.oneof(fc.string(), fc.constant('Camp')),
  tripDays: fc.oneof(fc.integer({ min: -5, max: 4000 }), fc.double(), fc.constant(3)),
  peakSunHours: fc.oneof(fc.constant(null), fc.double({ min: -1, max: 30 })),
  skyShare: fc.oneof(fc.constant(null), fc.double({ min: -1, max: 2 })),
  entries: fc.array(
    fc.record({
      gearItemId: fc.constant(null),
      freeName: fc.string({ maxLength: 20 }),
      quantity: fc.oneof(fc.integer({ min: -2, max: 1200 }), fc.constant(1)),
      hoursPerDay: fc.oneof(fc.constant(null), fc.double({ min: -2, max: 30 })),
      dutyCycle: fc.oneof(fc.constant(null), fc.double({ min: -1, max: 2 })),
      freeDrawW: fc.oneof(fc.constant(null), fc.double({ min: -10, max: 200 })),
    }),
    { maxLength: 4 },
  ),
});

describe('POST /api/v1/kits under fuzzing', () => {
  it('never answers 5xx; 422 stores nothing, 201 stores the kit', async () => {
    await fc.assert(
      fc.asyncProperty(fc.oneof(fc.jsonValue(), nearValid, fc.record({ name: fc.constant('x'), tripDays: fc.constant(1), entries: fc.constant([]), ownerId: fc.string() })), async (value) => {
        const before = stored();
        const body = JSON.stringify(value) ?? 'null';
        const response = await post(body);
        expect(response.status).toBeLessThan(500);
        const accepted = kitInputSchema.safeParse(JSON.parse(body)).success;
        if (accepted) expect(response.status).toBe(201);
        else {
          expect([400, 422]).toContain(response.status);
          expect(stored()).toBe(before);
        }
        expect(({} as Record<string, unknown>).polluted).toBeUndefined();
      }),
      { numRuns: 300, seed },
    );
  }, 120_000);

  it('ignores prototype keys (IV-03)', async () => {
    for (const body of ['{"__proto__":{"polluted":1},"name":"x","tripDays":1,"entries":[]}', '{"constructor":{"prototype":{"polluted":1}},"name":"x","tripDays":1,"entries":[]}']) {
      const before = stored();
      expect((await post(body)).status).toBe(422);
      expect(stored()).toBe(before);
      expect(({} as Record<string, unknown>).polluted).toBeUndefined();
    }
  });

  it('never answers 5xx to bytes that are not JSON', async () => {
    await fc.assert(
      fc.asyncProperty(fc.string({ unit: 'binary', maxLength: 200 }), async (text) => {
        expect((await post(text)).status).toBeLessThan(500);
      }),
      { numRuns: 200, seed },
    );
  });
});
