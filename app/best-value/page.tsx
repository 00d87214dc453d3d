import type { Metadata } from 'next';
import { Suspense } from 'react';
import { BestValue } from '@/components/best-value/best-value';
import { getUnitSystem } from '@/lib/units/preference';

export const metadata: Metadata = {
  title: 'Best-value line',
  description: 'Plot a category’s gear on two figures and see which items no other item beats on both.',
};

export default async function BestValuePage() {
  const units = await getUnitSystem();
  return (
    <main className="mx-auto max-w-6xl px-4 py-10 sm:px-6">
      <h1 className="text-3xl font-bold tracking-tight">Best-value line</h1>
      <p className="mt-2 max-w-2xl text-slate">
        Each point is a gear item. The line joins the items no other item beats on both figures at once — lighter and brighter, or cheaper
        and larger. Anything below or behind the line has a better choice on it.
      </p>
      <div className="mt-6">
        <Suspense fallback={<p className="text-sm text-slate">Loading the plot…</p>}>
          <BestValue units={units} />
        </Suspense>
      </div>
    </main>
  );
}
