import type { Metadata } from 'next';
import Link from 'next/link';
import { LogbookFieldTests } from '@/components/field-tests/logbook-field-tests';
import { LogbookLongTermNotes } from '@/components/long-term-notes/logbook-long-term-notes';
import { StatusBadge } from '@/components/gear/status-badge';
import { getDb } from '@/db';
import { listGearInReview, listLogbookGear, type LogbookGearRow } from '@/db/gear';
import { requirePageRole } from '@/lib/auth/guard';
import { hasRole } from '@/lib/auth/roles';
import { CATEGORY_DEFS } from '@/lib/gear/categories';
import { gearEditPath, gearPath } from '@/lib/gear/paths';

export const metadata: Metadata = { title: 'Logbook' };

function GearRows({ rows, testId, editable }: { rows: LogbookGearRow[]; testId: string; editable: boolean }) {
  return (
    <div className="overflow-x-auto rounded-lg border border-rule">
      <table className="w-full text-left text-sm" data-testid={testId}>
        <thead className="bg-card text-xs uppercase tracking-wide text-slate">
          <tr>
            <th scope="col" className="px-3 py-2">Gear item</th>
            <th scope="col" className="px-3 py-2">Category</th>
            <th scope="col" className="px-3 py-2">State</th>
            <th scope="col" className="px-3 py-2">Last change</th>
            {editable ? <th scope="col" className="px-3 py-2"><span className="sr-only">Edit</span></th> : null}
          </tr>
        </thead>
        <tbody>
          {rows.map((row) => (
            <tr key={row.slug} className="border-t border-rule" data-slug={row.slug}>
              <th scope="row" className="px-3 py-2 font-semibold">
                <Link href={gearPath(row.slug)} className="hover:underline">
                  {row.name}
                </Link>
                <span className="block text-xs font-normal text-slate">{row.maker}</span>
              </th>
              <td className="px-3 py-2">{CATEGORY_DEFS[row.category]?.label ?? row.category}</td>
              <td className="px-3 py-2">
                <StatusBadge status={row.status} />
                {row.public && row.status !== 'approved' ? <span className="ml-2 text-xs text-slate">approved version public</span> : null}
              </td>
              <td className="px-3 py-2 figure text-slate">{row.updatedAt.toISOString().slice(0, 10)}</td>
              {editable ? (
                <td className="px-3 py-2 text-right">
                  {row.status !== 'in-review' ? (
                    <Link href={gearEditPath(row.slug)} className="text-lichen underline">
                      Edit
                    </Link>
                  ) : (
                    <span className="text-xs text-slate">locked in review</span>
                  )}
                </td>
              ) : null}
            </tr>
          ))}
        </tbody>
      </table>
    </div>
  );
}

export default async function LogbookPage() {
  const user = await requirePageRole('reviewer', '/logbook');
  const db = getDb();
  const mine = listLogbookGear(db, user.id);
  const waiting = hasRole(user, 'editor') ? listGearInReview(db) : [];
  return (
    <main className="mx-auto max-w-5xl px-4 py-10 sm:px-6">
      <div className="flex flex-wrap items-end justify-between gap-4">
        <div>
          <p className="font-mono text-xs uppercase tracking-[0.2em] text-lichen">Logbook</p>
          <h1 className="mt-1 text-3xl font-bold tracking-tight">{user.name}&apos;s gear items</h1>
        </div>
        <Link href="/logbook/gear/new" className="rounded-md bg-lichen px-4 py-2 font-semibold text-paper hover:bg-lichen-dark">
          Record a gear item
        </Link>
      </div>
      <section className="mt-8" aria-labelledby="mine">
        <h2 id="mine" className="sr-only">
          My gear items
        </h2>
        {mine.length ? (
          <GearRows rows={mine} testId="logbook-gear" editable />
        ) : (
          <p className="rounded-lg border border-dashed border-rule p-6 text-slate">No gear items yet. Record the first one with its claimed specs.</p>
        )}
      </section>
      <div className="mt-10">
        <LogbookFieldTests />
      </div>
      <div className="mt-10">
        <LogbookLongTermNotes />
      </div>
      <p className="mt-10 text-sm text-slate">
        Reviews are written under <Link href="/write" className="font-semibold text-lichen underline">Write</Link>.
      </p>
      {waiting.length ? (
        <section className="mt-10" aria-labelledby="waiting">
          <h2 id="waiting" className="text-xl font-bold">
            Gear items waiting for an editor
          </h2>
          <p className="mt-1 text-sm text-slate">Open one to approve it or send it back with a comment.</p>
          <div className="mt-4">
            <GearRows rows={waiting} testId="gear-in-review" editable={false} />
          </div>
        </section>
      ) : null}
    </main>
  );
}
