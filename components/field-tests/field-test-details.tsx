import Link from 'next/link';
import type { FieldTestView } from '@/db/field-tests-view';
import { KINDS, SKY_LABELS, type Sky } from '@/lib/field-tests/kinds';
import { formatNumber } from '@/lib/gear/format';
import { gearPath } from '@/lib/gear/paths';
import { formatBytes, formatFigure, formatSummary, formatTestedAt, methodHref } from './format';
import { TrialChart } from './trial-chart';

function conditionsOf(view: FieldTestView): string {
  const { sky, ambientC } = view.test;
  return [sky ? SKY_LABELS[sky as Sky] : null, ambientC !== null ? `${formatNumber(ambientC)} °C` : null].filter(Boolean).join(', ');
}

/** Conditions, instruments and method of a field test. */
export function FieldTestRecord({ view }: { view: FieldTestView }) {
  const { test } = view;
  return (
    <section aria-labelledby="ft-record" className="space-y-4">
      <h2 id="ft-record" className="text-xl font-semibold">Conditions and method</h2>
      <dl className="grid grid-cols-1 gap-x-6 gap-y-2 text-sm sm:grid-cols-[10rem_1fr]">
        <dt className="text-slate">Kind</dt>
        <dd>{KINDS[view.kind].label}</dd>
        <dt className="text-slate">Date and time</dt>
        <dd className="figure">{formatTestedAt(test.testedAt)}</dd>
        <dt className="text-slate">Place</dt>
        <dd>{test.placeLabel}</dd>
        <dt className="text-slate">Sky and temperature</dt>
        <dd data-testid="ft-conditions">{conditionsOf(view) || '—'}</dd>
        <dt className="text-slate">Tested by</dt>
        <dd>{test.ownerName}</dd>
        <dt className="text-slate">Items</dt>
        <dd>
          <ul>
            {view.items.map((i) => (
              <li key={i.id}>
                {i.public ? <Link className="underline" href={gearPath(i.slug)}>{i.name}</Link> : i.name} <span className="text-slate">({i.maker})</span>
              </li>
            ))}
          </ul>
        </dd>
      </dl>
      <div>
        <h3 className="text-sm font-semibold">Instruments</h3>
        {test.instruments.length ? (
          <ul className="mt-1 list-disc pl-5 text-sm">
            {test.instruments.map((i, k) => (
              <li key={k}>
                {i.name}
                {i.accuracy ? <span className="text-slate"> — stated accuracy {i.accuracy}</span> : null}
              </li>
            ))}
          </ul>
        ) : (
          <p className="text-sm text-slate">None recorded.</p>
        )}
      </div>
      <div>
        <h3 className="text-sm font-semibold">Method</h3>
        <p className="mt-1 whitespace-pre-line text-sm">{test.methodNotes || '—'}</p>
      </div>
    </section>
  );
}

/** Results per item (mean ± sd, n) with the formula and standard used, linked to the method page. */
export function FieldTestResults({ view }: { view: FieldTestView }) {
  const name = (id: string) => view.items.find((i) => i.id === id)?.name ?? 'Item';
  return (
    <section aria-labelledby="ft-results" className="space-y-3">
      <h2 id="ft-results" className="text-xl font-semibold">Results</h2>
      {view.analysis.items.every((i) => i.summaries.length === 0) ? <p className="text-sm text-slate">No figures yet: add a trial.</p> : null}
      {view.analysis.items.map((item) =>
        item.summaries.length ? (
          <div key={item.itemId} className="overflow-x-auto rounded-lg border border-rule">
            <table className="w-full text-left text-sm" data-testid="ft-results">
              <caption className="bg-card px-3 py-2 text-left font-semibold">{name(item.itemId)}</caption>
              <thead className="text-xs uppercase tracking-wide text-slate">
                <tr>
                  <th scope="col" className="px-3 py-2">Figure</th>
                  <th scope="col" className="px-3 py-2">Measured (mean ± sd, n trials)</th>
                </tr>
              </thead>
              <tbody>
                {item.summaries.map((s) => (
                  <tr key={s.key} className="border-t border-rule" data-figure={s.key}>
                    <th scope="row" className="px-3 py-2 font-normal">{s.label}{s.specKey ? <span className="ml-1 text-xs text-slate">(becomes the item’s measured figure)</span> : null}</th>
                    <td className="figure px-3 py-2 font-semibold">{formatSummary(s)}</td>
                  </tr>
                ))}
              </tbody>
            </table>
          </div>
        ) : null,
      )}
      {view.analysis.methods.length ? (
        <div className="text-sm">
          <h3 className="font-semibold">Formula and standard used</h3>
          <ul className="mt-1 list-disc space-y-1 pl-5">
            {view.analysis.methods.map((m) => (
              <li key={m.id}>
                {m.text}{' '}
                <Link href={methodHref(m.id)} className="text-lichen underline">How we test</Link>
              </li>
            ))}
          </ul>
        </div>
      ) : null}
    </section>
  );
}

/** Each trial: chart (thinned copy, facts from every row), its figures and the parser's notes. */
export function FieldTestTrials({ view, children }: { view: FieldTestView; children?: (trialId: string) => React.ReactNode }) {
  const name = (id: string) => view.items.find((i) => i.id === id)?.name ?? 'Item';
  const conditions = KINDS[view.kind].weatherMatters ? conditionsOf(view) : undefined;
  return (
    <section aria-labelledby="ft-trials" className="space-y-6">
      <h2 id="ft-trials" className="text-xl font-semibold">Trials</h2>
      {view.trials.length === 0 ? <p className="text-sm text-slate">No trials yet.</p> : null}
      {view.trials.map((t, k) => {
        const title = `${name(t.itemId)} — ${t.label || `trial ${k + 1}`}`;
        return (
          <article key={t.id} className="space-y-2 rounded-lg border border-rule p-4" data-testid="ft-trial">
            <h3 className="font-semibold">{title}</h3>
            {t.rows > 0 ? (
              <p className="figure text-xs text-slate">
                {t.rows.toLocaleString('en-US')} readings{t.seriesMeta?.fileName ? ` from ${t.seriesMeta.fileName}` : t.seriesMeta?.source === 'typed' ? ', typed in' : ''}
                {t.switchedOnAt ? `; switched on ${formatTestedAt(t.switchedOnAt)}` : ''}; stored in {formatBytes(t.seriesBytes)}.
              </p>
            ) : null}
            {t.notes.length ? (
              <ul className="list-disc pl-5 text-sm text-slate">
                {t.notes.map((n) => (
                  <li key={n}>{n}</li>
                ))}
              </ul>
            ) : null}
            {t.analysis.ok ? (
              <>
                <TrialChart title={title} samples={t.chartSamples} chart={t.analysis.chart} conditions={conditions} />
                {t.analysis.figures.length ? (
                  <p className="figure text-sm" data-testid="ft-trial-figures">
                    {t.analysis.figures.map((f) => `${f.label}: ${formatFigure(f.value, f.unit, f.key)}`).join(' · ')}
                  </p>
                ) : null}
                {t.analysis.notes.map((n) => (
                  <p key={n} className="text-sm text-amber">{n}</p>
                ))}
              </>
            ) : (
              <p className="text-sm text-danger" role="alert">{t.analysis.error.message}</p>
            )}
            {children?.(t.id)}
          </article>
        );
      })}
    </section>
  );
}
