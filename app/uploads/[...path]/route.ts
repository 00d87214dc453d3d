import { getDb } from '@/db';
import { getCurrentUser } from '@/lib/auth/guard';
import { handleVariantRequest } from '@/lib/photos/serve';

export const dynamic = 'force-dynamic';

/** Stored photo variants: /uploads/<key>-<width>.webp (see lib/photos/serve.ts for caching and access). */
export async function GET(_request: Request, context: { params: Promise<{ path: string[] }> }) {
  const { path } = await context.params;
  return handleVariantRequest(getDb(), path, getCurrentUser);
}
