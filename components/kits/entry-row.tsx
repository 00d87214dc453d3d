'use client';

import { useState } from 'react';
import { useController, type Control, type FieldErrors, type UseFormRegister } from 'react-hook-form';
import { Button, Field, TextInput } from '@/components/ui/form';
import { CHEMISTRIES, isCurrencyCode, moneyFromMajor, moneyToMajor } from '@/lib/measure';
import { budgetRole, storesEnergy, CHEMISTRY_LABELS, defaultMode, depthSource, drawModes, pickSpec, UNPUBLISHED_ITEM, type KitCatalogItem, type KitFormValues, type KitInput } from '@/lib/kits';
import { fmt, fmtPercent } from './format';
import { FreePowerFields } from './free-power-fields';

export const optionalNumber = { setValueAs: (v: unknown) => (v === '' || v === null || v === undefined ? null : Number(v)) };
export const requiredNumber = { setValueAs: (v: unknown) => (v === '' || v === null || v === undefined ? Number.NaN : Number(v)) };

type Form = { register: UseFormRegister<KitFormValues>; control: Control<KitFormValues, unknown, KitInput>; errors: FieldErrors<KitFormValues> };

const CURRENCIES = ['USD', 'EUR', 'GBP', 'CAD', 'AUD', 'NZD', 'CHF', 'SEK', 'NOK', 'JPY'];

function msgs(errors: FieldErrors<KitFormValues>, i: number, key: string): string[] | undefined {
  const entry = errors.entries?.[i] as Record<string, { message?: string }> | undefined;
  const m = entry?.[key]?.message;
  return m ? [m] : undefined;
}

