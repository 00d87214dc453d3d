'use client';

import { useMemo } from 'react';
import type { Sample } from '@/lib/readings/types';
import { formatClock, formatNumber, lightChartData } from './chart-data';
import { TimeSeriesChart } from './time-series-chart';

export interface LightOutputChartProps {
  title?: string;
  samples: readonly Sample[];
  /** From `lightRuntime` (via analyzeTrial's chart facts): output at 30 s and the runtime (null if the log ends first). */
  referenceValue: number;
  runtimeS: number | null;
  /** Unit of the readings, for the sentence ("lx", "% relative"). */
  unit?: string;
}

/** Light output relative to the output at 30 s, with the 30 s reference, the 10 % line and the runtime marked. */
export function LightOutputChart({ title = 'Light output against time', samples, referenceValue, runtimeS, unit = '' }: LightOutputChartProps) {
  const data = useMemo(() => lightChartData(samples, { referenceValue, runtimeS }), [samples, referenceValue, runtimeS]);
  const ref = `${formatNumber(referenceValue)}${unit ? ` ${unit}` : ''}`;
  const summary =
    runtimeS === null
      ? `Output at 30 s: ${ref}. The log ends before the output falls to 10 % of it.`
      : `Output at 30 s: ${ref}. Runtime to 10 % of it (ANSI/PLATO FL 1): ${formatClock(runtimeS)} (h:mm), ${Math.round(runtimeS)} s.`;
  return <TimeSeriesChart title={title} data={data} summary={summary} />;
}
