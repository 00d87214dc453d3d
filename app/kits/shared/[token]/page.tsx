import type { Metadata } from 'next';
import Link from 'next/link';
import { notFound } from 'next/navigation';
import { getDb } from '@/db';
import { getSharedKit } from '@/db/kits';
import { BudgetPanel } from '@/components/kits/budget-panel';
import { ChargingPathsPanel } from '@/components/kits/charging-paths-panel';
import { fmt, fmtPercent } from '@/components/kits/format';
import { KitCautions } from '@/components/kits/kit-cautions';
import { KitTotalsPanel } from '@/components/kits/kit-totals';
import { getUnitSystem } from '@/lib/units/preference';
import { getCurrentUser } from '@/lib/auth/guard';
import { AppError } from '@/lib/http/errors';
import { CHEMISTRY_LABELS, cleanPort, entryName, kitBudget, kitTotals, portSummary, resolveEntries, SKY_LABELS } from '@/lib/kits';

// Rendered per request (dynamic), so Next sends `Cache-Control: private, no-cache, no-store`.
export const dynamic = 'force-dynamic';
export const metadata: Metadata = { title: 'Shared kit', robots: { index: false, follow: false } };

export default async function SharedKitPage({ params }: { params: Promise<{ token: string }> }) {
  const { token } = await params;
  const user = await getCurrentUser();
  let found;
  try {
    found = getSharedKit(getDb(), user, token);
  } catch (error) {
    if (error instanceof AppError && error.code === 'not_found') notFound();
    throw error;
  }
  const { kit, catalog, ownerIsViewer } = found;
  const budget = kitBudget(kit, catalog);
  const totals = kitTotals(kit.entries, catalog);
  const resolved = resolveEntries(kit.entries, catalog);
  return (
    <main className="mx-auto max-w-6xl px-4 py-10 sm:px-6">
      <p className="text-sm font-semibold uppercase tracking-wide text-slate">Shared kit · read-only</p>
      <h1 className="mt-1 text-3xl font-bold tracking-tight" data-testid="kit-title">
        {kit.name}
      </h1>
      {kit.purpose ? <p className="mt-2 max-w-2xl text-slate">{kit.purpose}</p> : null}
      {ownerIsViewer ? (
        <p className="mt-2 text-sm">
          This is your kit. <Link href={`/kits/${kit.id}`} className="text-lichen underline">Edit it</Link>
        </p>
      ) : null}
      <div className="mt-8 grid gap-8 lg:grid-cols-[minmax(0,1fr)_minmax(0,1fr)]">
        <div className="space-y-6">
          <section aria-labelledby="shared-gear">
            <h2 id="shared-gear" className="text-xl font-bold">
              Gear
            </h2>
            <ul className="mt-3 divide-y divide-rule rounded-lg border border-rule" data-testid="shared-entries">
              {resolved.map((e) => (
                <li key={e.index} className="px-4 py-3 text-sm">
                  <span className="font-semibold">
                    {e.quantity > 1 ? `${e.quantity} × ` : ''}
                    {entryName(e)}
                  </span>
                  <span className="block text-slate">
                    {[
                      e.entry.loadMode ? `mode ${e.entry.loadMode}` : null,
                      e.entry.hoursPerDay != null ? `${fmt(e.entry.hoursPerDay, 2)} h a day` : null,
                      e.entry.dutyCycle != null ? `duty ${fmtPercent(e.entry.dutyCycle)}` : null,
                      e.kind === 'free' && e.entry.freeDrawW != null ? `${fmt(e.entry.freeDrawW, 2)} W` : null,
                      e.entry.chemistry ? CHEMISTRY_LABELS[e.entry.chemistry] : null,
                      e.entry.depthOfDischarge != null ? `depth of discharge ${fmtPercent(e.entry.depthOfDischarge)}` : null,
                      e.kind === 'free' && e.entry.freeRole ? e.entry.freeRole : null,
                      ...(e.kind === 'free' ? (e.entry.freePorts ?? []).map((p) => `${p.direction === 'both' ? 'in and out' : p.direction}: ${portSummary(cleanPort(p))}`) : []),
                      e.kind === 'free' && e.entry.freeEfficiency != null ? `efficiency ${fmtPercent(e.entry.freeEfficiency)}` : null,
                      e.kind === 'free' && e.entry.freeEnergyWh != null ? `${fmt(e.entry.freeEnergyWh)} Wh stored` : null,
                      e.kind === 'free' && e.entry.freeRatedW != null ? `${fmt(e.entry.freeRatedW)} W rated` : null,
                    ]
                      .filter(Boolean)
                      .join(' · ')}
                  </span>
                </li>
              ))}
            </ul>
          </section>
          <section aria-labelledby="shared-sun" className="text-sm">
            <h2 id="shared-sun" className="text-xl font-bold">
              Sun and charging
            </h2>
            <dl className="mt-2 grid grid-cols-2 gap-2">
              <dt className="font-semibold">Trip length</dt>
              <dd>{kit.tripDays} days</dd>
              <dt className="font-semibold">Peak sun hours (clear day)</dt>
              <dd>{kit.peakSunHours ?? '—'}</dd>
              <dt className="font-semibold">Expected sky</dt>
              <dd>{kit.sky ? SKY_LABELS[kit.sky] : '—'}</dd>
              <dt className="font-semibold">Sky share</dt>
              <dd>{kit.skyShare ?? '1 (default)'}</dd>
              <dt className="font-semibold">System losses</dt>
              <dd>{kit.lossFraction ?? '0.14 (default)'}</dd>
              <dt className="font-semibold">Conversion efficiency</dt>
              <dd>{kit.conversionEfficiency ?? '0.9 (default)'}</dd>
            </dl>
          </section>
          <KitTotalsPanel totals={totals} units={await getUnitSystem()} />
        </div>
        <div className="space-y-6">
          <ChargingPathsPanel charging={budget.charging} />
          <BudgetPanel budget={budget} tripDays={kit.tripDays} />
          <KitCautions />
        </div>
      </div>
    </main>
  );
}
