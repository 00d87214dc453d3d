/**
 * Turns the OpenAPI document into what the API guide page shows: operations grouped by tag, their
 * parameters, body fields per media type, responses and who may call them. Pure: reads the document only.
 */
import type { OpenApiDocument } from './document';

type Schema = {
  $ref?: string;
  type?: string | string[];
  enum?: unknown[];
  const?: unknown;
  format?: string;
  anyOf?: Schema[];
  oneOf?: Schema[];
  allOf?: Schema[];
  items?: Schema;
  properties?: Record<string, Schema>;
  additionalProperties?: Schema | boolean;
  required?: string[];
  minLength?: number;
  maxLength?: number;
  minimum?: number;
  maximum?: number;
  exclusiveMinimum?: number;
  exclusiveMaximum?: number;
  minItems?: number;
  maxItems?: number;
  pattern?: string;
  default?: unknown;
  description?: string;
  contentMediaType?: string;
};

export interface GuideField {
  /** Dotted path; `[]` marks the items of an array (`entries[].quantity`). */
  name: string;
  type: string;
  required: boolean;
  notes: string;
}

export interface GuideParameter extends GuideField {
  in: string;
}

export interface GuideBody {
  mediaType: string;
  fields: GuideField[];
  /** The body is not an object (or has no listed fields): its type in words. */
  shape: string | null;
}

export interface GuideResponse {
  status: string;
  description: string;
  mediaType: string | null;
  fields: GuideField[];
}

export type GuideAccess = 'account' | 'anyone' | 'anyone, more when signed in';

export interface GuideOperation {
  id: string;
  method: string;
  path: string;
  summary: string;
  description: string;
  access: GuideAccess;
  parameters: GuideParameter[];
  bodies: GuideBody[];
  responses: GuideResponse[];
}

export interface GuideArea {
  tag: string;
  description: string;
  operations: GuideOperation[];
}

const METHODS = ['get', 'post', 'put', 'patch', 'delete'] as const;
/** Nested objects are listed down to this depth; deeper ones are summarised by their keys. */
const MAX_DEPTH = 3;
const MAX_ENUM_SHOWN = 8;
/** Longer patterns help programs, not readers: the guide points to the document instead. */
const MAX_PATTERN_SHOWN = 28;
/** A pattern made only of digits, signs, a decimal point and an exponent: a number sent as text. */
const NUMBER_PATTERN = /^\^[-?()\\d{}0-9,.*+|:eE[\]]+\$$/;
/** Parameters sharing a prefix (`min.mass`, `min.lm-per-g` …) are listed once as `min.{key}` from this many on. */
const PARAM_GROUP_MIN = 6;

type Components = Record<string, Schema>;

function resolve(schema: Schema | undefined, components: Components): Schema {
  if (!schema) return {};
  if (schema.$ref) {
    const name = schema.$ref.split('/').pop() ?? '';
    return { ...(components[name] ?? {}), description: schema.description ?? components[name]?.description };
  }
  return schema;
}

function isNullOnly(s: Schema): boolean {
  return s.type === 'null';
}

function literal(value: unknown): string {
  return typeof value === 'string' ? value : JSON.stringify(value);
}

/** The type of a schema in a few words: `string`, `integer or null`, `one of: a, b`, `array of object`, `file`. */
export function typeLabel(input: Schema | undefined, components: Components): string {
  const schema = resolve(input, components);
  const variants = schema.anyOf ?? schema.oneOf;
  if (variants) {
    const labels = [...new Set(variants.filter((v) => !isNullOnly(v)).map((v) => typeLabel(v, components)))];
    return variants.some(isNullOnly) ? `${labels.join(' or ')} or null` : labels.join(' or ');
  }
  if (schema.const !== undefined) return `“${literal(schema.const)}”`;
  if (schema.enum) {
    const values = schema.enum.filter((v) => v !== null).map(literal);
    const shown = values.length > MAX_ENUM_SHOWN ? [...values.slice(0, MAX_ENUM_SHOWN), '…'] : values;
    return `one of: ${shown.join(', ')}${schema.enum.includes(null) ? ' (or null)' : ''}`;
  }
  if (schema.format === 'binary') return schema.contentMediaType ? `file (${schema.contentMediaType})` : 'file';
  const types = Array.isArray(schema.type) ? schema.type : schema.type ? [schema.type] : [];
  const main = types.filter((t) => t !== 'null');
  let label = main.length ? main.join(' or ') : schema.properties ? 'object' : 'any';
  if (main.includes('array')) label = `array of ${typeLabel(schema.items, components)}`;
  if (schema.contentMediaType && main.includes('string')) label = `${schema.contentMediaType} text`;
  return types.includes('null') ? `${label} or null` : label;
}

