import 'server-only';
import { NextResponse } from 'next/server';
import { z } from 'zod';
import { readBodyCapped } from './body';
import { AppError, errorBody, zodFieldErrors } from './errors';

export { zodFieldErrors };

/** Seconds a client should wait after SQLite stayed locked for the whole busy_timeout (5 s) before retrying. */
export const BUSY_RETRY_AFTER_S = 2;

/** better-sqlite3 raises SqliteError with code SQLITE_BUSY (or an extended SQLITE_BUSY_* code) when the lock wait ran out. */
export function isSqliteBusy(error: unknown): boolean {
  const code = (error as { code?: unknown } | null)?.code;
  return typeof code === 'string' && /^SQLITE_BUSY(_|$)/.test(code);
}

export function errorResponse(error: unknown): NextResponse {
  if (error instanceof AppError) {
    const headers: Record<string, string> = {};
    if (error.retryAfterS) headers['Retry-After'] = String(error.retryAfterS);
    // RFC 9110 §15.5.2: a 401 carries a challenge naming the scheme the API accepts.
    if (error.status === 401) headers['WWW-Authenticate'] = 'Bearer realm="trailbench"';
    return NextResponse.json(errorBody(error.code, error.message, error.fields), { status: error.status, headers });
  }
  if (isSqliteBusy(error)) {
    // A transient lock, not a bug: the write was rolled back, so the same request may simply be sent again.
    return NextResponse.json(errorBody('busy', 'The database is busy. Nothing was saved; try again in a moment.'), {
      status: 503,
      headers: { 'Retry-After': String(BUSY_RETRY_AFTER_S) },
    });
  }
  if (error instanceof z.ZodError) {
    return NextResponse.json(errorBody('invalid', 'Some fields are not valid.', zodFieldErrors(error)), { status: 422 });
  }
  console.error('Unhandled API error', error);
  return NextResponse.json(errorBody('internal', 'Something went wrong on our side. Nothing was saved.'), { status: 500 });
}

/** Wraps a route handler so every failure leaves in the shared error format. */
export function apiHandler<A extends unknown[]>(handler: (...args: A) => Promise<Response>) {
  return async (...args: A): Promise<Response> => {
    try {
      return await handler(...args);
    } catch (error) {
      return errorResponse(error);
    }
  };
}

/** Default cap on a JSON body (the largest real one, a typed-in readings list, is far smaller). */
export const JSON_MAX_BYTES = 1024 * 1024;

/** Cap for record-sized JSON (a kit of 200 entries is about 60 KB; issue 8 asks for a cap with 413). */
export const RECORD_JSON_MAX_BYTES = 256 * 1024;

/** True when the request's Content-Type is `type` (parameters such as charset allowed). */
export function hasMediaType(request: Request, type: string): boolean {
  const declared = (request.headers.get('content-type') ?? '').split(';')[0]?.trim().toLowerCase();
  return declared === type;
}

/**
 * Reads a JSON body from a same-origin request: 415 for other content types, 413 above `maxBytes`, 400 for
 * malformed JSON, 403 cross-site.
 */
export async function readJson(request: Request, options: { maxBytes?: number } = {}): Promise<unknown> {
  assertSameOrigin(request);
  if (!hasMediaType(request, 'application/json')) {
    throw new AppError('unsupported_media_type', 'Send the body as application/json.');
  }
  const limit = options.maxBytes ?? JSON_MAX_BYTES;
  const bytes = await readBodyCapped(request, limit, () => new AppError('too_large', `The body is larger than ${formatBytes(limit)}.`));
  try {
    return JSON.parse(new TextDecoder('utf-8', { fatal: true }).decode(bytes));
  } catch {
    throw new AppError('bad_request', 'The body is not valid JSON.');
  }
}

function formatBytes(bytes: number): string {
  return bytes >= 1024 * 1024 ? `${Number((bytes / (1024 * 1024)).toFixed(1))} MB` : `${Math.round(bytes / 1024)} KB`;
}

function allowedOrigins(request: Request): Set<string> {
  const expected = new URL(request.url).origin;
  return new Set([expected, process.env.AUTH_URL ? new URL(process.env.AUTH_URL).origin : expected]);
}

/** Route handlers get no CSRF check from the framework: refuse state changes from other origins. */
export function assertSameOrigin(request: Request): void {
  const origin = request.headers.get('origin');
  if (origin === null) return; // non-browser clients (scripts) send no Origin; they still need a session or token
  if (!allowedOrigins(request).has(origin)) throw new AppError('forbidden', 'Cross-site requests are not allowed.');
}

/**
 * Positive proof that a browser sent the request from our own pages: a matching `Origin`, or, without one,
 * `Sec-Fetch-Site: same-origin`. Cookie-authenticated writes need it; a token needs no such proof.
 */
export function isProvenSameOrigin(request: Request): boolean {
  const origin = request.headers.get('origin');
  if (origin !== null) return allowedOrigins(request).has(origin);
  return request.headers.get('sec-fetch-site') === 'same-origin';
}

export function parseWith<S extends z.ZodType>(schema: S, input: unknown): z.output<S> {
  const result = schema.safeParse(input);
  if (!result.success) {
    throw new AppError('invalid', 'Some fields are not valid.', { fields: zodFieldErrors(result.error) });
  }
  return result.data;
}
