import { createHash } from 'node:crypto';
import { fileTypeFromBuffer } from 'file-type';
import sharp, { type Metadata } from 'sharp';
import { AppError } from '../http/errors';
import { LARGEST_WIDTH, MAX_INPUT_PIXELS, PLACEHOLDER_WIDTH, VARIANT_WIDTHS } from './config';
import { writeVariants } from './storage';

/*
 * Turns an uploaded file into stored WebP variants (security-tests.md 1.4, UP-01 … UP-07):
 * - the type comes from the bytes (file-type magic numbers, then sharp's own format), never from the
 *   file name or Content-Type: JPEG, PNG, WebP and AVIF only;
 * - a pixel cap far below sharp's default is checked from the header before anything is decoded;
 * - sharp's decoders are an allowlist (sharp.block / unblock) for the whole process;
 * - `.rotate()` applies the EXIF orientation; output carries no metadata at all (sharp's default;
 *   this module never asks to keep any), so GPS, camera serials, XMP and IPTC are gone;
 * - every output is re-encoded, so trailing payloads and polyglot tricks do not survive;
 * - the original is not kept.
 */

export interface StoredPhoto {
  storageKey: string;
  /** Upright size of the original (after orientation), in pixels. */
  width: number;
  height: number;
  /** Total bytes of the stored variants. */
  bytes: number;
}

const ACCEPTED: Record<string, string> = {
  'image/jpeg': 'jpeg',
  'image/png': 'png',
  'image/webp': 'webp',
  'image/avif': 'heif',
};

const SUPPORTED_WORDS = 'Upload a JPEG, PNG, WebP or AVIF photo.';

let allowlistApplied = false;

/** Blocks every libvips loader except the buffer loaders of the accepted formats (AVIF is read by the HEIF loader). */
export function applyDecoderAllowlist(): void {
  if (allowlistApplied) return;
  sharp.block({ operation: ['VipsForeignLoad'] });
  sharp.unblock({ operation: ['VipsForeignLoadJpegBuffer', 'VipsForeignLoadPngBuffer', 'VipsForeignLoadWebpBuffer', 'VipsForeignLoadHeifBuffer'] });
  allowlistApplied = true;
}

function unsupported(what: string): AppError {
  return new AppError('unsupported_media_type', `Unsupported image type: ${what}. ${SUPPORTED_WORDS}`);
}

function describeDetected(mime: string | undefined, ext: string | undefined): string {
  if (!mime) return 'the file is not a recognised image';
  if (mime === 'image/heic' || mime === 'image/heif') return 'HEIC/HEIF photos are not accepted (export the photo as JPEG first)';
  return `the file is ${ext ? ext.toUpperCase() : mime}`;
}

const pixelLimitError = () =>
  new AppError('invalid', `Image exceeds ${MAX_INPUT_PIXELS / 1_000_000} megapixels. Resize it before uploading.`, {
    fields: { file: [`Image exceeds ${MAX_INPUT_PIXELS / 1_000_000} megapixels.`] },
  });

const corruptError = () =>
  new AppError('invalid', 'Image is corrupt or truncated and could not be read.', { fields: { file: ['Image is corrupt or truncated.'] } });

function mapSharpError(error: unknown): AppError {
  const message = error instanceof Error ? error.message : String(error);
  if (/pixel limit/i.test(message)) return pixelLimitError();
  if (/unsupported image format/i.test(message)) return unsupported('the file is not a recognised image');
  return corruptError();
}

/** Decoding options for untrusted input: the pixel cap is never false or 0, and warnings abort. */
function decode(buffer: Buffer) {
  return sharp(buffer, { limitInputPixels: MAX_INPUT_PIXELS, failOn: 'warning', pages: 1 });
}

