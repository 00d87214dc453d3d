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
  const [sendingBack, setSendingBack] = useState(false);
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
    setSendingBack(false);
    router.refresh();
  };

  const moves = shown.filter((a) => a !== 'request-changes');
  return (
    <div className="space-y-3" role="group" aria-label={`Review of “${title}”`} data-testid="long-term-note-actions">
      <div className="flex flex-wrap gap-2">
        {shown.includes('request-changes') ? (
          <Button type="button" variant="quiet" disabled={busy} aria-expanded={sendingBack} aria-controls={`${uid}-send-back`} onClick={() => setSendingBack(!sendingBack)}>
            Send back…
          </Button>
        ) : null}
        {moves.map((a) => (
          <Button key={a} type="button" disabled={busy} variant={a === 'withdraw' ? 'quiet' : 'primary'} onClick={() => void run(a)} data-action={a}>
            {LABELS[a]}
          </Button>
        ))}
      </div>
      {sendingBack ? (
        <form
          id={`${uid}-send-back`}
          className="space-y-2"
          onSubmit={(e) => {
            e.preventDefault();
            void run('request-changes');
          }}
        >
          <label htmlFor={`${uid}-comment`} className="block text-sm font-semibold">
            What should the author change? (they see this with the note)
          </label>
          <textarea id={`${uid}-comment`} value={comment} onChange={(e) => setComment(e.target.value)} rows={3} className="block w-full rounded-md border border-rule bg-paper px-3 py-2 text-sm" />
          <Button type="submit" disabled={busy} data-action="request-changes">
            {LABELS['request-changes']}
          </Button>
        </form>
      ) : null}
      <FormMessage message={error} />
    </div>
  );
}
