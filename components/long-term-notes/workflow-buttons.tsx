'use client';

import { useRouter } from 'next/navigation';
import { useId, useState } from 'react';
import { Button, FormMessage } from '@/components/ui/form';
import { sendJson } from '@/components/field-tests/api';
import type { WorkflowAction } from '@/lib/workflow/transitions';

const LABELS: Partial<Record<WorkflowAction, string>> = {
  submit: 'Submit for review',
  withdraw: 'Withdraw from review',
  approve: 'Approve and publish',
  'request-changes': 'Send back to the author',
};

/** The workflow moves this viewer may take on a long-term note now (the server decides again). */
export function NoteWorkflowButtons({ id, actions, title }: { id: string; actions: WorkflowAction[]; title: string }) {
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
    const r = await sendJson('POST', `/api/v1/long-term-notes/${encodeURIComponent(id)}/transitions`, { action, comment });
    setBusy(false);
    if (!r.ok) {
      setError(r.error.fields?.comment?.join(' ') ?? r.error.message);
      return;
    }
    setComment('');
    router.refresh();
  };

  return (
    <div className="space-y-3" role="group" aria-label={`Review of “${title}”`} data-testid="long-term-note-actions">
      {shown.includes('request-changes') ? (
        <div className="space-y-1">
          <label htmlFor={`${uid}-comment`} className="block text-sm font-semibold">
            Comment for the author (needed to send it back)
          </label>
          <textarea id={`${uid}-comment`} value={comment} onChange={(e) => setComment(e.target.value)} rows={2} className="block w-full rounded-md border border-rule bg-paper px-3 py-2 text-sm" />
        </div>
      ) : null}
      <div className="flex flex-wrap gap-2">
        {shown.map((a) => (
          <Button key={a} type="button" disabled={busy} variant={a === 'request-changes' || a === 'withdraw' ? 'quiet' : 'primary'} onClick={() => void run(a)} data-action={a}>
            {LABELS[a]}
          </Button>
        ))}
      </div>
      <FormMessage message={error} />
    </div>
  );
}
