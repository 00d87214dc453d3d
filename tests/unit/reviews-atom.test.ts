import { describe, expect, it } from 'vitest';
import { atomFeed } from '@/lib/reviews/atom';
import type { PublishedReviewRow } from '@/db/reviews';

const row = (over: Partial<PublishedReviewRow>): PublishedReviewRow =>
  ({
    slug: 'lakeshore-lantern',
    title: 'Lakeshore lantern',
    summary: 'Bright and light.',
    verdict: 'Worth carrying.',
    disclosure: 'bought-retail',
    authorName: 'Cedar Hollow reviewer',
    updatedAt: new Date('2026-10-02T10:00:00Z'),
    firstPublishedAt: new Date('2026-10-01T10:00:00Z'),
    ...over,
  }) as PublishedReviewRow;

describe('atomFeed (RFC 4287 via the feed package)', () => {
  it('writes one entry per review with id, link, dates and author', () => {
    const xml = atomFeed([row({})], 'http://localhost:3000');
    expect(xml).toMatch(/^<\?xml version="1.0" encoding="utf-8"\?>/);
    expect(xml).toContain('<feed xmlns="http://www.w3.org/2005/Atom">');
    // RFC 4287 §4.1.1: a feed has exactly one id, title and updated.
    expect(xml.match(/<feed[\s\S]*?<entry>/)![0].match(/<id>/g)).toHaveLength(1);
    expect(xml).toContain('<id>http://localhost:3000/reviews/lakeshore-lantern</id>');
    expect(xml).toContain('<published>2026-10-01T10:00:00.000Z</published>');
    expect(xml).toContain('<updated>2026-10-02T10:00:00.000Z</updated>');
    expect(xml).toContain('<name>Cedar Hollow reviewer</name>');
    expect(xml).toContain('href="http://localhost:3000/reviews/feed.xml"');
    // The disclosure leads the summary (16 CFR Part 255: near the claim).
    expect(xml).toMatch(/<summary type="html"><!\[CDATA\[Bought at retail[^\]]*Verdict: Worth carrying\.\]\]><\/summary>/);
  });

  it('keeps author text inert: markup is escaped inside the HTML-typed CDATA, control characters dropped', () => {
    const xml = atomFeed([row({ title: 'Lantern <script>alert(1)</script> ]]> & "x"\u0001' })], 'http://localhost:3000');
    expect(xml).not.toContain('<script>');
    expect(xml).not.toContain('\u0001');
    expect(xml).toContain('<title type="html"><![CDATA[Lantern &lt;script&gt;alert(1)&lt;/script&gt; ]]&gt; &amp; &quot;x&quot;]]></title>');
  });
});
