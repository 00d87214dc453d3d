'use client';

import { createColumnHelper, tableFeatures, useTable } from '@tanstack/react-table';
import Link from 'next/link';
import { Fragment, useMemo } from 'react';
import type { ShownRow, SideBySideView } from '@/lib/side-by-side/table-model';

const features = tableFeatures({});
const helper = createColumnHelper<typeof features, ShownRow>();

const DIRECTION_TEXT = { higher: 'higher is better', lower: 'lower is better' } as const;
const BASIS_MARK = { measured: 'M', claimed: 'C', mixed: 'M+C' } as const;
const BASIS_TEXT = { measured: 'measured', claimed: 'claimed', mixed: 'measured and claimed figures' } as const;

interface Props {
  view: SideBySideView;
  onMove: (index: number, delta: -1 | 1) => void;
  onRemove: (slug: string) => void;
}

/** The side-by-side as a table: one column per item, rows grouped; best cells marked with ★ and text. */
export function SideBySideTable({ view, onMove, onRemove }: Props) {
  const data = useMemo(() => view.groups.flatMap((g) => g.rows), [view]);
  const columns = useMemo(
    () =>
      helper.columns([
        helper.display({
          id: 'figure',
          header: () => <span className="text-xs uppercase tracking-wide text-slate">Figure</span>,
          cell: ({ row }) => (
            <>
              <span className="font-semibold">{row.original.label}</span>
              {row.original.unit ? <span className="ml-1 font-normal text-slate">({row.original.unit})</span> : null}
              {row.original.direction ? <span className="block text-xs font-normal text-slate">{DIRECTION_TEXT[row.original.direction]}</span> : null}
            </>
          ),
        }),
        ...view.columns.map((item, index) =>
          helper.display({
            id: `item-${item.slug}`,
            header: () => (
              <div className="flex min-w-28 flex-col gap-1 sm:min-w-36">
                <span className="text-xs font-normal text-slate">{item.maker}</span>
                <Link href={`/gear/${encodeURIComponent(item.slug)}`} className="font-semibold hover:underline">
                  {item.name}
                </Link>
                <div className="flex gap-1 print:hidden" role="group" aria-label={`Arrange ${item.name}`}>
                  <button
                    type="button"
                    onClick={() => onMove(index, -1)}
                    disabled={index === 0}
                    className="rounded border border-rule px-2 py-0.5 text-xs hover:bg-paper disabled:opacity-40"
                    aria-label={`Move ${item.name} left`}
                  >
                    ←
                  </button>
                  <button
                    type="button"
                    onClick={() => onMove(index, 1)}
                    disabled={index === view.columns.length - 1}
                    className="rounded border border-rule px-2 py-0.5 text-xs hover:bg-paper disabled:opacity-40"
                    aria-label={`Move ${item.name} right`}
                  >
                    →
                  </button>
                  <button
                    type="button"
                    onClick={() => onRemove(item.slug)}
                    className="rounded border border-rule px-2 py-0.5 text-xs hover:bg-paper"
                    aria-label={`Remove ${item.name}`}
                  >
                    ✕
                  </button>
                </div>
              </div>
            ),
            cell: ({ row }) => {
              const cell = row.original.cells[index]!;
              if (cell.text === '') return <span className="text-slate" aria-label="no figure">—</span>;
              return (
                <span className="flex flex-wrap items-baseline gap-x-1.5">
                  <span className="figure font-mono" data-testid="cell-text">
                    {cell.text}
                  </span>
                  {cell.basis ? (
                    cell.provenance ? (
                      <Link href={cell.provenance} className="font-mono text-[0.7rem] text-slate underline" title={`${BASIS_TEXT[cell.basis]}: see the field test`}>
                        {BASIS_MARK[cell.basis]}
                        <span className="sr-only"> ({BASIS_TEXT[cell.basis]}, field test)</span>
                      </Link>
                    ) : (
                      <span className="font-mono text-[0.7rem] text-slate" title={BASIS_TEXT[cell.basis]}>
                        {BASIS_MARK[cell.basis]}
                        <span className="sr-only"> ({BASIS_TEXT[cell.basis]})</span>
                      </span>
                    )
                  ) : null}
                  {cell.best ? (
                    <span className="font-semibold text-lichen" data-testid="best-mark">
                      <span aria-hidden="true">★</span>
                      <span className="sr-only">best in this row</span>
                    </span>
                  ) : null}
                </span>
              );
            },
          }),
        ),
      ]),
    [view.columns, onMove, onRemove],
  );
  const table = useTable({ features, columns, data, getRowId: (row) => `${row.groupId}:${row.key}` });
  const rowsById = new Map(table.getRowModel().rows.map((r) => [r.id, r]));
  const columnCount = view.columns.length + 1;

  return (
    <div className="relative max-h-[80vh] overflow-auto rounded-lg border border-rule print:max-h-none print:overflow-visible print:border-0" tabIndex={0} role="region" aria-label="Side-by-side table (scrolls)">
      <table className="w-full border-separate border-spacing-0 text-left text-sm" data-testid="side-by-side-table">
        <caption className="sr-only">
          Side-by-side of {view.columns.length} gear items. ★ marks the best value in a row; M measured, C claimed.
        </caption>
        <thead>
          {table.getHeaderGroups().map((group) => (
            <tr key={group.id}>
              {group.headers.map((header, i) => (
                <th
                  key={header.id}
                  scope="col"
                  className={`sticky top-0 border-b border-rule bg-card px-3 py-2 align-bottom print:static ${i === 0 ? 'left-0 z-30 min-w-32 sm:min-w-40' : 'z-20'}`}
                >
                  {header.isPlaceholder ? null : <table.FlexRender header={header} />}
                </th>
              ))}
            </tr>
          ))}
        </thead>
        <tbody>
          {view.groups.map((group) => (
            <Fragment key={group.id}>
              <tr>
                <th colSpan={columnCount} scope="colgroup" className="border-b border-rule bg-paper px-3 pb-1 pt-4 text-left font-mono text-xs uppercase tracking-[0.15em] text-lichen">
                  {group.label}
                </th>
              </tr>
              {group.rows.map((shown) => {
                const row = rowsById.get(`${shown.groupId}:${shown.key}`);
                if (!row) return null;
                return (
                  <tr key={row.id} data-testid={`row-${shown.key}`}>
                    {row.getAllCells().map((cell, i) => {
                      const best = i > 0 && shown.cells[i - 1]!.best;
                      return i === 0 ? (
                        <th key={cell.id} scope="row" className="sticky left-0 z-10 border-b border-rule bg-paper px-3 py-2 align-top font-normal print:static">
                          <table.FlexRender cell={cell} />
                        </th>
                      ) : (
                        <td key={cell.id} className={`border-b border-rule px-3 py-2 align-top ${best ? 'bg-lichen-tint font-semibold' : ''}`}>
                          <table.FlexRender cell={cell} />
                        </td>
                      );
                    })}
                  </tr>
                );
              })}
            </Fragment>
          ))}
        </tbody>
      </table>
    </div>
  );
}
