import { beforeEach, describe, expect, it } from 'vitest';
import { getTableName } from 'drizzle-orm';
import { createTestDb } from '@/db/test-db';
import type { Db } from '@/db/connection';
import { authEvents, roleChanges, users } from '@/db/schema';
import { changeUserRole, createUser, DuplicateEmailError, findUserByEmail, setUserDisabled } from '@/db/users';
import { consumeMagicLinkToken, createMagicLinkToken, MAGIC_LINK_TTL_MS, peekMagicLinkToken } from '@/db/magic-links';
import { hashPassword, verifyPassword } from '@/lib/auth/password';

let db: Db;
const count = (table: typeof users | typeof roleChanges | typeof authEvents) =>
  (db.$client.prepare(`select count(*) as n from ${getTableName(table)}`).get() as { n: number }).n;

beforeEach(() => {
  db = createTestDb().db;
});

describe('database connection', () => {
  it('uses WAL, foreign keys and a busy timeout, with a current SQLite', () => {
    expect(db.$client.pragma('journal_mode', { simple: true })).toBe('wal');
    expect(db.$client.pragma('foreign_keys', { simple: true })).toBe(1);
    expect(db.$client.pragma('busy_timeout', { simple: true })).toBe(5000);
    // sqlite.org/wal.html: the WAL-reset bug is fixed in 3.51.3.
    const version = (db.$client.prepare('select sqlite_version() as v').get() as { v: string }).v.split('.').map(Number);
    expect(version[0]! * 1e6 + version[1]! * 1e3 + version[2]!).toBeGreaterThanOrEqual(3_051_003);
    expect(db.$client.pragma('integrity_check', { simple: true })).toBe('ok');
  });
});

describe('accounts', () => {
  it('creates readers, normalises e-mail case and refuses a duplicate without writing', async () => {
    const user = createUser(db, { email: 'Ada@Example.org', name: 'Ada', passwordHash: await hashPassword('long enough pass') });
    expect(user.role).toBe('reader');
    expect(findUserByEmail(db, 'ada@example.org')?.id).toBe(user.id);
    const before = count(users);
    expect(() => createUser(db, { email: 'ada@example.org', name: 'Other', passwordHash: null })).toThrow(DuplicateEmailError);
    expect(count(users)).toBe(before);
  });

  it('hashes passwords with argon2id and verifies exactly as typed', async () => {
    const stored = await hashPassword('correct horse battery staple');
    expect(stored.startsWith('$argon2id$')).toBe(true);
    expect(await verifyPassword(stored, 'correct horse battery staple')).toBe(true);
    expect(await verifyPassword(stored, 'correct horse battery stapl')).toBe(false);
    expect(await verifyPassword('not a hash', 'x')).toBe(false);
  });

  it('logs a role change and ends the user’s sessions in one transaction', () => {
    const admin = createUser(db, { email: 'admin@example.org', name: 'Admin', passwordHash: null, role: 'admin' });
    const user = createUser(db, { email: 'r@example.org', name: 'R', passwordHash: null });
    expect(changeUserRole(db, { userId: user.id, role: 'reviewer', actorId: admin.id })).toBe(true);
    const after = findUserByEmail(db, 'r@example.org')!;
    expect(after.role).toBe('reviewer');
    expect(after.sessionVersion).toBe(user.sessionVersion + 1);
    expect(count(roleChanges)).toBe(1);
    expect(changeUserRole(db, { userId: user.id, role: 'reviewer', actorId: admin.id })).toBe(false);
    expect(count(roleChanges)).toBe(1);
  });

  it('disabling bumps the session version and is logged', () => {
    const admin = createUser(db, { email: 'admin@example.org', name: 'Admin', passwordHash: null, role: 'admin' });
    const user = createUser(db, { email: 'd@example.org', name: 'D', passwordHash: null });
    setUserDisabled(db, { userId: user.id, disabled: true, actorId: admin.id });
    const after = findUserByEmail(db, 'd@example.org')!;
    expect(after.disabledAt).not.toBeNull();
    expect(after.sessionVersion).toBe(user.sessionVersion + 1);
  });
});

describe('magic links', () => {
  it('are single use, stored only as a hash, and expire after 10 minutes (ASVS 5.0 6.5.1, 6.5.5)', () => {
    createUser(db, { email: 'm@example.org', name: 'M', passwordHash: null });
    const now = Date.now();
    const token = createMagicLinkToken(db, 'm@example.org', now);
    const stored = db.$client.prepare('select token_hash from magic_link_tokens').get() as { token_hash: string };
    expect(stored.token_hash).not.toContain(token);
    expect(peekMagicLinkToken(db, token, now)?.email).toBe('m@example.org');
    // peeking (what a mail scanner's GET does) spends nothing
    expect(peekMagicLinkToken(db, token, now)).not.toBeNull();
    expect(consumeMagicLinkToken(db, token, now)?.email).toBe('m@example.org');
    expect(consumeMagicLinkToken(db, token, now)).toBeNull();

    const late = createMagicLinkToken(db, 'm@example.org', now);
    expect(consumeMagicLinkToken(db, late, now + MAGIC_LINK_TTL_MS + 1)).toBeNull();
    expect(MAGIC_LINK_TTL_MS).toBeLessThanOrEqual(600_000);
  });

  it('refuses an unknown token', () => {
    expect(consumeMagicLinkToken(db, 'A'.repeat(43))).toBeNull();
  });
});
