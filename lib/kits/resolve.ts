/** Matches a kit's entries with the catalog items the viewer may see; pure. */
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
