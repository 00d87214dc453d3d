/**
 * The pieces every area of the OpenAPI document shares: a fresh registry, the shared error format of
 * lib/http/errors.ts, error responses by status, and the security requirements of signed-in routes.
 *
 * Adding an area (one file per area under lib/openapi/paths/):
 *   1. Write `lib/openapi/paths/<area>.ts` exporting `register<Area>(registry: OpenAPIRegistry): void`
 *      that calls `registry.registerPath({...})` for each route+method, with the route's own zod
 *      schemas, `tags: [<your tag>]`, the media types it accepts and `...errorResponses(401, 404, …)`.
 *   2. Add one line to `API_AREAS` in lib/openapi/document.ts: `{ tag, description, register }`.
 *   The contract test (tests/e2e/api-contract.spec.ts) fails on any route file left undocumented.
 */
import { OpenAPIRegistry, type ResponseConfig } from '@asteasolutions/zod-to-openapi';
import { z } from 'zod';
import { ERROR_STATUS } from '@/lib/http/errors';

export { OpenAPIRegistry };

/** Names of the security schemes. The session scheme is registered here; the bearer scheme by paths/auth.ts. */
export const SESSION_SCHEME = 'sessionCookie';
export const BEARER_SCHEME = 'bearerToken';

/** A route that needs an account: a session cookie (same-origin) or a personal token. */
export const SIGNED_IN: Record<string, string[]>[] = [{ [SESSION_SCHEME]: [] }, { [BEARER_SCHEME]: [] }];
/** A route open to everyone that shows more (own drafts) to a signed-in caller. */
export const OPTIONALLY_SIGNED_IN: Record<string, string[]>[] = [{}, ...SIGNED_IN];

/** The status table's codes, plus `busy` (503, SQLite lock wait ran out) and `internal` (500). */
const ERROR_CODES = [...(Object.keys(ERROR_STATUS) as (keyof typeof ERROR_STATUS)[]), 'busy', 'internal'] as const;

export const errorSchema = z
  .object({
    error: z.object({
      code: z.enum(ERROR_CODES).meta({ description: 'Machine-readable reason; the HTTP status follows from it (lib/http/errors.ts).' }),
      message: z.string().meta({ description: 'A sentence for people: what went wrong and what to do.' }),
      fields: z
        .record(z.string(), z.array(z.string()))
        .optional()
        .meta({ description: 'Field errors keyed by dotted path (`specs.mass.value`, `entries.0.quantity`); `_` for the body as a whole.' }),
    }),
  })
  .meta({ id: 'Error', description: 'Every 4xx and 5xx response of /api/v1 has this body.' });

export type ErrorStatus = 400 | 401 | 403 | 404 | 409 | 413 | 415 | 422 | 429 | 503;

/** What each status means in this API (the status table of lib/http/errors.ts). */
export const ERROR_MEANING: Record<ErrorStatus, string> = {
  400: 'Malformed request: a bad query parameter, or a body that is not valid JSON / multipart.',
  401: 'No account: send an `Authorization: Bearer` personal token (or use the site’s session); also for a token that is unknown, revoked or whose account is disabled.',
  403: 'Not allowed: the target is visible but not yours to change, the role is too low, the token is read-only, or a session request did not come from this site.',
  404: 'No such resource, or the caller may not see it.',
  409: 'The resource is in a state that forbids this (for example in review and locked).',
  413: 'The body or file is too large.',
  415: 'Unsupported media type: send one of the media types listed for this operation.',
  422: 'The body fails its schema; `error.fields` names each field.',
  429: 'Too many requests: wait for `Retry-After` seconds.',
  503: 'The database was busy; nothing was saved. Send the same request again after `Retry-After` seconds.',
};

/** The responses for the given error statuses, each in the shared error format. */
export function errorResponses(...statuses: ErrorStatus[]): Record<string, ResponseConfig> {
  return Object.fromEntries(
    statuses.map((status) => [String(status), { description: ERROR_MEANING[status], content: { 'application/json': { schema: errorSchema } } }]),
  );
}

/** A registry with the shared components every area refers to. */
export function createRegistry(): OpenAPIRegistry {
  const registry = new OpenAPIRegistry();
  registry.registerComponent('securitySchemes', SESSION_SCHEME, {
    type: 'apiKey',
    in: 'cookie',
    name: 'authjs.session-token',
    description:
      'The browser session of a signed-in user (`__Secure-authjs.session-token` over HTTPS). Write requests with a session must come from this site: a different `Origin` is refused with 403.',
  });
  return registry;
}

/** Path parameters by name, described once. */
export const slugParam = z.string().min(1).max(200).meta({ description: 'The gear item’s slug, as in its page address `/gear/{slug}`.', example: 'glowmere-hearthglow-400' });
