import { z } from 'zod';
import { CATEGORIES, KIT_POWER_ROLES } from '@/lib/measure';
import { kitInputSchema, kitPatchSchema, MAX_ENTRIES } from '@/lib/kits/schemas';
import { errorResponses, OPTIONALLY_SIGNED_IN, SIGNED_IN, type OpenAPIRegistry } from '../registry';

const TAG = 'Kits';

const kitParams = z.object({ id: z.string().min(1).max(100).meta({ description: 'The kit’s id.' }) });

/** The kit as stored: the fields of `kitInputSchema` plus ids and times (db/kits.ts KitRecord). */
const kitRecordSchema = z
  .object({
    id: z.string(),
    name: z.string(),
    purpose: z.string(),
    tripDays: z.number().int(),
    peakSunHours: z.number().nullable().optional(),
    sky: z.string().nullable().optional(),
    skyShare: z.number().nullable().optional(),
    lossFraction: z.number().nullable().optional(),
    conversionEfficiency: z.number().nullable().optional(),
    entries: z.array(
      z
        .looseObject({
          quantity: z.number().int(),
          freeEnergyWh: z.number().nullable().optional().meta({ description: 'Free-form battery or power bank: stored energy of one unit, Wh (counted in `totals.storedWh` and the budget’s storage).' }),
          freeRatedW: z.number().nullable().optional().meta({ description: 'Free-form solar panel: rated power of one unit, W (counted in the budget’s panels).' }),
        })
        .meta({ description: 'An entry as sent (`kitEntrySchema`); `hidden: true` marks a catalog item the viewer may not read, shown as “unpublished item”.' }),
    ),
    createdAt: z.string(),
    updatedAt: z.string(),
    shareToken: z.string().nullable().optional().meta({ description: 'Only in the owner’s view.' }),
  })
  .meta({ id: 'KitRecord' });

const pathNodeSchema = z.object({
  itemName: z.string(),
  role: z.enum(KIT_POWER_ROLES).meta({ description: '`source` a panel, `storage` a battery or bank, `device`, `cable`, `adapter`.' }),
  detail: z.string().meta({ description: 'The ports used, in words: “12 V socket output”, “12 V socket → USB-C”.' }),
  efficiency: z.number().meta({ description: 'Share of the energy this step passes on (product of its stated efficiencies; 1 when it states no loss).' }),
});

const kitPathSchema = z
  .object({
    nodes: z.array(pathNodeSchema).meta({ description: 'The steps of the path in order, from the panel, battery or bank to the device.' }),
    efficiency: z.number().meta({ description: 'Product of every step’s efficiency: the share of the energy that arrives.' }),
    fromStorageEfficiency: z.number().nullable().meta({ description: 'From the last battery or bank to the device (what the budget uses); null for panel → device.' }),
    startsAt: z.enum(['source', 'storage']),
    maxWatts: z.number().nullable().meta({ description: 'The least power any stated port or cable rating along the path delivers, W; null when none is stated.' }),
    cautions: z.array(z.string()).meta({ description: 'Things to check by hand (plug sizes and polarity, unstated currents, cable ratings).' }),
  })
  .meta({ id: 'KitChargingPath' });

/** lib/kits/paths.ts KitChargingPaths. */
export const kitChargingSchema = z
  .object({
    devices: z.array(
      z.object({
        index: z.number().int().meta({ description: 'Index of the device’s entry in `kit.entries`.' }),
        name: z.string(),
        quantity: z.number().int(),
        listsPorts: z.boolean().meta({ description: 'False when the device lists no ports (nothing to check yet).' }),
        paths: z.array(kitPathSchema).meta({ description: 'Every path found, the most efficient first.' }),
        reasons: z.array(z.string()).meta({ description: 'With no path: each distinct reason, in plain words.' }),
        takes: z.array(z.string()).meta({ description: 'With no path: the inputs the device takes, in words.' }),
        offers: z.array(z.string()).meta({ description: 'With no path: the outputs of the kit’s batteries, banks and panels, in words.' }),
      }),
    ),
    truncated: z.boolean().meta({ description: 'True when the search reached its limits (some less efficient paths may be missing).' }),
    problem: z.string().nullable().meta({ description: 'Why no paths could be looked for at all (e.g. too many powered entries), else null.' }),
  })
  .meta({ id: 'KitChargingPaths', description: 'How each powered device of the kit can be run or charged from its panels, batteries and banks, or why it cannot.' });

/** app/api/v1/kits/view.ts `kitResponse`. */
export const kitResponseSchema = z
  .object({
    kit: kitRecordSchema,
    items: z.array(z.object({ id: z.string(), slug: z.string(), name: z.string(), maker: z.string(), category: z.enum(CATEGORIES) })).meta({
      description: 'The catalog items the kit uses that the viewer may read.',
    }),
    totals: z
      .looseObject({
        massG: z.number(),
        prices: z.array(z.object({ currency: z.string(), amountMinor: z.number().int() })).meta({ description: 'One total per currency (never added together), in minor units.' }),
        lightLm: z.number(),
        storedWh: z.number().meta({ description: 'Σ rated energy × quantity of the batteries and power banks, catalog and free-form (`freeEnergyWh`), Wh.' }),
        hiddenCount: z.number().int(),
      })
      .meta({ description: 'lib/kits/totals.ts KitTotals: mass (with a breakdown by group), prices, light output, stored energy.' }),
    budget: z
      .looseObject({
        result: z.unknown().meta({ description: 'lib/measure powerBudget result (daily Wh used and gathered, usable storage, days of autonomy, day-by-day state of charge), or null when the kit cannot be budgeted.' }),
        problem: z.unknown(),
        warnings: z.array(z.unknown()),
        loads: z.array(z.unknown()),
        storage: z.array(z.unknown()),
        panels: z.array(z.unknown()),
        charging: kitChargingSchema,
      })
      .meta({ description: 'The power budget of the kit (lib/kits/budget.ts) and the charging paths of its devices (`charging`).' }),
  })
  .meta({ id: 'Kit' });

