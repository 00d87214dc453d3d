import type { Metadata } from 'next';
import Link from 'next/link';
import { getDb } from '@/db';
import { FieldTestRecordForm } from '@/components/field-tests/record-form';
import { itemOptionsFor } from '@/components/field-tests/item-options';
import { requirePageRole } from '@/lib/auth/guard';
import { toDateTimeInput } from '@/lib/field-tests/schemas';
import { isFieldTestKind } from '@/lib/field-tests/kinds';

export const metadata: Metadata = { title: 'Log a field test' };

export default async function NewFieldTestPage({ searchParams }: { searchParams: Promise<{ item?: string; kind?: string }> }) {
  const user = await requirePageRole('reviewer', '/logbook/field-tests/new');
  const { item, kind } = await searchParams;
  const items = itemOptionsFor(getDb(), user.id);
  const preselected = typeof item === 'string' && items.some((i) => i.slug === item) ? [item] : [];
  return (
    <main className="mx-auto max-w-2xl px-4 py-10 sm:px-6">
      <Link href="/logbook" className="text-sm text-slate hover:underline">← Logbook</Link>
      <h1 className="mt-2 text-3xl font-bold tracking-tight">Log a field test</h1>
      <p className="mt-2 text-slate">
        Record when, where and how you tested; add the trials on the next page. The test stays a draft only you, the items’ owners and the editors can see until an editor approves it.
      </p>
      <div className="mt-8">
        <FieldTestRecordForm
          mode="create"
          items={items}
          defaults={{
            kind: isFieldTestKind(kind) ? kind : 'light-runtime',
            testedAt: toDateTimeInput(new Date()),
            placeLabel: '',
            sky: 'indoor',
            ambientC: null,
            instruments: [{ name: '', accuracy: '' }],
            methodNotes: '',
            items: preselected,
          }}
        />
      </div>
    </main>
  );
}
