import { mkdtempSync, readdirSync } from 'node:fs';
import { readFile } from 'node:fs/promises';
import { tmpdir } from 'node:os';
import path from 'node:path';
import { randomBytes } from 'node:crypto';
import sharp from 'sharp';
import { beforeAll, beforeEach, describe, expect, it } from 'vitest';
import type { Db } from '@/db/connection';
import { createTestDb } from '@/db/test-db';
import { gearItems, photos, users, type RecordState, type Role } from '@/db/schema';
import { countPhotos, deleteItemPhotos, listPhotos, type PhotoActor } from '@/db/photos';
import { AppError } from '@/lib/http/errors';
import { MAX_FILE_BYTES, MAX_PHOTOS_PER_ITEM, photoSrcSet, VARIANT_WIDTHS, variantFileName } from '@/lib/photos/config';
import { handlePhotoAltUpdate, handlePhotoDelete, handlePhotoList, handlePhotoUpload } from '@/lib/photos/handlers';
import { inspectImage, processAndStorePhoto } from '@/lib/photos/process';
import { handleVariantRequest } from '@/lib/photos/serve';

/*
 * Photo uploads end to end below the framework: type from bytes, pixel cap, metadata stripping,
 * orientation, re-encoding, per-item limit, sizes, access and serving. Cases follow
 * ../shared/reference/security-tests.md UP-01 … UP-08 (a local test plan; expected statuses come from
 * lib/http/errors.ts and issue 4).
 */

let db: Db;
let dir: string;
const ORIGIN = 'http://localhost:3102';

const owner: PhotoActor = { id: 'u-owner', role: 'reviewer' };
const other: PhotoActor = { id: 'u-other', role: 'reviewer' };
const editor: PhotoActor = { id: 'u-editor', role: 'editor' };
const reader: PhotoActor = { id: 'u-reader', role: 'reader' };

function addItem(slug: string, status: RecordState, ownerId = owner.id): string {
  const id = `item-${slug}`;
  // An item is public once a version has been approved (approvedAt set), as in the gear service.
  const approvedAt = status === 'approved' ? new Date() : null;
  db.insert(gearItems).values({ id, slug, ownerId, name: `Test ${slug}`, maker: 'Testmaker', category: 'light', status, approvedAt }).run();
  return id;
}

function storedFiles(): string[] {
  return readdirSync(dir).sort();
}

function uploadRequest(slug: string, file: Blob | null, opts: { name?: string; type?: string; alt?: string; headers?: Record<string, string> } = {}): Request {
  const form = new FormData();
  if (file) form.set('file', new File([file], opts.name ?? 'photo.jpg', { type: opts.type ?? 'image/jpeg' }));
  if (opts.alt !== undefined) form.set('alt', opts.alt);
  return new Request(`${ORIGIN}/api/v1/gear/${slug}/photos`, { method: 'POST', body: form, headers: { origin: ORIGIN, ...opts.headers } });
}

async function upload(slug: string, bytes: Buffer, user: PhotoActor | null = owner, opts: Parameters<typeof uploadRequest>[2] = {}) {
  const response = await handlePhotoUpload(db, user, slug, uploadRequest(slug, new Blob([new Uint8Array(bytes)]), opts), { uploadsDir: dir });
  return { status: response.status, body: (await response.json()) as { photo?: { id: string; width: number; height: number }; error?: { code: string; message: string } } };
}

/** A solid picture with a marker block in the top-left corner (to check orientation). */
async function picture(width: number, height: number, colour = '#3a7d44') {
  const marker = await sharp({ create: { width: Math.round(width / 4), height: Math.round(height / 4), channels: 3, background: '#ff0000' } }).png().toBuffer();
  return sharp({ create: { width, height, channels: 3, background: colour } }).composite([{ input: marker, left: 0, top: 0 }]);
}

let plainJpeg: Buffer;

beforeAll(async () => {
  db = createTestDb().db;
  const people: { id: string; role: Role }[] = [owner, other, editor, reader];
  db.insert(users)
    .values(people.map((p) => ({ id: p.id, email: `${p.id}@test.example`, name: p.id, role: p.role })))
    .run();
  plainJpeg = await (await picture(1200, 800)).jpeg().toBuffer();
});

