import { describe, expect, it } from 'vitest';
import { renderMarkdownSync } from '@/lib/markdown/render';
import { splitAtSpecTables } from '@/lib/reviews/split-html';
import { wordCount } from '@/lib/reviews/schemas';

// Expected values: the directive's documented output in lib/markdown/plugins.ts (rehypeSpecTableDirective).
describe('splitAtSpecTables', () => {
  it('cuts the sanitized HTML at top-level spec tables only', () => {
    const html = renderMarkdownSync('Intro\n\n::spec-table[lamp-a, lamp-b]\n\n> ::spec-table[lamp-c]\n\nEnd');
    const parts = splitAtSpecTables(html);
    expect(parts.map((p) => p.type)).toEqual(['html', 'spec-table', 'html']);
    expect(parts[1]).toEqual({ type: 'spec-table', slugs: ['lamp-a', 'lamp-b'] });
    // The nested one stays inert inside its quote.
    expect(parts[2]?.type === 'html' && parts[2].html).toContain('<blockquote>');
  });
  it('leaves HTML without tables as one part, and script attempts never become tables', () => {
    const html = renderMarkdownSync('<div data-spec-table="x"></div>\n\n<script>alert(1)</script> ::spec-table[a]');
    expect(splitAtSpecTables(html).every((p) => p.type === 'html')).toBe(true);
    expect(html).not.toContain('<script');
  });
  it('counts words (common practice, no source)', () => {
    expect(wordCount('## Heading\n\nIt ran for **4.6 h** — don’t guess.')).toBe(8);
    expect(wordCount('')).toBe(0);
  });
});
