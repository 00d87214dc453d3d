import { randomBytes } from 'node:crypto';
import { mkdir, readFile, rename, rm, stat, writeFile } from 'node:fs/promises';
import path from 'node:path';
import { STORAGE_KEY_RE, STORED_WIDTHS, variantFileName } from './config';

/** Files of stored photo variants under the uploads folder. Names come only from validated storage keys. */

function assertKey(storageKey: string): void {
  if (!STORAGE_KEY_RE.test(storageKey)) throw new Error(`Invalid storage key: ${JSON.stringify(storageKey)}`);
}

export function variantPath(dir: string, storageKey: string, width: number): string {
  assertKey(storageKey);
  return path.join(dir, variantFileName(storageKey, width));
}

async function exists(file: string): Promise<boolean> {
  try {
    await stat(file);
    return true;
  } catch {
    return false;
  }
}

/**
 * Writes each variant atomically (temporary name, then rename). If any write fails, the files this
 * call created are removed again, so a failed upload leaves nothing behind; files that were already
 * there (the same content under the same key) are left alone.
 */
export async function writeVariants(dir: string, storageKey: string, variants: ReadonlyMap<number, Buffer>): Promise<void> {
  await mkdir(dir, { recursive: true });
  const created: string[] = [];
  try {
    for (const [width, data] of variants) {
      const target = variantPath(dir, storageKey, width);
      if (await exists(target)) continue;
      const temp = path.join(dir, `.tmp-${randomBytes(8).toString('hex')}`);
      await writeFile(temp, data, { flag: 'wx' });
      try {
        await rename(temp, target);
      } catch (error) {
        await rm(temp, { force: true });
        throw error;
      }
      created.push(target);
    }
  } catch (error) {
    await Promise.all(created.map((file) => rm(file, { force: true })));
    throw error;
  }
}

/** Removes every stored variant of a key (missing files are fine). */
export async function removeVariants(dir: string, storageKey: string): Promise<void> {
  await Promise.all(STORED_WIDTHS.map((width) => rm(variantPath(dir, storageKey, width), { force: true })));
}

/** The bytes of one stored variant, or null when it is not there. */
export async function readVariant(dir: string, storageKey: string, width: number): Promise<Buffer | null> {
  try {
    return await readFile(variantPath(dir, storageKey, width));
  } catch {
    return null;
  }
}
