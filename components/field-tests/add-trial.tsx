'use client';

import { useRouter } from 'next/navigation';
import { useId, useMemo, useRef, useState } from 'react';
import { CsvPreview, type CsvReadyMeta } from '@/components/readings/csv-preview';
import { Button, FormMessage, TextInput } from '@/components/ui/form';
import { analyzeTrial } from '@/lib/field-tests/analysis';
import { KINDS, type FieldTestKind } from '@/lib/field-tests/kinds';
import { PORT_OUTPUT_LABELS } from '@/lib/field-tests/port-output';
import { typedKeysFor } from '@/lib/field-tests/schemas';
import { SPECS, isSpecKey } from '@/lib/measure';
import { typedReadings } from '@/lib/readings/typed';
import type { Sample, TimeUnit, ValueField } from '@/lib/readings/types';
import { sendJson, uploadWithProgress, type ApiError } from './api';
import { formatFigure } from './format';
import { TrialChart } from './trial-chart';

export interface TrialItemOption {
  slug: string;
  name: string;
  ratedW: number | null;
  ratedEnergyWh: number | null;
}

const EXTRA_LABELS: Record<string, [string, string]> = { illuminanceLx: ['Illuminance on the beam axis', 'lx'], distanceM: ['Distance from the lens', 'm'], ...PORT_OUTPUT_LABELS };

function ErrorList({ error }: { error: ApiError | null }) {
  if (!error) return null;
  const rows = error.fields?.rows ?? [];
  const other = Object.entries(error.fields ?? {}).filter(([k]) => k !== 'rows' && k !== 'dropRows' && k !== 'file');
  return (
    <div role="alert" className="rounded border border-danger bg-danger-tint p-3 text-sm text-danger" data-testid="trial-error">
      <p>{error.message}</p>
      {rows.length ? (
        <ul className="mt-1 list-disc pl-5 font-mono text-xs">
          {rows.slice(0, 20).map((r) => <li key={r}>{r}</li>)}
        </ul>
      ) : null}
      {other.map(([k, v]) => <p key={k}>{v.join(' ')}</p>)}
    </div>
  );
}

/** Adds a trial to the author's draft: a logger CSV (parsed in a worker, charted, then uploaded with progress), typed-in readings, or typed values. */
export function AddTrial({ testId, kind, items, maxBytes }: { testId: string; kind: FieldTestKind; items: TrialItemOption[]; maxBytes: number }) {
  const uid = useId();
  const router = useRouter();
  const info = KINDS[kind];
  const [item, setItem] = useState(items[0]?.slug ?? '');
  const [label, setLabel] = useState('');
  const [source, setSource] = useState<'csv' | 'typed-readings' | 'typed-values'>(info.input === 'typed' ? 'typed-values' : 'csv');
  const current = items.find((i) => i.slug === item) ?? items[0];
  const done = () => {
    setLabel('');
    router.refresh();
  };

  return (
    <section aria-labelledby={`${uid}-h`} className="space-y-4 rounded-lg border border-rule p-4" data-testid="add-trial">
      <h2 id={`${uid}-h`} className="text-xl font-semibold">Add a trial</h2>
      <div className="grid grid-cols-1 gap-3 sm:grid-cols-2">
        <label className="flex flex-col gap-1 text-sm">
          <span className="font-semibold">Item</span>
          <select className="rounded-md border border-rule bg-paper px-3 py-2" value={item} onChange={(e) => setItem(e.target.value)}>
            {items.map((i) => <option key={i.slug} value={i.slug}>{i.name}</option>)}
          </select>
        </label>
        <label className="flex flex-col gap-1 text-sm">
          <span className="font-semibold">Trial label</span>
          <TextInput value={label} onChange={(e) => setLabel(e.target.value)} placeholder="e.g. Trial 1, high mode" maxLength={80} />
        </label>
      </div>
      {info.input !== 'typed' ? (
        <div role="radiogroup" aria-label="Readings from" className="flex flex-wrap gap-4 text-sm">
          <label className="flex items-center gap-2"><input type="radio" checked={source === 'csv'} onChange={() => setSource('csv')} /> Upload a logger file</label>
          <label className="flex items-center gap-2"><input type="radio" checked={source === 'typed-readings'} onChange={() => setSource('typed-readings')} /> Type in readings</label>
          {info.input === 'either' ? <label className="flex items-center gap-2"><input type="radio" checked={source === 'typed-values'} onChange={() => setSource('typed-values')} /> Type in figures</label> : null}
        </div>
      ) : null}
      {source === 'csv' && current ? <CsvTrial key={current.slug} testId={testId} kind={kind} item={current} label={label} maxBytes={maxBytes} onSaved={done} /> : null}
      {source === 'typed-readings' && current ? <TypedReadingsTrial testId={testId} kind={kind} item={current} label={label} onSaved={done} /> : null}
      {source === 'typed-values' && current ? <TypedValuesTrial testId={testId} kind={kind} item={current} label={label} onSaved={done} /> : null}
    </section>
  );
}

