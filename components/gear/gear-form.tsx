'use client';

import { zodResolver } from '@hookform/resolvers/zod';
import { useMemo, useState, useTransition } from 'react';
import { get, useFieldArray, useForm, useWatch, type Control, type FieldPath, type Resolver, type UseFormRegister } from 'react-hook-form';
import { CATEGORIES, CHEMISTRIES, type Category } from '@/lib/measure';
import { clean, formRoles, type GearFormValues } from '@/lib/gear/form-values';
import { createGearAction, updateGearAction, type GearFormState } from '@/lib/gear/actions';
import { CATEGORY_DEFS, CHEMISTRY_LABELS, CLAIM_SOURCE_LABELS, CLAIM_SOURCES } from '@/lib/gear/categories';
import { roleSpecs } from '@/lib/gear/roles';
import { formatQuantity } from '@/lib/gear/format';
import { tryParseQuantity, TYPED_UNITS, type TypedQuantity } from '@/lib/gear/parse-quantity';
import { gearInputSchema } from '@/lib/gear/schemas';
import { Button, Field, FormMessage, TextInput } from '@/components/ui/form';
import { PortsFieldset } from './ports-fieldset';
import { AlsoServesFieldset, FeaturesFieldset } from './roles-features-fieldsets';

const CURRENCIES = ['USD', 'EUR', 'GBP', 'CAD', 'AUD', 'NZD', 'CHF', 'SEK', 'NOK', 'DKK', 'JPY'];

const baseResolver = zodResolver(gearInputSchema) as unknown as Resolver<Record<string, unknown>>;

