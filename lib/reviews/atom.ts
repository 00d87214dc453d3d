/**
 * The Atom feed of published reviews (RFC 4287), written by hand: no feed package is installed.
 * Pure: takes the rows and the site's base URL.
 */
import type { PublishedReviewRow } from '@/db/reviews';
import { DISCLOSURE_LABELS } from './schemas';

function xml(text: string): string {
  // Also drop characters XML 1.0 does not allow.
  return text
    .replace(/[^\x09\x0A\x0D\x20-\uD7FF\uE000-\uFFFD\u{10000}-\u{10FFFF}]/gu, '')
    .replace(/[&<>"']/g, (c) => ({ '&': '&amp;', '<': '&lt;', '>': '&gt;', '"': '&quot;', "'": '&apos;' })[c]!);
}

export function atomFeed(rows: PublishedReviewRow[], base: string, now = new Date()): string {
  const updated = rows.reduce((max, r) => Math.max(max, r.updatedAt?.getTime() ?? 0), 0);
  const entries = rows.map((r) => {
    const url = `${base}/reviews/${encodeURIComponent(r.slug)}`;
    const summary = [r.disclosure ? `${DISCLOSURE_LABELS[r.disclosure]}.` : '', r.summary, r.verdict ? `Verdict: ${r.verdict}` : ''].filter(Boolean).join(' ');
    return [
      '  <entry>',
      `    <id>${xml(url)}</id>`,
      `    <title>${xml(r.title)}</title>`,
      `    <link rel="alternate" type="text/html" href="${xml(url)}"/>`,
      `    <published>${(r.firstPublishedAt ?? now).toISOString()}</published>`,
      `    <updated>${(r.updatedAt ?? now).toISOString()}</updated>`,
      `    <author><name>${xml(r.authorName)}</name></author>`,
      `    <summary type="text">${xml(summary)}</summary>`,
      '  </entry>',
    ].join('\n');
  });
  return [
    '<?xml version="1.0" encoding="utf-8"?>',
    '<feed xmlns="http://www.w3.org/2005/Atom">',
    `  <id>${xml(`${base}/reviews`)}</id>`,
    '  <title>Trailbench reviews</title>',
    '  <subtitle>Measured field tests of camp and trail gear</subtitle>',
    `  <link rel="self" type="application/atom+xml" href="${xml(`${base}/reviews/feed.xml`)}"/>`,
    `  <link rel="alternate" type="text/html" href="${xml(`${base}/reviews`)}"/>`,
    `  <updated>${new Date(updated || now.getTime()).toISOString()}</updated>`,
    ...entries,
    '</feed>',
    '',
  ].join('\n');
}
