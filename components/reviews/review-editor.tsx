'use client';

import { zodResolver } from '@hookform/resolvers/zod';
import { useCallback, useEffect, useMemo, useRef, useState, useTransition } from 'react';
import { Controller, useForm, useWatch } from 'react-hook-form';
import type { PickableItem } from '@/db/reviews';
import { Button, Field, FormMessage, TextInput } from '@/components/ui/form';
import { saveReviewDraftAction, startCorrectionAction, submitReviewAction, withdrawReviewAction, type ReviewFormState } from '@/lib/reviews/actions';
import { DISCLOSURE_LABELS, DISCLOSURES, reviewDraftSchema, wordCount, type Disclosure, type ReviewDraftData, type ReviewDraftInput } from '@/lib/reviews/schemas';
import type { WorkflowAction, WorkflowState } from '@/lib/workflow/transitions';
import { formatDateTime } from '@/lib/reviews/dates';
import { ItemsPicker } from './items-picker';
import { MarkdownPreview } from './markdown-preview';

type SaveStatus = { kind: 'saved'; at: string | null } | { kind: 'dirty' } | { kind: 'saving' } | { kind: 'error'; message: string };

const AUTOSAVE_MS = 1200;

const LOCK_REASON: Partial<Record<WorkflowState, string>> = {
  'in-review': 'Submitted: the draft is locked while it is with the editors. Withdraw it to keep editing (only before an editor acts).',
  approved: 'Approved: locked until an editor publishes it or asks for changes.',
  published: 'Published text never changes. Start a correction to write a new revision with a visible note.',
  retracted: 'Retracted. Start a correction to write a new revision.',
};

const areaClass = 'block w-full rounded-md border bg-paper px-3 py-2 text-ink placeholder:text-slate/70';

