import type { Metadata } from 'next';
import type { ReactNode } from 'react';
import { CONTENT_PAGES, getContentPage, type ContentSlug } from '@/lib/content/pages';
import styles from './content-page.module.css';

/** `generateMetadata` for a content page: its title and description. */
export async function contentPageMetadata(slug: ContentSlug): Promise<Metadata> {
  const page = await getContentPage(slug);
  return { title: page.title, description: CONTENT_PAGES[slug].description };
}

/**
 * One of Trailbench's own pages (content/<slug>.md) in a readable column.
 * `lead` is rendered between the header and the body (e.g. a <Caution>).
 */
export async function ContentPage({ slug, lead }: { slug: ContentSlug; lead?: ReactNode }) {
  const page = await getContentPage(slug);
  return (
    <main className="mx-auto w-full max-w-5xl px-4 py-12 sm:px-6">
      <div className="lg:grid lg:grid-cols-[minmax(0,1fr)_14rem] lg:gap-12">
        <article className="min-w-0">
          <header className="max-w-[70ch] border-b border-rule pb-6">
            <h1 className="text-3xl font-bold tracking-tight sm:text-4xl">{page.title}</h1>
            <p className="mt-3 text-lg leading-relaxed text-slate">{page.description}</p>
          </header>
          {lead ? <div className="mt-8 max-w-[70ch]">{lead}</div> : null}
          <div
            className={`prose-content mt-8 ${styles.body}`}
            // Sanitized by renderMarkdown (lib/markdown/render.ts): the only HTML source allowed here.
            dangerouslySetInnerHTML={{ __html: page.html }}
          />
        </article>
        {page.headings.length > 2 ? (
          <nav aria-label="On this page" className="hidden lg:block">
            <div className="sticky top-8 border-l border-rule pl-4">
              <p className="font-mono text-xs uppercase tracking-wide text-slate">On this page</p>
              <ul className="mt-3 space-y-2 text-sm">
                {page.headings.map((heading) => (
                  <li key={heading.id}>
                    <a href={`#${heading.id}`} className="text-slate hover:text-lichen hover:underline">
                      {heading.text}
                    </a>
                  </li>
                ))}
              </ul>
            </div>
          </nav>
        ) : null}
      </div>
    </main>
  );
}
