/**
 * Module stand-ins shared by the integration tests that drive route handlers and server actions: the
 * shared database connection, the signed-in user and Next's redirect all point at the test.
 *
 * vitest hoists `vi.mock` above the imports and a `vi.mock` inside this module would not apply to the
 * test file, so each test file keeps its own state and one-line mocks that call these factories:
 *
 *   import { dbMock, guardMock, navigationMock, type SessionUser } from '../support/integration-mocks';
 *   const state = vi.hoisted(() => ({ db: null as unknown as Db, user: null as SessionUser | null }));
 *   vi.mock('@/db', () => dbMock(() => state.db));
 *   vi.mock('@/lib/auth/guard', () => guardMock(() => state.user));
 *
 * A factory runs when its module is first imported (the test's `await import(...)` of a route), by which
 * time this module is loaded; it must therefore import nothing that reads '@/db' or the guard itself
 * (db/users takes the database as an argument).
 */
import type { Db } from '@/db/connection';
import type { Role } from '@/db/schema';
import { createUser } from '@/db/users';

/** The signed-in user as lib/auth/guard hands it out (its CurrentUser). */
export type SessionUser = { id: string; email: string; name: string; role: Role };

/** A new account named `key` (email key@domain) with `role`, shaped as the guard hands out the signed-in user. */
export function createSessionUser(db: Db, key: string, role: Role, domain = 'example.org'): SessionUser {
  const created = createUser(db, { email: `${key}@${domain}`, name: key, passwordHash: null, role });
  return { id: created.id, email: created.email, name: created.name, role: created.role };
}

/** Stands in for '@/db': every caller of getDb() gets the test's database. */
export function dbMock(db: () => Db) {
  return { getDb: () => db() };
}

/** Stands in for 'next/navigation': redirect() throws an error carrying the target, as Next's does. */
export function navigationMock() {
  return {
    redirect: (to: string) => {
      throw Object.assign(new Error('redirect'), { redirectTo: to });
    },
  };
}

/**
 * Stands in for '@/lib/auth/guard' with the session replaced by `user()` (null = signed out); the
 * 401 and 403 rules are those of the real guard (same AppError codes and messages, same hasRole).
 */
export async function guardMock(user: () => SessionUser | null) {
  const { AppError } = await import('@/lib/http/errors');
  const { hasRole } = await import('@/lib/auth/roles');
  const requireUser = async () => {
    const current = user();
    if (!current) throw new AppError('unauthenticated', 'Sign in to do this.');
    return current;
  };
  return {
    getCurrentUser: async () => user(),
    requireUser,
    requireRole: async (role: Role) => {
      const current = await requireUser();
      if (!hasRole(current, role)) throw new AppError('forbidden', `This needs the ${role} role.`);
      return current;
    },
  };
}
