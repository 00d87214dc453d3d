/**
 * The OpenAPI 3.1 document of /api/v1, built from the zod schemas the routes themselves parse with.
 * Each area of the API lives in one file under ./paths and is listed once in API_AREAS (see registry.ts
 * for how to add one). Served at /api/v1/openapi.json and rendered by the API guide page (/api-guide).
 */
import { OpenApiGeneratorV31 } from '@asteasolutions/zod-to-openapi';
import { createRegistry, type OpenAPIRegistry } from './registry';
import { registerApiDocument } from './paths/api-document';
import { registerAuth } from './paths/auth';
import { registerFieldTests } from './paths/field-tests';
import { registerGearWrites } from './paths/gear';
import { registerKits } from './paths/kits';
import { registerLongTermNotes } from './paths/long-term-notes';
import { registerPhotos } from './paths/photos';
import { registerPublicReads } from './paths/public-reads';

export type OpenApiDocument = ReturnType<OpenApiGeneratorV31['generateDocument']>;

export interface ApiArea {
  /** Tag name shown as the group heading on the API guide. */
  tag: string;
  description: string;
  register: (registry: OpenAPIRegistry) => void;
}

export const API_AREAS: ApiArea[] = [
  { tag: 'Browse and reviews', description: 'Public reads of the catalog and the published reviews.', register: registerPublicReads },
  { tag: 'Gear', description: 'Record gear items and change them (reviewers; editors for any item).', register: registerGearWrites },
  { tag: 'Photos', description: 'Photos of a gear item: list, upload, describe, delete.', register: registerPhotos },
  { tag: 'Field tests', description: 'Field-test records, their trials and readings, and the review workflow.', register: registerFieldTests },
  { tag: 'Long-term notes', description: 'Dated notes on gear in service (use, wear, failures, repairs) and their review.', register: registerLongTermNotes },
  { tag: 'Kits', description: 'Kits and their power budget: your own kits, duplicates and share links.', register: registerKits },
  { tag: 'This document', description: 'The OpenAPI document itself, for code generators and API tools.', register: registerApiDocument },
  { tag: 'Personal tokens', description: 'Personal API tokens for scripts: created and revoked on your account page (/account), sent as `Authorization: Bearer <token>`.', register: registerAuth },
];

const DESCRIPTION = [
  'The JSON API of Trailbench: public reads of the catalog, and writes for reviewers’ scripts.',
  '',
  'Errors always have the body `{ "error": { "code", "message", "fields"? } }` (schema `Error`).',
  'Write routes accept a session cookie only from this site (same `Origin`), or a personal token as',
  '`Authorization: Bearer <token>`; a token acts with its owner’s current role.',
].join('\n');

/** Security requirements may name a scheme another area registers; drop those not (yet) registered. */
function keepRegisteredSchemes(doc: OpenApiDocument): OpenApiDocument {
  const known = new Set(Object.keys(doc.components?.securitySchemes ?? {}));
  for (const item of Object.values(doc.paths ?? {})) {
    for (const operation of Object.values(item)) {
      if (!operation || typeof operation !== 'object' || !('security' in operation) || !Array.isArray(operation.security)) continue;
      const security = (operation.security as Record<string, string[]>[]).filter((req) => Object.keys(req).every((name) => known.has(name)));
      operation.security = security;
    }
  }
  return doc;
}

export function buildOpenApiDocument(areas: readonly ApiArea[] = API_AREAS): OpenApiDocument {
  const registry = createRegistry();
  for (const area of areas) area.register(registry);
  const doc = new OpenApiGeneratorV31(registry.definitions).generateDocument({
    openapi: '3.1.0',
    info: { title: 'Trailbench API', version: '1', description: DESCRIPTION },
    servers: [{ url: '/' }],
    tags: areas.map((a) => ({ name: a.tag, description: a.description })),
  });
  return keepRegisteredSchemes(doc);
}

let cached: OpenApiDocument | null = null;

/** The document, built once per process (the schemas do not change at run time). */
export function openApiDocument(): OpenApiDocument {
  cached ??= buildOpenApiDocument();
  return cached;
}
