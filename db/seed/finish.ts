import type { Db } from '../connection';
import { backfillGearRatios } from '../gear';
import { seedKitBudgets } from './kits-budget';
import { seedDemoPhotos } from './photos';

/**
 * The demo steps that run after the main seed and are idempotent on their own: kit budget settings, stored value
 * ratios of approved items (browse sorts by them), and the drawn demo photos.
 */
export async function finishDemo(db: Db, uploadsDir: string): Promise<{ kits: number; ratios: number; photos: number }> {
  const kits = seedKitBudgets(db).kits;
  const ratios = backfillGearRatios(db);
  const photos = await seedDemoPhotos(db, uploadsDir);
  return { kits, ratios, photos };
}
