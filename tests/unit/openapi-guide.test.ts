import { describe, expect, it } from 'vitest';
import { z } from 'zod';
import { buildOpenApiDocument } from '@/lib/openapi/document';
import { apiGuide, constraintNotes, groupParameters, schemaFields, typeLabel } from '@/lib/openapi/guide';
import { readingsExample } from '@/app/api-guide/example';

const asSchema = (s: z.ZodType) => z.toJSONSchema(s, { target: 'draft-2020-12', io: 'input' }) as Parameters<typeof typeLabel>[0];

describe('API guide: the document in words', () => {
  it('names types the way a reader says them', () => {
    expect(typeLabel(asSchema(z.string().nullable()), {})).toBe('string or null');
    expect(typeLabel(asSchema(z.enum(['clear', 'overcast'])), {})).toBe('one of: clear, overcast');
    expect(typeLabel(asSchema(z.array(z.number().int())), {})).toBe('array of integer');
    expect(typeLabel(asSchema(z.union([z.number(), z.string()]).nullable()), {})).toBe('number or string or null');
    expect(typeLabel({ $ref: '#/components/schemas/Photo' }, { Photo: { type: 'object', properties: { id: { type: 'string' } } } })).toBe('object');
  });

  it('states limits and defaults', () => {
    expect(constraintNotes(asSchema(z.string().min(1).max(120)), {})).toEqual(['1–120 characters']);
    expect(constraintNotes(asSchema(z.number().gt(0).max(1)), {})).toEqual(['> 0, ≤ 1']);
    expect(constraintNotes(asSchema(z.string().default('packaging')), {})).toEqual(['default "packaging"']);
  });

  it('flattens nested objects and arrays of objects to dotted names, and lists keys of one shape once', () => {
    const spec = z.object({ value: z.number(), source: z.string().optional() }).optional();
    const schema = z.object({
      name: z.string(),
      entries: z.array(z.object({ quantity: z.number().int() })),
      specs: z.object(Object.fromEntries(['a', 'b', 'c', 'd', 'e', 'f'].map((k) => [k, spec]))),
    });
    const fields = schemaFields(asSchema(schema), {});
    expect(fields.map((f) => `${f.name} ${f.required ? '*' : ''}`.trim())).toEqual([
      'name *',
      'entries *',
      'entries[].quantity *',
      'specs *',
      'specs.{key}',
      'specs.{key}.value *',
      'specs.{key}.source',
    ]);
    expect(fields.find((f) => f.name === 'specs')?.notes).toContain('{key} is one of: a, b, c, d, e, f');
  });

  it('groups every documented operation under its area, in the order of the tags', () => {
    const doc = buildOpenApiDocument();
    const areas = apiGuide(doc);
    expect(areas.map((a) => a.tag)).toEqual(doc.tags?.map((t) => t.name).filter((t) => areas.some((a) => a.tag === t)));
    const count = Object.values(doc.paths ?? {}).reduce((n, item) => n + ['get', 'post', 'put', 'patch', 'delete'].filter((m) => m in (item as object)).length, 0);
    expect(areas.reduce((n, a) => n + a.operations.length, 0)).toBe(count);
    const upload = areas.flatMap((a) => a.operations).find((o) => o.method === 'POST' && o.path === '/api/v1/gear/{slug}/photos');
    expect(upload?.access).toBe('account');
    expect(upload?.bodies.map((b) => b.mediaType)).toEqual(['multipart/form-data']);
    expect(upload?.bodies[0]?.fields.find((f) => f.name === 'file')?.type).toMatch(/^file/);
    expect(new Set(areas.flatMap((a) => a.operations.map((o) => o.id))).size).toBe(count);
  });

  it('shows the readings upload in a media type the route is documented to take', () => {
    const doc = buildOpenApiDocument();
    const example = readingsExample(doc);
    const body = doc.paths?.['/api/v1/field-tests/{id}/readings']?.post?.requestBody as { content: Record<string, unknown> };
    const sent = example.command.includes('Content-Type: text/csv') ? 'text/csv' : 'multipart/form-data';
    expect(Object.keys(body.content)).toContain(sent);
    expect(example.command).toContain('Authorization: Bearer $TRAILBENCH_TOKEN');
    expect(example.command).toContain('/api/v1/field-tests/$FIELD_TEST_ID/readings');
  });
});

describe('API guide: parameters sharing a prefix', () => {
  it('lists six or more `prefix.key` parameters of one type once, with the keys; fewer stay as they are', () => {
    const keys = ['mass', 'luminousFlux', 'runtime', 'ratedEnergy', 'ratedPower', 'lm-per-g'];
    const params = [
      { name: 'sort', in: 'query', type: 'string', required: false, notes: '' },
      ...keys.map((k, i) => ({ name: `min.${k}`, in: 'query', type: 'string', required: false, notes: `Keep items whose ${k} is at least this (unit ${i}).` })),
      { name: 'max.mass', in: 'query', type: 'string', required: false, notes: 'Keep items whose mass is at most this.' },
    ];
    const grouped = groupParameters(params);
    expect(grouped.map((p) => p.name)).toEqual(['sort', 'min.{key}', 'max.mass']);
    expect(grouped[1]!.notes).toBe(`Keep items whose {key} is at least this. · {key} is one of: ${keys.join(', ')}`);
  });
});
