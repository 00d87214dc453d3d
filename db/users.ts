import { and, asc, eq, inArray, sql } from 'drizzle-orm';
import { randomUUID } from 'node:crypto';
import type { Db } from './connection';
import { authEvents, roleChanges, users, type Role, type User } from './schema';

export type PublicUser = Pick<User, 'id' | 'email' | 'name' | 'role' | 'disabledAt' | 'createdAt' | 'isDemo'>;

/** Display names of the given users by id (the desk and notes show who wrote what). */
export function userNamesById(db: Pick<Db, 'select'>, ids: readonly string[]): Map<string, string> {
  if (ids.length === 0) return new Map();
  return new Map(
    db
      .select({ id: users.id, name: users.name })
      .from(users)
      .where(inArray(users.id, [...new Set(ids)]))
      .all()
      .map((u) => [u.id, u.name]),
  );
}

export function findUserByEmail(db: Db, email: string): User | undefined {
  return db.select().from(users).where(eq(users.email, email.toLowerCase())).get();
}

export function findUserById(db: Db, id: string): User | undefined {
  return db.select().from(users).where(eq(users.id, id)).get();
}

export class DuplicateEmailError extends Error {}

/** Creates a reader account. Throws DuplicateEmailError when the address is taken; writes nothing then. */
export function createUser(db: Db, input: { email: string; name: string; passwordHash: string | null; role?: Role; isDemo?: boolean }): User {
  const email = input.email.toLowerCase();
  return db.transaction((tx) => {
    const existing = tx.select({ id: users.id }).from(users).where(eq(users.email, email)).get();
    if (existing) throw new DuplicateEmailError(email);
    return tx
      .insert(users)
      .values({
        id: randomUUID(),
        email,
        name: input.name,
        passwordHash: input.passwordHash,
        role: input.role ?? 'reader',
        isDemo: input.isDemo ?? false,
      })
      .returning()
      .get();
  }, { behavior: 'immediate' });
}

export function listUsers(db: Db): PublicUser[] {
  return db
    .select({
      id: users.id,
      email: users.email,
      name: users.name,
      role: users.role,
      disabledAt: users.disabledAt,
      createdAt: users.createdAt,
      isDemo: users.isDemo,
    })
    .from(users)
    .orderBy(asc(users.createdAt), asc(users.email))
    .all();
}

/** Changes a role, logs it and ends the user's existing sessions, all or nothing. Returns false when unchanged. */
export function changeUserRole(db: Db, input: { userId: string; role: Role; actorId: string }): boolean {
  return db.transaction((tx) => {
    const target = tx.select().from(users).where(eq(users.id, input.userId)).get();
    if (!target) throw new UserNotFoundError();
    if (target.role === input.role) return false;
    tx.update(users)
      .set({ role: input.role, sessionVersion: sql`${users.sessionVersion} + 1` })
      .where(eq(users.id, target.id))
      .run();
    tx.insert(roleChanges).values({ userId: target.id, changedById: input.actorId, fromRole: target.role, toRole: input.role }).run();
    tx.insert(authEvents)
      .values({ kind: 'role-changed', userId: target.id, actorId: input.actorId, email: target.email, detail: `${target.role} → ${input.role}` })
      .run();
    return true;
  }, { behavior: 'immediate' });
}

export class UserNotFoundError extends Error {}

export function setUserDisabled(db: Db, input: { userId: string; disabled: boolean; actorId: string }): void {
  db.transaction((tx) => {
    const target = tx.select().from(users).where(eq(users.id, input.userId)).get();
    if (!target) throw new UserNotFoundError();
    tx.update(users)
      .set({ disabledAt: input.disabled ? new Date() : null, sessionVersion: sql`${users.sessionVersion} + 1` })
      .where(eq(users.id, target.id))
      .run();
    tx.insert(authEvents)
      .values({ kind: input.disabled ? 'account-disabled' : 'account-enabled', userId: target.id, actorId: input.actorId, email: target.email })
      .run();
  }, { behavior: 'immediate' });
}

/** Ends every existing session of the user (sign-out). */
export function bumpSessionVersion(db: Db, userId: string): void {
  db.update(users)
    .set({ sessionVersion: sql`${users.sessionVersion} + 1` })
    .where(eq(users.id, userId))
    .run();
}

export function logAuthEvent(db: Db, event: { kind: string; email?: string | null; userId?: string | null; detail?: string }): void {
  db.insert(authEvents)
    .values({ kind: event.kind, email: event.email ?? null, userId: event.userId ?? null, detail: event.detail ?? null })
    .run();
}

export function roleHistory(db: Db, userId: string) {
  return db.select().from(roleChanges).where(and(eq(roleChanges.userId, userId))).orderBy(asc(roleChanges.createdAt)).all();
}