/** Limits and defaults in words: `1–200 characters`, `≥ 0, ≤ 24`, `default 'packaging'`. */
export function constraintNotes(input: Schema | undefined, components: Components): string[] {
  const schema = resolve(input, components);
  const notes: string[] = [];
  const range = (min: number | undefined, max: number | undefined, unit: string) => {
    if (min !== undefined && max !== undefined) notes.push(min === max ? `exactly ${min} ${unit}` : `${min}–${max} ${unit}`);
    else if (min !== undefined && min > 0) notes.push(`at least ${min} ${unit}`);
    else if (max !== undefined) notes.push(`at most ${max} ${unit}`);
  };
  range(schema.minLength, schema.maxLength, 'characters');
  range(schema.minItems, schema.maxItems, 'items');
  const low = schema.exclusiveMinimum !== undefined ? `> ${schema.exclusiveMinimum}` : schema.minimum !== undefined ? `≥ ${schema.minimum}` : null;
  const high = schema.exclusiveMaximum !== undefined ? `< ${schema.exclusiveMaximum}` : schema.maximum !== undefined ? `≤ ${schema.maximum}` : null;
  if (low || high) notes.push([low, high].filter(Boolean).join(', '));
  if (schema.pattern) notes.push(NUMBER_PATTERN.test(schema.pattern) ? 'a number, written as text' : schema.pattern.length <= MAX_PATTERN_SHOWN ? `pattern ${schema.pattern}` : 'a fixed format (its pattern is in openapi.json)');
  if (schema.default === '') notes.push('default empty');
  else if (schema.default !== undefined && !(typeof schema.default === 'object' && schema.default !== null)) notes.push(`default ${JSON.stringify(schema.default)}`);
  for (const v of schema.anyOf ?? schema.oneOf ?? []) if (!isNullOnly(v)) notes.push(...constraintNotes(v, components));
  return [...new Set(notes)];
}

function objectOf(input: Schema | undefined, components: Components): Schema | null {
  const schema = resolve(input, components);
  if (schema.properties) return schema;
  const variants = (schema.anyOf ?? schema.oneOf ?? []).filter((v) => !isNullOnly(v)).map((v) => resolve(v, components));
  return variants.length === 1 && variants[0]!.properties ? variants[0]! : null;
}

function itemsOf(input: Schema | undefined, components: Components): Schema | null {
  const schema = resolve(input, components);
  const types = Array.isArray(schema.type) ? schema.type : [schema.type];
  return types.includes('array') && schema.items ? schema.items : null;
}

/** Many keys with one shape (the spec keys of a gear item): listed once as `{key}` with the keys in words. */
const UNIFORM_MIN_KEYS = 6;

function uniformKeys(schema: Schema): string[] | null {
  const entries = Object.entries(schema.properties ?? {});
  if (entries.length < UNIFORM_MIN_KEYS) return null;
  const first = JSON.stringify(entries[0]![1]);
  return entries.every(([, v]) => JSON.stringify(v) === first) ? entries.map(([k]) => k) : null;
}

/** The fields of an object schema, nested objects and arrays of objects flattened to dotted names. */
export function schemaFields(input: Schema | undefined, components: Components, prefix = '', depth = 1): GuideField[] {
  const found = objectOf(input, components);
  if (!found?.properties) return [];
  const keys = prefix ? uniformKeys(found) : null;
  const schema: Schema = keys ? { properties: { '{key}': found.properties[keys[0]!]! } } : found;
  const required = new Set(schema.required ?? []);
  const fields: GuideField[] = [];
  for (const [key, raw] of Object.entries(schema.properties ?? {})) {
    const name = `${prefix}${key}`;
    const prop = resolve(raw, components);
    const nested = objectOf(prop, components);
    const items = itemsOf(prop, components);
    const itemObject = items ? objectOf(items, components) : null;
    let type = typeLabel(raw, components);
    if (nested && depth >= MAX_DEPTH) type = `object: ${Object.keys(nested.properties ?? {}).join(', ')}`;
    const keyList = nested ? uniformKeys(nested) : null;
    const notes = [prop.description ?? raw.description, keyList ? `{key} is one of: ${keyList.join(', ')}` : null, ...constraintNotes(raw, components)];
    fields.push({ name, type, required: required.has(key), notes: notes.filter(Boolean).join(' · ') });
    if (depth < MAX_DEPTH) {
      if (nested) fields.push(...schemaFields(nested, components, `${name}.`, depth + 1));
      else if (itemObject) fields.push(...schemaFields(itemObject, components, `${name}[].`, depth + 1));
    }
  }
  return fields;
}

