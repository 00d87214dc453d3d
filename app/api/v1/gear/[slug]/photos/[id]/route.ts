import { getDb } from '@/db';
import { requireApiCaller } from '@/lib/auth/api-caller';
import { apiHandler } from '@/lib/http/api';
import { handlePhotoAltUpdate, handlePhotoDelete } from '@/lib/photos/handlers';

export const dynamic = 'force-dynamic';

type Context = { params: Promise<{ slug: string; id: string }> };

/** Change a photo's alt text: JSON `{ "alt": "…" }`. */
export const PATCH = apiHandler(async (request: Request, context: Context) => {
  const { slug, id } = await context.params;
  return handlePhotoAltUpdate(getDb(), await requireApiCaller(request, { scope: 'write' }), slug, id, request);
});

/** Delete a photo and its stored files. */
export const DELETE = apiHandler(async (request: Request, context: Context) => {
  const { slug, id } = await context.params;
  return handlePhotoDelete(getDb(), await requireApiCaller(request, { scope: 'write' }), slug, id, request);
});