beforeEach(() => {
  dir = mkdtempSync(path.join(tmpdir(), 'trailbench-uploads-'));
});

describe('processing', () => {
  it('strips EXIF with GPS, camera serial and orientation, and stores the pixels upright', async () => {
    // Landscape pixels 400×200 tagged Orientation 6 (rotate 90° clockwise to display): upright is 200×400.
    const input = await (await picture(400, 200))
      .jpeg()
      .withExif({
        IFD0: { Make: 'TestCam', Model: 'Fixture 1', Copyright: 'test fixture' },
        IFD2: { BodySerialNumber: 'SN-0001-TEST' },
        IFD3: { GPSLatitudeRef: 'N', GPSLatitude: '51/1 30/1 0/1', GPSLongitudeRef: 'W', GPSLongitude: '3/1 10/1 0/1' },
      })
      // Test fixture only: sets the EXIF orientation tag on the input.
      .withMetadata({ orientation: 6 })
      .toBuffer();
    const inputMeta = await sharp(input).metadata();
    expect(inputMeta.orientation).toBe(6);
    expect(inputMeta.exif?.includes('SN-0001-TEST')).toBe(true);

    const stored = await processAndStorePhoto(input, { uploadsDir: dir, salt: 'item-a' });
    expect({ width: stored.width, height: stored.height }).toEqual({ width: 200, height: 400 });
    for (const width of [16, ...VARIANT_WIDTHS]) {
      const bytes = await readFile(path.join(dir, variantFileName(stored.storageKey, width)));
      const meta = await sharp(bytes).metadata();
      expect(meta.format).toBe('webp');
      expect(meta.exif).toBeUndefined();
      expect(meta.xmp).toBeUndefined();
      expect(meta.iptc).toBeUndefined();
      expect(meta.orientation).toBeUndefined();
      expect(bytes.includes('SN-0001-TEST')).toBe(false);
      expect(bytes.includes('TestCam')).toBe(false);
      // Not upscaled: the original is 200 px wide once upright.
      expect(meta.width).toBe(Math.min(width, 200));
      if (width === 480) {
        expect(meta.height).toBe(400); // upright: taller than wide
        // The red marker was top-left of the landscape pixels; after a 90° clockwise turn it is top-right.
        const { data, info } = await sharp(bytes).raw().toBuffer({ resolveWithObject: true });
        const px = (x: number, y: number) => [...data.subarray((y * info.width + x) * info.channels, (y * info.width + x) * info.channels + 3)];
        const [tr] = px(info.width - 5, 5);
        const [tl] = px(5, 5);
        expect(tr).toBeGreaterThan(200);
        expect(tl).toBeLessThan(100);
      }
    }
    expect(stored.bytes).toBeGreaterThan(0);
  });

  it('writes 480/960/1600 variants and a placeholder, never wider than the original', async () => {
    const input = await (await picture(2400, 1600)).png().toBuffer();
    const stored = await processAndStorePhoto(input, { uploadsDir: dir, salt: 'item-a' });
    expect(stored.storageKey).toMatch(/^[0-9a-f]{32}$/);
    for (const width of [16, 480, 960, 1600]) {
      // Read as a buffer: the decoder allowlist blocks sharp's file loaders in this process.
      const meta = await sharp(await readFile(path.join(dir, variantFileName(stored.storageKey, width)))).metadata();
      expect(meta.width).toBe(width);
    }
    expect(storedFiles()).toHaveLength(4); // the original is not kept
  });

  it('srcset lists real widths only', () => {
    const key = 'a'.repeat(32);
    expect(photoSrcSet({ storageKey: key, width: 300 })).toBe(`/uploads/${key}-480.webp 300w`);
    expect(photoSrcSet({ storageKey: key, width: 1000 })).toBe(`/uploads/${key}-480.webp 480w, /uploads/${key}-960.webp 960w, /uploads/${key}-1600.webp 1000w`);
  });

  it('rejects a PNG whose header claims 65535×65535 before decoding (pixel cap)', async () => {
    // A real 1×1 PNG with its IHDR width/height rewritten and the CRC fixed: a ~4.3 GP claim in a tiny file.
    const png = await sharp({ create: { width: 1, height: 1, channels: 3, background: '#000' } }).png().toBuffer();
    const ihdr = png.indexOf('IHDR');
    png.writeUInt32BE(65535, ihdr + 4);
    png.writeUInt32BE(65535, ihdr + 8);
    png.writeUInt32BE(crc32(png.subarray(ihdr, ihdr + 17)), ihdr + 17);
    const padded = Buffer.concat([png, Buffer.alloc(0)]);
    const started = Date.now();
    await expect(inspectImage(padded)).rejects.toMatchObject({ code: 'invalid', message: expect.stringContaining('exceeds 40 megapixels') });
    expect(Date.now() - started).toBeLessThan(1000);
  });

  it('rejects a real 8000×6000 (48 MP) PNG with 422 and stores nothing', async () => {
    const big = await sharp({ create: { width: 8000, height: 6000, channels: 3, background: '#ffffff' } }).png({ compressionLevel: 9 }).toBuffer();
    addItem('bomb-target', 'draft');
    const result = await upload('bomb-target', big, owner, { name: 'big.png', type: 'image/png' });
    expect(result.status).toBe(422);
    expect(result.body.error?.message).toMatch(/exceeds 40 megapixels/);
    expect(storedFiles()).toEqual([]);
    expect(countPhotos(db, 'item-bomb-target')).toBe(0);
  });

  it('re-encodes a JPEG with an appended payload: no trailing bytes survive', async () => {
    const payload = Buffer.from('<script>alert("polyglot")</script>PK\u0003\u0004trailing-zip');
    const input = Buffer.concat([plainJpeg, payload]);
    const stored = await processAndStorePhoto(input, { uploadsDir: dir, salt: 'item-a' });
    for (const name of storedFiles()) {
      const bytes = await readFile(path.join(dir, name));
      expect(bytes.includes('<script>')).toBe(false);
      expect(bytes.includes('trailing-zip')).toBe(false);
      expect(bytes.equals(input)).toBe(false);
    }
    expect(stored.width).toBe(1200);
  });

  it('rejects a truncated JPEG as corrupt (422), storing nothing', async () => {
    const noisy = await sharp({ create: { width: 600, height: 400, channels: 3, background: '#808080', noise: { type: 'gaussian', mean: 128, sigma: 40 } } }).jpeg().toBuffer();
    await expect(processAndStorePhoto(noisy.subarray(0, Math.floor(noisy.length / 2)), { uploadsDir: dir, salt: 'x' })).rejects.toMatchObject({ code: 'invalid' });
    expect(storedFiles()).toEqual([]);
  });

  it('accepts WebP and AVIF', async () => {
    const webp = await (await picture(300, 200)).webp().toBuffer();
    const avif = await (await picture(300, 200)).avif().toBuffer();
    expect((await processAndStorePhoto(webp, { uploadsDir: dir, salt: 'w' })).width).toBe(300);
    expect((await processAndStorePhoto(avif, { uploadsDir: dir, salt: 'a' })).width).toBe(300);
  });
});

