import type { Metadata } from 'next';
import Link from 'next/link';
import { forbidden, notFound } from 'next/navigation';
import { getDb } from '@/db';
import { findVisibleGear } from '@/db/gear';
import { mayAddLongTermNote } from '@/db/long-term-notes';
import { LongTermNoteForm } from '@/components/long-term-notes/note-form';
import { requirePageRole } from '@/lib/auth/guard';
import { gearPath } from '@/lib/gear/paths';
import { orPageError } from '@/lib/gear/page-errors';
import { wholeMonthsBetween } from '@/lib/long-term-notes/months';

export const metadata: Metadata = { title: 'Add a long-term note' };
export const dynamic = 'force-dynamic';

export default async function NewLongTermNotePage({ searchParams }: { searchParams: Promise<{ item?: string | string[] }> }) {
  const { item: slug } = await searchParams;
  const user = await requirePageRole('reviewer', `/logbook/notes/new${typeof slug === 'string' ? `?item=${encodeURIComponent(slug)}` : ''}`);
  if (typeof slug !== 'string' || !slug) notFound();
  const db = getDb();
  const item = orPageError(() => findVisibleGear(db, slug, user));
  if (!mayAddLongTermNote(db, user, item)) forbidden();
  const today = new Date().toISOString().slice(0, 10);
  return (
    <main className="mx-auto max-w-2xl px-4 py-10 sm:px-6">
      <Link href={gearPath(item.slug)} className="text-sm text-slate hover:underline">
        ← {item.name}
      </Link>
      <h1 className="mt-2 text-3xl font-bold tracking-tight">Add a long-term note</h1>
      <p className="mt-2 text-slate">
        On <strong>{item.maker} {item.name}</strong>: how it has held up in service — use, wear, failures, repairs. The note stays a draft only you and the editors see; submit it for review
        on the next page. Once an editor approves it, it appears in the item’s timeline.
      </p>
      <div className="mt-8">
        <LongTermNoteForm
          mode="create"
          slug={item.slug}
          defaults={{ notedOn: today, monthsInService: item.pricePaidOn && item.ownerId === user.id ? wholeMonthsBetween(item.pricePaidOn, today) : 0, kind: 'use', title: '', body: '' }}
        />
      </div>
    </main>
  );
}
