import type { Metadata } from 'next';
import Link from 'next/link';
import { GearForm } from '@/components/gear/gear-form';
import { requirePageRole } from '@/lib/auth/guard';
import { emptyGearValues } from '@/lib/gear/form-values';

export const metadata: Metadata = { title: 'New gear item' };

export default async function NewGearPage() {
  await requirePageRole('reviewer', '/logbook/gear/new');
  return (
    <main className="mx-auto max-w-2xl px-4 py-10 sm:px-6">
      <Link href="/logbook" className="text-sm text-slate hover:underline">
        ← Logbook
      </Link>
      <h1 className="mt-2 text-3xl font-bold tracking-tight">Record a gear item</h1>
      <p className="mt-2 text-slate">It starts as a draft only you and the editors can see. Submit it for review when the claims are in.</p>
      <div className="mt-8">
        <GearForm mode="create" defaults={emptyGearValues('light')} />
      </div>
    </main>
  );
}
