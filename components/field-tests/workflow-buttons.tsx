'use client';

import { useRouter } from 'next/navigation';
import { useId, useState } from 'react';
import { Button, FormMessage } from '@/components/ui/form';
import type { WorkflowAction } from '@/lib/workflow/transitions';
import { sendJson } from './api';

const LABELS: Partial<Record<WorkflowAction, string>> = {
  submit: 'Submit for review',
  withdraw: 'Withdraw from review',
  approve: 'Approve and publish figures',
  'request-changes': 'Request changes',
};

/** The workflow actions this viewer may take now (lib/workflow decides again on the server). */
export function WorkflowButtons({ id, actions }: { id: string; actions: WorkflowAction[] }) {
  const router = useRouter();
  const uid = useId();
  const [comment, setComment] = useState('');
  const [busy, setBusy] = useState(false);
  const [error, setError] = useState<string | undefined>();
  const shown = actions.filter((a) => LABELS[a]);
  if (shown.length === 0) return null;

  const run = async (action: WorkflowAction) => {
    setBusy(true);
    setError(undefined);
    const r = await sendJson('POST', `/api/v1/field-tests/${encodeURIComponent(id)}/transitions`, { action, comment });
    setBusy(false);
    if (!r.ok) {
      setError(r.error.message);
      return;
    }
    setComment('');
    router.refresh();
  };

  return (
    <section aria-label="Review" className="space-y-3 rounded-lg border border-rule bg-card p-4">
      {shown.includes('request-changes') ? (
        <div className="space-y-1">
          <label htmlFor={`${uid}-comment`} className="block text-sm font-semibold">Comment for the author (needed to request changes)</label>
          <textarea id={`${uid}-comment`} value={comment} onChange={(e) => setComment(e.target.value)} rows={3} className="block w-full rounded-md border border-rule bg-paper px-3 py-2 text-sm" />
        </div>
      ) : null}
      <div className="flex flex-wrap gap-2">
        {shown.map((a) => (
          <Button key={a} type="button" disabled={busy} variant={a === 'request-changes' || a === 'withdraw' ? 'quiet' : 'primary'} onClick={() => void run(a)}>
            {LABELS[a]}
          </Button>
        ))}
      </div>
      <FormMessage message={error} />
    </section>
  );
}
