import type { Metadata } from 'next';
import Link from 'next/link';
import { DeskLongTermNotes } from '@/components/long-term-notes/desk-long-term-notes';
import { StateBadge } from '@/components/reviews/state-badge';
import { getDb } from '@/db';
import { listDeskQueue } from '@/db/desk';
import { requirePageRole } from '@/lib/auth/guard';
import { formatDateTime } from '@/lib/reviews/dates';
import { deskFilterSchema, type DeskKind } from '@/lib/reviews/schemas';

export const metadata: Metadata = { title: 'Review desk' };
export const dynamic = 'force-dynamic';

const KIND_LABELS: Record<DeskKind, string> = { review: 'Review', 'gear-item': 'Gear item', 'field-test': 'Field test', 'long-term-note': 'Long-term note' };

function age(since: Date, now: Date): string {
  const h = Math.max(0, (now.getTime() - since.getTime()) / 3_600_000);
  if (h < 1) return 'under an hour';
  if (h < 48) return `${Math.floor(h)} h`;
  return `${Math.floor(h / 24)} days`;
}

export default async function ReviewDeskPage({ searchParams }: { searchParams: Promise<Record<string, string | string[] | undefined>> }) {
  await requirePageRole('editor', '/desk');
  const raw = await searchParams;
  const filters = deskFilterSchema.parse({ author: typeof raw.author === 'string' && raw.author ? raw.author : undefined, kind: typeof raw.kind === 'string' && raw.kind ? raw.kind : undefined });
  const { rows, authors } = listDeskQueue(getDb(), filters);
  const now = new Date();
  return (
    <main className="mx-auto w-full max-w-6xl px-4 py-10 sm:px-6">
      <h1 className="text-3xl font-bold tracking-tight">Review desk</h1>
      <p className="mt-2 max-w-[70ch] text-slate">Everything waiting for an editor, oldest first. Reviews open in a read view with the actions; gear items and field tests open on their own pages; long-term notes are shown in full below the queue.</p>
      <form method="get" className="mt-6 flex flex-wrap items-end gap-4 rounded-md border border-rule bg-card p-4 text-sm" aria-label="Filters">
        <label className="space-y-1">
          <span className="block font-semibold">Kind</span>
          <select name="kind" defaultValue={filters.kind ?? ''} className="rounded border border-rule bg-paper px-2 py-1.5">
            <option value="">All kinds</option>
            {Object.entries(KIND_LABELS).map(([k, label]) => (
              <option key={k} value={k}>
                {label}
              </option>
            ))}
          </select>
        </label>
        <label className="space-y-1">
          <span className="block font-semibold">Author</span>
          <select name="author" defaultValue={filters.author ?? ''} className="rounded border border-rule bg-paper px-2 py-1.5">
            <option value="">All authors</option>
            {authors.map((a) => (
              <option key={a.id} value={a.id}>
                {a.name}
              </option>
            ))}
          </select>
        </label>
        <button type="submit" className="rounded-md bg-lichen px-3 py-1.5 font-semibold text-paper hover:bg-lichen-dark">
          Filter
        </button>
        {filters.kind || filters.author ? (
          <Link href="/desk" className="py-1.5 text-lichen underline">
            Clear
          </Link>
        ) : null}
      </form>
      {rows.length === 0 ? (
        <p className="mt-8 text-slate" data-testid="desk-empty">
          Nothing is waiting. Good work.
        </p>
      ) : (
        <div className="mt-6 overflow-x-auto">
          <table className="w-full text-sm" data-testid="desk-queue">
            <thead>
              <tr className="border-b border-rule text-left text-slate">
                <th className="py-2 pr-3 font-semibold">Waiting</th>
                <th className="py-2 pr-3 font-semibold">Kind</th>
                <th className="py-2 pr-3 font-semibold">Title</th>
                <th className="py-2 pr-3 font-semibold">Author</th>
                <th className="py-2 font-semibold">State</th>
              </tr>
            </thead>
            <tbody>
              {rows.map((r) => (
                <tr key={`${r.kind}-${r.id}`} className="border-b border-rule align-top">
                  <td className="py-2 pr-3 font-mono text-xs whitespace-nowrap" title={formatDateTime(r.since)}>
                    {age(r.since, now)}
                  </td>
                  <td className="py-2 pr-3 whitespace-nowrap">{KIND_LABELS[r.kind]}</td>
                  <td className="py-2 pr-3">
                    <Link href={r.href} className="font-semibold text-lichen underline-offset-2 hover:underline">
                      {r.title}
                    </Link>
                    <span className="block text-xs text-slate">{r.detail}</span>
                  </td>
                  <td className="py-2 pr-3">{r.authorName}</td>
                  <td className="py-2">
                    <StateBadge state={r.state} />
                  </td>
                </tr>
              ))}
            </tbody>
          </table>
        </div>
      )}
      <DeskLongTermNotes filters={filters} />
    </main>
  );
}
