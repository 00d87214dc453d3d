import { getDb } from '@/db';
import { getCurrentUser } from '@/lib/auth/guard';
import { apiHandler } from '@/lib/http/api';
import { handlePhotoList, handlePhotoUpload } from '@/lib/photos/handlers';

export const dynamic = 'force-dynamic';

/** Upload one photo: multipart/form-data, field `file` (≤ 15 MB; JPEG, PNG, WebP, AVIF) and optional `alt`. */
export const POST = apiHandler(async (request: Request, context: { params: Promise<{ slug: string }> }) => {
  const { slug } = await context.params;
  return handlePhotoUpload(getDb(), await getCurrentUser(), slug, request);
});

/** The item's photos with their variant URLs, srcset and alt text. */
export const GET = apiHandler(async (_request: Request, context: { params: Promise<{ slug: string }> }) => {
  const { slug } = await context.params;
  return handlePhotoList(getDb(), await getCurrentUser(), slug);
});
