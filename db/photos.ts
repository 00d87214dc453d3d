import { and, asc, count, eq, max, sql } from 'drizzle-orm';
import { randomUUID } from 'node:crypto';
import type { Db } from './connection';
import { gearItems, photos, type RecordState, type Role } from './schema';
import { AppError } from '../lib/http/errors';
import { hasRole } from '../lib/auth/roles';
import { MAX_PHOTOS_PER_ITEM } from '../lib/photos/config';
import { removeVariants } from '../lib/photos/storage';

/*
 * Photos of gear items: data access plus the visibility rule they depend on.
 * Visibility (issue 4): items with an approved version are public (also while an edit is pending); other states only to the owner and editors/admins
 * (404 for everyone else). Changing photos needs the owner or an editor (403 when visible but not allowed);
 * an author may not change an item while it is in review (409), as for the item itself.
 */

export interface PhotoActor {
  id: string;
  role: Role;
}

export interface PhotoItem {
  id: string;
  slug: string;
  name: string;
  ownerId: string;
  status: RecordState;
  /** Set once an editor has approved a version: the item (and its photos) are public from then on. */
  approvedAt: Date | null;
}

export type Photo = typeof photos.$inferSelect;

export function canViewItem(item: Pick<PhotoItem, 'approvedAt' | 'ownerId'>, viewer: PhotoActor | null): boolean {
  if (item.approvedAt !== null) return true;
  return !!viewer && (viewer.id === item.ownerId || hasRole(viewer, 'editor'));
}

/** The item behind a slug if the viewer may see it; 404 otherwise (also when it does not exist). */
export function findItemForViewer(db: Db, slug: string, viewer: PhotoActor | null): PhotoItem {
  const item = db
    .select({ id: gearItems.id, slug: gearItems.slug, name: gearItems.name, ownerId: gearItems.ownerId, status: gearItems.status, approvedAt: gearItems.approvedAt })
    .from(gearItems)
    .where(eq(gearItems.slug, slug))
    .get();
  if (!item || !canViewItem(item, viewer)) throw new AppError('not_found', 'No such gear item.');
  return item;
}

/** 403 unless the actor owns the item or is an editor/admin; 409 for an author while the item is in review. */
export function assertCanChangePhotos(item: PhotoItem, actor: PhotoActor): void {
  const isEditor = hasRole(actor, 'editor');
  if (actor.id !== item.ownerId && !isEditor) throw new AppError('forbidden', 'Only the author or an editor may change the photos of this item.');
  if (item.status === 'in-review' && !isEditor) {
    throw new AppError('conflict', 'This item is in review: its photos are locked until an editor returns it or you withdraw it.');
  }
}

export function listPhotos(db: Db, gearItemId: string): Photo[] {
  return db.select().from(photos).where(eq(photos.gearItemId, gearItemId)).orderBy(asc(photos.position), asc(photos.createdAt)).all();
}

export function countPhotos(db: Db, gearItemId: string): number {
  return db.select({ n: count() }).from(photos).where(eq(photos.gearItemId, gearItemId)).get()?.n ?? 0;
}

/** Number of the item's photos without alt text (an item needs 0 before it is submitted for review). */
export function countPhotosMissingAlt(db: Db, gearItemId: string): number {
  return (
    db
      .select({ n: count() })
      .from(photos)
      .where(and(eq(photos.gearItemId, gearItemId), sql`trim(${photos.altText}) = ''`))
      .get()?.n ?? 0
  );
}

export function photoLimitError(): AppError {
  return new AppError('conflict', `An item can have at most ${MAX_PHOTOS_PER_ITEM} photos. Delete one before adding another.`);
}

/** 409 when the item already has the maximum number of photos. */
export function assertRoomForPhoto(db: Db, gearItemId: string): void {
  if (countPhotos(db, gearItemId) >= MAX_PHOTOS_PER_ITEM) throw photoLimitError();
}

export interface NewPhoto {
  gearItemId: string;
  ownerId: string;
  storageKey: string;
  width: number;
  height: number;
  bytes: number;
  altText: string;
}

/** Inserts a photo at the end of the item's list; the limit and duplicate checks run in the same write transaction. */
export function insertPhoto(db: Db, input: NewPhoto): Photo {
  return db.transaction(
    (tx) => {
      const n = tx.select({ n: count() }).from(photos).where(eq(photos.gearItemId, input.gearItemId)).get()?.n ?? 0;
      if (n >= MAX_PHOTOS_PER_ITEM) throw photoLimitError();
      const duplicate = tx
        .select({ id: photos.id })
        .from(photos)
        .where(and(eq(photos.gearItemId, input.gearItemId), eq(photos.storageKey, input.storageKey)))
        .get();
      if (duplicate) throw new AppError('conflict', 'This photo is already on this item.');
      const last = tx.select({ p: max(photos.position) }).from(photos).where(eq(photos.gearItemId, input.gearItemId)).get()?.p;
      return tx
        .insert(photos)
        .values({ id: randomUUID(), ...input, position: last == null ? 0 : last + 1 })
        .returning()
        .get();
    },
    { behavior: 'immediate' },
  );
}

export function findPhotoOnItem(db: Db, gearItemId: string, photoId: string): Photo {
  const photo = db
    .select()
    .from(photos)
    .where(and(eq(photos.id, photoId), eq(photos.gearItemId, gearItemId)))
    .get();
  if (!photo) throw new AppError('not_found', 'No such photo on this item.');
  return photo;
}

export function updatePhotoAlt(db: Db, gearItemId: string, photoId: string, altText: string): Photo {
  findPhotoOnItem(db, gearItemId, photoId);
  const updated = db.update(photos).set({ altText }).where(eq(photos.id, photoId)).returning().get();
  return updated;
}

function isStorageKeyUsed(db: Db, storageKey: string): boolean {
  return !!db.select({ id: photos.id }).from(photos).where(eq(photos.storageKey, storageKey)).get();
}

/** Removes a key's files when no photo row refers to it any more. */
export async function removeFilesIfUnused(db: Db, storageKey: string, uploadsDir: string): Promise<void> {
  if (!isStorageKeyUsed(db, storageKey)) await removeVariants(uploadsDir, storageKey);
}

/** Deletes a photo and its stored files. */
export async function deletePhoto(db: Db, gearItemId: string, photoId: string, uploadsDir: string): Promise<void> {
  const photo = findPhotoOnItem(db, gearItemId, photoId);
  db.delete(photos).where(eq(photos.id, photo.id)).run();
  await removeFilesIfUnused(db, photo.storageKey, uploadsDir);
}

/** For deleting an item: removes its photo rows and their files (call before deleting the item row). */
export async function deleteItemPhotos(db: Db, gearItemId: string, uploadsDir: string): Promise<number> {
  const rows = db.delete(photos).where(eq(photos.gearItemId, gearItemId)).returning({ storageKey: photos.storageKey }).all();
  for (const key of new Set(rows.map((r) => r.storageKey))) await removeFilesIfUnused(db, key, uploadsDir);
  return rows.length;
}

/** Who may fetch a stored key: the items whose photos use it (normally one). */
export function itemsUsingStorageKey(db: Db, storageKey: string): Pick<PhotoItem, 'approvedAt' | 'ownerId'>[] {
  return db
    .select({ approvedAt: gearItems.approvedAt, ownerId: gearItems.ownerId })
    .from(photos)
    .innerJoin(gearItems, eq(photos.gearItemId, gearItems.id))
    .where(eq(photos.storageKey, storageKey))
    .all();
}