function accessOf(security: Record<string, string[]>[] | undefined): GuideAccess {
  if (!security || security.length === 0) return 'anyone';
  const anonymous = security.some((req) => Object.keys(req).length === 0);
  const named = security.some((req) => Object.keys(req).length > 0);
  if (!named) return 'anyone';
  return anonymous ? 'anyone, more when signed in' : 'account';
}

type Operation = {
  summary?: string;
  description?: string;
  tags?: string[];
  security?: Record<string, string[]>[];
  parameters?: { name: string; in: string; required?: boolean; description?: string; schema?: Schema }[];
  requestBody?: { content?: Record<string, { schema?: Schema }> };
  responses?: Record<string, { description?: string; content?: Record<string, { schema?: Schema }> }>;
};

/** Optional parameters named `<prefix>.<key>` with one type, many of them: one row `<prefix>.{key}` listing the keys. */
export function groupParameters(params: GuideParameter[]): GuideParameter[] {
  const groups = new Map<string, GuideParameter[]>();
  for (const p of params) {
    const dot = p.name.indexOf('.');
    if (dot > 0 && !p.required) groups.set(`${p.in} ${p.name.slice(0, dot)} ${p.type}`, [...(groups.get(`${p.in} ${p.name.slice(0, dot)} ${p.type}`) ?? []), p]);
  }
  const out: GuideParameter[] = [];
  const done = new Set<string>();
  for (const p of params) {
    const dot = p.name.indexOf('.');
    const key = dot > 0 && !p.required ? `${p.in} ${p.name.slice(0, dot)} ${p.type}` : null;
    const group = key ? groups.get(key)! : null;
    if (!key || !group || group.length < PARAM_GROUP_MIN) {
      out.push(p);
      continue;
    }
    if (done.has(key)) continue;
    done.add(key);
    const prefix = p.name.slice(0, dot);
    const keys = group.map((g) => g.name.slice(dot + 1));
    // Notes that differ only by the key read as one; other differences (a unit in brackets) are left out.
    const variants = new Set(group.map((g) => g.notes.split(g.name.slice(dot + 1)).join('{key}')));
    const notes = variants.size === 1 ? [...variants][0]! : p.notes.split(keys[0]!).join('{key}').replace(/\s*\([^)]*\)/g, '');
    out.push({ ...p, name: `${prefix}.{key}`, notes: `${notes} · {key} is one of: ${keys.join(', ')}` });
  }
  return out;
}

export function operationId(method: string, path: string): string {
  return `${method}-${path.replace(/^\/api\/v1\//, '').replace(/[{}]/g, '').replace(/[^A-Za-z0-9]+/g, '-')}`.replace(/-+$/, '');
}

/** The document as areas (in the order of its tags) of operations (in the order of its paths). */
export function apiGuide(doc: OpenApiDocument): GuideArea[] {
  const components = (doc.components?.schemas ?? {}) as Components;
  const areas: GuideArea[] = (doc.tags ?? []).map((t) => ({ tag: t.name, description: t.description ?? '', operations: [] }));
  const byTag = new Map(areas.map((a) => [a.tag, a]));
  for (const [path, item] of Object.entries(doc.paths ?? {})) {
    for (const method of METHODS) {
      const op = (item as Record<string, Operation | undefined>)[method];
      if (!op) continue;
      const tag = op.tags?.[0] ?? 'Other';
      if (!byTag.has(tag)) {
        const area = { tag, description: '', operations: [] };
        areas.push(area);
        byTag.set(tag, area);
      }
      byTag.get(tag)!.operations.push({
        id: operationId(method, path),
        method: method.toUpperCase(),
        path,
        summary: op.summary ?? '',
        description: op.description ?? '',
        access: accessOf(op.security),
        parameters: groupParameters(
          (op.parameters ?? []).map((p) => ({
            name: p.name,
            in: p.in,
            type: typeLabel(p.schema, components),
            required: p.required ?? false,
            notes: [p.description, ...constraintNotes(p.schema, components)].filter(Boolean).join(' · '),
          })),
        ),
        bodies: Object.entries(op.requestBody?.content ?? {}).map(([mediaType, media]) => {
          const fields = schemaFields(media.schema, components);
          return { mediaType, fields, shape: fields.length ? null : typeLabel(media.schema, components) };
        }),
        responses: Object.entries(op.responses ?? {}).map(([status, response]) => {
          const [mediaType, media] = Object.entries(response.content ?? {})[0] ?? [null, null];
          const isError = /^[45]/.test(status);
          return { status, description: response.description ?? '', mediaType, fields: isError ? [] : schemaFields(media?.schema, components) };
        }),
      });
    }
  }
  return areas.filter((a) => a.operations.length > 0);
}
