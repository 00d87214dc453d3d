import type { Metadata } from 'next';
import Link from 'next/link';
import { getDb } from '@/db';
import { AddTrial } from '@/components/field-tests/add-trial';
import { DeleteTrialButton } from '@/components/field-tests/delete-trial-button';
import { FieldTestEvents } from '@/components/field-tests/events-list';
import { FieldTestRecord, FieldTestResults, FieldTestTrials } from '@/components/field-tests/field-test-details';
import { itemOptionsFor } from '@/components/field-tests/item-options';
import { loadFieldTestView } from '@/components/field-tests/load-view';
import { FieldTestRecordForm } from '@/components/field-tests/record-form';
import { FieldTestStatus } from '@/components/field-tests/status-badge';
import { RadioNoiseEditor } from '@/components/field-tests/radio-noise-editor';
import { RadioNoiseResults } from '@/components/field-tests/radio-noise-results';
import { getTestRadioNoise } from '@/db/radio-noise';
import { WorkflowButtons } from '@/components/field-tests/workflow-buttons';
import { readingsMaxBytes } from '@/app/api/v1/field-tests/handlers';
import { requirePageRole } from '@/lib/auth/guard';
import { KINDS } from '@/lib/field-tests/kinds';
import { toDateTimeInput } from '@/lib/field-tests/schemas';

export const metadata: Metadata = { title: 'Field test' };

export default async function LogbookFieldTestPage({ params }: { params: Promise<{ id: string }> }) {
  const { id } = await params;
  const user = await requirePageRole('reviewer', `/logbook/field-tests/${encodeURIComponent(id)}`);
  const db = getDb();
  const view = loadFieldTestView(db, id, user);
  const { test } = view;
  const editing = view.canEdit;
  const radioNoise = view.kind === 'radio-noise' ? getTestRadioNoise(db, test.id, user) : null;
  return (
    <main className="mx-auto max-w-3xl space-y-10 px-4 py-10 sm:px-6">
      <div>
        <Link href="/logbook" className="text-sm text-slate hover:underline">← Logbook</Link>
        <h1 className="mt-2 text-3xl font-bold tracking-tight">{KINDS[view.kind].label} — {test.placeLabel}</h1>
        <p className="mt-2 flex flex-wrap items-center gap-2 text-sm text-slate">
          <FieldTestStatus status={test.status} />
          {view.public ? <Link className="underline" href={`/field-tests/${encodeURIComponent(test.id)}`}>Public page</Link> : <span>Not public: only you, the items’ owners and the editors see it.</span>}
        </p>
      </div>
      <WorkflowButtons id={test.id} actions={view.actions} />
      {editing ? (
        <section aria-labelledby="ft-edit" className="space-y-4">
          <h2 id="ft-edit" className="text-xl font-semibold">Record</h2>
          <FieldTestRecordForm
            mode="edit"
            id={test.id}
            items={itemOptionsFor(db, user.id)}
            defaults={{
              kind: view.kind,
              testedAt: toDateTimeInput(test.testedAt),
              placeLabel: test.placeLabel,
              sky: test.sky ?? 'indoor',
              ambientC: test.ambientC,
              instruments: test.instruments.map((i) => ({ name: i.name, accuracy: i.accuracy ?? '' })),
              methodNotes: test.methodNotes,
              items: view.items.map((i) => i.slug),
            }}
          />
        </section>
      ) : (
        <FieldTestRecord view={view} />
      )}
      {radioNoise ? (
        <>
          {editing ? (
            <section aria-labelledby="rn-edit" className="space-y-4">
              <h2 id="rn-edit" className="text-xl font-semibold">Band readings</h2>
              <RadioNoiseEditor
                testId={test.id}
                items={view.items.map((i) => ({ slug: i.slug, name: i.name }))}
                defaults={radioNoise.readings.map((r) => ({ item: r.item.slug, band: r.band, frequencyMHz: r.frequencyMHz, mode: r.mode, bandwidthHz: r.bandwidthHz, antenna: r.antenna, distanceM: r.distanceM, baseline: r.baseline, withItem: r.withItem }))}
              />
            </section>
          ) : null}
          <RadioNoiseResults data={radioNoise} items={view.items} />
        </>
      ) : (
        <FieldTestTrials view={view}>{editing ? (trialId) => <DeleteTrialButton testId={test.id} trialId={trialId} /> : undefined}</FieldTestTrials>
      )}
      {editing && !radioNoise ? (
        <AddTrial
          testId={test.id}
          kind={view.kind}
          maxBytes={readingsMaxBytes()}
          items={view.items.map((i) => ({ slug: i.slug, name: i.name, ratedW: i.context.ratedW ?? null, ratedEnergyWh: i.context.ratedEnergyWh ?? null }))}
        />
      ) : null}
      {radioNoise ? null : <FieldTestResults view={view} />}
      <FieldTestEvents events={view.events} />
    </main>
  );
}
