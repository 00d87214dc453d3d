import 'server-only';
import type { Db } from '@/db';
import { listLogbookGear, listPublicGear } from '@/db/gear';
import type { ItemOption } from './record-form';

/** Items a reviewer may put in a field test: their own (any state) and every public item. */
export function itemOptionsFor(db: Db, userId: string): ItemOption[] {
  const own = listLogbookGear(db, userId).map((i) => ({ slug: i.slug, name: i.name, maker: i.maker, category: i.category, own: true }));
  const seen = new Set(own.map((i) => i.slug));
  const pub = listPublicGear(db)
    .filter((i) => !seen.has(i.slug))
    .map((i) => ({ slug: i.slug, name: i.name, maker: i.maker, category: i.category, own: false }));
  return [...own, ...pub];
}
