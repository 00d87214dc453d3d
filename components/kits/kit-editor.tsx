'use client';

import { zodResolver } from '@hookform/resolvers/zod';
import Link from 'next/link';
import { useRouter } from 'next/navigation';
import { useEffect, useMemo, useRef, useState } from 'react';
import { useFieldArray, useForm, useWatch } from 'react-hook-form';
import { Button, Field, FormMessage, TextInput } from '@/components/ui/form';
import { CATEGORIES } from '@/lib/measure';
import {
  budgetRole,
  kitBudget,
  kitCsv,
  kitInputSchema,
  kitTotals,
  MAX_TRIP_DAYS,
  MASS_GROUP_LABELS,
  SKIES,
  SKY_LABELS,
  suggestSkyShare,
  type KitCatalog,
  type KitFormValues,
  type KitInput,
  type Sky,
} from '@/lib/kits';
import { BudgetPanel } from './budget-panel';
import { ChargingPathsPanel } from './charging-paths-panel';
import { EntryRow, optionalNumber, requiredNumber } from './entry-row';
import { fmtPercent } from './format';
import { KitCautions } from './kit-cautions';
import { KitTotalsPanel } from './kit-totals';
import type { UnitSystem } from '@/lib/units/display';
import { PeakSunHelp } from './peak-sun-help';

export const GUEST_KIT_KEY = 'trailbench.guestKit.v1';

export type EditorMode = { kind: 'guest' } | { kind: 'new' } | { kind: 'edit'; id: string; shareToken: string | null };

/** Reads the guest kit saved in this browser; null when absent or no longer valid. */
export function readGuestKit(): KitInput | null {
  try {
    const raw = window.localStorage.getItem(GUEST_KIT_KEY);
    if (!raw) return null;
    const parsed = kitInputSchema.safeParse(JSON.parse(raw));
    return parsed.success ? parsed.data : null;
  } catch {
    return null;
  }
}

function download(name: string, text: string) {
  const url = URL.createObjectURL(new Blob([text], { type: 'text/csv;charset=utf-8' }));
  const a = document.createElement('a');
  a.href = url;
  a.download = name;
  a.click();
  URL.revokeObjectURL(url);
}

