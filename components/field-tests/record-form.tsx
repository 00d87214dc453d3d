'use client';

import { zodResolver } from '@hookform/resolvers/zod';
import { useRouter } from 'next/navigation';
import { useState } from 'react';
import { useFieldArray, useForm, useWatch, type Resolver } from 'react-hook-form';
import { Button, Field, FormMessage, TextInput } from '@/components/ui/form';
import { FIELD_TEST_KINDS, KINDS, SKIES, SKY_LABELS } from '@/lib/field-tests/kinds';
import { fieldTestInputSchema, type FieldTestInput } from '@/lib/field-tests/schemas';
import { sendJson } from './api';

export interface ItemOption {
  slug: string;
  name: string;
  maker: string;
  category: string;
  own: boolean;
}

export type RecordFormValues = FieldTestInput;

const resolver = zodResolver(fieldTestInputSchema) as unknown as Resolver<RecordFormValues>;
const selectClass = 'block w-full rounded-md border border-rule bg-paper px-3 py-2 text-ink';

/** The field test record (everything but trials): create a draft, or update the author's draft. */
export function FieldTestRecordForm({ mode, id, defaults, items }: { mode: 'create' | 'edit'; id?: string; defaults: RecordFormValues; items: ItemOption[] }) {
  const router = useRouter();
  const [message, setMessage] = useState<{ text: string; tone: 'ok' | 'danger' } | undefined>();
  const form = useForm<RecordFormValues>({ resolver, defaultValues: defaults, mode: 'onSubmit' });
  const { register, handleSubmit, formState, setError, control } = form;
  const instruments = useFieldArray({ control, name: 'instruments' });
  const kind = useWatch({ control, name: 'kind' });
  const err = (name: string) => {
    const e = name.split('.').reduce<unknown>((o, k) => (o as Record<string, unknown> | undefined)?.[k], formState.errors) as { message?: string } | undefined;
    return e?.message ? [e.message] : undefined;
  };

  const onSubmit = handleSubmit(async (values) => {
    setMessage(undefined);
    const r = mode === 'create' ? await sendJson('POST', '/api/v1/field-tests', values) : await sendJson('PATCH', `/api/v1/field-tests/${encodeURIComponent(id!)}`, values);
    if (!r.ok) {
      for (const [path, msgs] of Object.entries(r.error.fields ?? {})) setError(path as keyof RecordFormValues, { message: msgs.join(' ') });
      setMessage({ text: r.error.message, tone: 'danger' });
      return;
    }
    if (mode === 'create') {
      const created = (r.data as { fieldTest: { id: string } }).fieldTest;
      router.push(`/logbook/field-tests/${encodeURIComponent(created.id)}`);
    } else {
      setMessage({ text: 'Saved.', tone: 'ok' });
      router.refresh();
    }
  });

  return (
    <form onSubmit={onSubmit} noValidate className="space-y-5" aria-label="Field test record">
      <Field id="ft-kind" label="Kind of test" hint={KINDS[kind]?.description} errors={err('kind')}>
        <select id="ft-kind" className={selectClass} {...register('kind')}>
          {FIELD_TEST_KINDS.map((k) => (
            <option key={k} value={k}>{KINDS[k].label}</option>
          ))}
        </select>
      </Field>
      <Field id="ft-tested-at" label="Date and time (as on the test’s clock, stored as UTC)" errors={err('testedAt')}>
        <TextInput id="ft-tested-at" type="datetime-local" className="font-mono" invalid={!!err('testedAt')} {...register('testedAt')} />
      </Field>
      <Field id="ft-place" label="Place" hint="A place name such as “Upper Meadow camp” — never GPS coordinates." errors={err('placeLabel')}>
        <TextInput id="ft-place" invalid={!!err('placeLabel')} {...register('placeLabel')} />
      </Field>
      <div className="grid grid-cols-1 gap-4 sm:grid-cols-2">
        <Field id="ft-sky" label="Sky" errors={err('sky')}>
          <select id="ft-sky" className={selectClass} {...register('sky')}>
            {SKIES.map((s) => (
              <option key={s} value={s}>{SKY_LABELS[s]}</option>
            ))}
          </select>
        </Field>
        <Field id="ft-ambient" label="Ambient temperature (°C)" hint="Empty if not read." errors={err('ambientC')}>
          <TextInput id="ft-ambient" inputMode="decimal" className="font-mono" invalid={!!err('ambientC')} {...register('ambientC', { setValueAs: (v: unknown) => (v === '' || v === null || v === undefined ? null : Number(String(v).replace(',', '.'))) })} />
        </Field>
      </div>

      <fieldset className="space-y-2">
        <legend className="text-sm font-semibold">Instruments, with their stated accuracy</legend>
        {instruments.fields.map((f, i) => (
          <div key={f.id} className="grid grid-cols-1 gap-2 sm:grid-cols-[1fr_1fr_auto]">
            <TextInput aria-label={`Instrument ${i + 1}`} placeholder="e.g. logging lux meter" invalid={!!err(`instruments.${i}.name`)} {...register(`instruments.${i}.name` as const)} />
            <TextInput aria-label={`Instrument ${i + 1} accuracy`} placeholder="e.g. ±4 % of reading" {...register(`instruments.${i}.accuracy` as const)} />
            <Button type="button" variant="quiet" onClick={() => instruments.remove(i)}>Remove</Button>
            {err(`instruments.${i}.name`) ? <p className="text-sm text-danger sm:col-span-3">{err(`instruments.${i}.name`)}</p> : null}
          </div>
        ))}
        <Button type="button" variant="quiet" onClick={() => instruments.append({ name: '', accuracy: '' })}>Add an instrument</Button>
      </fieldset>

      <Field id="ft-method" label="Method notes" hint={kind === 'radio-noise' ? 'Name the quiet reference supply the baseline was read on (e.g. a lead-acid battery, no charger), the receiver and how the item was placed.' : undefined} errors={err('methodNotes')}>
        <textarea id="ft-method" rows={5} className="block w-full rounded-md border border-rule bg-paper px-3 py-2 text-sm" {...register('methodNotes')} />
      </Field>

      <fieldset className="space-y-1">
        <legend className="text-sm font-semibold">Gear items in this test</legend>
        <div className="max-h-64 space-y-1 overflow-auto rounded-md border border-rule p-2">
          {items.map((i) => (
            <label key={i.slug} className="flex items-center gap-2 text-sm">
              <input type="checkbox" value={i.slug} {...register('items')} />
              <span>{i.name}</span>
              <span className="text-xs text-slate">{i.maker}{i.own ? ' · yours' : ''}</span>
            </label>
          ))}
        </div>
        {err('items') ? <p className="text-sm text-danger" data-testid="ft-items-error">{err('items')}</p> : null}
      </fieldset>

      <FormMessage message={message?.text} tone={message?.tone} />
      <Button type="submit" disabled={formState.isSubmitting}>{mode === 'create' ? 'Create the draft' : 'Save the record'}</Button>
    </form>
  );
}