export function GearForm({ mode, slug, defaults, isPublic = false }: { mode: 'create' | 'edit'; slug?: string; defaults: GearFormValues; isPublic?: boolean }) {
  const [state, setState] = useState<GearFormState>({});
  const [pending, startTransition] = useTransition();
  const resolver: Resolver<GearFormValues> = useMemo(
    () => async (values, context, options) => {
      const result = await baseResolver(clean(values, true), context, options as never);
      return result.errors && Object.keys(result.errors).length ? { values: {}, errors: result.errors as never } : { values, errors: {} };
    },
    [],
  );
  const form = useForm<GearFormValues>({ resolver, defaultValues: defaults, mode: 'onSubmit' });
  const category = (useWatch({ control: form.control, name: 'category' }) as Category) || 'light';
  const def = CATEGORY_DEFS[category];
  const alsoServesAs = (useWatch({ control: form.control, name: 'alsoServesAs' }) as string[] | string | false | undefined) || [];
  // The union of the roles' specs, chemistry and water rating (a lantern serving as a bank asks for the bank's figures).
  const roles = formRoles({ category, alsoServesAs: Array.isArray(alsoServesAs) ? alsoServesAs : [alsoServesAs] });
  const roleDefs = roles.map((r) => CATEGORY_DEFS[r]);
  const chemistryShown = roleDefs.some((d) => d.chemistry.shown);
  const chemistryRequired = roleDefs.some((d) => d.chemistry.required);
  const specsShown = roleSpecs(roles).filter((s) => s.basis !== 'measured-only');

  const errorAt = (path: string): string[] | undefined => {
    const server = state.fields?.[path];
    if (server?.length) return server;
    const client = get(form.formState.errors, path) as { message?: string } | undefined;
    return client?.message ? [client.message] : undefined;
  };

  const onSubmit = form.handleSubmit((values) => {
    startTransition(async () => {
      const result = mode === 'create' ? await createGearAction(clean(values, true)) : await updateGearAction(slug!, clean(values, false));
      setState(result ?? {});
    });
  });

  const formErrorCount = Object.keys(form.formState.errors).length;
  return (
    <form onSubmit={onSubmit} noValidate className="space-y-8" aria-label={mode === 'create' ? 'New gear item' : 'Edit gear item'}>
      <fieldset className="space-y-4">
        <legend className="text-lg font-bold">The item</legend>
        {mode === 'create' ? (
          <Field id="gear-category" label="Category" errors={errorAt('category')}>
            <select id="gear-category" className="block w-full rounded-md border border-rule bg-paper px-3 py-2" {...form.register('category')}>
              {CATEGORIES.map((c) => (
                <option key={c} value={c}>
                  {CATEGORY_DEFS[c].label}
                </option>
              ))}
            </select>
          </Field>
        ) : (
          <p className="text-sm text-slate">
            Category: <strong className="text-ink">{def.label}</strong> (fixed when the item was created)
          </p>
        )}
        {def.kinds.length > 0 ? (
          <Field id="gear-kind" label="Kind" errors={errorAt('kind')}>
            <select id="gear-kind" className="block w-full rounded-md border border-rule bg-paper px-3 py-2" {...form.register('kind')}>
              <option value="">—</option>
              {def.kinds.map((k) => (
                <option key={k.id} value={k.id}>
                  {k.label}
                </option>
              ))}
            </select>
          </Field>
        ) : null}
        <Field id="gear-name" label="Name" errors={errorAt('name')}>
          <TextInput id="gear-name" invalid={!!errorAt('name')} {...form.register('name')} />
        </Field>
        <Field id="gear-maker" label="Maker" errors={errorAt('maker')}>
          <TextInput id="gear-maker" invalid={!!errorAt('maker')} {...form.register('maker')} />
        </Field>
        <Field id="gear-model-year" label="Model year" errors={errorAt('modelYear')}>
          <TextInput id="gear-model-year" inputMode="numeric" className="max-w-32" invalid={!!errorAt('modelYear')} {...form.register('modelYear')} />
        </Field>
        <div className="grid gap-4 sm:grid-cols-[2fr_1fr_2fr]">
          <Field id="gear-price" label="Price paid" errors={errorAt('price.amount')}>
            <TextInput id="gear-price" inputMode="decimal" placeholder="59.99" invalid={!!errorAt('price.amount')} {...form.register('price.amount')} />
          </Field>
          <Field id="gear-currency" label="Currency" errors={errorAt('price.currency')}>
            <select id="gear-currency" className="block w-full rounded-md border border-rule bg-paper px-3 py-2" {...form.register('price.currency')}>
              {CURRENCIES.map((c) => (
                <option key={c}>{c}</option>
              ))}
            </select>
          </Field>
          <Field id="gear-paid-on" label="Paid on" errors={errorAt('pricePaidOn')}>
            <TextInput id="gear-paid-on" type="date" invalid={!!errorAt('pricePaidOn')} {...form.register('pricePaidOn')} />
          </Field>
        </div>
        {chemistryShown ? (
          <Field id="gear-chemistry" label="Cell chemistry" errors={errorAt('chemistry')}>
            <select id="gear-chemistry" className="block w-full rounded-md border border-rule bg-paper px-3 py-2" {...form.register('chemistry')}>
              <option value="">{chemistryRequired ? 'Choose…' : 'Not stated / replaceable cells'}</option>
              {CHEMISTRIES.map((c) => (
                <option key={c} value={c}>
                  {CHEMISTRY_LABELS[c]}
                </option>
              ))}
            </select>
          </Field>
        ) : null}
        {roleDefs.some((d) => d.waterRating) ? (
          <Field id="gear-water" label="Water rating (IEC 60529 IP code)" hint="For example IPX4 or IP67." errors={errorAt('waterRating')}>
            <TextInput id="gear-water" className="max-w-32 font-mono" invalid={!!errorAt('waterRating')} {...form.register('waterRating')} />
          </Field>
        ) : null}
        <Field id="gear-notes" label="Notes" errors={errorAt('notes')}>
          <textarea id="gear-notes" rows={4} className="block w-full rounded-md border border-rule bg-paper px-3 py-2" {...form.register('notes')} />
        </Field>
      </fieldset>

      <AlsoServesFieldset category={category} register={form.register} errorAt={errorAt} />

      <fieldset className="space-y-4">
        <legend className="text-lg font-bold">Claimed specs</legend>
        <p className="text-sm text-slate">
          Type each figure with its unit as printed — “12.3 oz”, “2.1 lb”, “10 400 mAh at 3.6 V”, “3 h 30 min”. It is stored in
          the units shown beside each field. A number without a unit is taken in that unit.
        </p>
        <Field id="gear-claim-source" label="Where the claims come from" errors={errorAt('claimSource')}>
          <select id="gear-claim-source" className="block w-full rounded-md border border-rule bg-paper px-3 py-2" {...form.register('claimSource')}>
            {CLAIM_SOURCES.map((s) => (
              <option key={s} value={s}>
                {CLAIM_SOURCE_LABELS[s]}
              </option>
            ))}
          </select>
        </Field>
        {specsShown.map((spec) => (
          <div key={`${category}-${spec.key}`} className="grid gap-2 sm:grid-cols-[3fr_1fr]">
            <QuantityField
              id={`spec-${spec.key}`}
              label={`${spec.label}${spec.role !== category ? ` (as ${CATEGORY_DEFS[spec.role].label.toLowerCase()})` : ''}${roleDefs.some((d) => d.specs.some((x) => x.key === spec.key && x.required)) ? ' (required)' : ''}`}
              name={`specs.${spec.key}.value` as FieldPath<GearFormValues>}
              quantity={spec.quantity}
              placeholder={spec.example}
              control={form.control}
              register={form.register}
              errors={errorAt(`specs.${spec.key}.value`) ?? errorAt(`specs.${spec.key}`)}
            />
            <Field id={`spec-${spec.key}-source`} label="Source" errors={errorAt(`specs.${spec.key}.source`)}>
              <select id={`spec-${spec.key}-source`} className="block w-full rounded-md border border-rule bg-paper px-2 py-2 text-sm" {...form.register(`specs.${spec.key}.source`)}>
                <option value="">As above</option>
                {CLAIM_SOURCES.map((s) => (
                  <option key={s} value={s}>
                    {CLAIM_SOURCE_LABELS[s]}
                  </option>
                ))}
              </select>
            </Field>
          </div>
        ))}
      </fieldset>

      {def.modes ? <ModesFieldset style={def.modes} examples={def.modeExamples} control={form.control} register={form.register} errorAt={errorAt} /> : null}

      <PortsFieldset control={form.control} register={form.register} errorAt={errorAt} />

      <FeaturesFieldset roles={roles} register={form.register} errorAt={errorAt} />

      {isPublic ? (
        <Field id="gear-change-note" label="What changed and why" hint="Shown with the date in the item’s “figures updated” note once an editor approves the change." errors={errorAt('changeNote')}>
          <TextInput id="gear-change-note" invalid={!!errorAt('changeNote')} {...form.register('changeNote')} />
        </Field>
      ) : null}

      <FormMessage message={state.message ?? (formErrorCount ? 'Please correct the marked fields.' : undefined)} tone={state.ok ? 'ok' : 'danger'} />
      <Button type="submit" disabled={pending}>
        {pending ? 'Saving…' : mode === 'create' ? 'Save draft' : isPublic ? 'Save change (stays pending until approved)' : 'Save'}
      </Button>
    </form>
  );
}