/** One entry of the kit: a catalog item (or an unpublished one) or the reader's own entry, with its budget settings. */
export function EntryRow({ index, item, hidden, form, value, onRemove }: { index: number; item: KitCatalogItem | undefined; hidden: boolean; form: Form; value: KitFormValues['entries'][number] | undefined; onRemove: () => void }) {
  const { register, errors } = form;
  const id = (key: string) => `entries.${index}.${key}`;
  const name = hidden ? UNPUBLISHED_ITEM : item ? `${item.maker} ${item.name}` : value?.freeName || 'Your own entry';
  const role = item ? budgetRole(item) : 'load';
  // A lantern that also serves as a power bank is a load and storage at once.
  const stores = item ? storesEnergy(item) : false;
  const modes = item ? drawModes(item) : [];
  const chosenMode = modes.find((m) => m.mode === value?.loadMode) ?? defaultMode(modes);
  const duty = typeof value?.dutyCycle === 'number' && Number.isFinite(value.dutyCycle) ? value.dutyCycle : null;

  return (
    <fieldset className="rounded-lg border border-rule bg-paper p-4" data-testid="kit-entry">
      <legend className="px-1 font-semibold">{name}</legend>
      {hidden ? <p className="text-sm text-slate">This item is not published, so its details are not shown and it is not counted.</p> : null}
      <div className="grid gap-3 sm:grid-cols-4">
        {!item && !hidden ? (
          <>
            <div className="sm:col-span-2">
              <Field id={id('freeName')} label="Name" errors={msgs(errors, index, 'freeName')}>
                <TextInput id={id('freeName')} {...register(`entries.${index}.freeName`)} invalid={!!msgs(errors, index, 'freeName')} />
              </Field>
            </div>
            <Field id={id('freeMassG')} label="Mass each (g)" errors={msgs(errors, index, 'freeMassG')}>
              <TextInput id={id('freeMassG')} type="number" step="any" min="0" inputMode="decimal" {...register(`entries.${index}.freeMassG`, optionalNumber)} />
            </Field>
            <FreePrice index={index} form={form} />
            <Field id={id('freeDrawW')} label="Draw when on (W)" hint="Leave empty if it uses no power." errors={msgs(errors, index, 'freeDrawW')}>
              <TextInput id={id('freeDrawW')} type="number" step="any" min="0" inputMode="decimal" {...register(`entries.${index}.freeDrawW`, optionalNumber)} />
            </Field>
          </>
        ) : null}
        <Field id={id('quantity')} label="Quantity" errors={msgs(errors, index, 'quantity')}>
          <TextInput id={id('quantity')} type="number" min="1" step="1" inputMode="numeric" {...register(`entries.${index}.quantity`, requiredNumber)} invalid={!!msgs(errors, index, 'quantity')} />
        </Field>

        {item && role === 'load' && modes.length > 0 ? (
          <Field id={id('loadMode')} label="Mode" hint={chosenMode ? `${fmt(chosenMode.watts, 2)} W, ${chosenMode.basis}` : undefined}>
            <select id={id('loadMode')} className="block w-full rounded-md border border-rule bg-paper px-3 py-2" {...register(`entries.${index}.loadMode`, { setValueAs: (v: unknown) => (v === '' ? null : v) })}>
              {modes.map((m) => (
                <option key={m.mode} value={m.mode}>
                  {m.mode || 'on'}: {fmt(m.watts, 2)} W ({m.basis})
                </option>
              ))}
            </select>
          </Field>
        ) : null}
        {(item && role === 'load' && modes.length > 0) || (!item && !hidden) ? (
          <>
            <Field id={id('hoursPerDay')} label="Hours a day" hint="How long it is switched on each day (0–24)." errors={msgs(errors, index, 'hoursPerDay')}>
              <TextInput id={id('hoursPerDay')} type="number" step="any" min="0" max="24" inputMode="decimal" {...register(`entries.${index}.hoursPerDay`, optionalNumber)} invalid={!!msgs(errors, index, 'hoursPerDay')} />
            </Field>
            <Field
              id={id('dutyCycle')}
              label="Duty cycle (0–1)"
              hint={
                chosenMode?.mode === 'transmit'
                  ? `Share of the on-time spent transmitting${duty !== null ? ` (${fmtPercent(duty)}); it listens the rest` : '; e.g. 0.1 = 10 %'}.`
                  : `Share of the on-time it actually draws power${duty !== null ? ` (${fmtPercent(duty)})` : '; empty = all of it'}.`
              }
              errors={msgs(errors, index, 'dutyCycle')}
            >
              <TextInput id={id('dutyCycle')} type="number" step="any" min="0" max="1" inputMode="decimal" {...register(`entries.${index}.dutyCycle`, optionalNumber)} invalid={!!msgs(errors, index, 'dutyCycle')} />
            </Field>
          </>
        ) : null}

        {item && stores ? (
          <>
            <p className="text-sm sm:col-span-4">
              {role !== 'storage' ? `Also serves as ${item.alsoServesAs?.includes('power-bank') ? 'a power bank' : 'a 12 V battery'}: its stored energy counts in the budget, and its outputs can charge other devices. ` : ''}
              Rated {fmt(pickSpec(item, 'ratedEnergy')?.value ?? 0)} Wh
              {pickSpec(item, 'continuousPower') ? `, up to ${fmt(pickSpec(item, 'continuousPower')?.value ?? 0)} W continuous` : ''} (claimed).
            </p>
            <Field id={id('chemistry')} label="Chemistry" hint={item.chemistry ? `The catalog says ${CHEMISTRY_LABELS[item.chemistry]}.` : 'The catalog does not state it: choose it from the label.'}>
              <select id={id('chemistry')} className="block w-full rounded-md border border-rule bg-paper px-3 py-2" {...register(`entries.${index}.chemistry`, { setValueAs: (v: unknown) => (v === '' ? null : v) })}>
                <option value="">{item.chemistry ? `As in the catalog (${CHEMISTRY_LABELS[item.chemistry]})` : 'Not stated'}</option>
                {CHEMISTRIES.map((c) => (
                  <option key={c} value={c}>
                    {CHEMISTRY_LABELS[c]}
                  </option>
                ))}
              </select>
            </Field>
            <Field
              id={id('depthOfDischarge')}
              label="Depth of discharge (0–1)"
              hint={(() => {
                const c = value?.chemistry ?? item.chemistry;
                return c ? `Empty = the default, ${depthSource(c)}.` : 'How much of the capacity you allow yourself to use. Empty = the default for the chemistry.';
              })()}
              errors={msgs(errors, index, 'depthOfDischarge')}
            >
              <TextInput id={id('depthOfDischarge')} type="number" step="any" min="0" max="1" inputMode="decimal" {...register(`entries.${index}.depthOfDischarge`, optionalNumber)} invalid={!!msgs(errors, index, 'depthOfDischarge')} />
            </Field>
          </>
        ) : null}
        {!item && !hidden && value?.freeRole === 'storage' ? (
          <>
            <Field id={id('chemistry')} label="Chemistry" hint="From its label; until you choose one the budget uses only half of its stored energy.">
              <select id={id('chemistry')} className="block w-full rounded-md border border-rule bg-paper px-3 py-2" {...register(`entries.${index}.chemistry`, { setValueAs: (v: unknown) => (v === '' ? null : v) })}>
                <option value="">Not stated</option>
                {CHEMISTRIES.map((c) => (
                  <option key={c} value={c}>
                    {CHEMISTRY_LABELS[c]}
                  </option>
                ))}
              </select>
            </Field>
            <Field
              id={id('depthOfDischarge')}
              label="Depth of discharge (0–1)"
              hint={value?.chemistry ? `Empty = the default, ${depthSource(value.chemistry)}.` : 'How much of the capacity you allow yourself to use. Empty = the default for the chemistry.'}
              errors={msgs(errors, index, 'depthOfDischarge')}
            >
              <TextInput id={id('depthOfDischarge')} type="number" step="any" min="0" max="1" inputMode="decimal" {...register(`entries.${index}.depthOfDischarge`, optionalNumber)} invalid={!!msgs(errors, index, 'depthOfDischarge')} />
            </Field>
          </>
        ) : null}
        {item && role === 'panel' ? <p className="text-sm sm:col-span-3">Rated {fmt(pickSpec(item, 'ratedPower')?.value ?? 0)} W in full sun ({pickSpec(item, 'ratedPower')?.basis}).</p> : null}
        {item && role === 'none' && !stores ? <p className="text-sm text-slate sm:col-span-3">Counted in the totals; it neither uses nor stores energy in the budget.</p> : null}
      </div>
      {!item && !hidden ? (
        <div className="mt-4 border-t border-rule pt-3">
          <FreePowerFields index={index} form={form} />
        </div>
      ) : null}
      <Button type="button" variant="quiet" className="mt-3" onClick={onRemove} aria-label={`Remove ${name}`}>
        Remove
      </Button>
    </fieldset>
  );
}

