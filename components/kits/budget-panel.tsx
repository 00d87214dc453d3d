'use client';

import { floorWh, CHEMISTRY_LABELS, type KitBudget, type KitWarning } from '@/lib/kits';
import { fmt, fmtDays, fmtPercent } from './format';
import { StateOfChargeChart } from './soc-chart';

const basisLabel = (b: string) => (b === 'measured' ? 'measured' : b === 'claimed' ? 'claimed' : 'typed by you');

function Figure({ label, value, hint, testId }: { label: string; value: string; hint: string; testId: string }) {
  return (
    <div className="rounded-md border border-rule bg-paper px-3 py-2">
      <dt className="text-xs font-semibold uppercase tracking-wide text-slate">{label}</dt>
      <dd className="font-mono text-lg tabular-nums" data-testid={testId}>
        {value}
      </dd>
      <dd className="text-xs text-slate">{hint}</dd>
    </div>
  );
}

const SERIOUS = new Set<KitWarning['code']>(['does-not-close', 'load-exceeds-battery', 'load-exceeds-path', 'airline-cargo-only', 'autonomy-under-one-day']);

/** The power budget: headline, figures, warnings, day-by-day chart with a table alternative, and the lines it was built from. */
export function BudgetPanel({ budget, tripDays }: { budget: KitBudget; tripDays: number }) {
  const r = budget.result;
  return (
    <section aria-labelledby="budget-heading" className="space-y-5" data-testid="budget-panel">
      <h2 id="budget-heading" className="text-xl font-bold">
        Power budget
      </h2>
      <div aria-live="polite" aria-atomic="true">
        {r === null ? (
          <p className="rounded-md border border-rule bg-card px-4 py-3" data-testid="budget-verdict">
            {budget.problem}
          </p>
        ) : r.closes ? (
          <p className="rounded-md border-l-4 border-lichen bg-lichen-tint px-4 py-3 font-semibold" data-testid="budget-verdict">
            ✓ The plan closes: the batteries stay above their floor on all {tripDays} {tripDays === 1 ? 'day' : 'days'}.
          </p>
        ) : (
          <p className="rounded-md border-l-4 border-danger bg-danger-tint px-4 py-3 font-semibold text-danger" data-testid="budget-verdict">
            ✗ The plan does not close: on day {budget.warnings.find((w) => w.code === 'does-not-close')?.day} the batteries fall below their floor.
          </p>
        )}
      </div>

      {budget.warnings.length > 0 ? (
        <div>
          <h3 className="text-base font-bold">Warnings</h3>
          <ul className="mt-2 space-y-2" data-testid="budget-warnings">
            {budget.warnings.map((w, i) => (
              <li
                key={`${w.code}-${i}`}
                data-code={w.code}
                className={`rounded-md border-l-4 px-3 py-2 text-sm ${SERIOUS.has(w.code) ? 'border-danger bg-danger-tint' : 'border-amber bg-amber-tint'}`}
              >
                <span className="sr-only">{SERIOUS.has(w.code) ? 'Serious: ' : 'Note: '}</span>
                {w.message}
              </li>
            ))}
          </ul>
        </div>
      ) : null}

      {r ? (
        <>
          <dl className="grid gap-3 sm:grid-cols-2 lg:grid-cols-3">
            <Figure label="Used per day" value={`${fmt(r.dailyLoadWh)} Wh`} hint="What the devices use: watts × hours × duty × quantity." testId="fig-load" />
            <Figure
              label="Taken from storage per day"
              value={`${fmt(r.dailyDrawWh)} Wh`}
              hint={
                budget.loads.some((l) => l.efficiencyFrom === 'path')
                  ? 'Each load’s use ÷ the efficiency of its charging path, or the kit’s conversion efficiency where it has none (see how each item counts).'
                  : 'Used ÷ conversion efficiency (converters and cables lose some).'
              }
              testId="fig-draw"
            />
            <Figure label="Gathered per day" value={`${fmt(r.dailySolarWh)} Wh`} hint="Panel watts × peak sun hours × sky share × (1 − losses)." testId="fig-solar" />
            <Figure label="Net per day" value={`${r.netDailyWh >= 0 ? '+' : '−'}${fmt(Math.abs(r.netDailyWh))} Wh`} hint="Gathered − taken. Below zero, the batteries run down." testId="fig-net" />
            <Figure
              label="Usable stored energy"
              value={`${fmt(r.usableBatteryWh)} Wh`}
              hint={`Of ${fmt(r.capacityWh)} Wh rated: capacity × allowed depth of discharge.`}
              testId="fig-usable"
            />
            <Figure label="Days without sun" value={fmtDays(r.autonomyDays)} hint="Usable energy ÷ energy taken per day (no panels)." testId="fig-autonomy" />
            <Figure label="Days to refill" value={fmtDays(r.daysToRefill)} hint="Usable energy ÷ gathered per day, with the loads off." testId="fig-refill" />
          </dl>

          <StateOfChargeChart capacityWh={r.capacityWh} floorWh={floorWh(r)} byDay={r.stateOfChargeByDay} />
          <details className="rounded-md border border-rule px-4 py-2" open={tripDays <= 10}>
            <summary className="cursor-pointer text-sm font-semibold">The same as a table</summary>
            <table className="mt-2 w-full text-sm tabular-nums" data-testid="soc-table">
              <caption className="sr-only">Stored energy at the end of each day</caption>
              <thead>
                <tr className="text-left">
                  <th scope="col" className="py-1 pr-4">Day</th>
                  <th scope="col" className="py-1 pr-4">Stored at day&apos;s end</th>
                  <th scope="col" className="py-1 pr-4">Share of full</th>
                  <th scope="col" className="py-1">Above the {fmt(floorWh(r), 0)} Wh floor?</th>
                </tr>
              </thead>
              <tbody>
                {r.stateOfChargeByDay.map((wh, i) => {
                  const ok = wh >= floorWh(r) - 1e-9 * r.capacityWh;
                  return (
                    <tr key={i} className="border-t border-rule">
                      <th scope="row" className="py-1 pr-4 text-left font-normal">{i + 1}</th>
                      <td className="py-1 pr-4 font-mono">{fmt(wh)} Wh</td>
                      <td className="py-1 pr-4 font-mono">{fmtPercent(wh / r.capacityWh)}</td>
                      <td className={`py-1 ${ok ? '' : 'font-semibold text-danger'}`}>{ok ? 'Yes' : 'No — below the floor'}</td>
                    </tr>
                  );
                })}
              </tbody>
            </table>
          </details>
        </>
      ) : null}

      <BudgetLines budget={budget} />
    </section>
  );
}

