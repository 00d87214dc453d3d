import { and, eq, gt, isNull } from 'drizzle-orm';
import { createHash, randomBytes } from 'node:crypto';
import type { Db } from './connection';
import { magicLinkTokens, users, type User } from './schema';

/** ASVS 5.0 6.5.5: out-of-band links live at most 10 minutes. */
export const MAGIC_LINK_TTL_MS = 10 * 60 * 1000;

function hashToken(token: string): string {
  return createHash('sha256').update(token).digest('hex');
}

/** Stores a new single-use token for the address and returns the raw token (only its hash is kept). */
export function createMagicLinkToken(db: Db, email: string, now = Date.now()): string {
  const token = randomBytes(32).toString('base64url');
  db.insert(magicLinkTokens)
    .values({ tokenHash: hashToken(token), email: email.toLowerCase(), expiresAt: new Date(now + MAGIC_LINK_TTL_MS) })
    .run();
  return token;
}

/** Read-only check for the confirm page: does not spend the token. */
export function peekMagicLinkToken(db: Db, token: string, now = Date.now()): { email: string } | null {
  const row = db
    .select({ email: magicLinkTokens.email })
    .from(magicLinkTokens)
    .where(and(eq(magicLinkTokens.tokenHash, hashToken(token)), isNull(magicLinkTokens.usedAt), gt(magicLinkTokens.expiresAt, new Date(now))))
    .get();
  return row ?? null;
}

/** Spends the token once, atomically; returns the account it signs in, or null if unknown, used or expired. */
export function consumeMagicLinkToken(db: Db, token: string, now = Date.now()): User | null {
  return db.transaction((tx) => {
    const spent = tx
      .update(magicLinkTokens)
      .set({ usedAt: new Date(now) })
      .where(and(eq(magicLinkTokens.tokenHash, hashToken(token)), isNull(magicLinkTokens.usedAt), gt(magicLinkTokens.expiresAt, new Date(now))))
      .returning({ email: magicLinkTokens.email })
      .get();
    if (!spent) return null;
    const user = tx.select().from(users).where(eq(users.email, spent.email)).get();
    if (!user) return null;
    if (!user.emailVerifiedAt) tx.update(users).set({ emailVerifiedAt: new Date(now) }).where(eq(users.id, user.id)).run();
    return user;
  }, { behavior: 'immediate' });
}
