/**
 * Personal API tokens in the OpenAPI document: the bearer security scheme that SIGNED_IN and
 * OPTIONALLY_SIGNED_IN (registry.ts) refer to, and GET /api/v1/me, which a script calls to check its
 * token. Tokens are created and revoked on the account page (/account), never through the API.
 */
import { z } from 'zod';
import { ROLES } from '@/db/schema';
import { BEARER_SCHEME, errorResponses, SIGNED_IN, type OpenAPIRegistry } from '../registry';

const TAG = 'Personal tokens';

/** lib/auth/caller-view.ts callerView. */
const callerSchema = z
  .object({
    caller: z.object({
      id: z.string(),
      name: z.string(),
      role: z.enum(ROLES).meta({ description: 'The owner’s role now (a read-scope token sees as a reviewer at most).' }),
      via: z.enum(['token', 'session']),
      scope: z.enum(['read', 'write']).meta({ description: 'What this credential may do; a session counts as `write`.' }),
    }),
  })
  .meta({ id: 'Caller' });

export function registerAuth(registry: OpenAPIRegistry): void {
  registry.registerComponent('securitySchemes', BEARER_SCHEME, {
    type: 'http',
    scheme: 'bearer',
    bearerFormat: 'tb_<8-character id>_<43-character secret>',
    description: [
      'A personal API token, created by a reviewer (or editor, admin) on their account page (`/account`) and shown once.',
      'It acts as its owner with the owner’s role at the time of each request, and is refused with 401 once revoked or',
      'once the owner’s account is disabled. Scope `read`: public data plus the owner’s own drafts, kits and field tests.',
      'Scope `write`: also the write routes (a `read` token gets 403 there). Only a SHA-256 hash of the token is stored.',
      'Any `Authorization` header that is not a valid Bearer token is refused with 401 rather than treated as a guest.',
    ].join(' '),
  });

  registry.registerPath({
    method: 'get',
    path: '/api/v1/me',
    tags: [TAG],
    summary: 'Who this request acts as',
    description: 'Check a token before a long upload: the owner’s name, current role and the token’s scope. Never cached.',
    security: SIGNED_IN,
    responses: {
      200: { description: 'The caller.', content: { 'application/json': { schema: callerSchema } } },
      ...errorResponses(401),
    },
  });
}
