import 'server-only';
import type { Db } from '@/db/connection';
import { canViewItem, itemsUsingStorageKey, type PhotoActor } from '@/db/photos';
import { parseVariantFileName, uploadsDir } from './config';
import { readVariant } from './storage';

/*
 * GET /uploads/<key>-<width>.webp. The path is validated strictly (one segment, 32 hex, a stored width),
 * so nothing outside the uploads folder can be named. Photos of approved items are public and immutable
 * (their names are content hashes); drafts are private, no-store, and 404 to anyone who may not see the item.
 */

function notFound(): Response {
  return new Response('Not found.', {
    status: 404,
    headers: { 'Content-Type': 'text/plain; charset=utf-8', 'Cache-Control': 'no-store', 'X-Content-Type-Options': 'nosniff' },
  });
}

export async function handleVariantRequest(
  db: Db,
  segments: readonly string[],
  getViewer: () => Promise<PhotoActor | null>,
  options: { uploadsDir?: string } = {},
): Promise<Response> {
  const [name] = segments;
  if (segments.length !== 1 || name === undefined) return notFound();
  const parsed = parseVariantFileName(name);
  if (!parsed) return notFound();
  const items = itemsUsingStorageKey(db, parsed.storageKey);
  if (items.length === 0) return notFound();
  const isPublic = items.some((item) => item.approvedAt !== null);
  if (!isPublic) {
    const viewer = await getViewer();
    if (!items.some((item) => canViewItem(item, viewer))) return notFound();
  }
  const data = await readVariant(options.uploadsDir ?? uploadsDir(), parsed.storageKey, parsed.width);
  if (!data) return notFound();
  return new Response(new Uint8Array(data), {
    status: 200,
    headers: {
      'Content-Type': 'image/webp',
      'Content-Length': String(data.length),
      'Cache-Control': isPublic ? 'public, max-age=31536000, immutable' : 'private, no-store',
      'X-Content-Type-Options': 'nosniff',
      'Content-Disposition': `inline; filename="photo-${parsed.width}.webp"`,
      ...(isPublic ? {} : { Vary: 'Cookie' }),
    },
  });
}
