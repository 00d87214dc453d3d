'use client';

import { useId, useMemo, useState } from 'react';
import { analyzeTrial } from '@/lib/field-tests/analysis';
import type { FieldTestKind } from '@/lib/field-tests/kinds';
import type { CsvInspection } from '@/lib/readings/columns';
import { TIME_UNITS, VALUE_FIELDS, type ColumnSelection, type ReadingsMeta, type Sample, type TimeUnit, type ValueField } from '@/lib/readings/types';
import { LightOutputChart } from '@/components/charts/light-output-chart';
import { PowerChart } from '@/components/charts/power-chart';
import { SolarChart } from '@/components/charts/solar-chart';
import { useCsvParse } from './use-csv-parse';

export interface CsvReadyMeta extends ReadingsMeta {
  fileName: string;
  selection: ColumnSelection;
  switchOn?: string;
  dropRows: number[];
}

export interface CsvPreviewProps {
  /** The field test kind, to chart the series the way its result is computed. */
  kind: FieldTestKind;
  /** Called when the reviewer accepts a clean parse; the page sends the file with `meta.selection`, `switchOn` and `dropRows`. */
  onReady: (samples: Sample[], meta: CsvReadyMeta) => void;
  /** Refuse larger files before reading them (the upload route enforces its own cap). */
  maxBytes?: number;
  /** Panel rating (W) or rated energy (Wh) of the item, for the chart's reference line. */
  ratedW?: number | null;
  ratedEnergyWh?: number | null;
}

const TIME_UNIT_LABELS: Record<TimeUnit, string> = { s: 'seconds', min: 'minutes', h: 'hours', hms: 'elapsed h:mm:ss', clock: 'clock time (date and time)' };
const FIELD_LABELS: Record<ValueField, string> = { value: 'Light output (lux or relative)', watts: 'Power', volts: 'Voltage', amps: 'Current' };
const SCALES: Partial<Record<ValueField, [number, string][]>> = {
  watts: [[1, 'W'], [0.001, 'mW']],
  volts: [[1, 'V'], [0.001, 'mV']],
  amps: [[1, 'A'], [0.001, 'mA']],
};

function ColumnSelect({ id, label, value, columns, allowNone, onChange }: { id: string; label: string; value: number | undefined; columns: CsvInspection['columns']; allowNone: boolean; onChange: (v: number | undefined) => void }) {
  return (
    <label htmlFor={id} className="flex flex-col gap-1 text-sm">
      <span>{label}</span>
      <select id={id} className="rounded border border-[var(--color-rule)] bg-[var(--color-paper)] px-2 py-1" value={value ?? ''} onChange={(e) => onChange(e.target.value === '' ? undefined : Number(e.target.value))}>
        {allowNone ? <option value="">— none —</option> : null}
        {columns.map((c) => (
          <option key={c.index} value={c.index}>
            {c.index + 1}: {c.name}
          </option>
        ))}
      </select>
    </label>
  );
}

/**
 * Pick a logger CSV, check the guessed columns, see the first rows, the row-level errors and the
 * parsed series charted, then hand the series to `onReady`. Parsing runs in a module worker.
 */
