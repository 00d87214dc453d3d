import type { Metadata } from 'next';
import Link from 'next/link';
import { NewReviewForm } from '@/components/reviews/new-review-form';
import { StateBadge } from '@/components/reviews/state-badge';
import { getDb } from '@/db';
import { listMyReviews, listPickableItems } from '@/db/reviews';
import { requirePageRole } from '@/lib/auth/guard';
import { formatDateTime } from '@/lib/reviews/dates';

export const metadata: Metadata = { title: 'Write a review' };
export const dynamic = 'force-dynamic';

export default async function WritePage() {
  const user = await requirePageRole('reviewer', '/write');
  const db = getDb();
  const mine = listMyReviews(db, user.id);
  const items = listPickableItems(db, user);
  return (
    <main className="mx-auto w-full max-w-5xl px-4 py-10 sm:px-6">
      <p className="text-sm text-slate">
        <Link href="/logbook" className="hover:underline">
          Logbook
        </Link>{' '}
        / Reviews
      </p>
      <div className="mt-1 flex flex-wrap items-baseline gap-4">
        <h1 className="text-3xl font-bold tracking-tight">Your reviews</h1>
        <Link href="/write/notifications" className="text-sm text-lichen underline">
          Mail settings
        </Link>
      </div>
      <div className="mt-8 grid gap-10 lg:grid-cols-[minmax(0,1fr)_22rem]">
        <section aria-labelledby="mine">
          <h2 id="mine" className="sr-only">
            Your reviews
          </h2>
          {mine.length === 0 ? (
            <p className="text-slate">No reviews yet. Start one with the form.</p>
          ) : (
            <table className="w-full text-sm" data-testid="my-reviews">
              <thead>
                <tr className="border-b border-rule text-left text-slate">
                  <th className="py-2 pr-3 font-semibold">Title</th>
                  <th className="py-2 pr-3 font-semibold">State</th>
                  <th className="py-2 font-semibold">Last change</th>
                </tr>
              </thead>
              <tbody>
                {mine.map((r) => (
                  <tr key={r.id} className="border-b border-rule align-top">
                    <td className="py-2 pr-3">
                      <Link href={`/write/${encodeURIComponent(r.id)}`} className="font-semibold text-lichen underline-offset-2 hover:underline">
                        {r.title}
                      </Link>
                      {r.revisionNumber > 1 ? <span className="ml-2 text-xs text-slate">revision {r.revisionNumber}</span> : null}
                      {r.isPublic ? (
                        <Link href={`/reviews/${encodeURIComponent(r.slug)}`} className="ml-2 text-xs text-slate underline">
                          public page
                        </Link>
                      ) : null}
                    </td>
                    <td className="py-2 pr-3">
                      <StateBadge state={r.state} />
                    </td>
                    <td className="py-2 font-mono text-xs text-slate">{formatDateTime(r.updatedAt)}</td>
                  </tr>
                ))}
              </tbody>
            </table>
          )}
        </section>
        <section aria-labelledby="start" className="rounded-md border border-rule bg-card p-5">
          <h2 id="start" className="text-lg font-semibold">
            Start a review
          </h2>
          <p className="mt-1 text-sm text-slate">Cover one item, or several for a side-by-side. You can change both later while it is a draft.</p>
          <div className="mt-4">
            <NewReviewForm items={items} />
          </div>
        </section>
      </div>
    </main>
  );
}
