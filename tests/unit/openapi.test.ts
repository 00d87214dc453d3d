import { describe, expect, it } from 'vitest';
import { API_AREAS, buildOpenApiDocument } from '@/lib/openapi/document';

const METHODS = ['get', 'put', 'post', 'delete', 'options', 'head', 'patch', 'trace'] as const;

type Operation = {
  tags?: string[];
  parameters?: { name: string; in: string }[];
  requestBody?: { content?: Record<string, unknown> };
  responses?: Record<string, { content?: Record<string, { schema?: unknown }> }>;
  security?: Record<string, string[]>[];
};

const doc = buildOpenApiDocument();
const operations = Object.entries(doc.paths ?? {}).flatMap(([path, item]) =>
  METHODS.flatMap((method) => {
    const op = (item as Record<string, Operation | undefined>)[method];
    return op ? [{ path, method, op }] : [];
  }),
);

function refsIn(value: unknown, found: string[] = []): string[] {
  if (Array.isArray(value)) value.forEach((v) => refsIn(v, found));
  else if (value && typeof value === 'object') {
    for (const [k, v] of Object.entries(value)) {
      if (k === '$ref' && typeof v === 'string') found.push(v);
      else refsIn(v, found);
    }
  }
  return found;
}

describe('OpenAPI document of /api/v1', () => {
  it('is an OpenAPI 3.1 document with a title, a relative server and one tag per area', () => {
    // OpenAPI Specification 3.1.0 §4.8.1: the `openapi` field holds the version of the specification.
    expect(doc.openapi).toMatch(/^3\.1\.\d+$/);
    expect(doc.info.title).toBe('Trailbench API');
    expect(doc.servers).toEqual([{ url: '/' }]);
    expect(doc.tags?.map((t) => t.name)).toEqual(API_AREAS.map((a) => a.tag));
  });

  it('documents operations of every area, all under /api/v1, each tagged with a declared area', () => {
    const tags = new Set(API_AREAS.map((a) => a.tag));
    expect(operations.length).toBeGreaterThanOrEqual(22);
    for (const { path, op } of operations) {
      expect(path.startsWith('/api/v1/'), path).toBe(true);
      expect(op.tags?.length, path).toBe(1);
      expect(tags.has(op.tags![0]!), `${path} tag ${op.tags![0]}`).toBe(true);
    }
    for (const tag of tags) expect(operations.some(({ op }) => op.tags?.includes(tag)), tag).toBe(true);
  });

  it('gives every operation at least one response, and a media type with a schema to every body', () => {
    for (const { path, method, op } of operations) {
      const where = `${method.toUpperCase()} ${path}`;
      expect(Object.keys(op.responses ?? {}).length, where).toBeGreaterThan(0);
      expect(Object.keys(op.responses ?? {}).some((s) => /^2\d\d$/.test(s)), `${where} has a 2xx`).toBe(true);
      if (op.requestBody) {
        const media = Object.entries(op.requestBody.content ?? {});
        expect(media.length, where).toBeGreaterThan(0);
        for (const [type, body] of media) {
          expect(['application/json', 'multipart/form-data', 'text/csv'], `${where} ${type}`).toContain(type);
          expect((body as { schema?: unknown }).schema, `${where} ${type}`).toBeTruthy();
        }
      }
    }
  });

  it('sends every 4xx in the shared error format', () => {
    for (const { path, method, op } of operations) {
      for (const [status, response] of Object.entries(op.responses ?? {})) {
        if (!/^[45]\d\d$/.test(status)) continue;
        expect(response.content?.['application/json']?.schema, `${method} ${path} ${status}`).toEqual({ $ref: '#/components/schemas/Error' });
      }
    }
    const error = doc.components?.schemas?.Error as { required?: string[] };
    expect(error.required).toEqual(['error']);
  });

  it('declares each path parameter of the template, and nothing else in the path', () => {
    for (const { path, method, op } of operations) {
      const inTemplate = [...path.matchAll(/\{([^}]+)\}/g)].map((m) => m[1]).sort();
      const declared = (op.parameters ?? []).filter((p) => p.in === 'path').map((p) => p.name).sort();
      expect(declared, `${method} ${path}`).toEqual(inTemplate);
    }
  });

  it('resolves every $ref and names only registered security schemes', () => {
    for (const ref of refsIn(doc)) {
      const [, section, name] = /^#\/components\/(\w+)\/(.+)$/.exec(ref) ?? [];
      expect((doc.components as Record<string, Record<string, unknown>>)?.[section!]?.[name!], ref).toBeDefined();
    }
    const schemes = new Set(Object.keys(doc.components?.securitySchemes ?? {}));
    expect(schemes.has('sessionCookie')).toBe(true);
    for (const { path, op } of operations) for (const req of op.security ?? []) for (const name of Object.keys(req)) expect(schemes.has(name), `${path} ${name}`).toBe(true);
  });

  it('describes the write routes with the media types their handlers accept', () => {
    const body = (path: string, method: string) => Object.keys(operations.find((o) => o.path === path && o.method === method)?.op.requestBody?.content ?? {}).sort();
    expect(body('/api/v1/gear', 'post')).toEqual(['application/json']);
    expect(body('/api/v1/gear/{slug}/photos', 'post')).toEqual(['multipart/form-data']);
    expect(body('/api/v1/field-tests/{id}/readings', 'post')).toEqual(['application/json', 'multipart/form-data', 'text/csv']);
    expect(body('/api/v1/kits/{id}', 'patch')).toEqual(['application/json']);
  });

  it('is the same document when built twice (no state leaks between builds)', () => {
    expect(buildOpenApiDocument()).toEqual(doc);
  });
});
