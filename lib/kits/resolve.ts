/** Matches a kit's entries with the catalog items the viewer may see; pure. */
import type { Category } from '@/lib/measure';
import type { KitEntryInput } from './schemas';
import type { KitCatalog, KitCatalogItem, SpecBasis } from './types';

export type ResolvedEntry =
  /** A catalog item the viewer may not see (or that was removed): shown as "unpublished item", no details. */
  | { kind: 'hidden'; index: number; quantity: number; entry: KitEntryInput }
  | { kind: 'catalog'; index: number; quantity: number; entry: KitEntryInput; item: KitCatalogItem }
  | { kind: 'free'; index: number; quantity: number; entry: KitEntryInput };

export const UNPUBLISHED_ITEM = 'Unpublished item';

export function resolveEntries(entries: readonly KitEntryInput[], catalog: KitCatalog): ResolvedEntry[] {
  return entries.map((entry, index) => {
    const quantity = entry.quantity;
    if (typeof entry.gearItemId === 'string') {
      const item = Object.hasOwn(catalog, entry.gearItemId) ? catalog[entry.gearItemId] : undefined;
      return item ? { kind: 'catalog', index, quantity, entry, item } : { kind: 'hidden', index, quantity, entry };
    }
    return { kind: 'free', index, quantity, entry };
  });
}

/** The name to show for an entry. */
export function entryName(e: ResolvedEntry): string {
  if (e.kind === 'catalog') return `${e.item.maker} ${e.item.name}`;
  if (e.kind === 'hidden') return UNPUBLISHED_ITEM;
  return e.entry.freeName ?? 'Unnamed entry';
}

export interface PickedSpec {
  value: number;
  basis: SpecBasis;
}

/** A spec of the item for `mode`: the measured figure where there is one, else the claimed. */
export function pickSpec(item: KitCatalogItem, key: string, mode = ''): PickedSpec | null {
  const rows = item.specs.filter((s) => s.key === key && s.mode === mode);
  const row = rows.find((s) => s.basis === 'measured') ?? rows.find((s) => s.basis === 'claimed');
  return row ? { value: row.value, basis: row.basis } : null;
}

type RoleFields = Pick<KitCatalogItem, 'category' | 'alsoServesAs'>;

/** The categories an item counts as in a kit: its primary category, then what it also serves as (each once). */
export function kitRoles(item: RoleFields): Category[] {
  const roles: Category[] = [item.category];
  for (const c of item.alsoServesAs ?? []) if (!roles.includes(c)) roles.push(c);
  return roles;
}

const STORAGE_CATEGORIES: readonly Category[] = ['power-bank', 'battery-12v'];

/**
 * True when the item stores energy for the kit: a power bank or 12 V battery, or an item that also
 * serves as one (a lantern with a USB output). Its rated energy then counts in the budget and it is a
 * battery or bank in charging paths, through its output ports.
 */
export function storesEnergy(item: RoleFields): boolean {
  return kitRoles(item).some((c) => STORAGE_CATEGORIES.includes(c));
}

/** True when the item stores energy only because it also serves as a bank or battery (its primary category is something else). */
export function storesEnergyAsSecondRole(item: RoleFields): boolean {
  return storesEnergy(item) && !STORAGE_CATEGORIES.includes(item.category);
}

/** True when the item gathers solar energy for the kit: a solar panel, or an item that also serves as one. */
export function gathersSolar(item: RoleFields): boolean {
  return kitRoles(item).includes('solar-panel');
}
