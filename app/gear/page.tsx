import type { Metadata } from 'next';
import Link from 'next/link';
import { getDb } from '@/db';
import { listPublicGear } from '@/db/gear';
import { CATEGORY_LIST, kindLabel } from '@/lib/gear/categories';
import { formatMoney, formatQuantity } from '@/lib/gear/format';
import { gearPath } from '@/lib/gear/paths';

export const metadata: Metadata = { title: 'Gear' };
export const dynamic = 'force-dynamic';

export default function GearPage() {
  const items = listPublicGear(getDb());
  return (
    <main className="mx-auto max-w-5xl px-4 py-10 sm:px-6">
      <h1 className="text-3xl font-bold tracking-tight">Gear</h1>
      <p className="mt-2 max-w-2xl text-slate">Every approved gear item, by category, with its mass (measured where tested, else claimed) and the price paid.</p>
      {items.length === 0 ? <p className="mt-8 text-slate">No approved gear items yet.</p> : null}
      {CATEGORY_LIST.map((def) => {
        const rows = items.filter((i) => i.category === def.id);
        if (rows.length === 0) return null;
        return (
          <section key={def.id} aria-labelledby={`cat-${def.id}`} className="mt-10">
            <h2 id={`cat-${def.id}`} className="text-xl font-bold">
              {def.plural} <span className="text-sm font-normal text-slate">({rows.length})</span>
            </h2>
            <ul className="mt-3 divide-y divide-rule rounded-lg border border-rule" data-testid={`gear-list-${def.id}`}>
              {rows.map((row) => (
                <li key={row.slug} className="flex flex-wrap items-baseline justify-between gap-x-6 gap-y-1 px-4 py-3">
                  <div>
                    <Link href={gearPath(row.slug)} className="font-semibold hover:underline">
                      {row.name}
                    </Link>
                    <span className="block text-sm text-slate">
                      {row.maker}
                      {row.kind ? ` · ${kindLabel(row.category, row.kind)}` : ''}
                    </span>
                  </div>
                  <div className="figure flex gap-6 font-mono text-sm">
                    <span>{row.massG !== null ? formatQuantity(row.massG, 'g') : '—'}</span>
                    <span className="text-slate">{row.price ? formatMoney(row.price) : '—'}</span>
                  </div>
                </li>
              ))}
            </ul>
          </section>
        );
      })}
    </main>
  );
}