function ResultsPreview({ kind, samples, item }: { kind: FieldTestKind; samples: Sample[]; item: TrialItemOption }) {
  const a = useMemo(() => analyzeTrial(kind, { itemId: item.slug, samples }, { ratedW: item.ratedW, ratedEnergyWh: item.ratedEnergyWh }), [kind, samples, item]);
  if (!a.ok) return <p className="text-sm text-amber">{a.error.message}</p>;
  return (
    <div className="space-y-2">
      <TrialChart title={`${item.name}: readings to save`} samples={samples} chart={a.chart} />
      {a.figures.length ? <p className="figure text-sm font-semibold" data-testid="trial-preview-figures">{a.figures.map((f) => `${f.label}: ${formatFigure(f.value, f.unit, f.key)}`).join(' · ')}</p> : null}
      {a.notes.map((n) => <p key={n} className="text-sm text-amber">{n}</p>)}
    </div>
  );
}

function CsvTrial({ testId, kind, item, label, maxBytes, onSaved }: { testId: string; kind: FieldTestKind; item: TrialItemOption; label: string; maxBytes: number; onSaved: () => void }) {
  const file = useRef<File | null>(null);
  const [ready, setReady] = useState<{ samples: Sample[]; meta: CsvReadyMeta; file: File } | null>(null);
  const [progress, setProgress] = useState<number | null>(null);
  const [error, setError] = useState<ApiError | null>(null);
  const [saved, setSaved] = useState<string | undefined>();

  const save = async () => {
    if (!ready) return;
    const form = new FormData();
    form.set('file', ready.file, ready.file.name);
    form.set('item', item.slug);
    form.set('label', label);
    form.set('selection', JSON.stringify(ready.meta.selection));
    if (ready.meta.switchOn) form.set('switchOn', ready.meta.switchOn);
    if (ready.meta.dropRows.length) form.set('dropRows', JSON.stringify(ready.meta.dropRows));
    setError(null);
    setProgress(0);
    const r = await uploadWithProgress(`/api/v1/field-tests/${encodeURIComponent(testId)}/readings`, form, setProgress);
    if (!r.ok) {
      setProgress(null);
      setError(r.error);
      return;
    }
    const trial = (r.data as { trial: { rows: number } }).trial;
    setSaved(`Saved: ${trial.rows.toLocaleString('en-US')} readings stored.`);
    setReady(null);
    setProgress(null);
    onSaved();
  };

  return (
    <div
      className="space-y-3"
      onChange={(e) => {
        const t = e.target as HTMLInputElement;
        if (t.type === 'file') {
          file.current = t.files?.[0] ?? null;
          setReady(null);
          setSaved(undefined);
          setError(null);
        }
      }}
    >
      <CsvPreview kind={kind} maxBytes={maxBytes} ratedW={item.ratedW} ratedEnergyWh={item.ratedEnergyWh} onReady={(samples, meta) => file.current && setReady({ samples, meta, file: file.current })} />
      {ready ? (
        <div className="space-y-2 rounded-md border border-lichen p-3" data-testid="csv-ready">
          <p className="text-sm">
            {ready.samples.length.toLocaleString('en-US')} readings from {ready.meta.fileName} are ready. The server reads the file again and decides.
          </p>
          <Button type="button" onClick={() => void save()} disabled={progress !== null}>Save this trial</Button>
        </div>
      ) : null}
      {progress !== null ? (
        <div role="status" className="flex items-center gap-2 text-sm">
          <label htmlFor={`upload-${testId}`}>Uploading</label>
          <progress id={`upload-${testId}`} data-testid="upload-progress" max={1} value={progress} className="w-48" />
          <span className="figure">{Math.round(progress * 100)} %</span>
        </div>
      ) : null}
      <ErrorList error={error} />
      <FormMessage message={saved} tone="ok" testId="trial-saved" />
    </div>
  );
}

const TIME_UNITS: [TimeUnit, string][] = [['s', 's'], ['min', 'min'], ['h', 'h'], ['hms', 'h:mm:ss']];

