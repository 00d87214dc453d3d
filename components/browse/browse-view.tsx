'use client';

import { useInfiniteQuery, type InfiniteData } from '@tanstack/react-query';
import { debounce, parseAsString, useQueryStates } from 'nuqs';
import { useEffect, useId, useMemo, useState } from 'react';
import type { GearListResponse } from '@/lib/browse/contract';
import { CATEGORY_DEFS, CATEGORY_LIST } from '@/lib/gear/categories';
import { isCategory } from '@/lib/measure';
import { BROWSE_FIXED_KEYS, browseApiQuery } from './browse-params';
import { fetchJson } from './fetch-json';
import { GearCard, GearCardSkeleton } from './gear-card';
import { UnitsToggle } from '../units-toggle';
import type { UnitSystem } from '@/lib/units/display';
import { filterUnit } from '@/lib/units/filter';
import { RangeFilter } from './range-filter';
import { offersRadioQuiet, RadioQuietFilterChips } from './radio-quiet-filter';
import { FeatureFilterChecklist } from './feature-filter';
import { featureKeysOutside } from '@/lib/browse/feature-filters';
import { BROWSE_CURRENCIES, sortOptions } from './sort-options';

interface Props {
  /** The API query the server rendered, and its answer (or the API's message when the link is bad). */
  initial: { query: string; data: GearListResponse | null; error: string | null };
  /** The reader's site-wide display units (header toggle). */
  units: UnitSystem;
}

const fixedParsers = Object.fromEntries(BROWSE_FIXED_KEYS.map((k) => [k, parseAsString])) as Record<(typeof BROWSE_FIXED_KEYS)[number], typeof parseAsString>;
const TYPED = new Set(['q', 'min.mass', 'max.mass']);

/** The value once it has stopped changing for `ms`: typing in a filter sends one request, not one per key. */
function useSettled<T>(value: T, ms: number): T {
  const [settled, setSettled] = useState(value);
  useEffect(() => {
    const timer = setTimeout(() => setSettled(value), ms);
    return () => clearTimeout(timer);
  }, [value, ms]);
  return settled;
}

