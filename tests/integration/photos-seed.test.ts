import { mkdtempSync, readdirSync, rmSync } from 'node:fs';
import { readFile } from 'node:fs/promises';
import { tmpdir } from 'node:os';
import path from 'node:path';
import sharp from 'sharp';
import { beforeAll, describe, expect, it } from 'vitest';
import type { Db } from '@/db/connection';
import { createTestDb } from '@/db/test-db';
import { seedDemo } from '@/db/seed';
import { DEMO_GEAR } from '@/db/seed/demo-data';
import { seedDemoPhotos } from '@/db/seed/photos';
import { listPhotos } from '@/db/photos';
import { variantFileName } from '@/lib/photos/config';

/* The demo photo seed: one drawn picture per approved demo item, stored like an upload, idempotent. */

let db: Db;
let dir: string;
const approved = DEMO_GEAR.filter((g) => g.status === 'approved');

beforeAll(async () => {
  db = createTestDb().db;
  dir = mkdtempSync(path.join(tmpdir(), 'trailbench-seed-photos-'));
  await seedDemo(db);
});

describe('seedDemoPhotos', () => {
  it('stores one photo with alt text per approved demo item and none for other states', async () => {
    expect(await seedDemoPhotos(db, dir)).toBe(approved.length);
    for (const item of DEMO_GEAR) {
      const list = listPhotos(db, item.id);
      expect(list.length).toBe(item.status === 'approved' ? 1 : 0);
      for (const photo of list) {
        expect(photo.altText).toMatch(/^Drawing of /);
        const bytes = await readFile(path.join(dir, variantFileName(photo.storageKey, 960)));
        const meta = await sharp(bytes).metadata();
        expect(meta.format).toBe('webp');
        expect(meta.width).toBe(960);
        expect(meta.exif).toBeUndefined();
      }
    }
    expect(readdirSync(dir)).toHaveLength(approved.length * 4);
  }, 60_000);

  it('a second run inserts nothing and restores missing files', async () => {
    const [first] = readdirSync(dir);
    rmSync(path.join(dir, first!));
    expect(await seedDemoPhotos(db, dir)).toBe(0);
    expect(readdirSync(dir)).toHaveLength(approved.length * 4);
  }, 60_000);
});
