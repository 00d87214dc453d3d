import type { Metadata } from 'next';
import Link from 'next/link';
import { DeskActions } from '@/components/desk/desk-actions';
import { DisclosureNotice } from '@/components/reviews/disclosure';
import { EventLog } from '@/components/reviews/event-log';
import { BuyLinks } from '@/components/reviews/buy-links';
import { ReviewBody } from '@/components/reviews/review-body';
import { StateBadge } from '@/components/reviews/state-badge';
import { getDb } from '@/db';
import { getReviewForDesk } from '@/db/reviews';
import { requirePageRole } from '@/lib/auth/guard';
import { wordCount } from '@/lib/reviews/schemas';
import { orPageError } from '@/lib/reviews/page-errors';

export const metadata: Metadata = { title: 'Review desk: read view', robots: { index: false } };
export const dynamic = 'force-dynamic';

export default async function DeskReviewPage({ params }: { params: Promise<{ id: string }> }) {
  const { id } = await params;
  const user = await requirePageRole('editor', `/desk/reviews/${encodeURIComponent(id)}`);
  const data = orPageError(() => getReviewForDesk(getDb(), id, user));
  const { revision: rev, review } = data;
  return (
    <main className="mx-auto w-full max-w-7xl px-4 py-8 sm:px-6">
      <p className="text-sm text-slate">
        <Link href="/desk" className="hover:underline">
          Review desk
        </Link>{' '}
        / review by {data.authorName}
      </p>
      <div className="mt-6 grid gap-10 lg:grid-cols-[minmax(0,1fr)_22rem]">
        <article className="min-w-0 max-w-3xl">
          <div className="flex flex-wrap items-center gap-2 text-sm">
            <StateBadge state={rev.state} />
            <span className="text-slate">
              Revision {rev.number}
              {data.isCorrection ? ' (a correction)' : ''} · {wordCount(rev.body).toLocaleString('en-US')} words
            </span>
          </div>
          <h1 className="mt-2 text-3xl font-bold leading-tight tracking-tight" data-testid="desk-title">
            {rev.title}
          </h1>
          <div className="mt-4">
            <DisclosureNotice disclosure={rev.disclosure} note={rev.disclosureNote} />
          </div>
          {data.isCorrection ? (
            <p className="mt-3 rounded-md border-l-4 border-amber bg-amber-tint px-4 py-2 text-sm">
              <strong>Correction note:</strong> {rev.correctionNote || <em>none yet</em>}
            </p>
          ) : null}
          {rev.summary ? <p className="mt-4 text-lg leading-relaxed">{rev.summary}</p> : null}
          {rev.verdict ? (
            <p className="mt-3 rounded-md bg-lichen-tint px-4 py-3">
              <span className="font-semibold">Verdict:</span> {rev.verdict}
            </p>
          ) : null}
          <div className="mt-8">
            <ReviewBody source={rev.body} viewer={user} />
          </div>
          <BuyLinks links={data.buyLinks} />
        </article>
        <aside className="space-y-8 lg:sticky lg:top-4 lg:self-start">
          <section aria-labelledby="act">
            <h2 id="act" className="text-lg font-semibold">
              Decide
            </h2>
            <div className="mt-3">
              <DeskActions reviewId={review.id} actions={data.actions} hasDisclosure={rev.disclosure !== null} />
            </div>
            {data.publicRevision ? (
              <p className="mt-3 text-sm">
                <Link href={`/reviews/${encodeURIComponent(review.slug)}`} className="text-lichen underline">
                  Public page (revision {data.publicRevision.number}, {data.publicRevision.state})
                </Link>
              </p>
            ) : null}
          </section>
          <section aria-labelledby="items">
            <h2 id="items" className="text-lg font-semibold">
              Gear items
            </h2>
            <ul className="mt-2 space-y-1 text-sm">
              {data.items.map((i) => (
                <li key={i.id}>
                  <Link href={`/gear/${encodeURIComponent(i.slug)}`} className="text-lichen underline underline-offset-2">
                    {i.maker} {i.name}
                  </Link>{' '}
                  <span className="font-mono text-xs text-slate">{i.slug}</span>
                  {!i.isPublic ? <span className="ml-1 text-xs text-amber">not public</span> : null}
                </li>
              ))}
            </ul>
            <p className="mt-2 text-xs text-slate">Measured figures, their field tests and readings are on each item&apos;s page.</p>
          </section>
          <section aria-labelledby="hist">
            <h2 id="hist" className="text-lg font-semibold">
              History
            </h2>
            <div className="mt-3">
              <EventLog events={data.events} />
            </div>
          </section>
        </aside>
      </div>
    </main>
  );
}