export function CsvPreview({ kind, onReady, maxBytes, ratedW = null, ratedEnergyWh = null }: CsvPreviewProps) {
  const uid = useId();
  const [selection, setSelection] = useState<Partial<ColumnSelection>>({});
  const [switchOn, setSwitchOn] = useState('');
  const [dropRows, setDropRows] = useState<number[]>([]);
  const [tooBig, setTooBig] = useState<string | null>(null);

  const complete = (s: Partial<ColumnSelection>): s is ColumnSelection => !!s.time && !!(s.value || s.watts || (s.volts && s.amps));
  // A new file: start from the guess and read every row at once when the guess is complete.
  const { state, inspect, parse } = useCsvParse({
    onInspected: (found, parseNow) => {
      setSelection(found.guess);
      setDropRows([]);
      if (complete(found.guess)) parseNow({ selection: found.guess });
    },
  });

  const inspection = state.status === 'idle' || state.status === 'reading' ? null : state.inspection;
  const run = (drop: number[] = dropRows) => {
    if (!complete(selection)) return;
    setDropRows(drop);
    parse({ selection, switchOn: switchOn.trim() || undefined, dropRows: drop });
  };

  const analysis = useMemo(() => {
    if (state.status !== 'done') return null;
    return analyzeTrial(kind, { itemId: '', samples: state.samples }, { ratedW, ratedEnergyWh });
  }, [state, kind, ratedW, ratedEnergyWh]);

  const setField = (field: ValueField, column: number | undefined) =>
    setSelection((s) => {
      const next = { ...s };
      if (column === undefined) delete next[field];
      else next[field] = { column, ...(s[field]?.scale !== undefined && { scale: s[field]!.scale }) };
      return next;
    });

  return (
    <section className="flex flex-col gap-4" aria-label="Readings from a logger file">
      <label htmlFor={`${uid}-file`} className="flex flex-col gap-1 text-sm">
        <span className="font-semibold">Logger file (CSV)</span>
        <input
          id={`${uid}-file`}
          type="file"
          accept=".csv,.txt,.tsv,text/csv,text/plain"
          onChange={(e) => {
            const file = e.target.files?.[0];
            if (!file) return;
            if (maxBytes !== undefined && file.size > maxBytes) {
              setTooBig(`${file.name} is ${(file.size / 1e6).toFixed(1)} MB; the limit is ${(maxBytes / 1e6).toFixed(1)} MB.`);
              return;
            }
            setTooBig(null);
            setSwitchOn('');
            inspect(file);
          }}
        />
      </label>
      {tooBig ? <p role="alert" className="text-[var(--color-danger)]">{tooBig}</p> : null}
      {state.status === 'reading' ? <p role="status">Reading {state.fileName} …</p> : null}

      {inspection ? (
        <>
          <div className="overflow-x-auto">
            <table className="figure font-mono text-xs">
              <caption className="mb-1 text-left font-sans text-sm text-[var(--color-slate)]">
                First rows of {state.status !== 'idle' && 'fileName' in state ? state.fileName : 'the file'} (row numbers as in a spreadsheet)
              </caption>
              <thead>
                <tr>
                  <th scope="col" className="px-2 text-right">row</th>
                  {inspection.columns.map((c) => (
                    <th key={c.index} scope="col" className="px-2 text-left">
                      {c.name}
                      <span className="block font-normal text-[var(--color-slate)]">{c.role === 'unknown' ? '—' : c.role === 'time' ? `time (${c.timeUnit})` : c.role}</span>
                    </th>
                  ))}
                </tr>
              </thead>
              <tbody>
                {inspection.preview.map((r) => (
                  <tr key={r.row}>
                    <td className="px-2 text-right text-[var(--color-slate)]">{r.row}</td>
                    {inspection.columns.map((c) => (
                      <td key={c.index} className="px-2">{r.cells[c.index] ?? ''}</td>
                    ))}
                  </tr>
                ))}
              </tbody>
            </table>
          </div>

          <fieldset className="grid grid-cols-1 gap-3 sm:grid-cols-2">
            <legend className="mb-2 text-sm font-semibold">Columns</legend>
            {!inspection.guess.time ? <p className="text-sm text-[var(--color-amber)] sm:col-span-2">No column looks like time: choose the time column and its unit.</p> : null}
            <ColumnSelect
              id={`${uid}-time`}
              label="Time column"
              value={selection.time?.column}
              columns={inspection.columns}
              allowNone={!selection.time}
              onChange={(c) => c !== undefined && setSelection((s) => ({ ...s, time: { column: c, unit: s.time?.unit ?? 's' } }))}
            />
            <label htmlFor={`${uid}-unit`} className="flex flex-col gap-1 text-sm">
              <span>Time is written in</span>
              <select
                id={`${uid}-unit`}
                className="rounded border border-[var(--color-rule)] bg-[var(--color-paper)] px-2 py-1"
                value={selection.time?.unit ?? 's'}
                onChange={(e) => setSelection((s) => ({ ...s, time: { column: s.time?.column ?? 0, unit: e.target.value as TimeUnit } }))}
              >
                {TIME_UNITS.map((u) => (
                  <option key={u} value={u}>{TIME_UNIT_LABELS[u]}</option>
                ))}
              </select>
            </label>
            {selection.time?.unit === 'clock' ? (
              <label htmlFor={`${uid}-on`} className="flex flex-col gap-1 text-sm sm:col-span-2">
                <span>Switched on at (the logger’s clock; empty = the first row). Rows before it are left out.</span>
                <input id={`${uid}-on`} type="datetime-local" step={1} value={switchOn} onChange={(e) => setSwitchOn(e.target.value)} className="rounded border border-[var(--color-rule)] bg-[var(--color-paper)] px-2 py-1 font-mono" />
              </label>
            ) : null}
            {VALUE_FIELDS.map((f) => (
              <div key={f} className="flex items-end gap-2">
                <ColumnSelect id={`${uid}-${f}`} label={FIELD_LABELS[f]} value={selection[f]?.column} columns={inspection.columns} allowNone onChange={(c) => setField(f, c)} />
                {SCALES[f] && selection[f] ? (
                  <select
                    aria-label={`${FIELD_LABELS[f]} unit`}
                    className="rounded border border-[var(--color-rule)] bg-[var(--color-paper)] px-2 py-1 text-sm"
                    value={selection[f]!.scale ?? 1}
                    onChange={(e) => setSelection((s) => ({ ...s, [f]: { column: s[f]!.column, scale: Number(e.target.value) } }))}
                  >
                    {SCALES[f]!.map(([scale, label]) => (
                      <option key={label} value={scale}>{label}</option>
                    ))}
                  </select>
                ) : null}
              </div>
            ))}
          </fieldset>
          <div>
            <button type="button" disabled={!complete(selection) || state.status === 'parsing'} onClick={() => run([])} className="rounded bg-[var(--color-lichen)] px-3 py-1.5 text-sm font-semibold text-[var(--color-paper)] disabled:opacity-50">
              Read all rows with these columns
            </button>
          </div>
        </>
      ) : null}

      {state.status === 'parsing' ? (
        <div role="status" className="flex items-center gap-2 text-sm">
          <label htmlFor={`${uid}-progress`}>Reading rows</label>
          <progress id={`${uid}-progress`} max={1} value={state.progress} className="w-48" />
          <span className="figure">{Math.round(state.progress * 100)} %</span>
        </div>
      ) : null}

      {state.status === 'error' ? (
        <div role="alert" className="rounded border border-[var(--color-danger)] bg-[var(--color-danger-tint)] p-3 text-sm">
          <p>{state.error.message}</p>
          {state.error.rowErrors.length > 0 ? (
            <>
              <ul className="mt-2 max-h-48 list-disc overflow-auto pl-5 font-mono text-xs">
                {state.error.rowErrors.map((r) => (
                  <li key={`${r.row}-${r.code}`}>{r.message}</li>
                ))}
              </ul>
              {state.error.badRows.length > state.error.rowErrors.length ? <p className="mt-1">… and {state.error.badRows.length - state.error.rowErrors.length} more rows.</p> : null}
              <button type="button" className="mt-2 rounded border border-[var(--color-ink)] px-3 py-1" onClick={() => run([...dropRows, ...state.error.badRows])}>
                Leave out {state.error.badRows.length === 1 ? 'this row' : `these ${state.error.badRows.length} rows`} and read again
              </button>
            </>
          ) : null}
        </div>
      ) : null}

      {state.status === 'done' ? (
        <div className="flex flex-col gap-2">
          <p className="figure text-sm">
            {state.samples.length} readings over {(state.meta.durationS / 3600).toFixed(2)} h.
          </p>
          {state.meta.notes.length ? (
            <ul className="list-disc pl-5 text-sm text-[var(--color-slate)]">
              {state.meta.notes.map((n) => (
                <li key={n}>{n}</li>
              ))}
            </ul>
          ) : null}
          {analysis && !analysis.ok ? <p className="text-sm text-[var(--color-amber)]">{analysis.error.message}</p> : null}
          {analysis?.ok && analysis.chart?.kind === 'light' ? (
            <LightOutputChart samples={state.samples} referenceValue={analysis.chart.referenceValue} runtimeS={analysis.chart.runtimeS} />
          ) : null}
          {analysis?.ok && analysis.chart?.kind === 'power' ? <PowerChart samples={state.samples} deliveredWh={analysis.chart.deliveredWh} ratedEnergyWh={analysis.chart.ratedEnergyWh} /> : null}
          {analysis?.ok && analysis.chart?.kind === 'solar' ? <SolarChart samples={state.samples} meanW={analysis.chart.meanW} peakW={analysis.chart.peakW} ratedW={analysis.chart.ratedW} /> : null}
          {analysis?.ok && analysis.chart?.kind === 'charge' ? <PowerChart title="Charger input power against time" samples={state.samples} deliveredWh={0} /> : null}
          <div>
            <button
              type="button"
              className="rounded bg-[var(--color-lichen)] px-3 py-1.5 text-sm font-semibold text-[var(--color-paper)]"
              onClick={() => onReady(state.samples, { ...state.meta, fileName: state.fileName, selection: selection as ColumnSelection, switchOn: switchOn.trim() || undefined, dropRows })}
            >
              Use these readings
            </button>
          </div>
        </div>
      ) : null}
    </section>
  );
}
