import Link from 'next/link';
import { getDb } from '@/db';
import { listOwnFieldTests } from '@/db/field-tests-view';
import { getCurrentUser } from '@/lib/auth/guard';
import { hasRole } from '@/lib/auth/roles';
import { KINDS } from '@/lib/field-tests/kinds';
import { FieldTestStatus } from './status-badge';

/** The signed-in reviewer's own field tests with their state (a section of /logbook). Renders nothing for others. */
export async function LogbookFieldTests() {
  const user = await getCurrentUser();
  if (!user || !hasRole(user, 'reviewer')) return null;
  const rows = listOwnFieldTests(getDb(), user.id);
  return (
    <section aria-labelledby="logbook-field-tests" className="space-y-3">
      <div className="flex flex-wrap items-baseline justify-between gap-2">
        <h2 id="logbook-field-tests" className="text-xl font-semibold">Field tests</h2>
        <Link href="/logbook/field-tests/new" className="text-sm font-semibold text-lichen underline">Log a field test</Link>
      </div>
      {rows.length === 0 ? (
        <p className="text-sm text-slate">No field tests yet.</p>
      ) : (
        <div className="overflow-x-auto rounded-lg border border-rule">
          <table className="w-full text-left text-sm" data-testid="logbook-field-tests">
            <thead className="bg-card text-xs uppercase tracking-wide text-slate">
              <tr>
                <th scope="col" className="px-3 py-2">Test</th>
                <th scope="col" className="px-3 py-2">Items</th>
                <th scope="col" className="px-3 py-2">State</th>
                <th scope="col" className="px-3 py-2">Tested</th>
              </tr>
            </thead>
            <tbody>
              {rows.map((r) => (
                <tr key={r.id} className="border-t border-rule" data-field-test={r.id}>
                  <th scope="row" className="px-3 py-2 font-semibold">
                    <Link href={`/logbook/field-tests/${encodeURIComponent(r.id)}`} className="hover:underline">{KINDS[r.kind].label}</Link>
                    <span className="block text-xs font-normal text-slate">{r.placeLabel}</span>
                  </th>
                  <td className="px-3 py-2">{r.items.map((i) => i.name).join(', ')}</td>
                  <td className="px-3 py-2"><FieldTestStatus status={r.status} /></td>
                  <td className="figure px-3 py-2 text-slate">{r.testedAt.toISOString().slice(0, 10)}</td>
                </tr>
              ))}
            </tbody>
          </table>
        </div>
      )}
    </section>
  );
}