describe('type from bytes (415)', () => {
  const disguised: [string, Buffer][] = [
    ['HTML renamed .jpg', Buffer.from('<!doctype html><html><body><script>alert(1)</script></body></html>')],
    ['PDF renamed .jpg', Buffer.from('%PDF-1.4\n1 0 obj\n<< /Type /Catalog >>\nendobj\ntrailer\n%%EOF\n')],
    ['SVG renamed .jpg', Buffer.from('<svg xmlns="http://www.w3.org/2000/svg" width="10" height="10" onload="alert(1)"><rect width="10" height="10"/></svg>')],
    ['zip renamed .jpg', Buffer.concat([Buffer.from('504b030414000000080000000000', 'hex'), Buffer.alloc(64)])],
    ['HEIC renamed .jpg', Buffer.concat([Buffer.from('000000186674797068656963000000006d69663168656963', 'hex'), Buffer.alloc(64)])],
    ['empty file', Buffer.alloc(0)],
  ];
  for (const [label, bytes] of disguised) {
    it(`${label} → 415, nothing stored`, async () => {
      addItem(`spoof-${label.replace(/\W+/g, '-')}`, 'draft');
      const result = await upload(`spoof-${label.replace(/\W+/g, '-')}`, bytes, owner, { name: 'holiday.jpg', type: 'image/jpeg' });
      expect(result.status).toBe(415);
      expect(result.body.error?.message).toMatch(/Unsupported image type/);
      expect(storedFiles()).toEqual([]);
    });
  }

  it('HEIC gets a message that says so', async () => {
    const heic = Buffer.concat([Buffer.from('000000186674797068656963000000006d69663168656963', 'hex'), Buffer.alloc(64)]);
    await expect(inspectImage(heic)).rejects.toMatchObject({ code: 'unsupported_media_type', message: expect.stringMatching(/HEIC/) });
  });

  it('a body that is not multipart → 415', async () => {
    addItem('json-body', 'draft');
    const request = new Request(`${ORIGIN}/api/v1/gear/json-body/photos`, { method: 'POST', body: plainJpeg as unknown as BodyInit, headers: { 'content-type': 'image/jpeg', origin: ORIGIN } });
    const response = await handlePhotoUpload(db, owner, 'json-body', request, { uploadsDir: dir });
    expect(response.status).toBe(415);
  });
});

