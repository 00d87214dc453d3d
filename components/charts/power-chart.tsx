'use client';

import { useMemo } from 'react';
import type { Sample } from '@/lib/readings/types';
import { formatNumber, powerChartData } from './chart-data';
import { TimeSeriesChart } from './time-series-chart';

export interface PowerChartProps {
  title?: string;
  /** `{t, watts}` or `{t, volts, amps}` samples. */
  samples: readonly Sample[];
  /** Delivered energy from `energyWh` over every row. */
  deliveredWh: number;
  ratedEnergyWh?: number | null;
}

/** Power against time with the delivered energy stated. */
export function PowerChart({ title = 'Power against time', samples, deliveredWh, ratedEnergyWh = null }: PowerChartProps) {
  const data = useMemo(() => powerChartData(samples), [samples]);
  const share = ratedEnergyWh ? ` — ${Math.round((deliveredWh / ratedEnergyWh) * 100)} % of the rated ${formatNumber(ratedEnergyWh)} Wh` : '';
  return <TimeSeriesChart title={title} data={data} summary={`Energy delivered (area under the line): ${formatNumber(deliveredWh)} Wh${share}.`} />;
}
