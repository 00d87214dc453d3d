import type { Metadata } from 'next';
import Link from 'next/link';
import { getDb } from '@/db';
import { FieldTestEvents } from '@/components/field-tests/events-list';
import { FieldTestRecord, FieldTestResults, FieldTestTrials } from '@/components/field-tests/field-test-details';
import { formatTestedAt } from '@/components/field-tests/format';
import { loadFieldTestView } from '@/components/field-tests/load-view';
import { FieldTestStatus } from '@/components/field-tests/status-badge';
import { RadioNoiseResults } from '@/components/field-tests/radio-noise-results';
import { getTestRadioNoise } from '@/db/radio-noise';
import { WorkflowButtons } from '@/components/field-tests/workflow-buttons';
import { getCurrentUser } from '@/lib/auth/guard';
import { KINDS } from '@/lib/field-tests/kinds';

export const metadata: Metadata = { title: 'Field test' };

/** A field test: public once approved (and its items public); before that its author, the items' owners and editors see it marked pending. */
export default async function FieldTestPage({ params }: { params: Promise<{ id: string }> }) {
  const { id } = await params;
  const user = await getCurrentUser();
  const view = loadFieldTestView(getDb(), id, user);
  const { test } = view;
  return (
    <main className="mx-auto max-w-3xl space-y-10 px-4 py-10 sm:px-6">
      <header>
        <p className="font-mono text-xs uppercase tracking-wide text-slate">Field test</p>
        <h1 className="mt-1 text-3xl font-bold tracking-tight">
          {KINDS[view.kind].label}: {view.items.map((i) => i.name).join(', ')}
        </h1>
        <p className="figure mt-2 text-sm text-slate">{formatTestedAt(test.testedAt)} · {test.placeLabel}</p>
        {!view.public ? (
          <p className="mt-3 flex flex-wrap items-center gap-2 rounded-md border border-amber px-3 py-2 text-sm" data-testid="ft-pending">
            <FieldTestStatus status={test.status} /> Pending: not public. You see it as its author, an item’s owner or an editor; its figures are not on the item pages yet.
          </p>
        ) : null}
        {view.insider ? <p className="mt-2 text-sm"><Link className="underline" href={`/logbook/field-tests/${encodeURIComponent(test.id)}`}>Open in the logbook</Link></p> : null}
      </header>
      <WorkflowButtons id={test.id} actions={view.actions.filter((a) => a === 'approve' || a === 'request-changes')} />
      {view.kind === 'radio-noise' ? (
        <>
          <RadioNoiseResults data={getTestRadioNoise(getDb(), test.id, user)} items={view.items} />
          <FieldTestRecord view={view} />
        </>
      ) : (
        <>
          <FieldTestResults view={view} />
          <FieldTestRecord view={view} />
          <FieldTestTrials view={view} />
        </>
      )}
      <FieldTestEvents events={view.events} />
    </main>
  );
}