function TypedReadingsTrial({ testId, kind, item, label, onSaved }: { testId: string; kind: FieldTestKind; item: TrialItemOption; label: string; onSaved: () => void }) {
  const sets = KINDS[kind].seriesFields;
  const [setIndex, setSetIndex] = useState(0);
  const fields = (sets[setIndex] ?? ['value']) as readonly ValueField[];
  const [timeUnit, setTimeUnit] = useState<TimeUnit>('min');
  const [rows, setRows] = useState<Record<string, string>[]>(() => Array.from({ length: 5 }, () => ({ time: '' })));
  const [error, setError] = useState<ApiError | null>(null);
  const [busy, setBusy] = useState(false);
  const entries = rows.map((r) => ({ time: r.time ?? '', ...Object.fromEntries(fields.map((f) => [f, r[f] ?? ''])) }));
  const parsed = typedReadings(entries, { timeUnit, fields }); // a handful of rows: cheap on every render
  const unit: Record<ValueField, string> = { value: 'output (lx or relative)', watts: 'W', volts: 'V', amps: 'A' };

  const save = async () => {
    setBusy(true);
    setError(null);
    const r = await sendJson('POST', `/api/v1/field-tests/${encodeURIComponent(testId)}/readings`, { item: item.slug, label, timeUnit, fields, entries });
    setBusy(false);
    if (!r.ok) return setError(r.error);
    setRows(Array.from({ length: 5 }, () => ({ time: '' })));
    onSaved();
  };

  return (
    <div className="space-y-3">
      <div className="flex flex-wrap gap-4 text-sm">
        <label className="flex items-center gap-2">Time in
          <select className="rounded border border-rule bg-paper px-2 py-1" value={timeUnit} onChange={(e) => setTimeUnit(e.target.value as TimeUnit)}>
            {TIME_UNITS.map(([u, l]) => <option key={u} value={u}>{l}</option>)}
          </select>
        </label>
        {sets.length > 1 ? (
          <label className="flex items-center gap-2">Readings of
            <select className="rounded border border-rule bg-paper px-2 py-1" value={setIndex} onChange={(e) => setSetIndex(Number(e.target.value))}>
              {sets.map((s, i) => <option key={s.join()} value={i}>{s.map((f) => unit[f]).join(' and ')}</option>)}
            </select>
          </label>
        ) : null}
      </div>
      <table className="figure text-sm">
        <thead><tr><th scope="col" className="px-1 text-left">Time ({timeUnit})</th>{fields.map((f) => <th key={f} scope="col" className="px-1 text-left">{unit[f]}</th>)}</tr></thead>
        <tbody>
          {rows.map((r, i) => (
            <tr key={i}>
              <td className="px-1"><TextInput aria-label={`Reading ${i + 1} time`} className="font-mono" value={r.time ?? ''} onChange={(e) => setRows((rs) => rs.map((x, k) => (k === i ? { ...x, time: e.target.value } : x)))} /></td>
              {fields.map((f) => (
                <td key={f} className="px-1"><TextInput aria-label={`Reading ${i + 1} ${unit[f]}`} className="font-mono" inputMode="decimal" value={r[f] ?? ''} onChange={(e) => setRows((rs) => rs.map((x, k) => (k === i ? { ...x, [f]: e.target.value } : x)))} /></td>
              ))}
            </tr>
          ))}
        </tbody>
      </table>
      <Button type="button" variant="quiet" onClick={() => setRows((rs) => [...rs, { time: '' }])}>Add a row</Button>
      {parsed.ok ? <ResultsPreview kind={kind} samples={parsed.samples} item={item} /> : rows.some((r) => r.time) ? <p className="text-sm text-amber">{parsed.error.rowErrors[0]?.message ?? parsed.error.message}</p> : null}
      <Button type="button" onClick={() => void save()} disabled={busy || !parsed.ok}>Save this trial</Button>
      <ErrorList error={error} />
    </div>
  );
}

function TypedValuesTrial({ testId, kind, item, label, onSaved }: { testId: string; kind: FieldTestKind; item: TrialItemOption; label: string; onSaved: () => void }) {
  const keys = typedKeysFor(kind) ?? ['mass', 'luminousFlux', 'runtime', 'deliveredEnergy', 'chargeTime'];
  const [values, setValues] = useState<Record<string, string>>({});
  const [error, setError] = useState<ApiError | null>(null);
  const [busy, setBusy] = useState(false);
  const labelOf = (k: string): [string, string] => (isSpecKey(k) ? [SPECS[k].label, SPECS[k].unit] : (EXTRA_LABELS[k] ?? [k, '']));

  const save = async () => {
    const typedValues: Record<string, number> = {};
    for (const [k, v] of Object.entries(values)) if (v.trim() !== '') typedValues[k] = Number(v.replace(',', '.'));
    setBusy(true);
    setError(null);
    const r = await sendJson('POST', `/api/v1/field-tests/${encodeURIComponent(testId)}/trials`, { item: item.slug, label, typedValues });
    setBusy(false);
    if (!r.ok) return setError(r.error);
    setValues({});
    onSaved();
  };

  return (
    <div className="space-y-3">
      <div className="grid grid-cols-1 gap-3 sm:grid-cols-2">
        {keys.map((k) => {
          const [name, unit] = labelOf(k);
          return (
            <label key={k} className="flex flex-col gap-1 text-sm">
              <span>{name} ({unit})</span>
              <TextInput inputMode="decimal" className="font-mono" value={values[k] ?? ''} onChange={(e) => setValues((v) => ({ ...v, [k]: e.target.value }))} />
            </label>
          );
        })}
      </div>
      <Button type="button" onClick={() => void save()} disabled={busy}>Save this trial</Button>
      <ErrorList error={error} />
    </div>
  );
}
