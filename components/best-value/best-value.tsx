'use client';

import { useQuery } from '@tanstack/react-query';
import Link from 'next/link';
import { debounce, parseAsString, parseAsStringLiteral, useQueryStates } from 'nuqs';
import { useCallback, useId, useMemo, useState } from 'react';
import { CATEGORY_LIST } from '@/lib/gear/categories';
import { formatNumber } from '@/lib/gear/format';
import { isCategory, type Category } from '@/lib/measure';
import { axisOptions, axisUnit, defaultAxes, findAxis, type AxisOption } from '@/lib/side-by-side/axes';
import { bestValuePlot, type PlotPoint } from '@/lib/side-by-side/frontier';
import { MAX_SIDE_BY_SIDE, sideBySidePath } from '@/lib/side-by-side/selection';
import { BROWSE_CURRENCIES } from '../browse/sort-options';
import { useStoredSelection } from '../side-by-side/selection-store';
import { BestValueChart } from './best-value-chart';
import { fetchAllGear } from './fetch-all-gear';
import type { UnitSystem } from '@/lib/units/display';

const PLOTTED = CATEGORY_LIST.filter((def) => axisOptions(def.id).length >= 2);

const urlState = {
  category: parseAsString.withDefault('light'),
  x: parseAsString,
  y: parseAsString,
  currency: parseAsString,
  q: parseAsString,
  measured: parseAsStringLiteral(['only'] as const),
};

function axisTitle(axis: AxisOption, currency: string | null, units: UnitSystem): string {
  const unit = axisUnit(axis, currency, units);
  return unit ? `${axis.label} (${unit})` : axis.label;
}

/** `units`: the reader's site-wide display units (header toggle). */
/** One axis picker: every spec and ratio of the category, with which direction is better. */
function AxisSelect(props: { id: string; label: string; className: string; options: readonly AxisOption[]; value: string; onChange: (key: string) => void }) {
  return (
    <div>
      <label htmlFor={props.id} className="mb-1 block font-semibold">
        {props.label}
      </label>
      <select id={props.id} className={props.className} value={props.value} onChange={(e) => props.onChange(e.target.value)}>
        {props.options.map((o) => (
          <option key={o.key} value={o.key}>
            {o.label} ({o.better === 'min' ? 'less is better' : 'more is better'})
          </option>
        ))}
      </select>
    </div>
  );
}

