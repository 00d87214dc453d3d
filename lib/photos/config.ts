import path from 'node:path';

/** Upload limits and variant sizes for gear photos (issue 4, "Photos"; security-tests.md UP-01, UP-02). */
export const MAX_FILE_BYTES = 15 * 1024 * 1024;
/** Room for multipart boundaries, part headers and the alt text around the file. */
export const MAX_BODY_BYTES = MAX_FILE_BYTES + 64 * 1024;
/** Decompression-bomb cap, far below sharp's default of 268 MP (security-tests.md 1.4). */
export const MAX_INPUT_PIXELS = 40_000_000;
export const MAX_PHOTOS_PER_ITEM = 10;
export const ALT_TEXT_MAX = 300;

/** Responsive WebP widths; a narrower original is never upscaled. */
export const VARIANT_WIDTHS = [480, 960, 1600] as const;
export const LARGEST_WIDTH = 1600;
/** A tiny blurred preview shown while a variant loads. */
export const PLACEHOLDER_WIDTH = 16;
export const STORED_WIDTHS: readonly number[] = [PLACEHOLDER_WIDTH, ...VARIANT_WIDTHS];

/** Storage keys are 32 lowercase hex characters (a truncated SHA-256); nothing else names a stored file. */
export const STORAGE_KEY_RE = /^[0-9a-f]{32}$/;

export function uploadsDir(): string {
  return path.resolve(/* turbopackIgnore: true */ process.env.UPLOADS_DIR ?? './uploads');
}

export function variantFileName(storageKey: string, width: number): string {
  return `${storageKey}-${width}.webp`;
}

/** Public URL of a stored variant (served by app/uploads/[...path]/route.ts). */
export function variantUrl(storageKey: string, width: number): string {
  return `/uploads/${variantFileName(storageKey, width)}`;
}

/** Parses a requested file name strictly: `<32 hex>-<stored width>.webp`, nothing else. */
export function parseVariantFileName(name: string): { storageKey: string; width: number } | null {
  const match = /^([0-9a-f]{32})-(\d{1,4})\.webp$/.exec(name);
  const [, storageKey, widthText] = match ?? [];
  if (!storageKey || !widthText) return null;
  const width = Number(widthText);
  if (!STORED_WIDTHS.includes(width)) return null;
  return { storageKey, width };
}

/** srcset of a photo's variants, each with its real width (a narrow original is not upscaled, so duplicates are dropped). */
export function photoSrcSet(photo: { storageKey: string; width: number }): string {
  const seen = new Set<number>();
  const parts: string[] = [];
  for (const width of VARIANT_WIDTHS) {
    const real = Math.min(width, photo.width);
    if (seen.has(real)) continue;
    seen.add(real);
    parts.push(`${variantUrl(photo.storageKey, width)} ${real}w`);
  }
  return parts.join(', ');
}
