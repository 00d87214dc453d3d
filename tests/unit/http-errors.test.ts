import { describe, expect, it } from 'vitest';
import { z } from 'zod';
import { errorResponse, parseWith, readJson } from '@/lib/http/api';
import { AppError, ERROR_STATUS } from '@/lib/http/errors';

describe('shared API error format', () => {
  it('maps every error code to the status table of the foundation issue', () => {
    expect(ERROR_STATUS).toEqual({
      unauthenticated: 401,
      not_found: 404,
      forbidden: 403,
      conflict: 409,
      bad_request: 400,
      invalid: 422,
      too_large: 413,
      unsupported_media_type: 415,
      rate_limited: 429,
    });
  });

  it('answers { error: { code, message, fields } } with the status and Retry-After', async () => {
    const response = errorResponse(new AppError('rate_limited', 'Slow down.', { retryAfterS: 30 }));
    expect(response.status).toBe(429);
    expect(response.headers.get('retry-after')).toBe('30');
    expect(await response.json()).toEqual({ error: { code: 'rate_limited', message: 'Slow down.' } });
  });

  it('turns schema failures into 422 with field messages', async () => {
    const schema = z.object({ mass: z.number().positive('Mass must be above zero.') });
    let caught: unknown;
    try {
      parseWith(schema, { mass: -1 });
    } catch (error) {
      caught = error;
    }
    const response = errorResponse(caught);
    expect(response.status).toBe(422);
    expect(await response.json()).toEqual({ error: { code: 'invalid', message: 'Some fields are not valid.', fields: { mass: ['Mass must be above zero.'] } } });
  });

  it('never leaks internals of unexpected errors', async () => {
    const original = console.error;
    console.error = () => {};
    const response = errorResponse(new Error('SqliteError: no such table /srv/secret.db'));
    console.error = original;
    expect(response.status).toBe(500);
    const text = JSON.stringify(await response.json());
    expect(text).not.toMatch(/Sqlite|secret|\/srv/);
  });
});

describe('readJson (security-tests CS-01, CS-03)', () => {
  const post = (body: string, headers: Record<string, string>) =>
    new Request('http://localhost:3000/api/v1/thing', { method: 'POST', body, headers });

  it('refuses other content types with 415, including a cross-site text/plain form post', async () => {
    await expect(readJson(post('{"a":1}', { 'content-type': 'text/plain' }))).rejects.toMatchObject({ code: 'unsupported_media_type' });
  });

  it('refuses other origins with 403 and malformed JSON with 400', async () => {
    await expect(readJson(post('{"a":1}', { 'content-type': 'application/json', origin: 'https://evil.example' }))).rejects.toMatchObject({ code: 'forbidden' });
    await expect(readJson(post('{"a":', { 'content-type': 'application/json' }))).rejects.toMatchObject({ code: 'bad_request' });
    await expect(readJson(post('{"a":1}', { 'content-type': 'application/json; charset=utf-8', origin: 'http://localhost:3000' }))).resolves.toEqual({ a: 1 });
  });
});
