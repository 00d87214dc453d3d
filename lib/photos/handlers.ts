import 'server-only';
import { readBodyCapped } from '@/lib/http/body';
import { NextResponse } from 'next/server';
import type { Db } from '@/db/connection';
import {
  assertCanChangePhotos,
  assertRoomForPhoto,
  deletePhoto,
  findItemForViewer,
  insertPhoto,
  listPhotos,
  removeFilesIfUnused,
  updatePhotoAlt,
  type Photo,
  type PhotoActor,
} from '@/db/photos';
import { apiHandler, assertSameOrigin, parseWith, readJson } from '@/lib/http/api';
import { AppError } from '@/lib/http/errors';
import { MAX_BODY_BYTES, MAX_FILE_BYTES, photoSrcSet, uploadsDir, variantUrl } from './config';
import { processAndStorePhoto } from './process';
import { photoAltUpdateSchema, uploadAltSchema } from './schemas';

/*
 * The photo API without Next's request context: the route files resolve the session and call these,
 * and tests call them directly with a user and a Request. Each returns a Response (errors in the shared format).
 */

const MB = 1024 * 1024;
const tooLarge = () => new AppError('too_large', `The photo is larger than ${MAX_FILE_BYTES / MB} MB. Choose a smaller file.`);

export interface PhotoJson {
  id: string;
  url: string;
  srcSet: string;
  width: number;
  height: number;
  altText: string;
  position: number;
}

export function photoJson(photo: Photo): PhotoJson {
  return {
    id: photo.id,
    url: variantUrl(photo.storageKey, 960),
    srcSet: photoSrcSet(photo),
    width: photo.width,
    height: photo.height,
    altText: photo.altText,
    position: photo.position,
  };
}

function requireActor(user: PhotoActor | null): PhotoActor {
  if (!user) throw new AppError('unauthenticated', 'Sign in to do this.');
  return user;
}


async function readUploadForm(request: Request): Promise<{ file: File; alt: string }> {
  const type = request.headers.get('content-type') ?? '';
  if (!/^multipart\/form-data\s*;\s*boundary=/i.test(type)) {
    throw new AppError('unsupported_media_type', 'Send the photo as multipart/form-data with the field "file".');
  }
  const body = await readBodyCapped(request, MAX_BODY_BYTES, tooLarge);
  let form: FormData;
  try {
    form = await new Response(body as BodyInit, { headers: { 'content-type': type } }).formData();
  } catch {
    throw new AppError('bad_request', 'The upload could not be read as multipart/form-data.');
  }
  const file = form.get('file');
  if (!(file instanceof File)) throw new AppError('invalid', 'Choose a photo to upload.', { fields: { file: ['Choose a photo to upload.'] } });
  if (file.size > MAX_FILE_BYTES) throw tooLarge();
  const altRaw = form.get('alt');
  const alt = parseWith(uploadAltSchema, typeof altRaw === 'string' ? altRaw : '');
  return { file, alt };
}

/** GET /api/v1/gear/{slug}/photos — the item's photos in order (404 when the viewer may not see the item). */
export const handlePhotoList = apiHandler(async (db: Db, viewer: PhotoActor | null, slug: string) => {
  const item = findItemForViewer(db, slug, viewer);
  const list = listPhotos(db, item.id).map(photoJson);
  return NextResponse.json({ photos: list }, { headers: { 'Cache-Control': item.approvedAt !== null ? 'no-cache' : 'private, no-store' } });
});

/** POST /api/v1/gear/{slug}/photos — multipart field `file` (and optional `alt`); 201 with the stored photo. */
export const handlePhotoUpload = apiHandler(async (db: Db, user: PhotoActor | null, slug: string, request: Request, options: { uploadsDir?: string } = {}) => {
  assertSameOrigin(request);
  const actor = requireActor(user);
  const item = findItemForViewer(db, slug, actor);
  assertCanChangePhotos(item, actor);
  assertRoomForPhoto(db, item.id);
  const { file, alt } = await readUploadForm(request);

  const dir = options.uploadsDir ?? uploadsDir();
  const buffer = Buffer.from(await file.arrayBuffer());
  const stored = await processAndStorePhoto(buffer, { uploadsDir: dir, salt: item.id });
  let photo: Photo;
  try {
    photo = insertPhoto(db, { gearItemId: item.id, ownerId: actor.id, ...stored, altText: alt });
  } catch (error) {
    await removeFilesIfUnused(db, stored.storageKey, dir);
    throw error;
  }
  return NextResponse.json({ photo: photoJson(photo) }, { status: 201, headers: { 'Cache-Control': 'no-store' } });
});

function checkPhotoId(photoId: string): void {
  // Photo ids are server-made (UUIDs, or stable ids for demo photos); anything else cannot exist.
  if (!/^[A-Za-z0-9-]{1,100}$/.test(photoId)) throw new AppError('not_found', 'No such photo on this item.');
}

/** PATCH /api/v1/gear/{slug}/photos/{id} — JSON `{ alt }`. */
export const handlePhotoAltUpdate = apiHandler(async (db: Db, user: PhotoActor | null, slug: string, photoId: string, request: Request) => {
  assertSameOrigin(request);
  const actor = requireActor(user);
  const item = findItemForViewer(db, slug, actor);
  assertCanChangePhotos(item, actor);
  checkPhotoId(photoId);
  const { alt } = parseWith(photoAltUpdateSchema, await readJson(request));
  const photo = updatePhotoAlt(db, item.id, photoId, alt);
  return NextResponse.json({ photo: photoJson(photo) }, { headers: { 'Cache-Control': 'no-store' } });
});

/** DELETE /api/v1/gear/{slug}/photos/{id} — 204; the stored files go too. */
export const handlePhotoDelete = apiHandler(async (db: Db, user: PhotoActor | null, slug: string, photoId: string, request: Request, options: { uploadsDir?: string } = {}) => {
  assertSameOrigin(request);
  const actor = requireActor(user);
  const item = findItemForViewer(db, slug, actor);
  assertCanChangePhotos(item, actor);
  checkPhotoId(photoId);
  await deletePhoto(db, item.id, photoId, options.uploadsDir ?? uploadsDir());
  return new NextResponse(null, { status: 204 });
});