export function BestValue({ units }: { units: UnitSystem }) {
  const [state, setState] = useQueryStates(urlState, { history: 'replace' });
  const category: Category = isCategory(state.category) ? state.category : 'light';
  const defaults = defaultAxes(category);
  const xKey = findAxis(category, state.x) ? state.x! : defaults.x;
  const yKey = findAxis(category, state.y) ? state.y! : defaults.y;
  // Stable per key: the chart is memoised on them (see BestValueChart).
  const xAxis = useMemo(() => findAxis(category, xKey)!, [category, xKey]);
  const yAxis = useMemo(() => findAxis(category, yKey)!, [category, yKey]);
  const needsCurrency = xAxis.money || yAxis.money;
  const currency = needsCurrency ? (state.currency ?? 'USD') : null;

  const apiParams = useMemo(() => {
    const p = new URLSearchParams({ category });
    if (state.q) p.set('q', state.q);
    if (state.measured) p.set('measured', 'only');
    // Sorting by a money axis makes the API leave out (and count) items priced in other currencies.
    const moneyAxis = [xAxis, yAxis].find((a) => a.money);
    if (moneyAxis && currency) {
      p.set('sort', moneyAxis.key);
      p.set('currency', currency);
    }
    return p;
  }, [category, state.q, state.measured, xAxis, yAxis, currency]);

  const query = useQuery({
    queryKey: ['best-value', apiParams.toString()],
    queryFn: ({ signal }) => fetchAllGear(apiParams, signal),
    placeholderData: (previous) => previous,
  });

  const plot = useMemo(
    () => (query.data ? bestValuePlot(query.data.items, { x: xAxis, y: yAxis }, { currency, units }) : null),
    [query.data, xAxis, yAxis, currency, units],
  );

  const [activeSlug, setActiveSlug] = useState<string | null>(null);
  const [announcement, setAnnouncement] = useState('');
  const selection = useStoredSelection();
  const xUnit = axisUnit(xAxis, currency, units);
  const yUnit = axisUnit(yAxis, currency, units);
  const describe = useCallback(
    (p: PlotPoint) =>
      `${p.maker} ${p.name}: ${formatNumber(p.x)}${xUnit ? ` ${xUnit}` : ''} ${xAxis.label.toLowerCase()}, ${formatNumber(p.y)}${yUnit ? ` ${yUnit}` : ''} ${yAxis.label.toLowerCase()}${
        p.onFront ? ', on the best-value line' : ''
      }`,
    [xAxis, yAxis, xUnit, yUnit],
  );
  const { add } = selection;
  const choose = useCallback((p: PlotPoint) => {
    const result = add(p.slug);
    setActiveSlug(p.slug);
    setAnnouncement(
      result.ok
        ? `${p.name} added to the side-by-side (${result.slugs.length} of ${MAX_SIDE_BY_SIDE}).`
        : result.reason === 'present'
          ? `${p.name} is already in the side-by-side.`
          : `The side-by-side holds ${MAX_SIDE_BY_SIDE} items: remove one first.`,
    );
  }, [add]);
  const active = plot?.points.find((p) => p.slug === activeSlug) ?? null;

  const ids = { category: useId(), x: useId(), y: useId(), currency: useId(), q: useId() };
  const field = 'w-full rounded-md border border-rule bg-paper px-2 py-1.5 text-sm';
  const options = axisOptions(category);
  const xTitle = axisTitle(xAxis, currency, units);
  const yTitle = axisTitle(yAxis, currency, units);

  return (
    <div className="space-y-6">
      <form className="grid gap-3 text-sm sm:grid-cols-2 lg:grid-cols-6" onSubmit={(e) => e.preventDefault()} aria-label="Plot settings">
        <div>
          <label htmlFor={ids.category} className="mb-1 block font-semibold">
            Category
          </label>
          <select id={ids.category} className={field} value={category} onChange={(e) => void setState({ category: e.target.value, x: null, y: null })}>
            {PLOTTED.map((def) => (
              <option key={def.id} value={def.id}>
                {def.plural}
              </option>
            ))}
          </select>
        </div>
        <AxisSelect id={ids.x} label="Across (x)" className={field} options={options} value={xAxis.key} onChange={(key) => void setState({ x: key })} />
        <AxisSelect id={ids.y} label="Up (y)" className={field} options={options} value={yAxis.key} onChange={(key) => void setState({ y: key })} />
        {needsCurrency ? (
          <div>
            <label htmlFor={ids.currency} className="mb-1 block font-semibold">
              Currency
            </label>
            <select id={ids.currency} className={field} value={currency ?? 'USD'} onChange={(e) => void setState({ currency: e.target.value })}>
              {BROWSE_CURRENCIES.map((c) => (
                <option key={c} value={c}>
                  {c}
                </option>
              ))}
            </select>
          </div>
        ) : null}
        <div>
          <label htmlFor={ids.q} className="mb-1 block font-semibold">
            Name or maker
          </label>
          <input id={ids.q} type="search" className={field} defaultValue={state.q ?? ''} maxLength={100} onChange={(e) => void setState({ q: e.target.value || null }, { limitUrlUpdates: debounce(300) })} />
        </div>
        <fieldset className="space-y-1">
          <legend className="mb-1 font-semibold">Figures</legend>
          <label className="flex items-center gap-2">
            <input type="checkbox" checked={state.measured === 'only'} onChange={(e) => void setState({ measured: e.target.checked ? 'only' : null })} />
            Measured only
          </label>

        </fieldset>
      </form>

      {query.isError ? (
        <div className="rounded-md bg-danger-tint px-4 py-3 text-sm" data-testid="best-value-error">
          <p className="font-semibold">The plot could not be loaded.</p>
          <p className="mt-1">{query.error.message}</p>
          <button type="button" className="mt-2 underline" onClick={() => void query.refetch()}>
            Try again
          </button>
        </div>
      ) : null}
      {query.isPending ? (
        <p className="text-sm text-slate" role="status">
          Loading the items…
        </p>
      ) : null}

      {plot ? (
        <div className="grid gap-6 lg:grid-cols-[1fr_18rem]" aria-busy={query.isFetching || undefined}>
          <figure className="min-w-0">
            <figcaption className="mb-1 text-sm font-semibold">
              {yAxis.label} against {xAxis.label.toLowerCase()}: {plot.points.length} items, {plot.front.length} on the best-value line
            </figcaption>
            {plot.points.length === 0 ? (
              <p className="rounded-lg border border-dashed border-rule p-6 text-sm" data-testid="best-value-empty">
                No item has both figures. Choose other axes or clear the name filter.
              </p>
            ) : (
              <BestValueChart
                points={plot.points}
                front={plot.front}
                xLabel={xTitle}
                yLabel={yTitle}
                onActivate={setActiveSlug}
                onChoose={choose}
                describe={describe}
              />
            )}
            <p className="mt-1 text-xs text-slate">
              <span aria-hidden="true">◆</span> on the best-value line (no other item is better on both axes) · <span aria-hidden="true">○</span> other items. Tab to a point to
              read it; Enter adds it to the side-by-side.
            </p>
          </figure>

          <aside className="space-y-4 text-sm">
            <div className="min-h-24 rounded-lg border border-rule p-3" aria-live="polite" data-testid="active-point">
              {active ? (
                <>
                  <p className="font-semibold">
                    <Link href={active.path} className="hover:underline">
                      {active.maker} {active.name}
                    </Link>
                  </p>
                  <p className="figure font-mono">
                    {formatNumber(active.x)} {xUnit} · {formatNumber(active.y)} {yUnit}
                  </p>
                  <p className="text-slate">{active.onFront ? '◆ On the best-value line' : '○ Beaten on both axes by an item on the line'}</p>
                </>
              ) : (
                <p className="text-slate">Point at or tab to an item to see it here.</p>
              )}
              <p className="mt-1 text-lichen" role="status">
                {announcement}
              </p>
            </div>
            <section aria-labelledby="front-heading">
              <h2 id="front-heading" className="font-semibold">
                On the best-value line
              </h2>
              <ol className="mt-1 list-decimal space-y-1 pl-5" data-testid="frontier-list">
                {plot.front.map((p) => (
                  <li key={p.slug} data-testid="frontier-item">
                    <Link href={p.path} className="hover:underline">
                      {p.maker} {p.name}
                    </Link>
                  </li>
                ))}
              </ol>
            </section>
            {selection.slugs.length > 0 ? (
              <Link href={sideBySidePath(selection.slugs)} className="inline-block font-semibold text-lichen underline">
                Open the side-by-side ({selection.slugs.length})
              </Link>
            ) : null}
            {query.data && query.data.excludedOtherCurrency > 0 ? (
              <p className="text-xs text-slate">
                {query.data.excludedOtherCurrency === 1
                  ? '1 item priced in another currency is left out.'
                  : `${query.data.excludedOtherCurrency} items priced in other currencies are left out.`}
              </p>
            ) : null}
            {plot.missing.length > 0 ? (
              <p className="text-xs text-slate">
                Not plotted (missing a figure): {plot.missing.map((m) => `${m.maker} ${m.name}`).join(', ')}.
              </p>
            ) : null}
          </aside>
        </div>
      ) : null}

      {plot && plot.points.length > 0 ? (
        <details className="rounded-lg border border-rule">
          <summary className="cursor-pointer px-4 py-2 text-sm font-semibold">The plotted items as a table</summary>
          <div className="overflow-x-auto">
            <table className="w-full text-left text-sm" data-testid="best-value-table">
              <caption className="sr-only">Plotted items with their figures and whether they are on the best-value line</caption>
              <thead className="bg-card text-xs uppercase tracking-wide text-slate">
                <tr>
                  <th scope="col" className="px-3 py-2">
                    Item
                  </th>
                  <th scope="col" className="px-3 py-2">
                    {xTitle}
                  </th>
                  <th scope="col" className="px-3 py-2">
                    {yTitle}
                  </th>
                  <th scope="col" className="px-3 py-2">
                    Best-value line
                  </th>
                  <th scope="col" className="px-3 py-2">
                    <span className="sr-only">Side-by-side</span>
                  </th>
                </tr>
              </thead>
              <tbody>
                {[...plot.points]
                  .sort((a, b) => a.x - b.x)
                  .map((p) => (
                    <tr key={p.slug} className="border-t border-rule">
                      <th scope="row" className="px-3 py-2 font-semibold">
                        <Link href={p.path} className="hover:underline">
                          {p.maker} {p.name}
                        </Link>
                      </th>
                      <td className="figure px-3 py-2 font-mono">{formatNumber(p.x)}</td>
                      <td className="figure px-3 py-2 font-mono">{formatNumber(p.y)}</td>
                      <td className="px-3 py-2">{p.onFront ? '◆ yes' : 'no'}</td>
                      <td className="px-3 py-2">
                        <button type="button" className="rounded border border-rule px-2 py-0.5 text-xs hover:bg-card" onClick={() => choose(p)}>
                          Add<span className="sr-only"> {p.name}</span> to side-by-side
                        </button>
                      </td>
                    </tr>
                  ))}
              </tbody>
            </table>
          </div>
        </details>
      ) : null}
    </div>
  );
}
