import { z } from 'zod';
import { gearInputSchema, gearPatchSchema } from '@/lib/gear/schemas';
import { errorResponses, SIGNED_IN, slugParam, type OpenAPIRegistry } from '../registry';

const TAG = 'Gear';

const createdItem = z.object({
  item: z.object({
    slug: z.string().meta({ description: 'Made from the maker and name; the item’s address.' }),
    status: z.literal('draft'),
    path: z.string().meta({ description: 'The item’s page, `/gear/{slug}`.' }),
  }),
});

const changedItem = z.object({
  item: z.object({
    slug: z.string(),
    pending: z.boolean().meta({ description: 'True when the item is approved: the change waits for an editor and the public figures stay as they are.' }),
    path: z.string(),
  }),
});

export const gearWriteResponses = { createdItem, changedItem };

/** POST /api/v1/gear and PATCH /api/v1/gear/{slug} (app/api/v1/gear/route.ts, app/api/v1/gear/[slug]/route.ts). */
export function registerGearWrites(registry: OpenAPIRegistry): void {
  registry.registerPath({
    method: 'post',
    path: '/api/v1/gear',
    tags: [TAG],
    summary: 'Record a gear item (draft)',
    description:
      'Creates a draft item owned by the caller (reviewer, editor or admin). Spec values are typed text with a unit (`"12.3 oz"`, `"10 400 mAh at 3.6 V"`) or a number in the canonical unit; prices in major units with an ISO 4217 currency. Unknown keys are refused.',
    security: SIGNED_IN,
    request: { body: { required: true, content: { 'application/json': { schema: gearInputSchema } } } },
    responses: {
      201: {
        description: 'Created; `Location` is the item’s page.',
        headers: z.object({ Location: z.string() }),
        content: { 'application/json': { schema: createdItem } },
      },
      ...errorResponses(400, 401, 403, 413, 415, 422, 503),
    },
  });

  registry.registerPath({
    method: 'patch',
    path: '/api/v1/gear/{slug}',
    tags: [TAG],
    summary: 'Change a gear item',
    description:
      'Any subset of the editable fields; each given field replaces the current one (specs and modes as a whole). The category is fixed at creation. Only the author or an editor; locked (409) while in review.',
    security: SIGNED_IN,
    request: { params: z.object({ slug: slugParam }), body: { required: true, content: { 'application/json': { schema: gearPatchSchema } } } },
    responses: {
      200: { description: 'Saved.', content: { 'application/json': { schema: changedItem } } },
      ...errorResponses(400, 401, 403, 404, 409, 413, 415, 422, 503),
    },
  });
}
