'use client';

import { useState, useTransition } from 'react';
import { Button, FormMessage } from '@/components/ui/form';
import { approveReviewAction, publishReviewAction, requestChangesAction, retractReviewAction, type ReviewFormState } from '@/lib/reviews/actions';
import { requestChangesSchema, retractSchema } from '@/lib/reviews/schemas';
import type { WorkflowAction } from '@/lib/workflow/transitions';

const areaClass = 'block w-full rounded-md border border-rule bg-paper px-3 py-2 text-ink';

/** The editor's buttons on the desk read view; each opens its own small form where a comment is needed. */
export function DeskActions({ reviewId, actions, hasDisclosure }: { reviewId: string; actions: WorkflowAction[]; hasDisclosure: boolean }) {
  const [pending, startTransition] = useTransition();
  const [result, setResult] = useState<ReviewFormState | null>(null);
  const [comment, setComment] = useState('');
  const [note, setNote] = useState('');
  const [open, setOpen] = useState<'request-changes' | 'retract' | null>(null);
  const [localError, setLocalError] = useState<string | undefined>();

  const run = (fn: () => Promise<ReviewFormState>) =>
    startTransition(async () => {
      setResult(null);
      const r = await fn();
      if (r && !r.ok) setResult(r);
    });

  const fieldError = (key: string) => result?.fields?.[key]?.join(' ');

  return (
    <div className="space-y-4" data-testid="desk-actions">
      <FormMessage message={localError ?? result?.message} />
      <div className="flex flex-wrap gap-2">
        {actions.includes('approve') ? (
          <Button type="button" onClick={() => run(() => approveReviewAction(reviewId))} disabled={pending} data-testid="approve">
            Approve
          </Button>
        ) : null}
        {actions.includes('publish') ? (
          <Button type="button" onClick={() => run(() => publishReviewAction(reviewId))} disabled={pending || !hasDisclosure} data-testid="publish" title={hasDisclosure ? undefined : 'No disclosure: request changes first'}>
            Publish
          </Button>
        ) : null}
        {actions.includes('request-changes') ? (
          <Button type="button" variant="quiet" onClick={() => setOpen(open === 'request-changes' ? null : 'request-changes')} aria-expanded={open === 'request-changes'} data-testid="open-request-changes">
            Request changes…
          </Button>
        ) : null}
        {actions.includes('retract') ? (
          <Button type="button" variant="danger" onClick={() => setOpen(open === 'retract' ? null : 'retract')} aria-expanded={open === 'retract'} data-testid="open-retract">
            Retract…
          </Button>
        ) : null}
      </div>
      {actions.length === 0 ? <p className="text-sm text-slate">Nothing for you to do here now.</p> : null}
      {open === 'request-changes' ? (
        <form
          className="space-y-2"
          onSubmit={(e) => {
            e.preventDefault();
            const parsed = requestChangesSchema.safeParse({ comment });
            if (!parsed.success) return setLocalError(parsed.error.issues[0]?.message);
            setLocalError(undefined);
            run(() => requestChangesAction(reviewId, parsed.data));
          }}
        >
          <label htmlFor="desk-comment" className="block text-sm font-semibold">
            What should the author change?
          </label>
          <textarea id="desk-comment" rows={4} value={comment} onChange={(e) => setComment(e.target.value)} className={areaClass} />
          {fieldError('comment') ? <p className="text-sm text-danger">{fieldError('comment')}</p> : null}
          <Button type="submit" disabled={pending} data-testid="send-request-changes">
            Send back to the author
          </Button>
        </form>
      ) : null}
      {open === 'retract' ? (
        <form
          className="space-y-2"
          onSubmit={(e) => {
            e.preventDefault();
            const parsed = retractSchema.safeParse({ note });
            if (!parsed.success) return setLocalError(parsed.error.issues[0]?.message);
            setLocalError(undefined);
            run(() => retractReviewAction(reviewId, parsed.data));
          }}
        >
          <label htmlFor="desk-note" className="block text-sm font-semibold">
            Public note (readers see it at the top of the review)
          </label>
          <textarea id="desk-note" rows={3} value={note} onChange={(e) => setNote(e.target.value)} className={areaClass} />
          {fieldError('note') ? <p className="text-sm text-danger">{fieldError('note')}</p> : null}
          <Button type="submit" variant="danger" disabled={pending} data-testid="send-retract">
            Retract the review
          </Button>
        </form>
      ) : null}
    </div>
  );
}
