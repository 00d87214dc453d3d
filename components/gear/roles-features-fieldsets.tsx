'use client';

import type { UseFormRegister } from 'react-hook-form';
import { Field, TextInput } from '@/components/ui/form';
import { CATEGORY_DEFS } from '@/lib/gear/categories';
import { FEATURE_DEFS, statedChecklist } from '@/lib/gear/features';
import type { GearFormValues } from '@/lib/gear/form-values';
import { SECONDARY_ROLES } from '@/lib/gear/roles';
import type { Category } from '@/lib/measure';

type ErrorAt = (path: string) => string[] | undefined;

/** "Also serves as": a checkbox per other category; ticking one adds that role's specs and checklist below. */
export function AlsoServesFieldset({ category, register, errorAt }: { category: Category; register: UseFormRegister<GearFormValues>; errorAt: ErrorAt }) {
  const choices = SECONDARY_ROLES.filter((c) => c !== category);
  const errors = [...(errorAt('alsoServesAs') ?? []), ...choices.flatMap((_, i) => errorAt(`alsoServesAs.${i}`) ?? [])];
  return (
    <fieldset className="space-y-3" data-testid="also-serves-fieldset" aria-describedby="also-serves-hint">
      <legend className="text-lg font-bold">Also serves as</legend>
      <p id="also-serves-hint" className="text-sm text-slate">
        Tick another category when the item does that job too — a lantern with a USB output also serves as a power bank. It then appears when readers browse
        that category, its specs are asked for below, and a bank’s or battery’s rated energy counts as stored energy in kits.
      </p>
      <div className="flex flex-wrap gap-x-6 gap-y-2">
        {choices.map((c) => (
          <label key={c} className="inline-flex items-center gap-2 text-sm">
            <input type="checkbox" value={c} className="h-4 w-4 accent-lichen" {...register('alsoServesAs')} data-testid={`also-serves-${c}`} />
            {CATEGORY_DEFS[c].label}
          </label>
        ))}
      </div>
      {errors.length ? <p className="text-sm text-danger">{errors.join(' ')}</p> : null}
    </fieldset>
  );
}

const SELECT = 'block w-full rounded-md border border-rule bg-paper px-3 py-2';

/** The checklist of every role the item serves as: has / has not / not stated, with a detail where one is taken. */
export function FeaturesFieldset({ roles, register, errorAt }: { roles: readonly Category[]; register: UseFormRegister<GearFormValues>; errorAt: ErrorAt }) {
  const names = statedChecklist(roles);
  if (names.length === 0) return null;
  return (
    <fieldset className="space-y-4" data-testid="features-fieldset">
      <legend className="text-lg font-bold">Features</legend>
      <p className="text-sm text-slate">
        Say whether the item has each feature, as the maker states it or as you found it. Leave “Not stated” when you do not know. The IP rating comes from
        the water rating above.
      </p>
      <div className="grid gap-4 sm:grid-cols-2">
        {names.map((name) => {
          const def = FEATURE_DEFS[name];
          const errors = errorAt(`features.${name}`) ?? errorAt(`features.${name}.present`);
          return (
            <div key={name} className="space-y-2 rounded-md border border-rule p-3">
              <Field id={`feature-${name}`} label={def.label} hint={def.hint} errors={errors}>
                <select id={`feature-${name}`} className={SELECT} aria-describedby={`feature-${name}-hint`} {...register(`features.${name}.present`)}>
                  <option value="">Not stated</option>
                  <option value="yes">Has it</option>
                  <option value="no">Has not</option>
                </select>
              </Field>
              {def.detail ? (
                <Field id={`feature-${name}-detail`} label={`${def.detail.label} (if it has one)`} errors={errorAt(`features.${name}.detail`)}>
                  <TextInput id={`feature-${name}-detail`} placeholder={def.detail.example} maxLength={40} {...register(`features.${name}.detail`)} />
                </Field>
              ) : null}
            </div>
          );
        })}
      </div>
    </fieldset>
  );
}
