/**
 * The shapes lib/kits computes on. Pure data: the catalog side comes from db/kits.ts (only items the
 * viewer may see), the kit side from the form, localStorage or the database.
 */
import type { Category, Chemistry, Port } from '@/lib/measure';
import type { Sky } from './sky';

export type SpecBasis = 'claimed' | 'measured';

/** One spec row of a catalog item, in the canonical unit of its key (lib/measure SPECS). */
export interface KitSpec {
  key: string;
  mode: string;
  basis: SpecBasis;
  value: number;
}

/** Sky share of a panel under one sky, from the demo's paired field tests (same panel, clear and other sky). */
export interface PairedSkyShare {
  sky: Sky;
  /** Output under `sky` ÷ output under a clear sky, 0–1. */
  share: number;
  /** Where it came from, in words (item and test dates). */
  note: string;
}

/** A catalog item as a kit sees it: only items the viewer may read are ever given to lib/kits. */
export interface KitCatalogItem {
  id: string;
  slug: string;
  name: string;
  maker: string;
  category: Category;
  chemistry: Chemistry | null;
  priceMinor: number | null;
  priceCurrency: string | null;
  specs: KitSpec[];
  pairedSkyShares: PairedSkyShare[];
  /** Approved ports of the item (lib/measure `Port`); absent or empty when the catalog lists none. */
  ports?: Port[];
  /**
   * Other categories the item also serves as (never its primary one): a lantern that also serves as a
   * power bank stores energy for the kit and feeds other devices through its output ports.
   */
  alsoServesAs?: Category[];
}

/** Catalog items by id. An entry whose item is missing here is shown as "unpublished item". */
export type KitCatalog = Readonly<Record<string, KitCatalogItem>>;
