import { z } from 'zod';
import { ALT_TEXT_MAX, MAX_FILE_BYTES, MAX_PHOTOS_PER_ITEM } from '@/lib/photos/config';
import { photoAltUpdateSchema, uploadAltSchema } from '@/lib/photos/schemas';
import { errorResponses, OPTIONALLY_SIGNED_IN, SIGNED_IN, slugParam, type OpenAPIRegistry } from '../registry';

const TAG = 'Photos';
const MB = 1024 * 1024;

/** The shape of lib/photos/handlers.ts `photoJson`. */
export const photoSchema = z
  .object({
    id: z.string(),
    url: z.string().meta({ description: 'The 960 px WebP variant.' }),
    srcSet: z.string().meta({ description: 'Every stored WebP width, for `<img srcset>`.' }),
    width: z.number().int(),
    height: z.number().int(),
    altText: z.string(),
    position: z.number().int(),
  })
  .meta({ id: 'Photo' });

export const photoListSchema = z.object({ photos: z.array(photoSchema) });
export const photoOneSchema = z.object({ photo: photoSchema });

const uploadForm = z.object({
  file: z.string().meta({
    format: 'binary',
    contentMediaType: 'image/*',
    description: `JPEG, PNG, WebP or AVIF (decided by the bytes, not the name), at most ${MAX_FILE_BYTES / MB} MB and 40 megapixels. Metadata (EXIF, GPS) is stripped.`,
  }),
  alt: uploadAltSchema.optional().meta({ description: `Alt text, at most ${ALT_TEXT_MAX} characters; may be empty now but is required before the item is submitted.` }),
});

const photoParams = z.object({ slug: slugParam, id: z.string().min(1).max(100).meta({ description: 'The photo’s id.' }) });

/** /api/v1/gear/{slug}/photos and /api/v1/gear/{slug}/photos/{id} (lib/photos/handlers.ts). */
export function registerPhotos(registry: OpenAPIRegistry): void {
  registry.registerPath({
    method: 'get',
    path: '/api/v1/gear/{slug}/photos',
    tags: [TAG],
    summary: 'List an item’s photos',
    description: 'In display order. Photos of an unpublished item are visible only to its author and editors (404 to everyone else).',
    security: OPTIONALLY_SIGNED_IN,
    request: { params: z.object({ slug: slugParam }) },
    responses: {
      200: { description: 'The photos with their variant URLs.', content: { 'application/json': { schema: photoListSchema } } },
      ...errorResponses(401, 404),
    },
  });

  registry.registerPath({
    method: 'post',
    path: '/api/v1/gear/{slug}/photos',
    tags: [TAG],
    summary: 'Upload a photo',
    description: `One photo per request; at most ${MAX_PHOTOS_PER_ITEM} per item. The author or an editor; locked (409) while the item is in review.`,
    security: SIGNED_IN,
    request: {
      params: z.object({ slug: slugParam }),
      body: { required: true, content: { 'multipart/form-data': { schema: uploadForm } } },
    },
    responses: {
      201: { description: 'Stored; WebP variants made.', content: { 'application/json': { schema: photoOneSchema } } },
      ...errorResponses(400, 401, 403, 404, 409, 413, 415, 422, 503),
    },
  });

  registry.registerPath({
    method: 'patch',
    path: '/api/v1/gear/{slug}/photos/{id}',
    tags: [TAG],
    summary: 'Change a photo’s alt text',
    security: SIGNED_IN,
    request: { params: photoParams, body: { required: true, content: { 'application/json': { schema: photoAltUpdateSchema } } } },
    responses: {
      200: { description: 'Saved.', content: { 'application/json': { schema: photoOneSchema } } },
      ...errorResponses(400, 401, 403, 404, 409, 413, 415, 422, 503),
    },
  });

  registry.registerPath({
    method: 'delete',
    path: '/api/v1/gear/{slug}/photos/{id}',
    tags: [TAG],
    summary: 'Delete a photo',
    description: 'The stored files go too (unless another item uses the same image).',
    security: SIGNED_IN,
    request: { params: photoParams },
    responses: {
      204: { description: 'Deleted.' },
      ...errorResponses(401, 403, 404, 409, 503),
    },
  });
}