/** Builds and edits a kit; the budget and totals recompute as you type. */
export function KitEditor({ catalog, initial, mode, units = 'metric' }: { catalog: KitCatalog; initial: KitInput; mode: EditorMode; units?: UnitSystem }) {
  const router = useRouter();
  const form = useForm<KitFormValues, unknown, KitInput>({ resolver: zodResolver(kitInputSchema), defaultValues: initial, mode: 'onChange' });
  const { register, control, handleSubmit, setValue, setError, reset, formState } = form;
  const entries = useFieldArray({ control, name: 'entries' });
  const values = useWatch({ control }) as KitFormValues;
  const [message, setMessage] = useState<{ text: string; tone: 'ok' | 'danger' } | undefined>();
  const [shareToken, setShareToken] = useState(mode.kind === 'edit' ? mode.shareToken : null);
  const [picked, setPicked] = useState('');
  const loaded = useRef(mode.kind !== 'guest');

  // Guests: restore the kit saved in this browser once, then keep it saved as they type.
  useEffect(() => {
    if (mode.kind !== 'guest') return;
    if (!loaded.current) {
      loaded.current = true;
      const saved = readGuestKit();
      if (saved) reset(saved);
      return;
    }
    const parsed = kitInputSchema.safeParse(values);
    if (parsed.success) window.localStorage.setItem(GUEST_KIT_KEY, JSON.stringify(parsed.data));
  }, [mode.kind, values, reset]);

  const parsed = useMemo(() => kitInputSchema.safeParse(values), [values]);
  const [lastGood, setLastGood] = useState<KitInput>(initial);
  if (parsed.success && JSON.stringify(parsed.data) !== JSON.stringify(lastGood)) setLastGood(parsed.data);
  // While a field is being fixed, the budget shows the last figures that made sense.
  const kit = parsed.success ? parsed.data : lastGood;
  const budget = useMemo(() => kitBudget(kit, catalog), [kit, catalog]);
  const totals = useMemo(() => kitTotals(kit.entries, catalog), [kit, catalog]);

  const panelShares = useMemo(
    () => kit.entries.flatMap((e) => (e.gearItemId && catalog[e.gearItemId]?.category === 'solar-panel' ? (catalog[e.gearItemId]?.pairedSkyShares ?? []) : [])),
    [kit, catalog],
  );
  const sky = (values.sky ?? null) as Sky | null;
  const suggestion = sky ? suggestSkyShare(sky, panelShares) : null;
  const hasPanels = budget.panels.length > 0;

  const pickerGroups = useMemo(
    () => CATEGORIES.map((c) => ({ category: c, items: Object.values(catalog).filter((i) => i.category === c) })).filter((g) => g.items.length > 0),
    [catalog],
  );

  const addPicked = () => {
    const item = catalog[picked];
    if (!item) return;
    entries.append({ gearItemId: item.id, quantity: 1, ...(budgetRole(item) === 'storage' && item.chemistry === null ? { chemistry: null } : {}) });
    setPicked('');
  };

  const save = handleSubmit(async (data) => {
    setMessage(undefined);
    const response = await fetch(mode.kind === 'edit' ? `/api/v1/kits/${mode.id}` : '/api/v1/kits', {
      method: mode.kind === 'edit' ? 'PATCH' : 'POST',
      headers: { 'content-type': 'application/json' },
      body: JSON.stringify(data),
    });
    const body = (await response.json().catch(() => ({}))) as { kit?: { id: string }; error?: { message: string; fields?: Record<string, string[]> } };
    if (!response.ok) {
      for (const [path, list] of Object.entries(body.error?.fields ?? {})) setError(path as 'name', { message: list.join(' ') });
      setMessage({ text: body.error?.message ?? 'The kit could not be saved.', tone: 'danger' });
      return;
    }
    if (mode.kind === 'new' && body.kit) router.push(`/kits/${body.kit.id}`);
    else {
      setMessage({ text: 'Saved.', tone: 'ok' });
      reset(data);
    }
  });

  const post = async (path: string, method: 'POST' | 'DELETE') => {
    const response = await fetch(path, { method });
    return { ok: response.ok, body: (await response.json().catch(() => ({}))) as Record<string, unknown> };
  };

  return (
    <form onSubmit={save} noValidate aria-label="Kit" className="grid gap-8 lg:grid-cols-[minmax(0,1fr)_minmax(0,1fr)]">
      <div className="space-y-6">
        <section aria-labelledby="kit-about" className="space-y-3">
          <h2 id="kit-about" className="text-xl font-bold">
            The kit
          </h2>
          <Field id="name" label="Name" errors={formState.errors.name?.message ? [formState.errors.name.message] : undefined}>
            <TextInput id="name" {...register('name')} invalid={!!formState.errors.name} />
          </Field>
          <Field id="purpose" label="Purpose (optional)">
            <TextInput id="purpose" {...register('purpose')} />
          </Field>
          <Field
            id="tripDays"
            label="Trip length (days)"
            hint={`1 to ${MAX_TRIP_DAYS} days.`}
            errors={formState.errors.tripDays?.message ? [formState.errors.tripDays.message] : undefined}
          >
            <TextInput id="tripDays" type="number" min="1" max={MAX_TRIP_DAYS} step="1" inputMode="numeric" {...register('tripDays', requiredNumber)} invalid={!!formState.errors.tripDays} />
          </Field>
        </section>

        <section aria-labelledby="kit-gear" className="space-y-3">
          <h2 id="kit-gear" className="text-xl font-bold">
            Gear
          </h2>
          <div className="flex flex-wrap items-end gap-2">
            <div className="min-w-0 flex-1">
              <label htmlFor="pick-item" className="block text-sm font-semibold">
                Add from the catalog
              </label>
              <select id="pick-item" value={picked} onChange={(e) => setPicked(e.target.value)} className="mt-1 block w-full rounded-md border border-rule bg-paper px-3 py-2">
                <option value="">Choose an item…</option>
                {pickerGroups.map((g) => (
                  <optgroup key={g.category} label={MASS_GROUP_LABELS[g.category]}>
                    {g.items.map((i) => (
                      <option key={i.id} value={i.id}>
                        {i.maker} {i.name}
                      </option>
                    ))}
                  </optgroup>
                ))}
              </select>
            </div>
            <Button type="button" onClick={addPicked} disabled={!picked}>
              Add item
            </Button>
            <Button type="button" variant="quiet" onClick={() => entries.append({ gearItemId: null, freeName: '', quantity: 1 })}>
              Add your own entry
            </Button>
          </div>
          {entries.fields.length === 0 ? <p className="text-sm text-slate">No gear yet. Add lights, radios, batteries and panels, or your own entries such as a laptop.</p> : null}
          <div className="space-y-3">
            {entries.fields.map((f, i) => {
              const v = values.entries?.[i];
              const itemId = typeof v?.gearItemId === 'string' ? v.gearItemId : null;
              return (
                <EntryRow
                  key={f.id}
                  index={i}
                  item={itemId ? catalog[itemId] : undefined}
                  hidden={itemId !== null && !catalog[itemId]}
                  value={v}
                  form={{ register, control, errors: formState.errors }}
                  onRemove={() => entries.remove(i)}
                />
              );
            })}
          </div>
        </section>

        <section aria-labelledby="kit-charging" className="space-y-3">
          <h2 id="kit-charging" className="text-xl font-bold">
            Sun and charging
          </h2>
          {!hasPanels ? <p className="text-sm text-slate">Add a solar panel to count what it gathers.</p> : null}
          <div className="grid gap-3 sm:grid-cols-2">
            <Field id="peakSunHours" label="Peak sun hours (clear day)" hint="Hours of full sun a clear day gives at your place and season." errors={formState.errors.peakSunHours?.message ? [formState.errors.peakSunHours.message] : undefined}>
              <TextInput id="peakSunHours" type="number" step="any" min="0" max="24" inputMode="decimal" {...register('peakSunHours', optionalNumber)} invalid={!!formState.errors.peakSunHours} />
            </Field>
            <Field id="sky" label="Expected sky">
              <select
                id="sky"
                className="block w-full rounded-md border border-rule bg-paper px-3 py-2"
                {...register('sky', {
                  setValueAs: (v: unknown) => (v === '' ? null : v),
                  onChange: (e: { target: { value: string } }) => {
                    const next = e.target.value as Sky | '';
                    if (next) setValue('skyShare', suggestSkyShare(next, panelShares).share, { shouldValidate: true });
                  },
                })}
              >
                <option value="">Not chosen</option>
                {SKIES.map((s) => (
                  <option key={s} value={s}>
                    {SKY_LABELS[s]}
                  </option>
                ))}
              </select>
            </Field>
            <Field
              id="skyShare"
              label="Sky share (0–1)"
              hint={
                suggestion
                  ? `${suggestion.source === 'paired-test' ? 'Suggested' : 'Suggested (common practice)'}: ${suggestion.share}. ${suggestion.note}`
                  : 'Output under the expected sky ÷ output under a clear sky. Empty = 1 (clear).'
              }
              errors={formState.errors.skyShare?.message ? [formState.errors.skyShare.message] : undefined}
            >
              <TextInput id="skyShare" type="number" step="any" min="0" max="1" inputMode="decimal" {...register('skyShare', optionalNumber)} invalid={!!formState.errors.skyShare} />
            </Field>
            <Field
              id="lossFraction"
              label="System losses (0–1)"
              hint={`Dirt, wiring, heat and the charge controller. Empty = 0.14 (${fmtPercent(0.14)}, the PVWatts v5 default, NREL/TP-6A20-62641).`}
              errors={formState.errors.lossFraction?.message ? [formState.errors.lossFraction.message] : undefined}
            >
              <TextInput id="lossFraction" type="number" step="any" min="0" max="0.99" inputMode="decimal" {...register('lossFraction', optionalNumber)} invalid={!!formState.errors.lossFraction} />
            </Field>
            <Field
              id="conversionEfficiency"
              label="Conversion efficiency (0–1)"
              hint="Share of the stored energy that reaches the devices through converters, chargers and cables. Empty = 0.9 (common practice, no source)."
              errors={formState.errors.conversionEfficiency?.message ? [formState.errors.conversionEfficiency.message] : undefined}
            >
              <TextInput id="conversionEfficiency" type="number" step="any" min="0" max="1" inputMode="decimal" {...register('conversionEfficiency', optionalNumber)} invalid={!!formState.errors.conversionEfficiency} />
            </Field>
          </div>
          <PeakSunHelp
            onUseAllSky={(v) => {
              setValue('peakSunHours', v, { shouldValidate: true });
              setValue('sky', null);
              setValue('skyShare', 1, { shouldValidate: true });
            }}
          />
        </section>

        <section aria-labelledby="kit-actions" className="space-y-3 rounded-lg border border-rule bg-card p-4">
          <h2 id="kit-actions" className="text-lg font-bold">
            {mode.kind === 'guest' ? 'Keep this kit' : 'Save and share'}
          </h2>
          <FormMessage message={message?.text} tone={message?.tone} testId="kit-message" />
          {!parsed.success ? <p className="text-sm text-danger">Some fields need fixing; the budget shows the last figures that made sense.</p> : null}
          <div className="flex flex-wrap gap-2">
            {mode.kind === 'guest' ? (
              <>
                <p className="w-full text-sm">This kit is kept in this browser only. Sign in to save it to your account; nothing is lost.</p>
                <Link href="/signin?next=%2Fkits" className="rounded-md bg-lichen px-4 py-2 text-sm font-semibold text-paper hover:bg-lichen-dark">
                  Sign in to save
                </Link>
                <Link href="/signup?next=%2Fkits" className="rounded-md border border-rule px-4 py-2 text-sm font-semibold hover:bg-paper">
                  Create an account
                </Link>
              </>
            ) : (
              <Button type="submit" disabled={formState.isSubmitting}>
                {mode.kind === 'new' ? 'Save kit' : 'Save changes'}
              </Button>
            )}
            <Button type="button" variant="quiet" onClick={() => download(`${kit.name || 'kit'}.csv`.replace(/[^\w .-]+/g, '_'), kitCsv(kit.entries, catalog))}>
              Export CSV
            </Button>
          </div>
          {mode.kind === 'edit' ? (
            <div className="space-y-2 border-t border-rule pt-3">
              {shareToken ? (
                <p className="text-sm">
                  Anyone with this link can see the kit (read-only):{' '}
                  <a href={`/kits/shared/${shareToken}`} className="break-all font-mono text-lichen underline" data-testid="share-link">
                    /kits/shared/{shareToken}
                  </a>
                </p>
              ) : (
                <p className="text-sm text-slate">Private: only you can see this kit.</p>
              )}
              <div className="flex flex-wrap gap-2">
                <Button
                  type="button"
                  variant="quiet"
                  onClick={async () => {
                    const r = await post(`/api/v1/kits/${mode.id}/share`, 'POST');
                    if (r.ok) setShareToken(String(r.body.token));
                  }}
                >
                  {shareToken ? 'Make a new link (old one stops working)' : 'Create a share link'}
                </Button>
                {shareToken ? (
                  <Button
                    type="button"
                    variant="danger"
                    onClick={async () => {
                      if ((await post(`/api/v1/kits/${mode.id}/share`, 'DELETE')).ok) setShareToken(null);
                    }}
                  >
                    Stop sharing
                  </Button>
                ) : null}
                <Button
                  type="button"
                  variant="quiet"
                  onClick={async () => {
                    const r = await post(`/api/v1/kits/${mode.id}/duplicate`, 'POST');
                    const copy = r.body.kit as { path?: string } | undefined;
                    if (r.ok && copy?.path) router.push(copy.path);
                  }}
                >
                  Duplicate
                </Button>
                <Button
                  type="button"
                  variant="danger"
                  onClick={async () => {
                    if (!window.confirm('Delete this kit? This cannot be undone.')) return;
                    if ((await post(`/api/v1/kits/${mode.id}`, 'DELETE')).ok) router.push('/kits');
                  }}
                >
                  Delete kit
                </Button>
              </div>
            </div>
          ) : null}
        </section>
      </div>

      <div className="space-y-6">
        <KitTotalsPanel totals={totals} units={units} />
        <ChargingPathsPanel charging={budget.charging} />
        <BudgetPanel budget={budget} tripDays={kit.tripDays} />
        <KitCautions />
      </div>
    </form>
  );
}