export const kitListSchema = z.object({
  kits: z.array(
    z.object({ id: z.string(), name: z.string(), purpose: z.string(), tripDays: z.number().int(), entryCount: z.number().int(), shared: z.boolean(), updatedAt: z.string() }),
  ),
});

export const kitCopySchema = z.object({ kit: z.object({ id: z.string(), name: z.string(), path: z.string() }) });
export const kitShareSchema = z.object({
  token: z.string().meta({ description: 'At least 128 random bits, URL-safe.' }),
  path: z.string().meta({ description: '`/kits/shared/{token}`: the read-only page for anyone with the link.' }),
});

const privateNoStore = { description: 'Never cached: `private, no-store`.', headers: z.object({ 'Cache-Control': z.literal('private, no-store') }) };

/** /api/v1/kits… (app/api/v1/kits). */
export function registerKits(registry: OpenAPIRegistry): void {
  registry.registerPath({
    method: 'get',
    path: '/api/v1/kits',
    tags: [TAG],
    summary: 'List your kits',
    security: SIGNED_IN,
    responses: {
      200: { ...privateNoStore, description: 'Summaries of the caller’s own kits.', content: { 'application/json': { schema: kitListSchema } } },
      ...errorResponses(401),
    },
  });

  registry.registerPath({
    method: 'post',
    path: '/api/v1/kits',
    tags: [TAG],
    summary: 'Save a kit',
    description: `Private until shared. Up to ${MAX_ENTRIES} entries: catalog items by id (only items you may read) or free-form entries with a name and, for powered things, their draw (a free-form battery its stored energy, freeEnergyWh; a free-form panel its rated power, freeRatedW).`,
    security: SIGNED_IN,
    request: { body: { required: true, content: { 'application/json': { schema: kitInputSchema } } } },
    responses: {
      201: { description: 'The kit with its totals and budget; `Location` is its page.', content: { 'application/json': { schema: kitResponseSchema } } },
      ...errorResponses(400, 401, 403, 413, 415, 422, 503),
    },
  });

  registry.registerPath({
    method: 'get',
    path: '/api/v1/kits/{id}',
    tags: [TAG],
    summary: 'Read your kit',
    description: 'With totals and the power budget. Anyone else’s kit is 404.',
    security: SIGNED_IN,
    request: { params: kitParams },
    responses: {
      200: { ...privateNoStore, description: 'The kit.', content: { 'application/json': { schema: kitResponseSchema } } },
      ...errorResponses(401, 404),
    },
  });

  registry.registerPath({
    method: 'patch',
    path: '/api/v1/kits/{id}',
    tags: [TAG],
    summary: 'Change your kit',
    description: 'Any subset of the fields; `entries`, when given, replaces the list.',
    security: SIGNED_IN,
    request: { params: kitParams, body: { required: true, content: { 'application/json': { schema: kitPatchSchema } } } },
    responses: {
      200: { ...privateNoStore, description: 'The kit as saved.', content: { 'application/json': { schema: kitResponseSchema } } },
      ...errorResponses(400, 401, 403, 404, 413, 415, 422, 503),
    },
  });

  registry.registerPath({
    method: 'delete',
    path: '/api/v1/kits/{id}',
    tags: [TAG],
    summary: 'Delete your kit',
    security: SIGNED_IN,
    request: { params: kitParams },
    responses: { 204: { description: 'Deleted (its share link stops working).' }, ...errorResponses(401, 403, 404, 503) },
  });

  registry.registerPath({
    method: 'post',
    path: '/api/v1/kits/{id}/duplicate',
    tags: [TAG],
    summary: 'Duplicate your kit',
    description: 'A private copy (never shared).',
    security: SIGNED_IN,
    request: { params: kitParams },
    responses: {
      201: { description: 'The copy; `Location` is its page.', content: { 'application/json': { schema: kitCopySchema } } },
      ...errorResponses(401, 403, 404, 503),
    },
  });

  registry.registerPath({
    method: 'post',
    path: '/api/v1/kits/{id}/share',
    tags: [TAG],
    summary: 'Make a share link',
    description: 'A new random token; any earlier link of this kit stops working.',
    security: SIGNED_IN,
    request: { params: kitParams },
    responses: {
      201: { description: 'The link.', content: { 'application/json': { schema: kitShareSchema } } },
      ...errorResponses(401, 403, 404, 503),
    },
  });

  registry.registerPath({
    method: 'delete',
    path: '/api/v1/kits/{id}/share',
    tags: [TAG],
    summary: 'Revoke the share link',
    security: SIGNED_IN,
    request: { params: kitParams },
    responses: { 204: { description: 'Revoked at once.' }, ...errorResponses(401, 403, 404, 503) },
  });

  registry.registerPath({
    method: 'get',
    path: '/api/v1/kits/shared/{token}',
    tags: [TAG],
    summary: 'Read a shared kit',
    description: 'Read-only, for anyone with the link. Catalog items the viewer may not read appear as “unpublished item” with no details.',
    security: OPTIONALLY_SIGNED_IN,
    request: { params: z.object({ token: z.string().min(22).max(128).meta({ description: 'The share token from the link.' }) }) },
    responses: {
      200: { ...privateNoStore, description: 'The kit (no share token).', content: { 'application/json': { schema: kitResponseSchema } } },
      ...errorResponses(401, 404),
    },
  });
}
