import type { KitRecord, KitWithCatalog } from '@/db/kits';
import { kitBudget, kitTotals, type KitCatalog } from '@/lib/kits';

/**
 * The API's view of a kit: the record, its totals, and the power budget computed from it, with the
 * charging paths of each device (`budget.charging`: the steps and efficiency of every path, or the
 * reasons none exists). Entries the viewer may not read take no part in the paths.
 */
export function kitResponse<K extends KitRecord>({ kit, catalog }: KitWithCatalog<K>) {
  const budget = kitBudget(kit, catalog);
  return {
    kit,
    items: publicItems(catalog),
    totals: kitTotals(kit.entries, catalog),
    budget: { result: budget.result, problem: budget.problem, warnings: budget.warnings, loads: budget.loads, storage: budget.storage, panels: budget.panels, charging: budget.charging },
  };
}

/** Name, maker and category of the readable items the kit uses (never more than the viewer may read). */
function publicItems(catalog: KitCatalog) {
  return Object.values(catalog).map((i) => ({ id: i.id, slug: i.slug, name: i.name, maker: i.maker, category: i.category }));
}

export const NO_STORE = { 'Cache-Control': 'private, no-store' } as const;
