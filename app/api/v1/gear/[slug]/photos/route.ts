import { getDb } from '@/db';
import { optionalApiCaller, requireApiCaller } from '@/lib/auth/api-caller';
import { apiHandler } from '@/lib/http/api';
import { handlePhotoList, handlePhotoUpload } from '@/lib/photos/handlers';

export const dynamic = 'force-dynamic';

/** Upload one photo: multipart/form-data, field `file` (≤ 15 MB; JPEG, PNG, WebP, AVIF) and optional `alt`. */
export const POST = apiHandler(async (request: Request, context: { params: Promise<{ slug: string }> }) => {
  const { slug } = await context.params;
  return handlePhotoUpload(getDb(), await requireApiCaller(request, { scope: 'write' }), slug, request);
});

/** The item's photos with their variant URLs, srcset and alt text. */
export const GET = apiHandler(async (request: Request, context: { params: Promise<{ slug: string }> }) => {
  const { slug } = await context.params;
  return handlePhotoList(getDb(), await optionalApiCaller(request), slug);
});
