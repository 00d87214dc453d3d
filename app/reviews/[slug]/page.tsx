import type { Metadata } from 'next';
import Link from 'next/link';
import { BuyLinks } from '@/components/reviews/buy-links';
import { DisclosureNotice } from '@/components/reviews/disclosure';
import { ReviewBody } from '@/components/reviews/review-body';
import { StateBadge } from '@/components/reviews/state-badge';
import { getDb } from '@/db';
import { canSeeWorkingRevisions, getReviewPage, type Actor, type ReviewPageData } from '@/db/reviews';
import { cachedPublicReviewPage } from '@/db/reviews-cache';
import { getCurrentUser } from '@/lib/auth/guard';
import { formatDate } from '@/lib/reviews/dates';
import { orPageError } from '@/lib/reviews/page-errors';
import { siteUrl } from '@/lib/reviews/notify';

export const dynamic = 'force-dynamic';

/** Nothing is built ahead: pages render on demand and their data comes from the tagged cache (db/reviews-cache.ts). */
export function generateStaticParams(): { slug: string }[] {
  return [];
}

interface Props {
  params: Promise<{ slug: string }>;
  searchParams: Promise<{ revision?: string | string[] }>;
}

function revisionParam(value: string | string[] | undefined): number | undefined {
  if (typeof value !== 'string' || !/^\d{1,4}$/.test(value)) return undefined;
  return Number(value);
}

/**
 * The public data from the cache for readers; the uncached read for the review's author and editors
 * (drafts, their links) and for anything not public, which also decides between 404 and a preview.
 */
async function loadPage(slug: string, viewer: Actor | null, revision?: number): Promise<ReviewPageData> {
  const cached = await cachedPublicReviewPage(slug, revision);
  if (cached && !canSeeWorkingRevisions(viewer, cached.review)) return cached;
  return orPageError(() => getReviewPage(getDb(), slug, viewer, revision));
}

export async function generateMetadata({ params, searchParams }: Props): Promise<Metadata> {
  const { slug } = await params;
  const { revision } = await searchParams;
  try {
    const page = await loadPage(slug, await getCurrentUser(), revisionParam(revision));
    if (page.isPreview) return { title: page.revision.title, robots: { index: false } };
    const url = `${siteUrl()}/reviews/${encodeURIComponent(slug)}`;
    return {
      title: page.revision.title,
      description: page.revision.summary || undefined,
      openGraph: { type: 'article', title: page.revision.title, description: page.revision.summary || undefined, url, publishedTime: page.firstPublishedAt?.toISOString() },
    };
  } catch {
    return { title: 'Review' };
  }
}

