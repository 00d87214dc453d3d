import type { z } from 'zod';

/**
 * One status table for the whole app (pages, route handlers and actions), checked in this order:
 * 401 account needed · 404 caller may not see the target · 403 visible but not allowed · 409 state conflict ·
 * 400 malformed query or JSON · 422 body fails its schema · 413 too large · 415 unsupported media type · 429 rate limited.
 */
export const ERROR_STATUS = {
  unauthenticated: 401,
  not_found: 404,
  forbidden: 403,
  conflict: 409,
  bad_request: 400,
  invalid: 422,
  too_large: 413,
  unsupported_media_type: 415,
  rate_limited: 429,
} as const;

export type ErrorCode = keyof typeof ERROR_STATUS;
export type FieldErrors = Record<string, string[]>;

export class AppError extends Error {
  readonly code: ErrorCode;
  readonly fields?: FieldErrors;
  readonly retryAfterS?: number;

  constructor(code: ErrorCode, message: string, options: { fields?: FieldErrors; retryAfterS?: number } = {}) {
    super(message);
    this.name = 'AppError';
    this.code = code;
    this.fields = options.fields;
    this.retryAfterS = options.retryAfterS;
  }

  get status(): number {
    return ERROR_STATUS[this.code];
  }
}

export interface ErrorBody {
  error: { code: string; message: string; fields?: FieldErrors };
}

export function errorBody(code: string, message: string, fields?: FieldErrors): ErrorBody {
  return { error: fields ? { code, message, fields } : { code, message } };
}

/** Field errors keyed by dotted path, the shape used by forms, actions and the API alike. */
export function zodFieldErrors(error: z.ZodError): FieldErrors {
  const fields: FieldErrors = {};
  for (const issue of error.issues) {
    const key = issue.path.length ? issue.path.join('.') : '_';
    (fields[key] ??= []).push(issue.message);
  }
  return fields;
}
