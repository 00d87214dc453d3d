import type { Metadata } from 'next';
import { Suspense } from 'react';
import { BrowseView } from '@/components/browse/browse-view';
import { browseApiQuery, browseValuesFromSearchParams } from '@/components/browse/browse-params';
import { getDb } from '@/db';
import { listGear } from '@/db/browse';
import { getCurrentUser } from '@/lib/auth/guard';
import type { GearListResponse } from '@/lib/browse/contract';
import { parseGearListQuery } from '@/lib/browse/query';
import { AppError } from '@/lib/http/errors';
import { getUnitSystem } from '@/lib/units/preference';

export const metadata: Metadata = {
  title: 'Browse gear',
  description: 'Filter lights, power banks, 12 V batteries, solar panels and radios by mass, price and value ratios such as lumens per gram.',
};
export const dynamic = 'force-dynamic';

type SearchParams = Promise<Record<string, string | string[] | undefined>>;

export default async function GearPage({ searchParams }: { searchParams: SearchParams }) {
  // The first page is rendered here from the same query the client sends to /api/v1/gear, so the
  // client picks it up as its initial data and a shared link shows its list without a round trip.
  const units = await getUnitSystem();
  const query = browseApiQuery(browseValuesFromSearchParams(await searchParams), units);
  let data: GearListResponse | null = null;
  let error: string | null = null;
  try {
    data = listGear(getDb(), parseGearListQuery(new URLSearchParams(query)), await getCurrentUser());
  } catch (e) {
    if (!(e instanceof AppError)) throw e;
    error = e.message;
  }

  return (
    <main className="mx-auto max-w-6xl px-4 py-10 sm:px-6">
      <h1 className="text-3xl font-bold tracking-tight">Browse gear</h1>
      <p className="mt-2 max-w-2xl text-slate">
        Every approved gear item with its figures: measured where a field test measured them (●), else the maker’s claim (○). Filter, sort by any
        spec or value ratio, and add items to the side-by-side. The address of this page keeps your filters, so you can bookmark or share it.
      </p>
      <div className="mt-8">
        <Suspense fallback={<p className="text-sm text-slate">Loading gear…</p>}>
          <BrowseView initial={{ query, data, error }} units={units} />
        </Suspense>
      </div>
    </main>
  );
}
