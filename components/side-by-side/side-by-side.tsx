'use client';

import { useQuery } from '@tanstack/react-query';
import Link from 'next/link';
import { parseAsString, parseAsStringLiteral, useQueryStates } from 'nuqs';
import { useCallback, useEffect, useMemo } from 'react';
import type { CompareResponse } from '@/lib/browse/contract';
import { moveInSelection, parseSelection, removeFromSelection, serializeSelection, MAX_SIDE_BY_SIDE } from '@/lib/side-by-side/selection';
import { sideBySideCsv, sideBySideView } from '@/lib/side-by-side/table-model';
import { fetchJson } from '../browse/fetch-json';
import { useStoredSelection, writeSelection } from './selection-store';
import { SideBySideTable } from './side-by-side-table';
import { UnitsToggle } from '../units-toggle';
import type { UnitSystem } from '@/lib/units/display';

const urlState = {
  items: parseAsString,
  equal: parseAsStringLiteral(['show', 'hide'] as const).withDefault('show'),
};

/** `units`: the reader's site-wide display units (header toggle, also offered here). */
export function SideBySide({ units }: { units: UnitSystem }) {
  const [state, setState] = useQueryStates(urlState, { history: 'replace' });
  const stored = useStoredSelection();
  const fromUrl = useMemo(() => parseSelection(state.items), [state.items]);
  const slugs = state.items === null ? stored.slugs : fromUrl;

  // The URL wins when it names items (a shared link); else the reader's stored selection fills it.
  useEffect(() => {
    if (state.items === null) {
      if (stored.slugs.length > 0) void setState({ items: serializeSelection(stored.slugs) });
    } else if (serializeSelection(fromUrl) !== serializeSelection(stored.slugs)) {
      writeSelection(fromUrl);
    }
  }, [state.items, fromUrl, stored.slugs, setState]);

  const setSlugs = useCallback(
    (next: string[]) => {
      writeSelection(next);
      void setState({ items: next.length > 0 ? serializeSelection(next) : null });
    },
    [setState],
  );
  const onMove = useCallback((index: number, delta: -1 | 1) => setSlugs(moveInSelection(slugs, index, delta)), [slugs, setSlugs]);
  const onRemove = useCallback((slug: string) => setSlugs(removeFromSelection(slugs, slug)), [slugs, setSlugs]);

  const query = useQuery({
    queryKey: ['compare', serializeSelection(slugs)],
    queryFn: ({ signal }) => fetchJson<CompareResponse>(`/api/v1/compare?items=${slugs.map(encodeURIComponent).join(',')}`, signal),
    enabled: slugs.length >= 2,
    placeholderData: (previous) => previous,
  });

  const view = useMemo(
    () => (query.data ? sideBySideView(query.data, { units, hideEqual: state.equal === 'hide' }) : null),
    [query.data, units, state.equal],
  );
  // While a new order is fetched, keep showing the table in the order asked for.
  const stale = query.data && serializeSelection(query.data.items.map((i) => i.slug)) !== serializeSelection(slugs);

  const exportCsv = () => {
    if (!view) return;
    const blob = new Blob([sideBySideCsv(view)], { type: 'text/csv;charset=utf-8' });
    const url = URL.createObjectURL(blob);
    const a = document.createElement('a');
    a.href = url;
    a.download = 'trailbench-side-by-side.csv';
    document.body.append(a);
    a.click();
    a.remove();
    URL.revokeObjectURL(url);
  };

  if (slugs.length < 2) {
    return (
      <div className="rounded-lg border border-dashed border-rule p-6" data-testid="side-by-side-empty">
        <p className="font-semibold">{slugs.length === 0 ? 'Nothing to compare yet.' : 'Add one more item to compare.'}</p>
        <p className="mt-1 text-sm text-slate">
          Use “Add to side-by-side” on the <Link href="/gear" className="text-lichen underline">browse page</Link>, an item page or the{' '}
          <Link href="/best-value" className="text-lichen underline">best-value line</Link>: up to {MAX_SIDE_BY_SIDE} items.
        </p>
      </div>
    );
  }

  return (
    <div className="space-y-4">
      <div className="flex flex-wrap items-center gap-x-6 gap-y-3 text-sm print:hidden">
        <span className="flex items-center gap-2">
          Units <UnitsToggle current={units} />
        </span>
        <label className="flex items-center gap-2">
          <input type="checkbox" checked={state.equal === 'hide'} onChange={(e) => void setState({ equal: e.target.checked ? 'hide' : null })} />
          Hide rows where all items are equal
        </label>
        <button type="button" onClick={exportCsv} disabled={!view} className="rounded-md border border-rule px-3 py-1.5 font-semibold hover:bg-card">
          Export CSV
        </button>
        <button type="button" onClick={() => window.print()} className="rounded-md border border-rule px-3 py-1.5 font-semibold hover:bg-card">
          Print
        </button>
      </div>

      {query.isError ? (
        <p className="rounded-md bg-danger-tint px-3 py-2 text-sm" data-testid="side-by-side-error">
          {query.error instanceof Error ? query.error.message : 'The side-by-side could not be loaded.'}{' '}
          <button type="button" className="underline" onClick={() => void query.refetch()}>
            Try again
          </button>
        </p>
      ) : null}
      {query.isPending ? (
        <p className="text-sm text-slate" role="status">
          Loading the side-by-side…
        </p>
      ) : null}
      {view ? (
        <div aria-busy={stale || undefined} className={stale ? 'opacity-60' : undefined}>
          <SideBySideTable view={view} onMove={onMove} onRemove={onRemove} />
          <p className="mt-2 text-xs text-slate">
            ★ best in its row (direction-aware) · M measured in a field test (links to it) · C the maker’s claim · M+C a ratio of measured and claimed figures
            {view.hiddenEqualRows > 0 ? ` · ${view.hiddenEqualRows} rows with equal values hidden` : ''}
          </p>
        </div>
      ) : null}
    </div>
  );
}
