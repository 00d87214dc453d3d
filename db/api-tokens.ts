import { and, desc, eq, isNull, lt, or, sql } from 'drizzle-orm';
import { createHash, randomBytes, randomUUID, timingSafeEqual } from 'node:crypto';
import type { Db } from './connection';
import { apiTokens, users, type ApiTokenScope, type Role, type User } from './schema';
import { AppError } from '@/lib/http/errors';

/*
 * Personal API tokens (issue 7). A token reads `tb_<8-char id>_<43-char secret>`: the id part is the
 * non-secret prefix shown in the account page; the secret is 32 random bytes (256 bits). Only the SHA-256
 * of the whole token is stored, so the database alone never lets anyone act as a reviewer.
 */

const TOKEN_PATTERN = /^tb_([A-Za-z0-9_-]{8})_([A-Za-z0-9_-]{43})$/;

/** Enough for a logger, a spreadsheet and a few scripts; more is usually forgotten tokens. */
export const MAX_ACTIVE_TOKENS = 20;

/** last_used_at is written at most this often per token: a busy logger costs one write a minute, not one a request. */
export const LAST_USED_RESOLUTION_MS = 60_000;

function hashToken(token: string): Buffer {
  return createHash('sha256').update(token, 'utf8').digest();
}

export interface ApiTokenSummary {
  id: string;
  name: string;
  scope: ApiTokenScope;
  prefix: string;
  createdAt: Date;
  lastUsedAt: Date | null;
  revokedAt: Date | null;
}

const summaryColumns = {
  id: apiTokens.id,
  name: apiTokens.name,
  scope: apiTokens.scope,
  prefix: apiTokens.prefix,
  createdAt: apiTokens.createdAt,
  lastUsedAt: apiTokens.lastUsedAt,
  revokedAt: apiTokens.revokedAt,
};

/** The owner's tokens, newest first (no hashes). */
export function listApiTokens(db: Db, userId: string): ApiTokenSummary[] {
  return db.select(summaryColumns).from(apiTokens).where(eq(apiTokens.userId, userId)).orderBy(desc(apiTokens.createdAt), desc(apiTokens.id)).all();
}

/**
 * Creates a token for a reviewer or above and returns the raw token once: it is not stored and cannot be
 * shown again. 403 below reviewer; 409 at MAX_ACTIVE_TOKENS unrevoked tokens.
 */
export function createApiToken(db: Db, owner: { id: string; role: Role }, input: { name: string; scope: ApiTokenScope }): { token: string; summary: ApiTokenSummary } {
  if (owner.role === 'reader') throw new AppError('forbidden', 'API tokens are for reviewers, editors and admins.');
  const prefix = `tb_${randomBytes(6).toString('base64url')}`;
  const token = `${prefix}_${randomBytes(32).toString('base64url')}`;
  const summary = db.transaction(
    (tx) => {
      const active = tx
        .select({ n: sql<number>`count(*)` })
        .from(apiTokens)
        .where(and(eq(apiTokens.userId, owner.id), isNull(apiTokens.revokedAt)))
        .get();
      if ((active?.n ?? 0) >= MAX_ACTIVE_TOKENS) {
        throw new AppError('conflict', `You already have ${MAX_ACTIVE_TOKENS} active tokens. Revoke one you no longer use first.`);
      }
      return tx
        .insert(apiTokens)
        .values({ id: randomUUID(), userId: owner.id, name: input.name, scope: input.scope, tokenHash: hashToken(token).toString('hex'), prefix })
        .returning(summaryColumns)
        .get();
    },
    { behavior: 'immediate' },
  );
  return { token, summary };
}

/** Revokes the owner's token at once (idempotent). 404 for a token that is not theirs. */
export function revokeApiToken(db: Db, userId: string, tokenId: string, now = Date.now()): void {
  const row = db.select({ revokedAt: apiTokens.revokedAt }).from(apiTokens).where(and(eq(apiTokens.id, tokenId), eq(apiTokens.userId, userId))).get();
  if (!row) throw new AppError('not_found', 'No such token.');
  if (row.revokedAt) return;
  db.update(apiTokens).set({ revokedAt: new Date(now) }).where(eq(apiTokens.id, tokenId)).run();
}

export interface TokenHolder {
  user: User;
  tokenId: string;
  scope: ApiTokenScope;
}

/**
 * The unrevoked token matching `raw` and its owner as stored now (the caller decides whether the account may
 * act), or null. Looked up by hash through the unique index, then compared in constant time.
 * Marks the token used, at most once per LAST_USED_RESOLUTION_MS.
 */
export function authenticateApiToken(db: Db, raw: string, now = Date.now()): TokenHolder | null {
  if (!TOKEN_PATTERN.test(raw)) return null;
  const hash = hashToken(raw);
  const row = db
    .select({ token: apiTokens, user: users })
    .from(apiTokens)
    .innerJoin(users, eq(users.id, apiTokens.userId))
    .where(eq(apiTokens.tokenHash, hash.toString('hex')))
    .get();
  if (!row) return null;
  const stored = Buffer.from(row.token.tokenHash, 'hex');
  if (stored.length !== hash.length || !timingSafeEqual(stored, hash)) return null;
  if (row.token.revokedAt) return null;
  const lastUsed = row.token.lastUsedAt?.getTime();
  // The read row already says whether a write is due: most requests take no write lock at all.
  if (lastUsed === undefined || lastUsed < now - LAST_USED_RESOLUTION_MS) {
    db.update(apiTokens)
      .set({ lastUsedAt: new Date(now) })
      .where(and(eq(apiTokens.id, row.token.id), or(isNull(apiTokens.lastUsedAt), lt(apiTokens.lastUsedAt, new Date(now - LAST_USED_RESOLUTION_MS)))))
      .run();
  }
  return { user: row.user, tokenId: row.token.id, scope: row.token.scope };
}
