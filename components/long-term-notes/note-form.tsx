'use client';

import { zodResolver } from '@hookform/resolvers/zod';
import { useRouter } from 'next/navigation';
import { useState } from 'react';
import { useForm, useWatch, type Resolver } from 'react-hook-form';
import { Button, Field, FormMessage, TextInput } from '@/components/ui/form';
import { sendJson } from '@/components/field-tests/api';
import { LONG_TERM_NOTE_KIND_INFO, LONG_TERM_NOTE_KINDS } from '@/lib/long-term-notes/kinds';
import { logbookNotePath } from '@/lib/long-term-notes/paths';
import { longTermNoteInputSchema, MAX_NOTE_BODY, type LongTermNoteInput } from '@/lib/long-term-notes/schemas';

const resolver = zodResolver(longTermNoteInputSchema) as unknown as Resolver<LongTermNoteInput>;
const selectClass = 'block w-full rounded-md border border-rule bg-paper px-3 py-2 text-ink';

/** Write a long-term note on an item (create a draft), or change the author's draft. Same schema as the API. */
export function LongTermNoteForm({ mode, slug, id, defaults }: { mode: 'create' | 'edit'; slug?: string; id?: string; defaults: LongTermNoteInput }) {
  const router = useRouter();
  const [message, setMessage] = useState<{ text: string; tone: 'ok' | 'danger' } | undefined>();
  const { register, handleSubmit, formState, setError, control } = useForm<LongTermNoteInput>({ resolver, defaultValues: defaults, mode: 'onSubmit' });
  const kind = useWatch({ control, name: 'kind' });
  const err = (name: keyof LongTermNoteInput) => {
    const m = formState.errors[name]?.message;
    return m ? [m] : undefined;
  };
  const describedBy = (fieldId: string, name: keyof LongTermNoteInput) => (err(name) ? `${fieldId}-error` : `${fieldId}-hint`);

  const onSubmit = handleSubmit(async (values) => {
    setMessage(undefined);
    const r = mode === 'create' ? await sendJson('POST', `/api/v1/gear/${encodeURIComponent(slug!)}/notes`, values) : await sendJson('PATCH', `/api/v1/long-term-notes/${encodeURIComponent(id!)}`, values);
    if (!r.ok) {
      for (const [path, msgs] of Object.entries(r.error.fields ?? {})) setError(path as keyof LongTermNoteInput, { message: msgs.join(' ') });
      setMessage({ text: r.error.message, tone: 'danger' });
      return;
    }
    if (mode === 'create') {
      router.push(logbookNotePath((r.data as { note: { id: string } }).note.id));
    } else {
      setMessage({ text: 'Saved.', tone: 'ok' });
      router.refresh();
    }
  });

  return (
    <form onSubmit={onSubmit} noValidate className="space-y-5" aria-label="Long-term note">
      <div className="grid grid-cols-1 gap-4 sm:grid-cols-2">
        <Field id="ltn-noted-on" label="Date of the note" hint="The day it happened or you checked, e.g. 2026-11-20." errors={err('notedOn')}>
          <TextInput id="ltn-noted-on" type="date" className="font-mono" invalid={!!err('notedOn')} aria-describedby={describedBy('ltn-noted-on', 'notedOn')} {...register('notedOn')} />
        </Field>
        <Field id="ltn-months" label="Months in service" hint="Whole months since it went into use (0 for under a month)." errors={err('monthsInService')}>
          <TextInput
            id="ltn-months"
            type="number"
            min={0}
            step={1}
            inputMode="numeric"
            className="font-mono"
            invalid={!!err('monthsInService')}
            aria-describedby={describedBy('ltn-months', 'monthsInService')}
            {...register('monthsInService', { setValueAs: (v: unknown) => (v === '' || v === null || v === undefined ? undefined : Number(v)) })}
          />
        </Field>
      </div>
      <Field id="ltn-kind" label="What the note is about" hint={LONG_TERM_NOTE_KIND_INFO[kind]?.hint} errors={err('kind')}>
        <select id="ltn-kind" className={selectClass} aria-describedby={describedBy('ltn-kind', 'kind')} {...register('kind')}>
          {LONG_TERM_NOTE_KINDS.map((k) => (
            <option key={k} value={k}>
              {LONG_TERM_NOTE_KIND_INFO[k].label}
            </option>
          ))}
        </select>
      </Field>
      <Field id="ltn-title" label="Short title" hint="e.g. “Hanging hook cracked after frosty nights”." errors={err('title')}>
        <TextInput id="ltn-title" invalid={!!err('title')} maxLength={120} aria-describedby={describedBy('ltn-title', 'title')} {...register('title')} />
      </Field>
      <Field id="ltn-body" label="The note (Markdown)" hint={`What happened, how you use it, what you did about it. Markdown: **bold**, lists, links. At most ${MAX_NOTE_BODY} characters.`} errors={err('body')}>
        <textarea id="ltn-body" rows={8} aria-invalid={!!err('body') || undefined} aria-describedby={describedBy('ltn-body', 'body')} className="block w-full rounded-md border border-rule bg-paper px-3 py-2 text-sm" {...register('body')} />
      </Field>
      <FormMessage message={message?.text} tone={message?.tone} />
      <Button type="submit" disabled={formState.isSubmitting}>
        {mode === 'create' ? 'Save as draft' : 'Save the note'}
      </Button>
    </form>
  );
}
