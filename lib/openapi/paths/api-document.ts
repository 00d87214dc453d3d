import { z } from 'zod';
import type { OpenAPIRegistry } from '../registry';

/** GET /api/v1/openapi.json (app/api/v1/openapi.json/route.ts): this document. */
export function registerApiDocument(registry: OpenAPIRegistry): void {
  registry.registerPath({
    method: 'get',
    path: '/api/v1/openapi.json',
    tags: ['This document'],
    summary: 'The OpenAPI document',
    description: 'OpenAPI 3.1, built from the same zod schemas the routes parse with. Public; cached for a minute.',
    security: [{}],
    responses: {
      200: {
        description: 'The document (`Cache-Control: public, max-age=60`).',
        content: {
          'application/json': {
            schema: z.looseObject({ openapi: z.string(), info: z.looseObject({ title: z.string(), version: z.string() }), paths: z.record(z.string(), z.unknown()) }),
          },
        },
      },
    },
  });
}
