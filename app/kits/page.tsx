import type { Metadata } from 'next';
import Link from 'next/link';
import { getDb } from '@/db';
import { listOwnKits, readableCatalog } from '@/db/kits';
import { GuestKitImport } from '@/components/kits/guest-kit-import';
import { KitEditor } from '@/components/kits/kit-editor';
import { getUnitSystem } from '@/lib/units/preference';
import { KitIntro } from '@/components/kits/kit-intro';
import { getCurrentUser } from '@/lib/auth/guard';
import { emptyKit } from '@/lib/kits';

export const metadata: Metadata = { title: 'Kits and power budget' };
export const dynamic = 'force-dynamic';

export default async function KitsPage() {
  const user = await getCurrentUser();
  const db = getDb();
  const catalog = readableCatalog(db, user);
  const mine = user ? listOwnKits(db, user) : [];
  return (
    <main className="mx-auto max-w-6xl px-4 py-10 sm:px-6">
      <h1 className="text-3xl font-bold tracking-tight">Kits and power budget</h1>
      <KitIntro />
      {user ? (
        <section aria-labelledby="my-kits" className="mt-8 space-y-3">
          <GuestKitImport />
          <h2 id="my-kits" className="text-xl font-bold">
            Your kits
          </h2>
          {mine.length === 0 ? <p className="text-slate">No saved kits yet. Start one below.</p> : null}
          <ul className="divide-y divide-rule rounded-lg border border-rule" data-testid="my-kits">
            {mine.map((k) => (
              <li key={k.id} className="flex flex-wrap items-baseline justify-between gap-x-6 gap-y-1 px-4 py-3">
                <Link href={`/kits/${k.id}`} className="font-semibold text-lichen underline-offset-2 hover:underline">
                  {k.name}
                </Link>
                <span className="text-sm text-slate">
                  {k.tripDays} {k.tripDays === 1 ? 'day' : 'days'} · {k.entryCount} {k.entryCount === 1 ? 'entry' : 'entries'}
                  {k.shared ? ' · shared by link' : ' · private'}
                </span>
              </li>
            ))}
          </ul>
        </section>
      ) : null}
      <section aria-labelledby="new-kit" className="mt-10">
        <h2 id="new-kit" className="mb-4 text-2xl font-bold">
          {user ? 'Start a new kit' : 'Build a kit'}
        </h2>
        <KitEditor catalog={catalog} initial={emptyKit()} mode={user ? { kind: 'new' } : { kind: 'guest' }} units={await getUnitSystem()} />
      </section>
    </main>
  );
}
