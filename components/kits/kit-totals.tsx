import type { KitTotals } from '@/lib/kits';
import type { UnitSystem } from '@/lib/units/display';
import { formatFigure } from '@/lib/units/format';
import { fmt, fmtMass, fmtMoney } from './format';

/** Mass with a per-category breakdown, price per currency, light output and stored energy. */
export function KitTotalsPanel({ totals, units = 'metric' }: { totals: KitTotals; units?: UnitSystem }) {
  const mass = (grams: number) => (units === 'imperial' ? formatFigure(grams, 'g', 'imperial') : fmtMass(grams));
  return (
    <section aria-labelledby="totals-heading" className="rounded-lg border border-rule bg-card p-4" data-testid="kit-totals">
      <h2 id="totals-heading" className="text-lg font-bold">
        Totals
      </h2>
      <dl className="mt-2 grid gap-x-6 gap-y-2 text-sm sm:grid-cols-2">
        <div>
          <dt className="font-semibold">Mass</dt>
          <dd className="font-mono tabular-nums" data-testid="total-mass">
            {mass(totals.massG)}
            {totals.massBasis === 'mixed' ? <span className="font-sans text-xs text-slate"> (measured where tested, else claimed or typed)</span> : null}
          </dd>
          {totals.massByGroup.length > 0 ? (
            <dd>
              <ul className="mt-1 text-xs text-slate">
                {totals.massByGroup.map((g) => (
                  <li key={g.group}>
                    {g.label}: <span className="font-mono tabular-nums">{mass(g.massG)}</span>
                  </li>
                ))}
              </ul>
            </dd>
          ) : null}
          {totals.massMissing.length > 0 ? <dd className="text-xs text-amber">No mass known for: {totals.massMissing.join(', ')}.</dd> : null}
        </div>
        <div>
          <dt className="font-semibold">Price</dt>
          {totals.prices.length === 0 ? <dd className="text-slate">—</dd> : null}
          {totals.prices.map((p) => (
            <dd key={p.currency} className="font-mono tabular-nums">
              {fmtMoney(p.amountMinor, p.currency)}
            </dd>
          ))}
          {totals.prices.length > 1 ? <dd className="text-xs text-slate">Prices in different currencies are kept apart, never converted.</dd> : null}
          {totals.priceMissing.length > 0 ? <dd className="text-xs text-amber">No price for: {totals.priceMissing.join(', ')}.</dd> : null}
        </div>
        <div>
          <dt className="font-semibold">Light output available</dt>
          <dd className="font-mono tabular-nums">{fmt(totals.lightLm, 0)} lm</dd>
          <dd className="text-xs text-slate">Every light on its highest mode at once.</dd>
        </div>
        <div>
          <dt className="font-semibold">Stored energy</dt>
          <dd className="font-mono tabular-nums">{fmt(totals.storedWh)} Wh</dd>
          <dd className="text-xs text-slate">
            Rated, in batteries and power banks{totals.deviceCellsWh > 0 ? `; plus ${fmt(totals.deviceCellsWh)} Wh in the devices' own cells` : ''}.
          </dd>
        </div>
      </dl>
      {totals.hiddenCount > 0 ? (
        <p className="mt-2 text-xs text-slate">
          {totals.hiddenCount} unpublished {totals.hiddenCount === 1 ? 'item is' : 'items are'} not counted.
        </p>
      ) : null}
    </section>
  );
}
