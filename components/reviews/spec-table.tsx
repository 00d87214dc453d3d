import Link from 'next/link';
import type { SpecTableItem } from '@/db/reviews';
import { formatSpec } from '@/lib/gear/format';
import { isSpecKey, SPEC_KEYS, SPECS } from '@/lib/measure';

/**
 * The table a `::spec-table[slug-a, slug-b]` directive asks for: one column per gear item, one row
 * per spec; measured figures solid (mean ± sd, n), claimed figures lighter and labelled "claimed".
 * Items the reader may not see, or unknown slugs, are named in a note instead.
 */
export function SpecTable({ items, missing }: { items: SpecTableItem[]; missing: string[] }) {
  const keys = SPEC_KEYS.filter((key) => items.some((item) => item.specs.some((s) => s.key === key && s.mode === '')));
  return (
    <figure className="my-6 max-w-full overflow-x-auto rounded-md border border-rule" data-testid="spec-table">
      {items.length > 0 ? (
        <table className="w-full border-collapse text-sm tabular-nums">
          <caption className="sr-only">Specs of {items.map((i) => `${i.maker} ${i.name}`).join(', ')}</caption>
          <thead className="bg-card">
            <tr>
              <th scope="col" className="sticky left-0 bg-card px-3 py-2 text-left font-semibold">
                Spec
              </th>
              {items.map((item) => (
                <th key={item.slug} scope="col" className="px-3 py-2 text-left font-semibold">
                  <Link href={`/gear/${encodeURIComponent(item.slug)}`} className="text-lichen underline underline-offset-2">
                    {item.maker} {item.name}
                  </Link>
                </th>
              ))}
            </tr>
          </thead>
          <tbody>
            {keys.map((key) => (
              <tr key={key} className="border-t border-rule">
                <th scope="row" className="sticky left-0 bg-paper px-3 py-2 text-left font-normal text-slate">
                  {SPECS[key].label}
                </th>
                {items.map((item) => {
                  const measured = item.specs.find((s) => s.key === key && s.mode === '' && s.basis === 'measured');
                  const claimed = item.specs.find((s) => s.key === key && s.mode === '' && s.basis === 'claimed');
                  return (
                    <td key={item.slug} className="px-3 py-2 align-top font-mono">
                      {measured && isSpecKey(measured.key) ? (
                        <div className="font-semibold">
                          {formatSpec(key, measured.value)}
                          {measured.sd !== null && measured.n && measured.n > 1 ? (
                            <span className="font-normal text-slate">
                              {' '}
                              ± {formatSpec(key, measured.sd)} (n = {measured.n})
                            </span>
                          ) : null}
                          <span className="sr-only"> measured</span>
                        </div>
                      ) : null}
                      {claimed ? (
                        <div className="text-slate">
                          {formatSpec(key, claimed.value)}{' '}
                          <span className="rounded border border-rule px-1 font-sans text-[0.7rem] uppercase tracking-wide">claimed</span>
                        </div>
                      ) : null}
                      {!measured && !claimed ? <span className="text-slate">—</span> : null}
                    </td>
                  );
                })}
              </tr>
            ))}
          </tbody>
        </table>
      ) : null}
      <figcaption className="border-t border-rule px-3 py-2 text-xs text-slate">
        Solid figures are measured on this site (the item page links each to its field test); lighter ones are the maker&apos;s claims.
        {missing.length ? ` Not shown (not published, or no such item): ${missing.join(', ')}.` : ''}
      </figcaption>
    </figure>
  );
}