/** A spec field with its unit hint and the canonical value echoed as the reviewer types. */
function QuantityField({
  id,
  label,
  name,
  quantity,
  placeholder,
  control,
  register,
  errors,
}: {
  id: string;
  label: string;
  name: FieldPath<GearFormValues>;
  quantity: TypedQuantity;
  placeholder?: string;
  control: Control<GearFormValues>;
  register: UseFormRegister<GearFormValues>;
  errors?: string[];
}) {
  const text = (useWatch({ control, name }) as string | undefined) ?? '';
  const parsed = text.trim() ? tryParseQuantity(text, quantity) : null;
  return (
    <Field id={id} label={label} errors={errors}>
      <div className="flex items-center gap-2">
        <TextInput id={id} placeholder={placeholder} autoComplete="off" invalid={!!errors?.length} aria-describedby={`${id}-echo`} {...register(name)} />
        <span className="w-24 flex-none font-mono text-[11px] leading-tight text-slate sm:w-36" aria-hidden="true">
          {TYPED_UNITS[quantity].slice(0, 4).join(' · ')}
        </span>
      </div>
      <p id={`${id}-echo`} aria-live="polite" data-testid={`${id}-echo`} className="min-h-5 font-mono text-xs">
        {parsed === null ? null : parsed.ok ? (
          <span className="text-lichen">
            = {formatQuantity(parsed.parsed.value, parsed.parsed.unit)}
            {parsed.parsed.assumedUnit ? ` (no unit typed: taken as ${parsed.parsed.unit})` : ''}
          </span>
        ) : (
          <span className="text-amber">{parsed.error.message}</span>
        )}
      </p>
    </Field>
  );
}

function ModesFieldset({
  style,
  examples,
  control,
  register,
  errorAt,
}: {
  style: 'light' | 'device';
  examples: readonly string[];
  control: Control<GearFormValues>;
  register: UseFormRegister<GearFormValues>;
  errorAt: (path: string) => string[] | undefined;
}) {
  const { fields, append, remove } = useFieldArray({ control, name: 'modes' });
  return (
    <fieldset className="space-y-4">
      <legend className="text-lg font-bold">{style === 'light' ? 'Light modes' : 'Power draw per mode'}</legend>
      <p className="text-sm text-slate">
        {style === 'light'
          ? 'Each further mode with its claimed output, runtime and power draw (the highest mode’s output and runtime go above; give its power draw here, e.g. as “high”).'
          : 'What the device draws in each mode, e.g. receive and transmit; type a current at the supply voltage (“1.5 A at 13.8 V”) or watts.'}
      </p>
      {fields.map((field, i) => (
        <div key={field.id} className="space-y-2 rounded-md border border-rule p-3" data-testid={`mode-${i}`}>
          <Field id={`mode-${i}-name`} label="Mode name" errors={errorAt(`modes.${i}.name`)}>
            <TextInput id={`mode-${i}-name`} placeholder={examples[i % Math.max(1, examples.length)]} invalid={!!errorAt(`modes.${i}.name`)} {...register(`modes.${i}.name`)} />
          </Field>
          {style === 'light' ? (
            <>
              <QuantityField id={`mode-${i}-output`} label="Light output" name={`modes.${i}.luminousFlux`} quantity="luminousFlux" placeholder="60 lm" control={control} register={register} errors={errorAt(`modes.${i}.luminousFlux`)} />
              <QuantityField id={`mode-${i}-runtime`} label="Runtime" name={`modes.${i}.runtime`} quantity="duration" placeholder="30 h" control={control} register={register} errors={errorAt(`modes.${i}.runtime`)} />
            </>
          ) : null}
          <QuantityField id={`mode-${i}-draw`} label="Power draw" name={`modes.${i}.powerDraw`} quantity="power" placeholder={style === 'light' ? '3.8 W' : '1.5 A at 13.8 V'} control={control} register={register} errors={errorAt(`modes.${i}.powerDraw`)} />
          <Button type="button" variant="quiet" onClick={() => remove(i)}>
            Remove this mode
          </Button>
        </div>
      ))}
      <Button type="button" variant="quiet" onClick={() => append({ name: '', luminousFlux: '', runtime: '', powerDraw: '' })}>
        Add a mode
      </Button>
    </fieldset>
  );
}
