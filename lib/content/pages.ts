import 'server-only';
import { readFile } from 'node:fs/promises';
import path from 'node:path';
import { renderMarkdown } from '@/lib/markdown/render';

/**
 * Trailbench's own pages, written in Markdown in content/<slug>.md and rendered through the
 * same sanitizing pipeline as reviews. Only the slugs below can be read: a slug is looked up
 * in this fixed list, never joined into a path from user input.
 */
export const CONTENT_PAGES = {
  about: {
    description:
      'What Trailbench is, who does what, and how a measured figure gets from a field test to a published page.',
  },
  'how-we-test': {
    description:
      'Claimed and measured figures, trials, runtime and beam distance, energy delivered, solar output, radio-noise checks, value ratios and the best-value line.',
  },
  safety: {
    description:
      'Cautions for lithium cells, flying with batteries, 12 V wiring, mains charging, carbon monoxide and radio transmitting.',
  },
  help: {
    description:
      'Signing in, the logbook, the review desk, the workflow states, the units you can type and writing in Markdown.',
  },
  disclosure: {
    description:
      'How testers get the gear they review, what the "Where to buy" and affiliate links are, and what money never changes.',
  },
} as const satisfies Record<string, { description: string }>;

export type ContentSlug = keyof typeof CONTENT_PAGES;

export const CONTENT_SLUGS = Object.keys(CONTENT_PAGES) as ContentSlug[];

export function isContentSlug(value: string): value is ContentSlug {
  return Object.prototype.hasOwnProperty.call(CONTENT_PAGES, value);
}

/** A second-level heading of a page, for its "On this page" list. */
export interface ContentHeading {
  /** The element id in `html` (already prefixed by the sanitizer). */
  id: string;
  text: string;
}

export interface ContentPage {
  slug: ContentSlug;
  title: string;
  description: string;
  /** Sanitized HTML of the body, without the title heading. */
  html: string;
  headings: ContentHeading[];
}

const CONTENT_DIR = path.join(process.cwd(), 'content');

/** Splits off the first `# ` heading as the title. */
export function splitTitle(source: string): { title: string; body: string } {
  const lines = source.replace(/^\uFEFF/, '').split(/\r?\n/);
  const index = lines.findIndex((line) => /^#\s+\S/.test(line));
  if (index === -1) return { title: '', body: source };
  const title = lines[index]!.replace(/^#\s+/, '').replace(/\s+#*\s*$/, '').trim();
  return { title, body: [...lines.slice(0, index), ...lines.slice(index + 1)].join('\n') };
}

function decodeText(html: string): string {
  return html
    .replace(/<[^>]*>/g, '')
    .replace(/&#x([0-9a-f]+);/gi, (_, hex: string) => String.fromCodePoint(parseInt(hex, 16)))
    .replace(/&#(\d+);/g, (_, dec: string) => String.fromCodePoint(parseInt(dec, 10)))
    .replace(/&amp;/g, '&')
    .replace(/&lt;/g, '<')
    .replace(/&gt;/g, '>')
    .replace(/&quot;/g, '"')
    .trim();
}

/** The `<h2 id="…">` headings of rendered HTML (our renderer's output, not arbitrary HTML). */
export function headingsOf(html: string): ContentHeading[] {
  return [...html.matchAll(/<h2 id="([^"]+)">([\s\S]*?)<\/h2>/g)].map((match) => ({
    id: match[1] ?? '',
    text: decodeText(match[2] ?? ''),
  }));
}

// Content ships with the app and cannot change while a production server runs: render each
// page once. In development every request re-reads the file, so edits show up at once.
const rendered = new Map<ContentSlug, Promise<ContentPage>>();

/** Reads and renders one content page. Throws for a slug outside the allow-list. */
export function getContentPage(slug: ContentSlug): Promise<ContentPage> {
  if (!isContentSlug(slug)) return Promise.reject(new Error(`Unknown content page "${String(slug)}".`));
  if (process.env.NODE_ENV !== 'production') return loadContentPage(slug);
  let page = rendered.get(slug);
  if (!page) {
    page = loadContentPage(slug);
    rendered.set(slug, page);
    page.catch(() => rendered.delete(slug));
  }
  return page;
}

async function loadContentPage(slug: ContentSlug): Promise<ContentPage> {
  const source = await readFile(path.join(CONTENT_DIR, `${slug}.md`), 'utf8');
  const { title, body } = splitTitle(source);
  if (!title) throw new Error(`content/${slug}.md needs a "# " title line.`);
  const html = await renderMarkdown(body);
  return { slug, title, description: CONTENT_PAGES[slug].description, html, headings: headingsOf(html) };
}
