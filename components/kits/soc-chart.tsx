'use client';

import { CartesianGrid, Line, LineChart, ReferenceLine, ResponsiveContainer, Tooltip, XAxis, YAxis } from 'recharts';
import { fmt } from './format';

/** Stored energy at the end of each day, starting full, with the depth-of-discharge floor drawn dashed and labelled. */
export function StateOfChargeChart({ capacityWh, floorWh, byDay }: { capacityWh: number; floorWh: number; byDay: readonly number[] }) {
  const data = [{ day: 0, wh: capacityWh }, ...byDay.map((wh, i) => ({ day: i + 1, wh }))];
  return (
    <figure aria-labelledby="soc-caption" className="rounded-lg border border-rule bg-card p-3">
      <figcaption id="soc-caption" className="px-1 pb-2 text-sm font-semibold">
        Stored energy at the end of each day (Wh); day 0 is the start, fully charged
      </figcaption>
      <div aria-hidden="true" className="h-64 w-full" data-testid="soc-chart">
        <ResponsiveContainer width="100%" height="100%">
          <LineChart data={data} margin={{ top: 16, right: 24, bottom: 24, left: 8 }}>
            <CartesianGrid stroke="var(--color-rule)" strokeDasharray="2 4" />
            <XAxis
              dataKey="day"
              type="number"
              domain={[0, byDay.length]}
              allowDecimals={false}
              stroke="var(--color-slate)"
              label={{ value: 'Trip day', position: 'insideBottom', offset: -12, fill: 'var(--color-slate)' }}
            />
            <YAxis
              domain={[0, Math.ceil(capacityWh)]}
              stroke="var(--color-slate)"
              width={56}
              label={{ value: 'Wh', angle: -90, position: 'insideLeft', fill: 'var(--color-slate)' }}
            />
            <Tooltip formatter={(v) => [`${fmt(Number(v), 0)} Wh`, 'Stored']} labelFormatter={(d) => `Day ${String(d)}`} />
            <ReferenceLine
              y={floorWh}
              stroke="var(--color-danger)"
              strokeDasharray="6 4"
              label={{ value: `Floor: ${fmt(floorWh, 0)} Wh (depth-of-discharge limit)`, position: 'insideBottomRight', fill: 'var(--color-danger)', fontSize: 12 }}
            />
            <ReferenceLine
              y={capacityWh}
              stroke="var(--color-slate)"
              strokeDasharray="2 3"
              label={{ value: `Full: ${fmt(capacityWh, 0)} Wh`, position: 'insideTopRight', fill: 'var(--color-slate)', fontSize: 12 }}
            />
            <Line type="linear" dataKey="wh" stroke="var(--color-lichen)" strokeWidth={2} dot={{ r: 3 }} isAnimationActive={false} />
          </LineChart>
        </ResponsiveContainer>
      </div>
    </figure>
  );
}
