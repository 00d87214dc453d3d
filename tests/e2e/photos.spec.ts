import { randomBytes } from 'node:crypto';
import { expect, test, type APIRequestContext } from '@playwright/test';
import sharp from 'sharp';
import { baseURL } from '../../playwright.config';
import { DEMO_GEAR } from '@/db/seed/demo-data';
import { storageStateFor } from './support';

/*
 * Photos through the real server: the demo reviewer uploads a JPEG carrying GPS EXIF to their own
 * items; the served variant has no EXIF; drafts are private (404 to a reader and to guests); approved
 * items' photos are public and immutable; 14 MB goes through untruncated and 15 MB + 1 byte gets 413.
 */

const ownItem = (status: 'draft' | 'approved') => {
  const item = DEMO_GEAR.find((g) => g.owner === 'reviewer' && g.status === status);
  if (!item) throw new Error(`no ${status} demo item of the reviewer`);
  return item;
};
const draft = ownItem('draft');
const approved = ownItem('approved');

async function gpsJpeg(): Promise<Buffer> {
  return sharp({ create: { width: 640, height: 480, channels: 3, background: '#3a7d44' } })
    .jpeg()
    .withExif({
      IFD0: { Make: 'TestCam', Model: 'Fixture 1' },
      IFD2: { BodySerialNumber: 'SN-E2E-0001' },
      IFD3: { GPSLatitudeRef: 'N', GPSLatitude: '51/1 30/1 0/1', GPSLongitudeRef: 'W', GPSLongitude: '3/1 10/1 0/1' },
    })
    .toBuffer();
}

async function upload(request: APIRequestContext, slug: string, buffer: Buffer, name = 'camp.jpg', mimeType = 'image/jpeg') {
  return request.post(`/api/v1/gear/${slug}/photos`, {
    headers: { origin: baseURL },
    multipart: { file: { name, mimeType, buffer }, alt: 'Test photo on a camp table' },
    timeout: 60_000,
  });
}

test.describe('photos as the demo reviewer', () => {
  test.use({ storageState: storageStateFor('reviewer') });

  test('GPS EXIF is stripped; drafts are private, approved photos public', async ({ page, browser, playwright }) => {
    const input = await gpsJpeg();
    expect((await sharp(input).metadata()).exif).toBeDefined();

    const response = await upload(page.request, draft.slug, input);
    expect(response.status()).toBe(201);
    const { photo } = (await response.json()) as { photo: { id: string; url: string } };
    expect(photo.url).toMatch(/^\/uploads\/[0-9a-f]{32}-960\.webp$/);

    const served = await page.request.get(photo.url);
    expect(served.status()).toBe(200);
    expect(served.headers()['content-type']).toBe('image/webp');
    expect(served.headers()['cache-control']).toBe('private, no-store');
    expect(served.headers()['x-content-type-options']).toBe('nosniff');
    const body = await served.body();
    const meta = await sharp(body).metadata();
    expect(meta.exif).toBeUndefined();
    expect(meta.xmp).toBeUndefined();
    expect(body.includes('SN-E2E-0001')).toBe(false);

    const reader = await browser.newContext({ storageState: storageStateFor('reader') });
    expect((await reader.request.get(`${baseURL}${photo.url}`)).status()).toBe(404);
    await reader.close();
    // Explicitly empty: a request context made here would otherwise inherit the reviewer's session.
    const guest = await playwright.request.newContext({ baseURL, storageState: { cookies: [], origins: [] } });
    expect((await guest.storageState()).cookies).toEqual([]);
    expect((await guest.get(photo.url)).status()).toBe(404);

    // An approved item's photo is public and immutable; deleting it removes the file.
    const onApproved = await upload(page.request, approved.slug, input);
    expect(onApproved.status()).toBe(201);
    const publicPhoto = ((await onApproved.json()) as { photo: { id: string; url: string } }).photo;
    const publicServed = await guest.get(publicPhoto.url);
    expect(publicServed.status()).toBe(200);
    expect(publicServed.headers()['cache-control']).toBe('public, max-age=31536000, immutable');
    const removed = await page.request.delete(`/api/v1/gear/${approved.slug}/photos/${publicPhoto.id}`, { headers: { origin: baseURL } });
    expect(removed.status()).toBe(204);
    expect((await guest.get(publicPhoto.url)).status()).toBe(404);
    await guest.dispose();
  });

  test('a 14 MB photo goes through whole; 15 MB + 1 byte gets 413', async ({ page }) => {
    test.setTimeout(120_000);
    // Random noise does not compress: a 2160×2160 RGB PNG is about 14 MB.
    const png = await sharp(randomBytes(2160 * 2160 * 3), { raw: { width: 2160, height: 2160, channels: 3 } }).png({ compressionLevel: 1 }).toBuffer();
    expect(png.length).toBeGreaterThan(14_000_000);
    const ok = await upload(page.request, draft.slug, png, 'noise.png', 'image/png');
    expect(ok.status()).toBe(201);
    const { photo } = (await ok.json()) as { photo: { id: string; width: number } };
    expect(photo.width).toBe(2160);
    expect((await page.request.delete(`/api/v1/gear/${draft.slug}/photos/${photo.id}`, { headers: { origin: baseURL } })).status()).toBe(204);

    const tooBig = await upload(page.request, draft.slug, Buffer.concat([png, Buffer.alloc(15 * 1024 * 1024 + 1 - png.length)]), 'big.png', 'image/png');
    expect(tooBig.status()).toBe(413);
    expect(((await tooBig.json()) as { error: { message: string } }).error.message).toMatch(/larger than 15 MB/);
  });

  test('approved demo items come with a drawn, public photo', async ({ playwright }) => {
    const guest = await playwright.request.newContext({ baseURL, storageState: { cookies: [], origins: [] } });
    const list = await guest.get(`/api/v1/gear/${approved.slug}/photos`);
    expect(list.status()).toBe(200);
    const { photos } = (await list.json()) as { photos: { url: string; altText: string }[] };
    expect(photos[0]?.altText).toMatch(/^Drawing of /);
    const served = await guest.get(photos[0]!.url);
    expect(served.status()).toBe(200);
    expect(served.headers()['cache-control']).toBe('public, max-age=31536000, immutable');
    expect((await guest.get(`/api/v1/gear/${draft.slug}/photos`)).status()).toBe(404);
    await guest.dispose();
  });

  test('a disguised HTML file is refused with 415', async ({ page }) => {
    const response = await upload(page.request, draft.slug, Buffer.from('<!doctype html><script>alert(1)</script>'), 'holiday.jpg');
    expect(response.status()).toBe(415);
  });
});
