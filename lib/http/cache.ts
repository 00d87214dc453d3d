/**
 * Caching of the public read API. Anonymous GETs carry only public data: `Cache-Control: public,
 * max-age=60` with a strong ETag (a hash of the body) and 304 on a matching `If-None-Match`.
 * Authenticated GETs may include the caller's own drafts: `Cache-Control: private, no-store`.
 * Both vary on `Authorization` and `Cookie`, so a shared cache never hands one to the other.
 */
import { createHash } from 'node:crypto';

export const PUBLIC_CACHE_CONTROL = 'public, max-age=60';
export const PRIVATE_CACHE_CONTROL = 'private, no-store';
export const VARY = 'Authorization, Cookie';

/** A strong entity tag of a body: quoted base64url SHA-256 (first 128 bits). */
export function etagOf(body: string): string {
  return `"${createHash('sha256').update(body).digest('base64url').slice(0, 22)}"`;
}

/**
 * Whether an `If-None-Match` header matches an ETag (RFC 9110 §13.1.2: weak comparison, so `W/"x"`
 * matches `"x"`; a list matches when any member does; `*` matches any current representation).
 */
export function ifNoneMatchMatches(header: string | null, etag: string): boolean {
  if (!header) return false;
  const opaque = (tag: string) => tag.trim().replace(/^W\//, '');
  const wanted = opaque(etag);
  return header.split(',').some((member) => {
    const tag = member.trim();
    return tag === '*' || (tag !== '' && opaque(tag) === wanted);
  });
}

/** A JSON response of a read, with the cache headers for an anonymous or an authenticated caller. */
export function cachedJson(request: Request, data: unknown, authenticated: boolean): Response {
  const body = JSON.stringify(data);
  const headers = new Headers({ 'Content-Type': 'application/json', Vary: VARY });
  if (authenticated) {
    headers.set('Cache-Control', PRIVATE_CACHE_CONTROL);
    return new Response(body, { status: 200, headers });
  }
  const etag = etagOf(body);
  headers.set('Cache-Control', PUBLIC_CACHE_CONTROL);
  headers.set('ETag', etag);
  if (ifNoneMatchMatches(request.headers.get('if-none-match'), etag)) {
    headers.delete('Content-Type');
    return new Response(null, { status: 304, headers });
  }
  return new Response(body, { status: 200, headers });
}
