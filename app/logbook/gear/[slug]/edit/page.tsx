import type { Metadata } from 'next';
import Link from 'next/link';
import { GearForm } from '@/components/gear/gear-form';
import { getDb } from '@/db';
import { getGearForEdit } from '@/db/gear';
import { requirePageRole } from '@/lib/auth/guard';
import { toFormValues } from '@/lib/gear/form-values';
import { orPageError } from '@/lib/gear/page-errors';
import { gearPath } from '@/lib/gear/paths';

export const metadata: Metadata = { title: 'Edit gear item' };

export default async function EditGearPage({ params }: { params: Promise<{ slug: string }> }) {
  const { slug } = await params;
  const user = await requirePageRole('reviewer', `/logbook/gear/${encodeURIComponent(slug)}/edit`);
  const { item, input, category, locked } = orPageError(() => getGearForEdit(getDb(), slug, user));
  return (
    <main className="mx-auto max-w-2xl px-4 py-10 sm:px-6">
      <Link href={gearPath(item.slug)} className="text-sm text-slate hover:underline">
        ← {item.name}
      </Link>
      <h1 className="mt-2 text-3xl font-bold tracking-tight">Edit {item.name}</h1>
      {item.approvedAt ? (
        <p className="mt-3 rounded-md bg-amber-tint px-3 py-2 text-sm" data-testid="pending-notice">
          This item is public. Your changes are saved as a pending change: readers keep seeing the approved figures until an editor approves it.
        </p>
      ) : null}
      <div className="mt-8">
        {locked ? (
          <p className="rounded-md border border-rule p-4 text-slate">This item is in review and locked until an editor acts. Withdraw it from its page to edit it.</p>
        ) : (
          <GearForm mode="edit" slug={item.slug} defaults={toFormValues(input, category)} isPublic={item.approvedAt !== null} />
        )}
      </div>
    </main>
  );
}
