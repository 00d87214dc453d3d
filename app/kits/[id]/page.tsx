import type { Metadata } from 'next';
import Link from 'next/link';
import { notFound } from 'next/navigation';
import { getDb } from '@/db';
import { getOwnKit, readableCatalog } from '@/db/kits';
import { KitEditor } from '@/components/kits/kit-editor';
import { getUnitSystem } from '@/lib/units/preference';
import { requirePageUser } from '@/lib/auth/guard';
import { AppError } from '@/lib/http/errors';
import type { KitInput } from '@/lib/kits';

export const metadata: Metadata = { title: 'Edit kit' };
export const dynamic = 'force-dynamic';

export default async function KitPage({ params, searchParams }: { params: Promise<{ id: string }>; searchParams: Promise<{ from?: string }> }) {
  const { id } = await params;
  const { from } = await searchParams;
  const user = await requirePageUser(`/kits/${encodeURIComponent(id)}`);
  const db = getDb();
  let found;
  try {
    found = getOwnKit(db, user, id);
  } catch (error) {
    if (error instanceof AppError && error.code === 'not_found') notFound();
    throw error;
  }
  const { kit, catalog } = found;
  const initial: KitInput = {
    name: kit.name,
    purpose: kit.purpose,
    tripDays: kit.tripDays,
    peakSunHours: kit.peakSunHours,
    sky: kit.sky,
    skyShare: kit.skyShare,
    lossFraction: kit.lossFraction,
    conversionEfficiency: kit.conversionEfficiency,
    entries: kit.entries.map((entry) => {
      const { hidden, ...rest } = entry;
      void hidden;
      return rest;
    }),
  };
  return (
    <main className="mx-auto max-w-6xl px-4 py-10 sm:px-6">
      <p className="text-sm">
        <Link href="/kits" className="text-lichen underline">
          ← Your kits
        </Link>
      </p>
      <h1 className="mt-2 text-3xl font-bold tracking-tight" data-testid="kit-title">
        {kit.name}
      </h1>
      {from === 'browser' ? (
        <p role="status" className="mt-3 rounded-md bg-lichen-tint px-3 py-2 text-sm" data-testid="kit-saved-from-browser">
          The kit you built before signing in is now saved to your account.
        </p>
      ) : null}
      <div className="mt-6">
        <KitEditor catalog={{ ...readableCatalog(db, user), ...catalog }} initial={initial} mode={{ kind: 'edit', id: kit.id, shareToken: kit.shareToken }} units={await getUnitSystem()} />
      </div>
    </main>
  );
}
