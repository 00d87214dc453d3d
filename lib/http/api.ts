import 'server-only';
import { NextResponse } from 'next/server';
import { z } from 'zod';
import { AppError, errorBody, zodFieldErrors } from './errors';

export { zodFieldErrors };

export function errorResponse(error: unknown): NextResponse {
  if (error instanceof AppError) {
    const headers: Record<string, string> = {};
    if (error.retryAfterS) headers['Retry-After'] = String(error.retryAfterS);
    return NextResponse.json(errorBody(error.code, error.message, error.fields), { status: error.status, headers });
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

/** Reads a JSON body from a same-origin request: 415 for other content types, 400 for malformed JSON, 403 cross-site. */
export async function readJson(request: Request): Promise<unknown> {
  assertSameOrigin(request);
  const type = request.headers.get('content-type') ?? '';
  if (!/^application\/json\b/i.test(type)) {
    throw new AppError('unsupported_media_type', 'Send the body as application/json.');
  }
  try {
    return await request.json();
  } catch {
    throw new AppError('bad_request', 'The body is not valid JSON.');
  }
}

/** Route handlers get no CSRF check from the framework: refuse state changes from other origins. */
export function assertSameOrigin(request: Request): void {
  const origin = request.headers.get('origin');
  if (origin === null) return; // non-browser clients (scripts) send no Origin; they still need a session or token
  const expected = new URL(request.url).origin;
  const allowed = new Set([expected, process.env.AUTH_URL ? new URL(process.env.AUTH_URL).origin : expected]);
  if (!allowed.has(origin)) throw new AppError('forbidden', 'Cross-site requests are not allowed.');
}

export function parseWith<S extends z.ZodType>(schema: S, input: unknown): z.output<S> {
  const result = schema.safeParse(input);
  if (!result.success) {
    throw new AppError('invalid', 'Some fields are not valid.', { fields: zodFieldErrors(result.error) });
  }
  return result.data;
}