export function ReviewEditor({
  reviewId,
  initial,
  updatedAt,
  state,
  editable,
  actions,
  isCorrection,
  items,
}: {
  reviewId: string;
  initial: ReviewDraftInput;
  updatedAt: string;
  state: WorkflowState;
  editable: boolean;
  actions: WorkflowAction[];
  isCorrection: boolean;
  items: PickableItem[];
}) {
  const form = useForm<ReviewDraftInput, unknown, ReviewDraftData>({ resolver: zodResolver(reviewDraftSchema), defaultValues: initial, mode: 'onChange' });
  const { register, control, formState, setError, clearErrors } = form;
  const values = useWatch({ control }) as ReviewDraftInput;
  const [status, setStatus] = useState<SaveStatus>({ kind: 'saved', at: updatedAt });
  const [message, setMessage] = useState<ReviewFormState | null>(null);
  const [pending, startTransition] = useTransition();
  const lastSaved = useRef(JSON.stringify(initial));
  const inFlight = useRef<Promise<boolean> | null>(null);

  const applyFieldErrors = useCallback(
    (fields?: Record<string, string[]>) => {
      for (const [name, messages] of Object.entries(fields ?? {})) {
        if (name in initial) setError(name as keyof ReviewDraftInput, { type: 'server', message: messages.join(' ') });
      }
    },
    [initial, setError],
  );

  /** Saves the current values if they changed; true when the server has them. */
  const save = useCallback(async (): Promise<boolean> => {
    if (!editable) return true;
    const current = form.getValues();
    const snapshot = JSON.stringify(current);
    if (snapshot === lastSaved.current) return true;
    const parsed = reviewDraftSchema.safeParse(current);
    if (!parsed.success) {
      setStatus({ kind: 'error', message: 'Not saved: fix the marked fields.' });
      void form.trigger();
      return false;
    }
    setStatus({ kind: 'saving' });
    const run = (async () => {
      try {
        const result = await saveReviewDraftAction(reviewId, parsed.data);
        if (result.ok) {
          lastSaved.current = snapshot;
          clearErrors();
          setStatus(JSON.stringify(form.getValues()) === snapshot ? { kind: 'saved', at: result.savedAt ?? null } : { kind: 'dirty' });
          return true;
        }
        applyFieldErrors(result.fields);
        setStatus({ kind: 'error', message: result.message ?? 'Not saved.' });
        return false;
      } catch {
        setStatus({ kind: 'error', message: 'Not saved: the connection failed. Your text is still here; it will be saved on the next change.' });
        return false;
      }
    })();
    inFlight.current = run;
    return run;
  }, [editable, form, reviewId, clearErrors, applyFieldErrors]);

  // Autosave: a short pause after the last change.
  const serialized = JSON.stringify(values);
  useEffect(() => {
    if (!editable || serialized === lastSaved.current) return;
    setStatus((s) => (s.kind === 'saving' ? s : { kind: 'dirty' }));
    const timer = window.setTimeout(() => void (inFlight.current ?? Promise.resolve()).then(save), AUTOSAVE_MS);
    return () => window.clearTimeout(timer);
  }, [serialized, editable, save]);

  // Warn before leaving with unsaved text (the browser's own prompt, only when something is unsaved).
  useEffect(() => {
    const onLeave = (e: BeforeUnloadEvent) => {
      if (editable && JSON.stringify(form.getValues()) !== lastSaved.current) e.preventDefault();
    };
    window.addEventListener('beforeunload', onLeave);
    return () => window.removeEventListener('beforeunload', onLeave);
  }, [editable, form]);

  const act = (action: (id: string) => Promise<ReviewFormState>, saveFirst: boolean) =>
    startTransition(async () => {
      setMessage(null);
      if (saveFirst && !(await save())) {
        setMessage({ message: 'Fix the marked fields first: the draft could not be saved.' });
        return;
      }
      const result = await action(reviewId);
      if (result && !result.ok) {
        applyFieldErrors(result.fields);
        setMessage(result);
      }
    });

  const itemNames = useMemo(() => Object.fromEntries(items.map((i) => [i.slug, `${i.maker} ${i.name}`])), [items]);
  const words = wordCount(values.body ?? '');
  const errors = formState.errors;
  const err = (name: keyof ReviewDraftInput) => {
    const m = errors[name]?.message;
    return m ? [String(m)] : undefined;
  };
  const disclosure = values.disclosure ?? null;

  return (
    <div className="space-y-6">
      <div className="sticky top-0 z-10 -mx-4 flex flex-wrap items-center gap-3 border-b border-rule bg-paper/95 px-4 py-2 backdrop-blur sm:-mx-6 sm:px-6">
        <SaveIndicator status={status} editable={editable} />
        <span className="font-mono text-xs text-slate" data-testid="word-count">
          {words.toLocaleString('en-US')} {words === 1 ? 'word' : 'words'}
        </span>
        <div className="ml-auto flex flex-wrap gap-2">
          {actions.includes('submit') ? (
            <Button type="button" onClick={() => act(submitReviewAction, true)} disabled={pending || status.kind === 'saving'} data-testid="submit-review">
              {state === 'changes-requested' ? 'Resubmit for review' : 'Submit for review'}
            </Button>
          ) : null}
          {actions.includes('withdraw') ? (
            <Button type="button" variant="quiet" onClick={() => act(withdrawReviewAction, false)} disabled={pending} data-testid="withdraw-review">
              Withdraw to edit
            </Button>
          ) : null}
          {actions.includes('start-correction') ? (
            <Button type="button" variant="quiet" onClick={() => act(startCorrectionAction, false)} disabled={pending} data-testid="start-correction">
              Start a correction
            </Button>
          ) : null}
        </div>
      </div>
      {!editable && LOCK_REASON[state] ? (
        <p role="status" className="rounded-md border border-rule bg-card px-4 py-3 text-sm" data-testid="lock-reason">
          {LOCK_REASON[state]}
        </p>
      ) : null}
      <FormMessage message={message?.message} />

      <form onSubmit={(e) => e.preventDefault()} noValidate className="grid gap-8 lg:grid-cols-2">
        <fieldset disabled={!editable} className="min-w-0 space-y-5">
          <legend className="sr-only">Review text</legend>
          <Field id="title" label="Title" errors={err('title')}>
            <TextInput id="title" {...register('title')} invalid={!!errors.title} />
          </Field>
          <Field id="summary" label="Summary" hint="One or two sentences: what was measured and what came out." errors={err('summary')}>
            <textarea id="summary" rows={2} {...register('summary')} className={`${areaClass} ${errors.summary ? 'border-danger' : 'border-rule'}`} />
          </Field>
          <Field id="verdict" label="Verdict" hint="Who should buy it, and for what." errors={err('verdict')}>
            <textarea id="verdict" rows={2} {...register('verdict')} className={`${areaClass} ${errors.verdict ? 'border-danger' : 'border-rule'}`} />
          </Field>
          <Field id="body" label="Review (Markdown)" errors={err('body')}>
            <textarea id="body" rows={18} {...register('body')} className={`${areaClass} font-mono text-sm leading-relaxed ${errors.body ? 'border-danger' : 'border-rule'}`} spellCheck />
          </Field>
          <details className="rounded-md border border-rule bg-card px-4 py-2 text-sm" open={!values.body}>
            <summary className="cursor-pointer font-semibold">Markdown and the spec table</summary>
            <div className="mt-2 space-y-2 leading-relaxed">
              <p>
                Headings <code>## Results</code>, lists, tables, <code>**bold**</code> and links work. Raw HTML, scripts and images from other sites are removed; images must be your own
                uploads.
              </p>
              <p>
                To show a spec table of one or several items, put this on a line of its own (not in a list or quote), with item slugs from the list below, at most 12:
              </p>
              <pre className="font-mono text-xs">::spec-table[{items.find((i) => values.itemIds?.includes(i.id))?.slug ?? 'item-slug'}, another-item-slug]</pre>
              <p>
                A quote that starts with <code>**Caution**</code> becomes a safety caution block.
              </p>
            </div>
          </details>
          <Field id="disclosure" label="How did you get the gear?" hint="Shown to readers at the top of the review. Required before an editor can publish." errors={err('disclosure')}>
            <select
              id="disclosure"
              {...register('disclosure', { setValueAs: (v: string | null) => (v === '' || v === null ? null : v) })}
              className={`block w-full rounded-md border bg-paper px-3 py-2 ${errors.disclosure ? 'border-danger' : 'border-rule'}`}
            >
              <option value="">Choose…</option>
              {DISCLOSURES.map((d) => (
                <option key={d} value={d}>
                  {DISCLOSURE_LABELS[d]}
                </option>
              ))}
            </select>
          </Field>
          <Field
            id="disclosureNote"
            label="Disclosure note"
            hint={disclosure && disclosure !== 'bought-retail' ? 'Name the maker and any other material connection, in plain words.' : 'Optional: e.g. "Bought by the school at full price."'}
            errors={err('disclosureNote')}
          >
            <textarea id="disclosureNote" rows={2} {...register('disclosureNote')} className={`${areaClass} ${errors.disclosureNote ? 'border-danger' : 'border-rule'}`} />
          </Field>
          {isCorrection ? (
            <Field id="correctionNote" label="Correction note" hint={'Readers see "Corrected on <date>: <note>" at the top. Say what changed and why.'} errors={err('correctionNote')}>
              <textarea id="correctionNote" rows={2} {...register('correctionNote')} className={`${areaClass} ${errors.correctionNote ? 'border-danger' : 'border-rule'}`} />
            </Field>
          ) : null}
          <div className="space-y-1">
            <p className="text-sm font-semibold" id="items-label">
              Gear items covered
            </p>
            <Controller
              control={control}
              name="itemIds"
              render={({ field }) => <ItemsPicker items={items} value={field.value ?? []} onChange={field.onChange} disabled={!editable} invalid={!!errors.itemIds} />}
            />
            {errors.itemIds ? <p className="text-sm text-danger">{String(errors.itemIds.message ?? 'Pick at least one gear item.')}</p> : null}
          </div>
        </fieldset>
        <section aria-label="Preview" className="min-w-0 lg:sticky lg:top-14 lg:max-h-[calc(100vh-4rem)] lg:overflow-y-auto">
          <p className="font-mono text-xs uppercase tracking-wide text-slate">Preview — rendered as readers will see it</p>
          <div className="mt-2 rounded-md border border-rule bg-paper p-5">
            <h2 className="text-2xl font-bold leading-tight">{values.title || 'Untitled'}</h2>
            {disclosure ? (
              <p className="mt-3 rounded bg-card px-3 py-2 text-sm">
                <strong>How we got this gear:</strong> {DISCLOSURE_LABELS[disclosure as Disclosure]}.{values.disclosureNote ? ` ${values.disclosureNote}` : ''}
              </p>
            ) : null}
            {values.summary ? <p className="mt-3 text-lg">{values.summary}</p> : null}
            {values.verdict ? (
              <p className="mt-3 rounded bg-lichen-tint px-3 py-2">
                <strong>Verdict:</strong> {values.verdict}
              </p>
            ) : null}
            <div className="mt-4">
              <MarkdownPreview source={values.body ?? ''} itemNames={itemNames} />
            </div>
          </div>
        </section>
      </form>
    </div>
  );
}

function SaveIndicator({ status, editable }: { status: SaveStatus; editable: boolean }) {
  if (!editable) return <span className="text-sm text-slate">Read only</span>;
  const text =
    status.kind === 'saving'
      ? 'Saving…'
      : status.kind === 'dirty'
        ? 'Unsaved changes'
        : status.kind === 'error'
          ? status.message
          : status.at
            ? `Saved ${savedWhen(new Date(status.at))}`
            : 'Saved';
  return (
    <span role="status" aria-live="polite" data-testid="save-status" data-state={status.kind} className={`text-sm ${status.kind === 'error' ? 'text-danger' : 'text-slate'}`}>
      {text}
    </span>
  );
}

/** UTC, so the server-rendered and hydrated text agree. */
function savedWhen(at: Date): string {
  const sameDay = at.toISOString().slice(0, 10) === new Date().toISOString().slice(0, 10);
  return sameDay ? `${at.toISOString().slice(11, 19)} UTC` : formatDateTime(at);
}
