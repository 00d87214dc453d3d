'use client';

import { zodResolver } from '@hookform/resolvers/zod';
import { useRouter } from 'next/navigation';
import { useState } from 'react';
import { useFieldArray, useForm, useWatch, type Control, type Resolver, type UseFormRegister } from 'react-hook-form';
import { Button, FormMessage, TextInput } from '@/components/ui/form';
import {
  bandFigures,
  formatDb,
  RADIO_MODE_LABELS,
  RADIO_MODES,
  radioNoiseBandSchema,
  radioNoiseReadingsInputSchema,
  RANGE_BOUNDARY_MHZ,
  type RadioNoiseReadingsFormValues,
  type RadioNoiseReadingsInput,
} from '@/lib/field-tests/radio-noise';
import { radioQuietVerdict, RADIO_QUIET_WORDING } from '@/lib/measure';
import { sendJson } from './api';

type FormValues = RadioNoiseReadingsFormValues;
type BandValues = FormValues['readings'][number];

const resolver = zodResolver(radioNoiseReadingsInputSchema) as unknown as Resolver<FormValues, unknown, RadioNoiseReadingsInput>;
const selectClass = 'block w-full rounded-md border border-rule bg-paper px-3 py-2 text-ink';
/** Empty text → undefined (the schema then says "Give the … as a number"), else a number ("7,1" read as 7.1). */
const asNumber = { setValueAs: (v: unknown) => (v === '' || v === null || v === undefined ? undefined : Number(String(v).replace(',', '.'))) };

export const emptyBand = (item: string): BandValues => ({
  item,
  band: '',
  frequencyMHz: undefined as unknown as number,
  mode: 'ssb',
  bandwidthHz: undefined as unknown as number,
  antenna: '',
  distanceM: undefined as unknown as number,
  baseline: { scale: 's-meter', sUnits: undefined as unknown as number, dbOverS9: 0 },
  withItem: { scale: 's-meter', sUnits: undefined as unknown as number, dbOverS9: 0 },
});

function errorAt(errors: unknown, path: string): string | undefined {
  const e = path.split('.').reduce<unknown>((o, k) => (o as Record<string, unknown> | undefined)?.[k], errors) as { message?: string } | undefined;
  return e?.message;
}

/** One labelled input with its error in words, tied to it by aria-describedby. */
function LabelledInput({ id, label, error, hint, ...input }: { id: string; label: string; error?: string; hint?: string } & React.ComponentProps<typeof TextInput>) {
  return (
    <div className="space-y-1">
      <label htmlFor={id} className="block text-xs font-semibold">{label}</label>
      <TextInput id={id} inputMode="decimal" className="font-mono" invalid={!!error} aria-describedby={error ? `${id}-error` : hint ? `${id}-hint` : undefined} {...input} />
      {error ? <p id={`${id}-error`} className="text-xs text-danger">{error}</p> : hint ? <p id={`${id}-hint`} className="text-xs text-slate">{hint}</p> : null}
    </div>
  );
}

