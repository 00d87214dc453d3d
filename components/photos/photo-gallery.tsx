import 'server-only';
import { getDb } from '@/db';
import { listPhotos } from '@/db/photos';
import { photoSrcSet, PLACEHOLDER_WIDTH, uploadsDir, variantUrl } from '@/lib/photos/config';
import { readVariant } from '@/lib/photos/storage';
import { PhotoActions } from './photo-actions';

/*
 * The photos of one gear item (server component). The caller has already checked that the viewer may
 * see the item. Each photo is an <img> with a srcset of the stored WebP variants and its alt text,
 * over a tiny blurred placeholder inlined as a data: URL (CSP img-src allows data:).
 */

export interface PhotoGalleryProps {
  gearItemId: string;
  /** Slug of the item (needed only with `manage`). */
  slug: string;
  itemName: string;
  /** Show alt-text editing and delete buttons (pass true for the owner or an editor). */
  manage?: boolean;
}

async function placeholderDataUrl(storageKey: string): Promise<string | null> {
  const bytes = await readVariant(uploadsDir(), storageKey, PLACEHOLDER_WIDTH);
  return bytes ? `data:image/webp;base64,${bytes.toString('base64')}` : null;
}

export async function PhotoGallery({ gearItemId, slug, itemName, manage = false }: PhotoGalleryProps) {
  const photos = listPhotos(getDb(), gearItemId);
  if (photos.length === 0) {
    return (
      <p className="text-sm text-slate" data-testid="photo-gallery-empty">
        No photos of {itemName} yet.
      </p>
    );
  }
  const placeholders = await Promise.all(photos.map((p) => placeholderDataUrl(p.storageKey)));
  return (
    <ul className="grid gap-4 sm:grid-cols-2" aria-label={`Photos of ${itemName}`} data-testid="photo-gallery">
      {photos.map((photo, index) => {
        const placeholder = placeholders[index];
        return (
          <li key={photo.id} className="space-y-2">
            <figure>
              <div
                className="overflow-hidden rounded-md bg-card bg-cover bg-center"
                style={{ aspectRatio: `${photo.width} / ${photo.height}`, ...(placeholder ? { backgroundImage: `url("${placeholder}")` } : {}) }}
              >
                {/* eslint-disable-next-line @next/next/no-img-element -- variants are pre-built by lib/photos; next/image would re-encode them */}
                <img
                  src={variantUrl(photo.storageKey, 960)}
                  srcSet={photoSrcSet(photo)}
                  sizes="(min-width: 640px) 50vw, 100vw"
                  width={photo.width}
                  height={photo.height}
                  alt={photo.altText}
                  loading={index === 0 ? 'eager' : 'lazy'}
                  decoding="async"
                  className="block h-full w-full object-cover"
                />
              </div>
            </figure>
            {manage ? <PhotoActions slug={slug} photoId={photo.id} altText={photo.altText} /> : null}
          </li>
        );
      })}
    </ul>
  );
}
