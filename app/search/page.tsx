import type { Metadata } from 'next';
import Link from 'next/link';
import { getDb } from '@/db';
import { searchPublic, type SearchHit } from '@/db/search';
import { categoryDef } from '@/lib/gear/categories';
import { isCategory } from '@/lib/measure';
import { MAX_QUERY_CHARS } from '@/lib/search/query';
import { snippetParts } from '@/lib/search/snippet';

export const metadata: Metadata = {
  title: 'Search',
  description: 'Search published reviews and the gear catalog.',
  robots: { index: false },
};
export const dynamic = 'force-dynamic';

interface Props {
  searchParams: Promise<{ q?: string | string[] }>;
}

/** Text with FTS hits as <mark> elements, built from text nodes only. */
function Marked({ text }: { text: string }) {
  return (
    <>
      {snippetParts(text).map((part, i) =>
        part.hit ? (
          <mark key={i} className="rounded-sm bg-amber-tint px-0.5 font-semibold text-ink">
            {part.text}
          </mark>
        ) : (
          <span key={i}>{part.text}</span>
        ),
      )}
    </>
  );
}

function kindLabel(hit: SearchHit): string {
  if (hit.kind === 'review') return 'Review';
  return hit.category && isCategory(hit.category) ? `Gear · ${categoryDef(hit.category).label}` : 'Gear';
}

export default async function SearchPage({ searchParams }: Props) {
  const { q: rawQ } = await searchParams;
  const q = (typeof rawQ === 'string' ? rawQ : '').slice(0, MAX_QUERY_CHARS);
  const result = q.trim() ? searchPublic(getDb(), q) : null;
  return (
    <main className="mx-auto w-full max-w-4xl px-4 py-12 sm:px-6">
      <header className="border-b border-rule pb-6">
        <h1 className="text-3xl font-bold tracking-tight sm:text-4xl">Search</h1>
        <p className="mt-3 max-w-[65ch] text-slate">Published reviews and the public gear catalog. Every word must appear; the last one may be the start of a word.</p>
        <form role="search" action="/search" method="get" className="mt-5 flex max-w-xl gap-2">
          <label htmlFor="search-q" className="sr-only">
            Search words
          </label>
          <input
            id="search-q"
            name="q"
            type="search"
            defaultValue={q}
            maxLength={MAX_QUERY_CHARS}
            placeholder="e.g. lantern runtime"
            className="min-w-0 flex-1 rounded-md border border-rule bg-paper px-3 py-2"
          />
          <button type="submit" className="rounded-md bg-lichen px-4 py-2 font-semibold text-paper hover:bg-lichen-dark">
            Search
          </button>
        </form>
      </header>
      {result === null ? null : result.match === null ? (
        <p className="mt-8 text-slate" data-testid="search-empty">
          Nothing to search for in “{q}”: type a word or the start of one — letters and digits only count.
        </p>
      ) : result.hits.length === 0 ? (
        <p className="mt-8 text-slate" data-testid="search-empty">
          No published review or public gear item matches “{q}”. Try fewer words, or the start of a word.
        </p>
      ) : (
        <section aria-labelledby="search-results-heading" className="mt-6">
          <h2 id="search-results-heading" className="text-sm text-slate" aria-live="polite">
            {result.hits.length === 1 ? '1 result' : `${result.hits.length} results`} for “{q}”
          </h2>
          <ol className="mt-2 divide-y divide-rule" data-testid="search-results">
            {result.hits.map((hit) => (
              <li key={`${hit.kind}:${hit.slug}`} className="py-5">
                <article>
                  <p className="font-mono text-xs uppercase tracking-wide text-slate">{kindLabel(hit)}</p>
                  <h3 className="mt-1 text-lg font-semibold leading-snug">
                    <Link href={hit.kind === 'review' ? `/reviews/${encodeURIComponent(hit.slug)}` : `/gear/${encodeURIComponent(hit.slug)}`} className="hover:text-lichen hover:underline">
                      <Marked text={hit.title} />
                    </Link>
                  </h3>
                  {hit.snippet ? (
                    <p className="mt-1 max-w-[70ch] leading-relaxed" data-testid="search-snippet">
                      <Marked text={hit.snippet} />
                    </p>
                  ) : null}
                </article>
              </li>
            ))}
          </ol>
        </section>
      )}
    </main>
  );
}