/** A noise-floor reading: S-meter (S-units, and dB over S9 at S9) or a level in dBm. */
function ReadingFields({ index, which, title, control, register, errors }: { index: number; which: 'baseline' | 'withItem'; title: string; control: Control<FormValues>; register: UseFormRegister<FormValues>; errors: unknown }) {
  const scale = useWatch({ control, name: `readings.${index}.${which}.scale` });
  const base = `readings.${index}.${which}` as const;
  const id = `rn-${index}-${which}`;
  return (
    <fieldset className="space-y-2 rounded-md border border-rule p-3">
      <legend className="px-1 text-sm font-semibold">{title}</legend>
      <div className="flex flex-wrap gap-4 text-sm">
        <label className="flex items-center gap-2"><input type="radio" value="s-meter" {...register(`${base}.scale`)} /> S-meter</label>
        <label className="flex items-center gap-2"><input type="radio" value="dbm" {...register(`${base}.scale`)} /> dBm</label>
      </div>
      {scale === 'dbm' ? (
        <LabelledInput id={`${id}-dbm`} label="Level (dBm)" placeholder="e.g. −118" error={errorAt(errors, `${base}.dbm`)} {...register(`${base}.dbm` as `readings.${number}.baseline.scale`, asNumber)} />
      ) : (
        <div className="grid grid-cols-2 gap-2">
          <LabelledInput id={`${id}-s`} label="S-units (0–9)" placeholder="e.g. 5" error={errorAt(errors, `${base}.sUnits`)} {...register(`${base}.sUnits` as `readings.${number}.baseline.scale`, asNumber)} />
          <LabelledInput id={`${id}-over`} label="dB over S9" hint="Only at S9; else 0." placeholder="0" error={errorAt(errors, `${base}.dbOverS9`)} {...register(`${base}.dbOverS9` as `readings.${number}.baseline.scale`, asNumber)} />
        </div>
      )}
      {errorAt(errors, base) ? <p className="text-xs text-danger">{errorAt(errors, base)}</p> : null}
    </fieldset>
  );
}

/** Live dBm and rise of a band as the reviewer types (the server works it out again on saving). */
function BandEcho({ index, control }: { index: number; control: Control<FormValues> }) {
  const values = useWatch({ control, name: `readings.${index}` });
  const parsed = radioNoiseBandSchema.safeParse(values);
  if (!parsed.success) return <p className="text-xs text-slate">The rise shows here once both readings and the frequency are filled in.</p>;
  const f = bandFigures(parsed.data);
  const verdict = radioQuietVerdict(f.riseDb);
  return (
    <p className="figure text-sm" data-testid="rn-echo">
      {formatDb(f.baselineDbm)} dBm → {formatDb(f.withItemDbm)} dBm: rise <strong>{formatDb(f.riseDb)} dB</strong> — {verdict}, {RADIO_QUIET_WORDING[verdict]}.
    </p>
  );
}

/**
 * The band readings of a radio-noise check (the author's draft): one group per band with its frequency,
 * mode, bandwidth, antenna and distance, and the two noise-floor readings. Saving replaces every band.
 */