function BudgetLines({ budget }: { budget: KitBudget }) {
  if (budget.loads.length + budget.storage.length + budget.panels.length === 0) return null;
  return (
    <details className="rounded-md border border-rule px-4 py-2">
      <summary className="cursor-pointer text-sm font-semibold">How each item counts</summary>
      <div className="mt-2 space-y-4 overflow-x-auto text-sm">
        {budget.loads.length > 0 ? (
          <table className="w-full tabular-nums">
            <caption className="text-left font-semibold">Loads</caption>
            <thead>
              <tr className="text-left">
                <th scope="col" className="pr-3">Device</th>
                <th scope="col" className="pr-3">Draw</th>
                <th scope="col" className="pr-3">Hours a day</th>
                <th scope="col" className="pr-3">Duty</th>
                <th scope="col" className="pr-3">Qty</th>
                <th scope="col" className="pr-3">Wh a day</th>
                <th scope="col">Efficiency used</th>
              </tr>
            </thead>
            <tbody>
              {budget.loads.map((l, i) => (
                <tr key={i} className="border-t border-rule">
                  <th scope="row" className="pr-3 text-left font-normal">
                    {l.name}
                    {l.mode ? <span className="text-slate"> ({l.mode})</span> : null}
                  </th>
                  <td className="pr-3 font-mono">
                    {fmt(l.watts, 2)} W <span className="rounded border border-rule px-1 text-xs text-slate">{basisLabel(l.basis)}</span>
                  </td>
                  <td className="pr-3 font-mono">{fmt(l.hoursPerDay, 2)}</td>
                  <td className="pr-3 font-mono">{fmtPercent(l.dutyCycle)}</td>
                  <td className="pr-3 font-mono">{l.quantity}</td>
                  <td className="pr-3 font-mono">{fmt(l.dailyWh, 2)}</td>
                  <td data-testid="load-efficiency">
                    <span className="font-mono">{fmtPercent(l.efficiency)}</span>{' '}
                    <span className="block text-xs text-slate" title={l.pathText ?? undefined}>
                      {l.efficiencyFrom === 'path' ? 'its best charging path from storage' : 'the kit’s figure'}
                    </span>
                  </td>
                </tr>
              ))}
            </tbody>
          </table>
        ) : null}
        {budget.storage.length > 0 ? (
          <table className="w-full tabular-nums">
            <caption className="text-left font-semibold">Storage</caption>
            <thead>
              <tr className="text-left">
                <th scope="col" className="pr-3">Battery or bank</th>
                <th scope="col" className="pr-3">Rated</th>
                <th scope="col" className="pr-3">Chemistry</th>
                <th scope="col" className="pr-3">Depth of discharge</th>
                <th scope="col">Usable</th>
              </tr>
            </thead>
            <tbody>
              {budget.storage.map((s, i) => (
                <tr key={i} className="border-t border-rule align-top">
                  <th scope="row" className="pr-3 text-left font-normal">
                    {s.quantity > 1 ? `${s.quantity} × ` : ''}
                    {s.name}
                  </th>
                  <td className="pr-3 font-mono">{fmt(s.capacityWh)} Wh</td>
                  <td className="pr-3">{s.chemistry ? CHEMISTRY_LABELS[s.chemistry] : 'not stated'}</td>
                  <td className="pr-3">
                    <span className="font-mono">{fmtPercent(s.depthOfDischarge)}</span> <span className="text-xs text-slate">({s.depthNote})</span>
                  </td>
                  <td className="font-mono">{fmt(s.usableWh)} Wh</td>
                </tr>
              ))}
            </tbody>
          </table>
        ) : null}
        {budget.panels.length > 0 ? (
          <table className="w-full tabular-nums">
            <caption className="text-left font-semibold">Panels</caption>
            <thead>
              <tr className="text-left">
                <th scope="col" className="pr-3">Panel</th>
                <th scope="col" className="pr-3">Rated</th>
                <th scope="col">Qty</th>
              </tr>
            </thead>
            <tbody>
              {budget.panels.map((p, i) => (
                <tr key={i} className="border-t border-rule">
                  <th scope="row" className="pr-3 text-left font-normal">{p.name}</th>
                  <td className="pr-3 font-mono">
                    {fmt(p.ratedW)} W <span className="rounded border border-rule px-1 text-xs text-slate">{basisLabel(p.basis)}</span>
                  </td>
                  <td className="font-mono">{p.quantity}</td>
                </tr>
              ))}
            </tbody>
          </table>
        ) : null}
      </div>
    </details>
  );
}
