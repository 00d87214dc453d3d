import type { Metadata } from 'next';
import { Suspense } from 'react';
import { SideBySide } from '@/components/side-by-side/side-by-side';
import { getUnitSystem } from '@/lib/units/preference';

export const metadata: Metadata = { title: 'Side-by-side' };

export default async function SideBySidePage() {
  const units = await getUnitSystem();
  return (
    <main className="mx-auto max-w-6xl px-4 py-10 sm:px-6 print:max-w-none print:p-0">
      <h1 className="text-3xl font-bold tracking-tight">Side-by-side</h1>
      <p className="mt-2 max-w-2xl text-slate print:hidden">
        Up to six gear items, figure by figure: specs, radio noise, ports, features, value ratios, measured ÷ claimed and the conditions of the field tests. The link of this page
        keeps the items and their order, so you can share it.
      </p>
      <div className="mt-6">
        <Suspense fallback={<p className="text-sm text-slate">Loading the side-by-side…</p>}>
          <SideBySide units={units} />
        </Suspense>
      </div>
    </main>
  );
}