export function RadioNoiseEditor({ testId, items, defaults }: { testId: string; items: { slug: string; name: string }[]; defaults: BandValues[] }) {
  const router = useRouter();
  const [message, setMessage] = useState<{ text: string; tone: 'ok' | 'danger' } | undefined>();
  const form = useForm<FormValues, unknown, RadioNoiseReadingsInput>({
    resolver,
    defaultValues: { readings: defaults.length ? defaults : [emptyBand(items[0]?.slug ?? '')] },
    mode: 'onSubmit',
  });
  const { register, handleSubmit, formState, setError, control } = form;
  const bands = useFieldArray({ control, name: 'readings' });
  const errors = formState.errors;

  const onSubmit = handleSubmit(async (values) => {
    setMessage(undefined);
    const r = await sendJson('PUT', `/api/v1/field-tests/${encodeURIComponent(testId)}/radio-noise`, values);
    if (!r.ok) {
      for (const [path, msgs] of Object.entries(r.error.fields ?? {})) setError(path as 'readings', { message: msgs.join(' ') });
      setMessage({ text: r.error.message, tone: 'danger' });
      return;
    }
    setMessage({ text: `Saved ${values.readings.length} band reading${values.readings.length === 1 ? '' : 's'}.`, tone: 'ok' });
    router.refresh();
  });

  return (
    <form onSubmit={onSubmit} noValidate className="space-y-5" aria-label="Radio-noise band readings" data-testid="rn-editor">
      <div className="space-y-2 text-sm">
        <p>
          For each band, tune the receiver to a quiet spot, read its noise floor with the radio on a quiet reference supply (the <strong>baseline</strong>),
          then with the item under test powering it or running at the distance you give. Read either the S-meter or a level in dBm.
        </p>
        <p className="text-slate">
          Describe the reference supply (for example a lead-acid battery with no charger attached), the receiver and its antenna set-up in the test’s
          method notes above. Frequencies of {RANGE_BOUNDARY_MHZ} MHz and below use the HF S-meter scale (S9 = −73 dBm), higher ones the VHF scale (S9 = −93 dBm).
        </p>
      </div>
      {bands.fields.map((f, i) => {
        const p = `readings.${i}` as const;
        return (
          <fieldset key={f.id} className="space-y-3 rounded-lg border border-rule p-4" data-testid="rn-band">
            <legend className="px-1 font-semibold">Band {i + 1}</legend>
            <div className="grid grid-cols-1 gap-3 sm:grid-cols-3">
              {items.length > 1 ? (
                <div className="space-y-1 sm:col-span-3">
                  <label htmlFor={`rn-${i}-item`} className="block text-xs font-semibold">Item under test</label>
                  <select id={`rn-${i}-item`} className={selectClass} {...register(`${p}.item`)}>
                    {items.map((it) => <option key={it.slug} value={it.slug}>{it.name}</option>)}
                  </select>
                </div>
              ) : null}
              <LabelledInput id={`rn-${i}-band`} label="Band" inputMode="text" placeholder="e.g. 40 m" className="" error={errorAt(errors, `${p}.band`)} {...register(`${p}.band`)} />
              <LabelledInput id={`rn-${i}-freq`} label="Frequency (MHz)" placeholder="e.g. 7.1" error={errorAt(errors, `${p}.frequencyMHz`)} {...register(`${p}.frequencyMHz`, asNumber)} />
              <div className="space-y-1">
                <label htmlFor={`rn-${i}-mode`} className="block text-xs font-semibold">Mode</label>
                <select id={`rn-${i}-mode`} className={selectClass} {...register(`${p}.mode`)}>
                  {RADIO_MODES.map((m) => <option key={m} value={m}>{RADIO_MODE_LABELS[m]}</option>)}
                </select>
                {errorAt(errors, `${p}.mode`) ? <p className="text-xs text-danger">{errorAt(errors, `${p}.mode`)}</p> : null}
              </div>
              <LabelledInput id={`rn-${i}-bw`} label="Receiver bandwidth (Hz)" placeholder="e.g. 2400" error={errorAt(errors, `${p}.bandwidthHz`)} {...register(`${p}.bandwidthHz`, asNumber)} />
              <LabelledInput id={`rn-${i}-dist`} label="Distance from the item (m)" placeholder="e.g. 1" error={errorAt(errors, `${p}.distanceM`)} {...register(`${p}.distanceM`, asNumber)} />
              <LabelledInput id={`rn-${i}-ant`} label="Antenna notes" inputMode="text" placeholder="e.g. end-fed wire, 10 m" className="" error={errorAt(errors, `${p}.antenna`)} {...register(`${p}.antenna`)} />
            </div>
            <div className="grid grid-cols-1 gap-3 sm:grid-cols-2">
              <ReadingFields index={i} which="baseline" title="Baseline (reference supply)" control={control} register={register} errors={errors} />
              <ReadingFields index={i} which="withItem" title="With the item" control={control} register={register} errors={errors} />
            </div>
            <BandEcho index={i} control={control} />
            {errorAt(errors, p) ? <p className="text-sm text-danger">{errorAt(errors, p)}</p> : null}
            {bands.fields.length > 1 ? (
              <Button type="button" variant="quiet" onClick={() => bands.remove(i)} aria-label={`Remove band ${i + 1}`}>Remove this band</Button>
            ) : null}
          </fieldset>
        );
      })}
      {errorAt(errors, 'readings') ? <p className="text-sm text-danger">{errorAt(errors, 'readings')}</p> : null}
      <div className="flex flex-wrap gap-3">
        <Button type="button" variant="quiet" onClick={() => bands.append(emptyBand(items[0]?.slug ?? ''))}>Add a band</Button>
        <Button type="submit" disabled={formState.isSubmitting}>Save the band readings</Button>
      </div>
      <FormMessage message={message?.text} tone={message?.tone} testId="rn-message" />
    </form>
  );
}
