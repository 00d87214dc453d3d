'use client';

import { useState, useTransition } from 'react';
import { approveGearAction, sendBackGearAction, submitGearAction, withdrawGearAction, type GearFormState } from '@/lib/gear/actions';
import { Button, Field, FormMessage } from '@/components/ui/form';

/** Submit / withdraw for the author; approve / send back for an editor on an item in review. */
export function ReviewActions({ slug, canSubmit, canWithdraw, canReview }: { slug: string; canSubmit: boolean; canWithdraw: boolean; canReview: boolean }) {
  const [state, setState] = useState<GearFormState>({});
  const [pending, startTransition] = useTransition();
  const [comment, setComment] = useState('');
  const act = (work: () => Promise<GearFormState>) => startTransition(async () => setState((await work()) ?? {}));
  if (!canSubmit && !canWithdraw && !canReview) return null;
  return (
    <section aria-label="Review" className="space-y-3 rounded-lg border border-rule bg-card/60 p-4">
      {canSubmit ? (
        <div className="flex flex-wrap items-center gap-3">
          <Button type="button" disabled={pending} onClick={() => act(() => submitGearAction(slug))}>
            Submit for review
          </Button>
          <span className="text-sm text-slate">An editor checks the figures; the item is locked until they act.</span>
        </div>
      ) : null}
      {canWithdraw ? (
        <Button type="button" variant="quiet" disabled={pending} onClick={() => act(() => withdrawGearAction(slug))}>
          Withdraw from review
        </Button>
      ) : null}
      {canReview ? (
        <div className="space-y-3">
          <Button type="button" disabled={pending} onClick={() => act(() => approveGearAction(slug))}>
            Approve
          </Button>
          <Field id="send-back-comment" label="Comment for the author" errors={state.fields?.comment}>
            <textarea
              id="send-back-comment"
              rows={3}
              value={comment}
              onChange={(e) => setComment(e.target.value)}
              className="block w-full rounded-md border border-rule bg-paper px-3 py-2"
            />
          </Field>
          <Button type="button" variant="danger" disabled={pending} onClick={() => act(() => sendBackGearAction(slug, { comment }))}>
            Send back with comment
          </Button>
        </div>
      ) : null}
      <FormMessage message={state.message} tone={state.ok ? 'ok' : 'danger'} />
    </section>
  );
}