describe('upload route core', () => {
  it('stores a photo (201), lists it, and serves it with the right headers', async () => {
    addItem('approved-lantern', 'approved');
    const result = await upload('approved-lantern', plainJpeg, owner, { alt: 'Lantern on a stump' });
    expect(result.status).toBe(201);
    const [photo] = listPhotos(db, 'item-approved-lantern');
    expect(photo?.altText).toBe('Lantern on a stump');
    expect(photo?.width).toBe(1200);

    const served = await handleVariantRequest(db, [variantFileName(photo!.storageKey, 960)], async () => null, { uploadsDir: dir });
    expect(served.status).toBe(200);
    expect(served.headers.get('content-type')).toBe('image/webp');
    expect(served.headers.get('cache-control')).toBe('public, max-age=31536000, immutable');
    expect(served.headers.get('x-content-type-options')).toBe('nosniff');
    expect((await sharp(Buffer.from(await served.arrayBuffer())).metadata()).width).toBe(960);
  });

  it('serves draft photos privately to their viewers only (404 to others)', async () => {
    addItem('draft-panel', 'draft');
    expect((await upload('draft-panel', plainJpeg)).status).toBe(201);
    const [photo] = listPhotos(db, 'item-draft-panel');
    const name = variantFileName(photo!.storageKey, 480);
    const as = (viewer: PhotoActor | null) => handleVariantRequest(db, [name], async () => viewer, { uploadsDir: dir });
    expect((await as(null)).status).toBe(404);
    expect((await as(reader)).status).toBe(404);
    expect((await as(other)).status).toBe(404);
    const mine = await as(owner);
    expect(mine.status).toBe(200);
    expect(mine.headers.get('cache-control')).toBe('private, no-store');
    expect((await as(editor)).status).toBe(200);

    expect((await handlePhotoList(db, null, 'draft-panel')).status).toBe(404);
    const listed = (await (await handlePhotoList(db, owner, 'draft-panel')).json()) as { photos: { id: string; srcSet: string }[] };
    expect(listed.photos.map((p) => p.id)).toEqual([photo!.id]);
    // 1200 px original: all three variants are real widths.
    expect(listed.photos[0]?.srcSet).toContain('-1600.webp 1200w');
  });

  it('serving refuses anything but a strict variant name', async () => {
    for (const segments of [['..', '..', 'etc', 'passwd'], ['../../etc/passwd'], ['a.php%00.jpg'], ['CON'], ['0123456789abcdef0123456789abcdef-481.webp'], ['0123456789ABCDEF0123456789abcdef-480.webp'], ['x'.repeat(300)], []]) {
      const response = await handleVariantRequest(db, segments, async () => owner, { uploadsDir: dir });
      expect(response.status).toBe(404);
    }
  });

  it('401 without a user, 404 for a draft the caller cannot see, 403 for a visible item of someone else, 403 cross-site', async () => {
    addItem('someone-draft', 'draft');
    addItem('someone-approved', 'approved');
    expect((await upload('someone-draft', plainJpeg, null)).status).toBe(401);
    expect((await upload('someone-draft', plainJpeg, other)).status).toBe(404);
    expect((await upload('no-such-item', plainJpeg, owner)).status).toBe(404);
    expect((await upload('someone-approved', plainJpeg, reader)).status).toBe(403);
    expect((await upload('someone-approved', plainJpeg, other)).status).toBe(403);
    expect((await upload('someone-approved', plainJpeg, owner, { headers: { origin: 'https://evil.example' } })).status).toBe(403);
    expect((await upload('someone-approved', plainJpeg, editor)).status).toBe(201);
    expect(countPhotos(db, 'item-someone-draft')).toBe(0);
  });

  it('an author cannot change photos while the item is in review (409); an editor can', async () => {
    addItem('in-review-item', 'in-review');
    expect((await upload('in-review-item', plainJpeg, owner)).status).toBe(409);
    expect((await upload('in-review-item', plainJpeg, editor)).status).toBe(201);
  });

  it('limits an item to 10 photos (409) and refuses the same photo twice', async () => {
    addItem('ten-photos', 'draft');
    for (let i = 0; i < MAX_PHOTOS_PER_ITEM; i += 1) {
      const img = await (await picture(320, 240, `#${(0x102030 + i * 0x0a0b0c).toString(16).padStart(6, '0')}`)).jpeg().toBuffer();
      const result = await upload('ten-photos', img);
      expect(result.status).toBe(201);
      if (i === 0) expect((await upload('ten-photos', img)).status).toBe(409); // duplicate
    }
    const before = storedFiles();
    const eleventh = await upload('ten-photos', plainJpeg);
    expect(eleventh.status).toBe(409);
    expect(eleventh.body.error?.message).toMatch(/at most 10 photos/);
    expect(storedFiles()).toEqual(before);
    expect(countPhotos(db, 'item-ten-photos')).toBe(10);
    expect(listPhotos(db, 'item-ten-photos').map((p) => p.position)).toEqual([0, 1, 2, 3, 4, 5, 6, 7, 8, 9]);
  });

  it('accepts a 14 MB file', async () => {
    // Random RGB noise does not compress: a 2160×2160 PNG is about 14 MB (13.99 MB of pixels plus PNG overhead).
    const raw = randomBytes(2160 * 2160 * 3);
    const png = await sharp(raw, { raw: { width: 2160, height: 2160, channels: 3 } }).png({ compressionLevel: 1 }).toBuffer();
    expect(png.length).toBeGreaterThan(14_000_000);
    expect(png.length).toBeLessThan(MAX_FILE_BYTES);
    addItem('fourteen-mb', 'draft');
    const result = await upload('fourteen-mb', png, owner, { name: 'big.png', type: 'image/png' });
    expect(result.status).toBe(201);
    expect(result.body.photo?.width).toBe(2160);
  }, 60_000);

  it('refuses 15 MB + 1 byte with 413 (from the actual size) and stores nothing', async () => {
    addItem('too-big', 'draft');
    const result = await upload('too-big', Buffer.concat([plainJpeg, Buffer.alloc(MAX_FILE_BYTES + 1 - plainJpeg.length)]));
    expect(result.status).toBe(413);
    expect(result.body.error?.message).toMatch(/larger than 15 MB/);
    expect(storedFiles()).toEqual([]);
    expect(countPhotos(db, 'item-too-big')).toBe(0);
  });

  it('refuses a declared Content-Length above the limit before reading the body (413)', async () => {
    addItem('declared-big', 'draft');
    let pulled = 0;
    const body = new ReadableStream<Uint8Array>({
      pull(controller) {
        pulled += 1;
        controller.enqueue(new Uint8Array(1024));
      },
    });
    const request = new Request(`${ORIGIN}/api/v1/gear/declared-big/photos`, {
      method: 'POST',
      body,
      headers: { 'content-type': 'multipart/form-data; boundary=x', 'content-length': String(30 * 1024 * 1024), origin: ORIGIN },
      duplex: 'half',
    } as RequestInit);
    const response = await handlePhotoUpload(db, owner, 'declared-big', request, { uploadsDir: dir });
    expect(response.status).toBe(413);
    expect(pulled).toBeLessThanOrEqual(1);
  });

  it('refuses an endless chunked body without Content-Length once it passes the limit (413)', async () => {
    addItem('chunked-big', 'draft');
    let sent = 0;
    const body = new ReadableStream<Uint8Array>({
      pull(controller) {
        sent += 1024 * 1024;
        controller.enqueue(new Uint8Array(1024 * 1024));
      },
    });
    const request = new Request(`${ORIGIN}/api/v1/gear/chunked-big/photos`, {
      method: 'POST',
      body,
      headers: { 'content-type': 'multipart/form-data; boundary=x', origin: ORIGIN },
      duplex: 'half',
    } as RequestInit);
    const response = await handlePhotoUpload(db, owner, 'chunked-big', request, { uploadsDir: dir });
    expect(response.status).toBe(413);
    expect(sent).toBeLessThan(20 * 1024 * 1024);
  });

  it('a form without a file → 422 with a field error', async () => {
    addItem('no-file', 'draft');
    const response = await handlePhotoUpload(db, owner, 'no-file', uploadRequest('no-file', null, { alt: 'x' }), { uploadsDir: dir });
    expect(response.status).toBe(422);
    expect(((await response.json()) as { error: { fields: Record<string, string[]> } }).error.fields.file).toBeDefined();
  });

  it('updates alt text (PATCH) and deletes a photo with its files (DELETE)', async () => {
    addItem('alt-and-delete', 'draft');
    const created = await upload('alt-and-delete', plainJpeg);
    const id = created.body.photo!.id;
    const patch = (user: PhotoActor | null, body: unknown) =>
      handlePhotoAltUpdate(db, user, 'alt-and-delete', id, new Request(`${ORIGIN}/x`, { method: 'PATCH', body: JSON.stringify(body), headers: { 'content-type': 'application/json', origin: ORIGIN } }));
    expect((await patch(owner, { alt: '  Panel unfolded on grass  ' })).status).toBe(200);
    expect(listPhotos(db, 'item-alt-and-delete')[0]?.altText).toBe('Panel unfolded on grass');
    expect((await patch(owner, { alt: '' })).status).toBe(422);
    expect((await patch(owner, { alt: 'x'.repeat(301) })).status).toBe(422);
    expect((await patch(other, { alt: 'mine now' })).status).toBe(404);

    const del = (user: PhotoActor | null, photoId = id) =>
      handlePhotoDelete(db, user, 'alt-and-delete', photoId, new Request(`${ORIGIN}/x`, { method: 'DELETE', headers: { origin: ORIGIN } }), { uploadsDir: dir });
    expect((await del(null)).status).toBe(401);
    expect((await del(owner, 'no-such-photo')).status).toBe(404);
    expect(storedFiles()).toHaveLength(4);
    expect((await del(owner)).status).toBe(204);
    expect(storedFiles()).toEqual([]);
    expect(countPhotos(db, 'item-alt-and-delete')).toBe(0);
  });

  it('deleting an item’s photos removes their files', async () => {
    addItem('item-to-delete', 'draft');
    await upload('item-to-delete', plainJpeg);
    expect(storedFiles()).toHaveLength(4);
    expect(await deleteItemPhotos(db, 'item-item-to-delete', dir)).toBe(1);
    expect(storedFiles()).toEqual([]);
    expect(db.select().from(photos).all().some((p) => p.gearItemId === 'item-item-to-delete')).toBe(false);
  });

  it('AppError maps to the status table', () => {
    expect(new AppError('unsupported_media_type', 'x').status).toBe(415);
  });
});

/** CRC-32 (ISO-HDLC, as PNG chunks use: RFC 2083 / PNG spec section 5.3). */
function crc32(bytes: Uint8Array): number {
  let crc = 0xffffffff;
  for (const byte of bytes) {
    crc ^= byte;
    for (let k = 0; k < 8; k += 1) crc = crc & 1 ? (crc >>> 1) ^ 0xedb88320 : crc >>> 1;
  }
  return (crc ^ 0xffffffff) >>> 0;
}