/** Checks type and size from the bytes and header only (nothing is decoded yet). */
export async function inspectImage(buffer: Buffer): Promise<{ width: number; height: number; format: string }> {
  if (buffer.length === 0) throw new AppError('unsupported_media_type', `Unsupported image type: the file is empty. ${SUPPORTED_WORDS}`);
  const detected = await fileTypeFromBuffer(buffer);
  const expectedFormat = detected ? ACCEPTED[detected.mime] : undefined;
  if (!detected || !expectedFormat) throw unsupported(describeDetected(detected?.mime, detected?.ext));

  applyDecoderAllowlist();
  let meta: Metadata;
  try {
    meta = await decode(buffer).metadata();
  } catch (error) {
    throw mapSharpError(error);
  }
  if (meta.format !== expectedFormat) throw unsupported(`the file content does not match a ${detected.ext.toUpperCase()} image`);
  if (meta.format === 'heif' && meta.compression !== 'av1') throw unsupported(describeDetected('image/heic', 'heic'));
  const { width, height } = meta;
  if (!width || !height) throw corruptError();
  if (width * height > MAX_INPUT_PIXELS) throw pixelLimitError();
  const upright = (meta.orientation ?? 1) >= 5;
  return { width: upright ? height : width, height: upright ? width : height, format: meta.format };
}

/** Decodes once into an upright sRGB bitmap no wider than the largest variant, then encodes every variant from it. */
async function renderVariants(buffer: Buffer, originalWidth: number): Promise<Map<number, Buffer>> {
  const largest = Math.min(LARGEST_WIDTH, originalWidth);
  const { data, info } = await decode(buffer)
    .rotate()
    .resize({ width: largest, withoutEnlargement: true })
    .toColourspace('srgb')
    .raw({ depth: 'uchar' })
    .toBuffer({ resolveWithObject: true });
  const raw = { raw: { width: info.width, height: info.height, channels: info.channels } };
  const variants = new Map<number, Buffer>();
  const byRealWidth = new Map<number, Buffer>();
  for (const width of VARIANT_WIDTHS) {
    // A narrow original gives the same pixels for several names: encode once, store under each name.
    const real = Math.min(width, info.width);
    let encoded = byRealWidth.get(real);
    if (!encoded) {
      encoded = await sharp(data, raw).resize({ width: real }).webp({ quality: 80, effort: 4 }).toBuffer();
      byRealWidth.set(real, encoded);
    }
    variants.set(width, encoded);
  }
  variants.set(PLACEHOLDER_WIDTH, await sharp(data, raw).resize({ width: PLACEHOLDER_WIDTH }).blur(0.6).webp({ quality: 40 }).toBuffer());
  return variants;
}

/**
 * Checks, re-encodes and stores an uploaded image. `salt` (the gear item id) makes the content-hashed
 * key differ between items, so two items never share files. Throws AppError 415 (type), 422 (pixel cap,
 * corrupt input); writes nothing unless every variant was produced.
 */
export async function processAndStorePhoto(buffer: Buffer, options: { uploadsDir: string; salt: string }): Promise<StoredPhoto> {
  const { width, height } = await inspectImage(buffer);
  let variants: Map<number, Buffer>;
  try {
    variants = await renderVariants(buffer, width);
  } catch (error) {
    throw mapSharpError(error);
  }
  const largest = variants.get(LARGEST_WIDTH);
  if (!largest) throw new Error('largest variant missing');
  const storageKey = createHash('sha256').update(options.salt).update('\0').update(largest).digest('hex').slice(0, 32);
  await writeVariants(options.uploadsDir, storageKey, variants);
  const bytes = [...variants.values()].reduce((sum, b) => sum + b.length, 0);
  return { storageKey, width, height, bytes };
}

/**
 * Renders an SVG that the application itself wrote (the demo seed's drawings) to PNG. The SVG loader is
 * unblocked only for this call; uploads never reach sharp as SVG, because the byte check refuses them first.
 */
let trustedSvgRenders = 0;

export async function renderTrustedSvg(svg: string): Promise<Buffer> {
  // The allowlist is process-wide and renders may overlap: apply it first, and keep the SVG loader open until the
  // last overlapping render ends (a plain unblock/block pair let one render close the loader under another).
  applyDecoderAllowlist();
  if (trustedSvgRenders++ === 0) sharp.unblock({ operation: ['VipsForeignLoadSvgBuffer'] });
  try {
    return await sharp(Buffer.from(svg), { limitInputPixels: MAX_INPUT_PIXELS }).png().toBuffer();
  } finally {
    if (--trustedSvgRenders === 0) sharp.block({ operation: ['VipsForeignLoadSvgBuffer'] });
  }
}
