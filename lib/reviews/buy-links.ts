import { z } from 'zod';

/**
 * "Where to buy" links of a review revision (issue 6, reader trust): optional, at most MAX_BUY_LINKS,
 * https only, and marked when they are affiliate links (the site earns from a purchase). One schema
 * for the form, the server action and the data layer.
 */
export const MAX_BUY_LINKS = 6;

const httpsUrl = z
  .string()
  .trim()
  .max(500, 'Keep the address under 500 characters.')
  .refine((value) => {
    try {
      const url = new URL(value);
      return url.protocol === 'https:' && url.hostname.length > 0 && !url.username && !url.password;
    } catch {
      return false;
    }
  }, 'Use a full https:// address (no user name or password in it).');

export const buyLinkSchema = z.strictObject({
  label: z.string().trim().min(1, 'Name the shop or page.').max(80, 'Keep the label under 80 characters.'),
  url: httpsUrl,
  isAffiliate: z.boolean(),
});

export const buyLinksSchema = z.strictObject({
  links: z.array(buyLinkSchema).max(MAX_BUY_LINKS, `At most ${MAX_BUY_LINKS} links.`),
});

export type BuyLink = z.output<typeof buyLinkSchema>;

/** rel for a where-to-buy link: every such link is sponsored-style commerce; affiliate ones are also nofollow. */
export function buyLinkRel(link: Pick<BuyLink, 'isAffiliate'>): string {
  return link.isAffiliate ? 'sponsored nofollow noopener' : 'sponsored noopener';
}
