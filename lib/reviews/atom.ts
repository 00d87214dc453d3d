/**
 * The Atom feed of published reviews (RFC 4287), generated with the `feed` package.
 * Pure: takes the rows and the site's base URL.
 */
import { Feed } from 'feed';
import type { PublishedReviewRow } from '@/db/reviews';
import { DISCLOSURE_LABELS } from './schemas';

/** XML 1.0 forbids most control characters; author text may contain them. */
function xmlSafe(text: string): string {
  return text.replace(/[^\x09\x0A\x0D\x20-\uD7FF\uE000-\uFFFD\u{10000}-\u{10FFFF}]/gu, '');
}

/**
 * The package writes titles and summaries as `type="html"` CDATA, so readers parse them as HTML:
 * escape our plain text so it shows literally (and so no "]]>" can end the CDATA section).
 */
function asHtmlText(text: string): string {
  return xmlSafe(text).replace(/[&<>"']/g, (c) => ({ '&': '&amp;', '<': '&lt;', '>': '&gt;', '"': '&quot;', "'": '&#39;' })[c]!);
}

export function atomFeed(rows: PublishedReviewRow[], base: string, now = new Date()): string {
  const updated = rows.reduce((max, r) => Math.max(max, r.updatedAt?.getTime() ?? 0), 0);
  const feed = new Feed({
    title: 'Trailbench reviews',
    description: 'Measured field tests of camp and trail gear',
    id: `${base}/reviews`,
    link: `${base}/reviews`,
    updated: new Date(updated || now.getTime()),
    generator: 'Trailbench',
    feedLinks: { atom: `${base}/reviews/feed.xml` },
    copyright: 'Cedar Hollow Field School and the reviewers named on each review',
  });
  for (const r of rows) {
    const url = `${base}/reviews/${encodeURIComponent(r.slug)}`;
    const summary = [r.disclosure ? `${DISCLOSURE_LABELS[r.disclosure]}.` : '', r.summary, r.verdict ? `Verdict: ${r.verdict}` : ''].filter(Boolean).join(' ');
    feed.addItem({
      title: asHtmlText(r.title),
      id: url,
      link: url,
      description: asHtmlText(summary),
      author: [{ name: xmlSafe(r.authorName) }],
      date: r.updatedAt ?? now,
      published: r.firstPublishedAt ?? now,
    });
  }
  return feed.atom1();
}
