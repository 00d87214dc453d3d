import { eq } from 'drizzle-orm';
import type { BuyLink } from '@/lib/reviews/buy-links';
import { reviewBuyLinks, reviewRevisions } from '../schema';

/**
 * Invented "where to buy" links of demo review revisions (reserved example domains only, RFC 2606:
 * .example and example.com). A correction carries its revision's links, as the app does.
 */
const HEARTHGLOW: BuyLink[] = [
  { label: 'Cedar Hollow Field School kit shop', url: 'https://kitshop.cedar-hollow.example/lanterns/hearthglow-400', isAffiliate: false },
  { label: 'Trailside Supply Co. (online)', url: 'https://trailside-supply.example/p/glowmere-hearthglow-400?ref=trailbench', isAffiliate: true },
];

const POWER_BANKS: BuyLink[] = [{ label: 'Voltmoth web shop', url: 'https://www.example.com/voltmoth/cellhive', isAffiliate: false }];

const BATTERIES: BuyLink[] = [
  { label: 'Dunlow Outfitters web shop', url: 'https://dunlow-outfitters.example/power/campcore-20', isAffiliate: false },
  { label: 'Basecamp Power Depot', url: 'https://basecamp-power.example/deepwell-50?aff=trailbench', isAffiliate: true },
];

export const DEMO_BUY_LINKS: Readonly<Record<string, readonly BuyLink[]>> = {
  'demo-review-hearthglow-r1': HEARTHGLOW,
  'demo-review-hearthglow-r2': HEARTHGLOW,
  'demo-review-power-banks-r1': POWER_BANKS,
  'demo-review-power-banks-r2': POWER_BANKS,
  'demo-review-12v-batteries-r1': BATTERIES,
};

type Q = Pick<import('../connection').Db, 'select' | 'insert'>;

/** Adds the demo links to each demo revision that exists and has no links yet (idempotent; fills in databases seeded before links existed). */
export function seedDemoBuyLinks(tx: Q): number {
  let inserted = 0;
  for (const [revisionId, links] of Object.entries(DEMO_BUY_LINKS)) {
    const exists = tx.select({ id: reviewRevisions.id }).from(reviewRevisions).where(eq(reviewRevisions.id, revisionId)).get();
    if (!exists) continue;
    const has = tx.select({ id: reviewBuyLinks.id }).from(reviewBuyLinks).where(eq(reviewBuyLinks.revisionId, revisionId)).get();
    if (has) continue;
    inserted += tx
      .insert(reviewBuyLinks)
      .values(links.map((link, position) => ({ revisionId, position, ...link })))
      .run().changes;
  }
  return inserted;
}
