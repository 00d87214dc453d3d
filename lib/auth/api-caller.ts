import 'server-only';
import { getDb } from '@/db';
import { authenticateApiToken } from '@/db/api-tokens';
import type { ApiTokenScope, Role } from '@/db/schema';
import { isProvenSameOrigin } from '@/lib/http/api';
import { AppError } from '@/lib/http/errors';
import { mayUseAccount } from './config';
import { getCurrentUser, type CurrentUser } from './guard';
import { hasRole } from './roles';

/*
 * Who is calling the JSON API: a personal token (`Authorization: Bearer tb_…`) or the session cookie.
 * A token acts as its owner's current role, read from the database on every request, and stops working
 * the moment it is revoked or the owner is disabled. Cookie writes must prove they come from our pages.
 */

export interface ApiCaller extends CurrentUser {
  via: 'token' | 'session';
  /** What the caller may do through this credential; a session may do whatever its role allows. */
  scope: ApiTokenScope;
  tokenId?: string;
}

/** A read-only token sees public data plus its owner's own records, never other people's drafts, whatever the role. */
const READ_TOKEN_ROLE_CAP: Role = 'reviewer';

function bearerToken(request: Request): string | null {
  const header = request.headers.get('authorization');
  if (header === null) return null;
  const match = /^Bearer[ ]+(\S+)\s*$/i.exec(header);
  if (!match?.[1]) throw new AppError('unauthenticated', 'Send a personal API token as “Authorization: Bearer <token>”.');
  return match[1];
}

function callerFromToken(raw: string): ApiCaller {
  const holder = authenticateApiToken(getDb(), raw);
  // One answer for unknown, revoked and disabled: a caller learns nothing about which it was.
  if (!holder || !mayUseAccount(holder.user)) throw new AppError('unauthenticated', 'This API token is not valid (unknown, revoked, or its account is disabled).');
  const { user, scope, tokenId } = holder;
  const role = scope === 'read' && hasRole(user, READ_TOKEN_ROLE_CAP) ? READ_TOKEN_ROLE_CAP : user.role;
  return { id: user.id, email: user.email, name: user.name, role, via: 'token', scope, tokenId };
}

/**
 * The caller, or null for a guest. A request that sends an Authorization header must carry a valid token
 * (401 otherwise) rather than silently falling back to guest access.
 */
export async function optionalApiCaller(request: Request): Promise<ApiCaller | null> {
  const raw = bearerToken(request);
  if (raw !== null) return callerFromToken(raw);
  const user = await getCurrentUser();
  return user ? { ...user, via: 'session', scope: 'write' } : null;
}

/**
 * For route handlers: 401 without a valid token or session; for `scope: 'write'`, 403 for a read-only token
 * and for a cookie request without a same-origin `Origin` / `Sec-Fetch-Site`; 403 below `role`.
 */
export async function requireApiCaller(request: Request, options: { scope: ApiTokenScope; role?: Role }): Promise<ApiCaller> {
  const caller = await optionalApiCaller(request);
  if (!caller) throw new AppError('unauthenticated', 'Sign in, or send a personal API token as “Authorization: Bearer <token>”.');
  if (options.scope === 'write') {
    if (caller.via === 'token' && caller.scope !== 'write') throw new AppError('forbidden', 'This token is read-only; create a token with write scope to change data.');
    if (caller.via === 'session' && !isProvenSameOrigin(request)) {
      throw new AppError('forbidden', 'Cookie-authenticated changes must come from Trailbench pages (same-origin Origin or Sec-Fetch-Site). Scripts use an API token.');
    }
  }
  if (options.role && !hasRole(caller, options.role)) throw new AppError('forbidden', `This needs the ${options.role} role.`);
  return caller;
}