export function BrowseView({ initial, units }: Props) {
  const [fixed, setFixed] = useQueryStates(fixedParsers, { history: 'replace' });
  const sortKey = fixed.sort;
  const rangeParsers = useMemo(
    () => (sortKey && sortKey !== 'mass' ? { [`min.${sortKey}`]: parseAsString, [`max.${sortKey}`]: parseAsString } : {}),
    [sortKey],
  );
  const [ranges, setRanges] = useQueryStates(rangeParsers, { history: 'replace' });
  const values: Record<string, string | null> = { ...fixed, ...ranges };
  const apiQuery = useSettled(browseApiQuery(values, units), 250);
  const imperial = units === 'imperial';
  const category = fixed.category && isCategory(fixed.category) ? fixed.category : null;
  const options = sortOptions(category, fixed.currency);
  const sort = options.find((o) => o.key === sortKey) ?? null;

  const query = useInfiniteQuery<GearListResponse, Error, InfiniteData<GearListResponse, string | null>, string[], string | null>({
    queryKey: ['gear-list', apiQuery],
    queryFn: ({ pageParam, signal }) => fetchJson<GearListResponse>(`/api/v1/gear?${apiQuery}${pageParam ? `&cursor=${encodeURIComponent(pageParam)}` : ''}`, signal),
    initialPageParam: null,
    getNextPageParam: (last) => last.nextCursor,
    initialData: apiQuery === initial.query && initial.data ? { pages: [initial.data], pageParams: [null] } : undefined,
    placeholderData: (previous) => previous,
    retry: (count, error) => count < 1 && !/^Query parameter/.test(error.message),
  });
  const serverError = apiQuery === initial.query ? initial.error : null;
  const first = query.data?.pages[0];
  const items = query.data?.pages.flatMap((p) => p.items) ?? [];
  const total = first?.total ?? 0;
  const allCount = first?.facets.all ?? first?.facets.categories.reduce((n, c) => n + c.count, 0) ?? 0;
  const error = serverError ?? (query.isError ? query.error.message : null);

  /** Sets one parameter; a money figure brings a currency with it (the API needs one). */
  const set = (key: string, value: string | null) => {
    const v = value === '' ? null : value;
    if (key.startsWith('min.') || key.startsWith('max.')) {
      if (key === 'min.mass' || key === 'max.mass') void setFixed({ [key]: v }, { limitUrlUpdates: debounce(400) });
      else void setRanges({ [key]: v }, { limitUrlUpdates: debounce(400) });
      return;
    }
    const next: Record<string, string | null> = { [key]: v };
    if (key === 'category') {
      next.kind = null;
      if (v === null || !sortOptions(v, null).some((o) => o.key === fixed.sort)) next.sort = null;
      if (!offersRadioQuiet(v)) next.radioQuiet = null;
      for (const k of featureKeysOutside(v)) next[k] = null;
    }
    if (key === 'sort') {
      next.order = null;
      if (v && sortOptions(category, null).find((o) => o.key === v)?.money && !fixed.currency) next.currency = 'USD';
    }
    void setFixed(next, TYPED.has(key) ? { limitUrlUpdates: debounce(300) } : undefined);
  };

  const [formKey, setFormKey] = useState(0);
  const [filtersOpen, setFiltersOpen] = useState(false);
  const activeFilters = Object.entries(values).filter(([k, v]) => v && k !== 'sort' && k !== 'order').length;
  const clearAll = () => {
    void setFixed(Object.fromEntries(BROWSE_FIXED_KEYS.map((k) => [k, null])));
    void setRanges(Object.fromEntries(Object.keys(rangeParsers).map((k) => [k, null])));
    setFormKey((n) => n + 1); // typed inputs are uncontrolled: remount them empty
  };

  const ids = { q: useId(), kind: useId(), sort: useId(), order: useId(), currency: useId() };
  const field = 'w-full rounded-md border border-rule bg-paper px-2 py-1.5 text-sm';
  const kinds = category ? CATEGORY_DEFS[category].kinds : [];
  const moneyInUse = sort?.money || Boolean(values['min.price'] || values['max.price']);

  return (
    <div className="grid gap-4 lg:grid-cols-[17rem_1fr] lg:gap-8">
      <button
        type="button"
        className="rounded-md border border-rule px-3 py-2 text-left text-sm font-semibold lg:hidden"
        aria-expanded={filtersOpen}
        aria-controls="browse-filters"
        onClick={() => setFiltersOpen((o) => !o)}
      >
        {filtersOpen ? 'Hide filters' : 'Filters and sort'}
        {activeFilters > 0 ? ` (${activeFilters} active)` : ''}
      </button>
      <form
        key={formKey}
        id="browse-filters"
        role="search"
        aria-label="Filter gear"
        className={`space-y-5 text-sm lg:block ${filtersOpen ? '' : 'hidden'}`} onSubmit={(e) => e.preventDefault()}>
        <fieldset>
          <legend className="mb-2 font-semibold">Category</legend>
          <ul className="space-y-1" data-testid="category-facets">
            <li>
              <label className="flex items-center gap-2">
                <input type="radio" name="category" checked={!category} onChange={() => set('category', null)} />
                All gear <span className="ml-auto font-mono text-xs text-slate">{allCount}</span>
              </label>
            </li>
            {(first?.facets.categories ?? []).map((c) => (
              <li key={c.id}>
                <label className="flex items-center gap-2">
                  <input type="radio" name="category" value={c.id} checked={category === c.id} onChange={() => set('category', c.id)} />
                  {c.label} <span className="ml-auto font-mono text-xs text-slate">{c.count}</span>
                </label>
              </li>
            ))}
          </ul>
        </fieldset>

        {kinds.length > 0 ? (
          <div>
            <label htmlFor={ids.kind} className="mb-1 block font-semibold">
              Kind
            </label>
            <select id={ids.kind} className={field} value={fixed.kind ?? ''} onChange={(e) => set('kind', e.target.value)}>
              <option value="">Any kind</option>
              {kinds.map((k) => (
                <option key={k.id} value={k.id}>
                  {k.label}
                </option>
              ))}
            </select>
          </div>
        ) : null}

        <div>
          <label htmlFor={ids.q} className="mb-1 block font-semibold">
            Name or maker
          </label>
          <input id={ids.q} type="search" className={field} defaultValue={fixed.q ?? ''} onChange={(e) => set('q', e.target.value)} maxLength={100} />
        </div>

        <RangeFilter
          key={`mass-${units}-${category}`}
          label="Mass"
          typedUnit={filterUnit('g', units, category)}
          canonicalUnit="g"
          min={fixed['min.mass']}
          max={fixed['max.mass']}
          onChange={(bound, v) => set(`${bound}.mass`, v)}
          className={field}
          nonNegative
        />

        <FeatureFilterChecklist category={category} values={fixed} onChange={set} />

        {offersRadioQuiet(category) ? <RadioQuietFilterChips value={fixed.radioQuiet} onChange={(v) => set('radioQuiet', v)} /> : null}

        <div className="grid gap-3">
          <div>
            <label htmlFor={ids.sort} className="mb-1 block font-semibold">
              Sort by
            </label>
            <select id={ids.sort} className={field} value={sortKey ?? ''} onChange={(e) => set('sort', e.target.value)}>
              <option value="">Name (A–Z)</option>
              {options.map((o) => (
                <option key={o.key} value={o.key}>
                  {o.label}
                  {o.unit && o.unit !== 'ratio' ? ` (${o.unit})` : ''}
                </option>
              ))}
            </select>
          </div>
          <div>
            <label htmlFor={ids.order} className="mb-1 block font-semibold">
              Order
            </label>
            <select id={ids.order} className={field} value={fixed.order ?? ''} onChange={(e) => set('order', e.target.value)} disabled={!sortKey}>
              <option value="">Best first</option>
              <option value="asc">Lowest first</option>
              <option value="desc">Highest first</option>
            </select>
          </div>
        </div>
        {!category ? <p className="-mt-3 text-xs text-slate">Choose a category to sort by its output, capacity and value ratios.</p> : null}

        {sort && sort.key !== 'mass' ? (
          <RangeFilter
            key={`${sort.key}-${units}`}
            label={sort.label}
            typedUnit={filterUnit(sort.unit, units, category)}
            canonicalUnit={sort.unit}
            min={values[`min.${sort.key}`]}
            max={values[`max.${sort.key}`]}
            onChange={(bound, v) => set(`${bound}.${sort.key}`, v)}
            className={field}
          />
        ) : null}

        <div>
          <label htmlFor={ids.currency} className="mb-1 block font-semibold">
            Currency
          </label>
          <select id={ids.currency} className={field} value={fixed.currency ?? ''} onChange={(e) => set('currency', e.target.value)} aria-describedby={`${ids.currency}-hint`}>
            <option value="" disabled={moneyInUse}>
              Any currency
            </option>
            {BROWSE_CURRENCIES.map((c) => (
              <option key={c} value={c}>
                {c}
              </option>
            ))}
          </select>
          <p id={`${ids.currency}-hint`} className="mt-1 text-xs text-slate">
            Prices and per-money ratios compare only items bought in one currency.
          </p>
        </div>

        <fieldset className="space-y-1">
          <legend className="mb-1 font-semibold">Show only</legend>
          <label className="flex items-center gap-2">
            <input type="checkbox" checked={fixed.measured === 'only'} onChange={(e) => set('measured', e.target.checked ? 'only' : null)} />
            Measured figures (filters and sort)
          </label>
          <label className="flex items-center gap-2">
            <input type="checkbox" checked={fixed.reviewed === 'true'} onChange={(e) => set('reviewed', e.target.checked ? 'true' : null)} />
            Reviewed gear
          </label>
        </fieldset>

        <fieldset className="flex items-center gap-3">
          <legend className="mb-1 font-semibold">Units shown</legend>
          <UnitsToggle current={units} />
        </fieldset>

        <button type="button" onClick={clearAll} className="text-lichen underline">
          Clear all filters
        </button>
      </form>

      <section aria-labelledby="results-heading" aria-busy={query.isFetching || undefined}>
        <h2 id="results-heading" className="sr-only">
          Results
        </h2>
        <p className="text-sm text-slate" role="status" data-testid="result-count">
          {error
            ? ''
            : query.isPending
              ? 'Loading gear…'
              : `${total} ${total === 1 ? 'item' : 'items'}${sort ? `, by ${sort.label.charAt(0).toLowerCase()}${sort.label.slice(1)}` : ''}${
                  first && first.excludedOtherCurrency > 0 ? ` · ${first.excludedOtherCurrency} priced in other currencies left out` : ''
                }`}
        </p>
        {error ? (
          <div className="mt-4 rounded-md bg-danger-tint px-4 py-3 text-sm" data-testid="browse-error">
            <p className="font-semibold">These filters could not be applied.</p>
            <p className="mt-1">{error}</p>
            <p className="mt-2">
              <button type="button" className="underline" onClick={() => void query.refetch()}>
                Try again
              </button>{' '}
              or{' '}
              <button type="button" className="underline" onClick={clearAll}>
                clear the filters
              </button>
              .
            </p>
          </div>
        ) : query.isPending ? (
          <ul className="mt-4 space-y-3">
            {[0, 1, 2].map((i) => (
              <GearCardSkeleton key={i} />
            ))}
          </ul>
        ) : items.length === 0 ? (
          <div className="mt-4 rounded-lg border border-dashed border-rule p-6" data-testid="browse-empty">
            <p className="font-semibold">No gear matches these filters.</p>
            <p className="mt-1 text-sm text-slate">Widen a range, choose another category or clear the filters.</p>
          </div>
        ) : (
          <>
            <div className={query.isFetching && !query.isFetchingNextPage ? 'opacity-60' : undefined} data-testid="gear-results">
              {category || sort ? (
                <ol className="mt-4 space-y-3" data-testid={`gear-list-${category ?? 'all'}`}>
                  {items.map((item) => (
                    <GearCard key={item.slug} item={item} sort={sort} imperial={imperial} listedAs={category} />
                  ))}
                </ol>
              ) : (
                // Unfiltered and unsorted: the loaded items grouped by category, in the catalog's order.
                CATEGORY_LIST.map((def) => {
                  const rows = items.filter((i) => i.category === def.id);
                  if (rows.length === 0) return null;
                  return (
                    <section key={def.id} aria-labelledby={`cat-${def.id}`} className="mt-6">
                      <h3 id={`cat-${def.id}`} className="text-lg font-bold">
                        {def.plural}
                      </h3>
                      <ul className="mt-2 space-y-3" data-testid={`gear-list-${def.id}`}>
                        {rows.map((item) => (
                          <GearCard key={item.slug} item={item} sort={null} imperial={imperial} headingLevel={4} />
                        ))}
                      </ul>
                    </section>
                  );
                })
              )}
            </div>
            {query.hasNextPage ? (
              <button
                type="button"
                onClick={() => void query.fetchNextPage()}
                disabled={query.isFetchingNextPage}
                className="mt-4 rounded-md border border-rule px-4 py-2 text-sm font-semibold hover:bg-card"
              >
                {query.isFetchingNextPage ? 'Loading…' : `Load more (${items.length} of ${total} shown)`}
              </button>
            ) : null}
          </>
        )}
      </section>
    </div>
  );
}
