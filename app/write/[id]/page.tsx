import type { Metadata } from 'next';
import Link from 'next/link';
import { BuyLinksEditor } from '@/components/reviews/buy-links-editor';
import { EventLog } from '@/components/reviews/event-log';
import { ReviewEditor } from '@/components/reviews/review-editor';
import { StateBadge } from '@/components/reviews/state-badge';
import { getDb } from '@/db';
import { getReviewForWriting, listPickableItems } from '@/db/reviews';
import { requirePageRole } from '@/lib/auth/guard';
import { orPageError } from '@/lib/reviews/page-errors';

export const metadata: Metadata = { title: 'Writing a review', robots: { index: false } };
export const dynamic = 'force-dynamic';

export default async function WriteReviewPage({ params }: { params: Promise<{ id: string }> }) {
  const { id } = await params;
  const user = await requirePageRole('reviewer', `/write/${encodeURIComponent(id)}`);
  const db = getDb();
  const data = orPageError(() => getReviewForWriting(db, id, user));
  const { revision: rev, review } = data;
  const returned = [...data.events].reverse().find((e) => e.revisionNumber === rev.number && e.to === 'changes-requested');
  // Items already on the review stay pickable even if they are someone else's and no longer public.
  const pickable = listPickableItems(db, user);
  const known = new Set(pickable.map((i) => i.id));
  const items = [...pickable, ...data.items.filter((i) => !known.has(i.id)).map((i) => ({ ...i, mine: false }))];
  return (
    <main className="mx-auto w-full max-w-7xl px-4 py-8 sm:px-6">
      <p className="text-sm text-slate">
        <Link href="/logbook" className="hover:underline">
          Logbook
        </Link>{' '}
        /{' '}
        <Link href="/write" className="hover:underline">
          Reviews
        </Link>
      </p>
      <div className="mt-1 flex flex-wrap items-center gap-3">
        <h1 className="text-2xl font-bold tracking-tight">{data.isCorrection ? `Correction: revision ${rev.number}` : 'Draft review'}</h1>
        <StateBadge state={rev.state} />
        {data.latestPublicNumber ? (
          <Link href={`/reviews/${encodeURIComponent(review.slug)}`} className="text-sm text-lichen underline">
            Public page (revision {data.latestPublicNumber})
          </Link>
        ) : (
          <Link href={`/reviews/${encodeURIComponent(review.slug)}`} className="text-sm text-lichen underline">
            Page preview
          </Link>
        )}
      </div>
      {rev.state === 'changes-requested' && returned ? (
        <aside role="note" className="mt-4 rounded-r-md border-l-4 border-amber bg-amber-tint px-4 py-3" data-testid="editor-comment">
          <p className="text-sm font-semibold">{returned.actorName ?? 'An editor'} asked for changes:</p>
          <p className="mt-1 whitespace-pre-line">{returned.comment}</p>
        </aside>
      ) : null}
      <div className="mt-4">
        <ReviewEditor
          key={`${rev.id}-${rev.state}`}
          reviewId={review.id}
          initial={{
            title: rev.title,
            summary: rev.summary,
            verdict: rev.verdict,
            body: rev.body,
            disclosure: rev.disclosure,
            disclosureNote: rev.disclosureNote,
            correctionNote: rev.correctionNote ?? '',
            itemIds: data.items.map((i) => i.id),
          }}
          updatedAt={rev.updatedAt.toISOString()}
          state={rev.state}
          editable={data.editable}
          actions={data.actions}
          isCorrection={data.isCorrection}
          items={items}
        />
      </div>
      <div className="mt-12 border-t border-rule pt-6">
        <BuyLinksEditor key={`${rev.id}-${rev.state}`} reviewId={review.id} initial={data.buyLinks} editable={data.editable} />
      </div>
      <section className="mt-12 max-w-2xl border-t border-rule pt-6">
        <h2 className="text-lg font-semibold">History</h2>
        <div className="mt-3">
          <EventLog events={data.events} />
        </div>
      </section>
    </main>
  );
}
