import { readdirSync } from 'node:fs';
import { describe, expect, it, vi } from 'vitest';

// `server-only` throws outside a React Server Components bundle; vitest is not one.
vi.mock('server-only', () => ({}));

const { CONTENT_SLUGS, getContentPage, isContentSlug, splitTitle } = await import('@/lib/content/pages');

describe('content pages', () => {
  it('has a Markdown file for every slug, and a slug for every file', () => {
    const files = readdirSync('content')
      .filter((name) => name.endsWith('.md'))
      .map((name) => name.slice(0, -3))
      .sort();
    expect([...CONTENT_SLUGS].sort()).toEqual(files);
  });

  it.each(CONTENT_SLUGS)('%s renders with a title, a description and a body', async (slug) => {
    const page = await getContentPage(slug);
    expect(page.title.length).toBeGreaterThan(2);
    expect(page.description.length).toBeGreaterThan(20);
    expect(page.html.trim().length).toBeGreaterThan(200);
    // The title is rendered by the page component, not repeated in the body.
    expect(page.html).not.toMatch(/<h1[\s>]/);
    // Every "On this page" entry points at a heading that exists.
    for (const heading of page.headings) {
      expect(page.html).toContain(`<h2 id="${heading.id}">`);
      expect(heading.id.startsWith('user-content-')).toBe(true);
      expect(heading.text).not.toMatch(/[<>]|&#/);
    }
    // In-page links resolve; site links go to pages that exist or are planned.
    for (const [, target] of page.html.matchAll(/href="#([^"]+)"/g)) {
      expect(page.html).toContain(`id="${target}"`);
    }
  });

  it('shows the safety cautions as caution blocks', async () => {
    const page = await getContentPage('safety');
    expect((page.html.match(/<blockquote class="caution">/g) ?? []).length).toBeGreaterThanOrEqual(6);
    expect(page.html).not.toMatch(/<blockquote>/);
  });

  it('refuses anything outside the allow-list', async () => {
    for (const bad of ['../package', '../../etc/passwd', 'ABOUT', 'about.md', '', 'constructor', '__proto__', 'toString']) {
      expect(isContentSlug(bad), bad).toBe(false);
      await expect(getContentPage(bad as never), bad).rejects.toThrow(/Unknown content page/);
    }
  });

  it('splits the first "# " heading off as the title', () => {
    expect(splitTitle('# About Trailbench\n\nText.')).toEqual({ title: 'About Trailbench', body: '\nText.' });
    expect(splitTitle('\uFEFF# Help #\r\nBody')).toEqual({ title: 'Help', body: 'Body' });
    expect(splitTitle('No heading').title).toBe('');
  });

  // Brief: no real brands, products or people; sources by designation only, never a website.
  it('cites no websites and keeps demo names in the demo section', async () => {
    for (const slug of CONTENT_SLUGS) {
      const page = await getContentPage(slug);
      expect(page.html, slug).not.toMatch(/https?:\/\/|www\.|\.(?:com|org|net|gov)\b/i);
      const demoNames = /Northcairn|Glowmere|Voltmoth|Brackenfold|Dunlow|Cedar Hollow/;
      if (slug !== 'about') expect(page.html, slug).not.toMatch(demoNames);
    }
  });
});
