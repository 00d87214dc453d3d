import type { Metadata } from 'next';
import Link from 'next/link';
import { DiffLegend, FieldDiffView } from '@/components/reviews/revision-diff';
import { getDb } from '@/db';
import { getReviewDiff } from '@/db/reviews';
import { formatDate } from '@/lib/reviews/dates';
import { diffRevisions } from '@/lib/reviews/diff';
import { orPageError } from '@/lib/reviews/page-errors';

export const dynamic = 'force-dynamic';

interface Props {
  params: Promise<{ slug: string }>;
  searchParams: Promise<{ from?: string | string[] }>;
}

function fromParam(value: string | string[] | undefined): number {
  return typeof value === 'string' && /^\d{1,4}$/.test(value) ? Number(value) : 1;
}

export const metadata: Metadata = { title: 'Changes between revisions', robots: { index: false } };

/** What changed from an earlier public revision of a review to the current one, word by word. */
export default async function ReviewChangesPage({ params, searchParams }: Props) {
  const { slug } = await params;
  const { from } = await searchParams;
  const data = orPageError(() => getReviewDiff(getDb(), slug, fromParam(from)));
  const reviewHref = `/reviews/${encodeURIComponent(data.slug)}`;
  const same = data.from.number === data.to.number;
  const diffs = same ? [] : diffRevisions(data.from.text, data.to.text);
  const when = (d: Date | null) => (d ? ` (${formatDate(d)})` : '');
  return (
    <main className="mx-auto w-full max-w-3xl px-4 py-12 sm:px-6">
      <p className="text-sm text-slate">
        <Link href={reviewHref} className="hover:underline">
          {data.title}
        </Link>
      </p>
      <h1 className="mt-2 text-3xl font-bold tracking-tight">
        Changes from revision {data.from.number} to revision {data.to.number}
      </h1>
      <p className="mt-3 text-slate">
        Revision {data.from.number}
        {when(data.from.publishedAt)} compared with the current revision {data.to.number}
        {when(data.to.publishedAt)}
        {data.to.state === 'retracted' ? ', which is retracted' : ''}. Published text never changes: each correction is a new revision.
      </p>
      <nav aria-label="Compare another revision" className="mt-4 flex flex-wrap gap-2 text-sm">
        {data.publicNumbers
          .filter((n) => n !== data.to.number)
          .map((n) =>
            n === data.from.number ? (
              <span key={n} aria-current="page" className="rounded-md border border-ink px-2 py-1 font-semibold">
                From revision {n}
              </span>
            ) : (
              <Link key={n} href={`${reviewHref}/changes?from=${n}`} className="rounded-md border border-rule px-2 py-1 text-lichen hover:bg-card">
                From revision {n}
              </Link>
            ),
          )}
        <Link href={`${reviewHref}?revision=${data.from.number}`} className="rounded-md px-2 py-1 text-lichen underline">
          Read revision {data.from.number} in full
        </Link>
      </nav>
      {same ? (
        <p className="mt-8" data-testid="diff-same">
          Revision {data.to.number} is the current revision: there is nothing to compare.{' '}
          {data.publicNumbers.length > 1 ? 'Pick an earlier revision above.' : 'This review has had no corrections.'}
        </p>
      ) : (
        <div className="mt-6">
          <DiffLegend />
          <div className="mt-4">
            {diffs
              .filter((d) => d.changed)
              .map((d) => (
                <FieldDiffView key={d.field} diff={d} />
              ))}
          </div>
          {diffs.some((d) => !d.changed) ? (
            <p className="border-t border-rule pt-4 text-sm text-slate" data-testid="diff-unchanged">
              Unchanged:{' '}
              {diffs
                .filter((d) => !d.changed)
                .map((d) => d.label.charAt(0).toLowerCase() + d.label.slice(1))
                .join(', ')}
              .
            </p>
          ) : null}
        </div>
      )}
    </main>
  );
}
