import type { Metadata } from 'next';
import Link from 'next/link';
import { cachedPublishedReviews } from '@/db/reviews-cache';
import { formatDate } from '@/lib/reviews/dates';
import { DISCLOSURE_LABELS } from '@/lib/reviews/schemas';

export const metadata: Metadata = {
  title: 'Reviews',
  description: 'Published reviews of measured field tests, each with how the tester got the gear.',
  alternates: { types: { 'application/atom+xml': '/reviews/feed.xml' } },
};
export const dynamic = 'force-dynamic';

export default async function ReviewsPage() {
  // Public data from the tagged cache (db/reviews-cache.ts), expired on publish, retract and correction.
  const rows = await cachedPublishedReviews();
  return (
    <main className="mx-auto w-full max-w-4xl px-4 py-12 sm:px-6">
      <header className="border-b border-rule pb-6">
        <h1 className="text-3xl font-bold tracking-tight sm:text-4xl">Reviews</h1>
        <p className="mt-3 max-w-[65ch] text-lg leading-relaxed text-slate">
          Written verdicts on gear we measured. Each says at the top how the tester got the gear, and its figures link to the field tests that produced them.{' '}
          <a href="/reviews/feed.xml" className="text-lichen underline underline-offset-2">
            Atom feed
          </a>
          .
        </p>
      </header>
      {rows.length === 0 ? (
        <p className="mt-8 text-slate">No reviews are published yet.</p>
      ) : (
        <ol className="mt-4 divide-y divide-rule" data-testid="review-list">
          {rows.map((r) => (
            <li key={r.slug} className="py-6">
              <article>
                <h2 className="text-xl font-semibold leading-snug">
                  <Link href={`/reviews/${encodeURIComponent(r.slug)}`} className="hover:text-lichen hover:underline">
                    {r.title}
                  </Link>
                </h2>
                <p className="mt-1 text-sm text-slate">
                  {r.authorName}
                  {r.firstPublishedAt ? (
                    <>
                      {' · '}
                      <time dateTime={r.firstPublishedAt.toISOString()}>{formatDate(r.firstPublishedAt)}</time>
                    </>
                  ) : null}
                  {r.revisionNumber > 1 && r.updatedAt ? ` · corrected ${formatDate(r.updatedAt)}` : ''}
                  {r.disclosure ? ` · ${DISCLOSURE_LABELS[r.disclosure]}` : ''}
                </p>
                {r.summary ? <p className="mt-2 max-w-[65ch] leading-relaxed">{r.summary}</p> : null}
                {r.verdict ? (
                  <p className="mt-2 max-w-[65ch] leading-relaxed">
                    <span className="font-semibold">Verdict:</span> {r.verdict}
                  </p>
                ) : null}
                {r.items.length ? (
                  <p className="mt-2 text-sm text-slate">
                    Covers{' '}
                    {r.items.map((item, i) => (
                      <span key={item.slug}>
                        {i > 0 ? ', ' : ''}
                        <Link href={`/gear/${encodeURIComponent(item.slug)}`} className="underline underline-offset-2 hover:text-lichen">
                          {item.name}
                        </Link>
                      </span>
                    ))}
                  </p>
                ) : null}
              </article>
            </li>
          ))}
        </ol>
      )}
    </main>
  );
}
