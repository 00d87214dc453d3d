'use client';

import { useState } from 'react';
import { CartesianGrid, Line, LineChart, ReferenceLine, ResponsiveContainer, XAxis, YAxis } from 'recharts';
import { formatClock, type ChartData } from './chart-data';

export interface TimeSeriesChartProps {
  /** Accessible name of the chart, e.g. "Light output of trial 1". */
  title: string;
  data: ChartData;
  /** A sentence under the chart (the result in words). */
  summary?: string;
  height?: number;
}

const AXIS = { stroke: 'var(--color-slate)', fontSize: 12 };

/**
 * Thin line chart against time since switch-on (h:mm), dashed labelled reference lines, and a
 * collapsible table of the drawn points as the text alternative.
 */
export function TimeSeriesChart({ title, data, summary, height = 280 }: TimeSeriesChartProps) {
  const [tableOpen, setTableOpen] = useState(false);
  const lastTick = data.xTicks.at(-1) ?? 0;
  const seconds = lastTick <= 1200;
  return (
    <figure className="my-4">
      <figcaption className="mb-2 text-sm font-semibold">{title}</figcaption>
      <div role="img" aria-label={`${title}. ${summary ?? ''} The data table below lists the points.`}>
        <ResponsiveContainer width="100%" height={height}>
          <LineChart data={data.points} margin={{ top: 16, right: 16, bottom: 28, left: 8 }}>
            <CartesianGrid stroke="var(--color-rule)" strokeWidth={0.5} />
            <XAxis
              dataKey="t"
              type="number"
              domain={[0, lastTick]}
              ticks={data.xTicks}
              tickFormatter={(t: number) => formatClock(t, seconds)}
              tick={AXIS}
              stroke="var(--color-slate)"
              label={{ value: `Time since switch-on (${seconds ? 'h:mm:ss' : 'h:mm'})`, position: 'insideBottom', offset: -16, fill: 'var(--color-slate)', fontSize: 12 }}
            />
            <YAxis
              type="number"
              domain={[0, data.yMax]}
              tick={AXIS}
              stroke="var(--color-slate)"
              width={56}
              label={{ value: data.yLabel, angle: -90, position: 'insideLeft', offset: 10, fill: 'var(--color-slate)', fontSize: 12, style: { textAnchor: 'middle' } }}
            />
            {data.refLines.map((r) => (
              <ReferenceLine
                key={`${r.axis}-${r.label}`}
                {...(r.axis === 'x' ? { x: r.at } : { y: r.at })}
                stroke={r.label.startsWith('Runtime') ? 'var(--color-lichen)' : 'var(--color-amber)'}
                strokeDasharray="6 4"
                strokeWidth={1}
                ifOverflow="extendDomain"
                label={{
                  value: r.label,
                  position: r.axis === 'x' ? 'insideTopLeft' : 'insideTopRight',
                  fill: 'var(--color-ink)',
                  fontSize: 11,
                }}
              />
            ))}
            <Line type="linear" dataKey="y" stroke="var(--color-lichen)" strokeWidth={1.5} dot={false} isAnimationActive={false} />
          </LineChart>
        </ResponsiveContainer>
      </div>
      {summary ? <p className="figure mt-1 text-sm">{summary}</p> : null}
      <details className="mt-2 text-sm" onToggle={(e) => setTableOpen(e.currentTarget.open)}>
        <summary className="cursor-pointer text-[var(--color-slate)]">
          Data table ({data.points.length} of {data.totalReadings} readings shown)
        </summary>
        {tableOpen ? (
          <div className="max-h-80 overflow-auto">
            <table className="figure font-mono text-xs">
              <caption className="sr-only">{title}</caption>
              <thead>
                <tr>
                  <th scope="col" className="px-2 text-left">{data.table.head[0]}</th>
                  <th scope="col" className="px-2 text-right">{data.table.head[1]}</th>
                </tr>
              </thead>
              <tbody>
                {data.table.rows.map(([t, y], i) => (
                  <tr key={i}>
                    <td className="px-2">{t}</td>
                    <td className="px-2 text-right">{y}</td>
                  </tr>
                ))}
              </tbody>
            </table>
          </div>
        ) : null}
      </details>
    </figure>
  );
}
