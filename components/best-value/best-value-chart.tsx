'use client';

import { memo } from 'react';
import { CartesianGrid, ResponsiveContainer, Scatter, ScatterChart, XAxis, YAxis } from 'recharts';
import { formatNumber } from '@/lib/gear/format';
import type { PlotPoint } from '@/lib/side-by-side/frontier';

const AXIS = { stroke: 'var(--color-slate)', fontSize: 12 };

interface Props {
  points: PlotPoint[];
  front: PlotPoint[];
  xLabel: string;
  yLabel: string;
  onActivate: (slug: string | null) => void;
  onChoose: (point: PlotPoint) => void;
  describe: (point: PlotPoint) => string;
}

/**
 * Scatter plot with the best-value line joining the items no other item beats on both axes. Each
 * point is focusable: focus or hover shows it, Enter/Space or a click adds it to the side-by-side.
 * Front points are filled diamonds, the others hollow circles (shape, not colour alone).
 */
export const BestValueChart = memo(function BestValueChart({ points, front, xLabel, yLabel, onActivate, onChoose, describe }: Props) {
  // Memoised with stable props: focusing a point re-renders the page around it, never the points
  // themselves (a re-render inside recharts would drop the keyboard focus).
  const others = points.filter((p) => !p.onFront);
  const shape = (onFrontLine: boolean) =>
    function PointShape(props: unknown) {
      const { cx, cy, payload } = props as { cx?: number; cy?: number; payload?: PlotPoint };
      if (cx === undefined || cy === undefined || !payload) return <g />;
      const r = 6;
      return (
        <g
          tabIndex={0}
          role="button"
          aria-label={`${describe(payload)}. Press Enter to add it to the side-by-side.`}
          data-testid={`point-${payload.slug}`}
          onFocus={() => onActivate(payload.slug)}
          onMouseEnter={() => onActivate(payload.slug)}
          onClick={() => onChoose(payload)}
          onKeyDown={(e) => {
            if (e.key === 'Enter' || e.key === ' ') {
              e.preventDefault();
              onChoose(payload);
            }
          }}
          className="cursor-pointer outline-none [&:focus-visible>.ring]:opacity-100"
        >
          <circle className="ring opacity-0" cx={cx} cy={cy} r={r + 5} fill="none" stroke="var(--color-ink)" strokeWidth={2} />
          {onFrontLine ? (
            <path d={`M${cx},${cy - r - 1} L${cx + r + 1},${cy} L${cx},${cy + r + 1} L${cx - r - 1},${cy} Z`} fill="var(--color-lichen)" stroke="var(--color-lichen-dark)" strokeWidth={1.5} />
          ) : (
            <circle cx={cx} cy={cy} r={r} fill="var(--color-paper)" stroke="var(--color-slate)" strokeWidth={2} />
          )}
        </g>
      );
    };

  return (
    <div className="h-80 w-full sm:h-[26rem]">
      <ResponsiveContainer width="100%" height="100%">
        <ScatterChart margin={{ top: 16, right: 24, bottom: 36, left: 16 }} accessibilityLayer={false}>
          <CartesianGrid stroke="var(--color-rule)" strokeWidth={0.5} />
          <XAxis
            type="number"
            dataKey="x"
            name={xLabel}
            domain={['auto', 'auto']}
            tick={AXIS}
            stroke="var(--color-slate)"
            tickFormatter={(v: number) => formatNumber(v)}
            label={{ value: xLabel, position: 'insideBottom', offset: -24, fill: 'var(--color-slate)', fontSize: 12 }}
          />
          <YAxis
            type="number"
            dataKey="y"
            name={yLabel}
            domain={['auto', 'auto']}
            tick={AXIS}
            stroke="var(--color-slate)"
            width={64}
            tickFormatter={(v: number) => formatNumber(v)}
            label={{ value: yLabel, angle: -90, position: 'insideLeft', offset: 0, fill: 'var(--color-slate)', fontSize: 12, style: { textAnchor: 'middle' } }}
          />
          <Scatter name="Other items" data={others} shape={shape(false)} isAnimationActive={false} />
          <Scatter
            name="Best-value line"
            data={front}
            line={{ stroke: 'var(--color-lichen)', strokeWidth: 2 }}
            lineType="joint"
            shape={shape(true)}
            isAnimationActive={false}
          />
        </ScatterChart>
      </ResponsiveContainer>
    </div>
  );
});