function FreePrice({ index, form }: { index: number; form: Form }) {
  const { field, fieldState } = useController({ control: form.control, name: `entries.${index}.freePrice` });
  const current = field.value as { amountMinor: number; currency: string } | null | undefined;
  const [currency, setCurrency] = useState(current?.currency ?? 'USD');
  const [amount, setAmount] = useState(current && isCurrencyCode(current.currency) ? String(moneyToMajor({ amountMinor: current.amountMinor, currency: current.currency })) : '');
  const push = (a: string, c: string) => {
    if (a.trim() === '') return field.onChange(null);
    try {
      field.onChange({ amountMinor: moneyFromMajor(Number(a), c).amountMinor, currency: c });
    } catch {
      field.onChange({ amountMinor: Number.NaN, currency: c });
    }
  };
  const id = `entries.${index}.freePrice`;
  return (
    <Field id={id} label="Price each" errors={fieldState.error ? ['Enter a price of 0 or more, or leave it empty.'] : undefined}>
      <div className="flex gap-2">
        <TextInput id={id} type="number" min="0" step="any" inputMode="decimal" value={amount} onBlur={field.onBlur} onChange={(e) => { setAmount(e.target.value); push(e.target.value, currency); }} />
        <select aria-label="Currency" className="rounded-md border border-rule bg-paper px-2" value={currency} onChange={(e) => { setCurrency(e.target.value); push(amount, e.target.value); }}>
          {CURRENCIES.map((c) => (
            <option key={c}>{c}</option>
          ))}
        </select>
      </div>
    </Field>
  );
}
