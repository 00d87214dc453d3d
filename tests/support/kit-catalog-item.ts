import type { KitCatalogItem } from '@/lib/kits';

/** An invented catalog item for kit tests (no real product): blank figures unless the test gives them. */
export const catalogItem = (id: string, partial: Partial<KitCatalogItem>): KitCatalogItem => ({
  id,
  slug: id,
  name: id,
  maker: 'Testmaker',
  category: 'other',
  chemistry: null,
  priceMinor: null,
  priceCurrency: null,
  specs: [],
  pairedSkyShares: [],
  ...partial,
});
