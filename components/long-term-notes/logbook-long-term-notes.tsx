import Link from 'next/link';
import { getDb } from '@/db';
import { listOwnLongTermNotes } from '@/db/long-term-notes';
import { getCurrentUser } from '@/lib/auth/guard';
import { hasRole } from '@/lib/auth/roles';
import { gearPath } from '@/lib/gear/paths';
import { logbookNotePath } from '@/lib/long-term-notes/paths';
import { monthsInServiceText } from '@/lib/long-term-notes/render';
import { KindLabel } from './kind-label';
import { NoteStatus } from './status-badge';

/** The signed-in reviewer's own long-term notes with their state (a section of /logbook). Renders nothing for others. */
export async function LogbookLongTermNotes() {
  const user = await getCurrentUser();
  if (!user || !hasRole(user, 'reviewer')) return null;
  const rows = listOwnLongTermNotes(getDb(), user.id);
  return (
    <section aria-labelledby="long-term-notes" className="space-y-3">
      <h2 id="long-term-notes" className="text-xl font-semibold">
        Long-term notes
      </h2>
      <p className="text-sm text-slate">Add one from the page of an item you own or have tested (“Add a long-term note”).</p>
      {rows.length === 0 ? (
        <p className="text-sm text-slate">No long-term notes yet.</p>
      ) : (
        <div className="overflow-x-auto rounded-lg border border-rule">
          <table className="w-full text-left text-sm" data-testid="logbook-long-term-notes">
            <thead className="bg-card text-xs uppercase tracking-wide text-slate">
              <tr>
                <th scope="col" className="px-3 py-2">Note</th>
                <th scope="col" className="px-3 py-2">Gear item</th>
                <th scope="col" className="px-3 py-2">Kind</th>
                <th scope="col" className="px-3 py-2">State</th>
                <th scope="col" className="px-3 py-2">Dated</th>
              </tr>
            </thead>
            <tbody>
              {rows.map((r) => (
                <tr key={r.id} className="border-t border-rule align-top" data-long-term-note={r.id}>
                  <th scope="row" className="px-3 py-2 font-semibold">
                    <Link href={logbookNotePath(r.id)} className="hover:underline">
                      {r.title}
                    </Link>
                    <span className="block text-xs font-normal text-slate">{monthsInServiceText(r.monthsInService)}</span>
                    {r.sentBackComment ? <span className="block text-xs font-normal text-danger">Editor: {r.sentBackComment}</span> : null}
                  </th>
                  <td className="px-3 py-2">
                    <Link href={gearPath(r.item.slug)} className="hover:underline">
                      {r.item.name}
                    </Link>
                  </td>
                  <td className="px-3 py-2">
                    <KindLabel kind={r.kind} />
                  </td>
                  <td className="px-3 py-2">
                    <NoteStatus status={r.status} />
                  </td>
                  <td className="figure px-3 py-2 text-slate">
                    <time dateTime={r.notedOn}>{r.notedOn}</time>
                  </td>
                </tr>
              ))}
            </tbody>
          </table>
        </div>
      )}
    </section>
  );
}