export default async function ReviewPage({ params, searchParams }: Props) {
  const { slug } = await params;
  const { revision: revParam } = await searchParams;
  const viewer = await getCurrentUser();
  const page = await loadPage(slug, viewer, revisionParam(revParam));
  const { revision: rev, review } = page;
  const isOld = page.latestPublicNumber !== null && rev.number !== page.latestPublicNumber && !page.isPreview;
  return (
    <main className="mx-auto w-full max-w-3xl px-4 py-12 sm:px-6 print:py-0">
      {page.isPreview ? (
        <p role="status" className="mb-6 rounded-md border border-amber bg-amber-tint px-4 py-3 text-sm" data-testid="draft-banner">
          <strong>Not published.</strong> Revision {rev.number} is {rev.state.replace('-', ' ')}: only its author and editors can see this page.
        </p>
      ) : null}
      {isOld ? (
        <p role="status" className="mb-6 rounded-md border border-rule bg-card px-4 py-3 text-sm">
          You are reading revision {rev.number}, an earlier version.{' '}
          <Link href={`/reviews/${encodeURIComponent(review.slug)}`} className="text-lichen underline">
            Read the current revision
          </Link>{' '}
          or{' '}
          <Link href={`/reviews/${encodeURIComponent(review.slug)}/changes?from=${rev.number}`} className="text-lichen underline">
            see what changed since
          </Link>
          .
        </p>
      ) : null}
      {page.retraction ? (
        <aside role="note" className="mb-6 rounded-r-md border-l-4 border-danger bg-danger-tint px-5 py-4" data-testid="retraction">
          <h2 className="font-bold text-danger">Retracted on {formatDate(page.retraction.at)}</h2>
          <p className="mt-1 whitespace-pre-line leading-relaxed">{page.retraction.note}</p>
          <p className="mt-2 text-sm text-slate">The retracted text stays below for the record. Do not rely on its figures.</p>
        </aside>
      ) : null}
      <article className={page.retraction ? 'opacity-80' : undefined}>
        <header className="border-b border-rule pb-6">
          <p className="flex items-center gap-2 text-sm text-slate">
            <Link href="/reviews" className="hover:underline">
              Reviews
            </Link>
            {page.isPreview || rev.state === 'retracted' ? <StateBadge state={rev.state} /> : null}
          </p>
          <h1 className="mt-2 text-3xl font-bold leading-tight tracking-tight sm:text-4xl">{rev.title}</h1>
          <p className="mt-3 text-sm text-slate">
            By {page.authorName}
            {page.firstPublishedAt ? (
              <>
                {' · published '}
                <time dateTime={page.firstPublishedAt.toISOString()}>{formatDate(page.firstPublishedAt)}</time>
              </>
            ) : null}
          </p>
          <div className="mt-4">
            <DisclosureNotice disclosure={rev.disclosure} note={rev.disclosureNote} />
          </div>
          {rev.number > 1 && rev.correctionNote && rev.publishedAt ? (
            <p className="mt-3 rounded-md border-l-4 border-amber bg-amber-tint px-4 py-2 text-sm" data-testid="correction-note">
              <strong>Corrected on {formatDate(rev.publishedAt)}:</strong> {rev.correctionNote}
            </p>
          ) : rev.number > 1 && rev.correctionNote ? (
            <p className="mt-3 rounded-md border-l-4 border-amber bg-amber-tint px-4 py-2 text-sm" data-testid="correction-note">
              <strong>Correction (not yet published):</strong> {rev.correctionNote}
            </p>
          ) : null}
          {rev.summary ? <p className="mt-4 text-lg leading-relaxed">{rev.summary}</p> : null}
          {rev.verdict ? (
            <p className="mt-3 rounded-md bg-lichen-tint px-4 py-3 leading-relaxed">
              <span className="font-semibold">Verdict:</span> {rev.verdict}
            </p>
          ) : null}
        </header>
        <div className="mt-8">
          <ReviewBody source={rev.body} viewer={viewer} />
        </div>
        {page.items.length ? (
          <section className="mt-10 border-t border-rule pt-6 text-sm print:hidden">
            <h2 className="font-semibold">Gear in this review</h2>
            <ul className="mt-2 list-disc pl-5">
              {page.items
                .filter((i) => i.isPublic)
                .map((i) => (
                  <li key={i.slug}>
                    <Link href={`/gear/${encodeURIComponent(i.slug)}`} className="text-lichen underline underline-offset-2">
                      {i.maker} {i.name}
                    </Link>{' '}
                    — specs, field tests and readings
                  </li>
                ))}
            </ul>
          </section>
        ) : null}
        <BuyLinks links={page.buyLinks} />
        {page.history.length > 1 ? (
          <section className="mt-8 border-t border-rule pt-6 text-sm print:hidden" data-testid="revision-history">
            <h2 className="font-semibold">Revisions</h2>
            <ol className="mt-2 space-y-2">
              {page.history.map((h) => (
                <li key={h.number}>
                  {h.number === rev.number ? (
                    <span className="font-semibold">Revision {h.number} (shown)</span>
                  ) : (
                    <Link href={`/reviews/${encodeURIComponent(review.slug)}?revision=${h.number}`} className="text-lichen underline underline-offset-2">
                      Revision {h.number}
                    </Link>
                  )}
                  {h.publishedAt ? ` · ${formatDate(h.publishedAt)}` : ''}
                  {h.state === 'retracted' ? ' · retracted' : ''}
                  {h.correctionNote ? <span className="text-slate"> — {h.correctionNote}</span> : null}
                  {page.latestPublicNumber !== null && h.number !== page.latestPublicNumber ? (
                    <>
                      {' · '}
                      <Link href={`/reviews/${encodeURIComponent(review.slug)}/changes?from=${h.number}`} className="text-lichen underline underline-offset-2">
                        what changed since
                      </Link>
                    </>
                  ) : null}
                </li>
              ))}
            </ol>
          </section>
        ) : null}
        {page.working || (page.viewerIsAuthor && page.isPreview) ? (
          <p className="mt-8 text-sm print:hidden">
            <Link href={`/write/${encodeURIComponent(review.id)}`} className="text-lichen underline">
              {page.working ? `Open revision ${page.working.number} (${page.working.state.replace('-', ' ')}) in the writing page` : 'Open in the writing page'}
            </Link>
          </p>
        ) : null}
      </article>
    </main>
  );
}
