'use client';

import { useMemo } from 'react';
import type { Sample } from '@/lib/readings/types';
import { formatNumber, solarChartData } from './chart-data';
import { TimeSeriesChart } from './time-series-chart';

export interface SolarChartProps {
  title?: string;
  samples: readonly Sample[];
  /** From `solarOutput`. */
  meanW: number;
  peakW: number;
  /** Panel rating at STC, drawn as a dashed line when known. */
  ratedW: number | null;
  /** Sky and temperature in words, e.g. "Overcast, 11 °C". */
  conditions?: string;
}

/** Panel output against time with the rating line and the mean. */
export function SolarChart({ title = 'Panel output against time', samples, meanW, peakW, ratedW, conditions }: SolarChartProps) {
  const data = useMemo(() => solarChartData(samples, { ratedW, meanW }), [samples, ratedW, meanW]);
  const share = ratedW ? ` (${Math.round((meanW / ratedW) * 100)} % of the ${formatNumber(ratedW)} W rating)` : '';
  const summary = `Mean ${formatNumber(meanW)} W${share}, peak ${formatNumber(peakW)} W${conditions ? `; ${conditions}` : ''}.`;
  return <TimeSeriesChart title={title} data={data} summary={summary} />;
}
