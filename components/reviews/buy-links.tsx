import Link from 'next/link';
import { buyLinkRel, type BuyLink } from '@/lib/reviews/buy-links';

/**
 * "Where to buy" block of a review: each link says in words whether it is an affiliate link, carries
 * rel="sponsored noopener" (plus nofollow for affiliate links) and the block links the disclosure page.
 */
export function BuyLinks({ links }: { links: BuyLink[] }) {
  if (links.length === 0) return null;
  const anyAffiliate = links.some((l) => l.isAffiliate);
  return (
    <section aria-labelledby="where-to-buy" className="mt-10 rounded-md border border-rule bg-card px-5 py-4 text-sm print:hidden" data-testid="where-to-buy">
      <h2 id="where-to-buy" className="font-semibold">
        Where to buy
      </h2>
      <ul className="mt-2 space-y-1.5">
        {links.map((link, i) => (
          <li key={i}>
            <a href={link.url} rel={buyLinkRel(link)} target="_blank" className="text-lichen underline underline-offset-2">
              {link.label}
              <span className="sr-only"> (opens in a new tab)</span>
            </a>{' '}
            <span className="text-slate">({new URL(link.url).hostname})</span>
            {link.isAffiliate ? (
              <span className="ml-2 rounded border border-amber px-1.5 py-0.5 text-xs font-semibold text-amber" data-testid="affiliate-mark">
                affiliate link
              </span>
            ) : null}
          </li>
        ))}
      </ul>
      <p className="mt-3 text-slate">
        {anyAffiliate
          ? 'If you buy through an affiliate link, Trailbench may earn a small commission. It never changes a figure or a verdict.'
          : 'None of these links earns Trailbench anything.'}{' '}
        <Link href="/disclosure" className="text-lichen underline underline-offset-2">
          How we handle links and money
        </Link>
        .
      </p>
    </section>
  );
}
