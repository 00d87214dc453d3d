'use client';

import { LightOutputChart } from '@/components/charts/light-output-chart';
import { PowerChart } from '@/components/charts/power-chart';
import { SolarChart } from '@/components/charts/solar-chart';
import type { ChartFacts } from '@/lib/field-tests/analysis';
import type { Sample } from '@/lib/readings/types';

/** The chart of one trial, drawn from a thinned copy of its series with the facts computed from every row. */
export function TrialChart({ title, samples, chart, conditions }: { title: string; samples: Sample[]; chart: ChartFacts | null; conditions?: string }) {
  if (!chart || samples.length === 0) return null;
  switch (chart.kind) {
    case 'light':
      return <LightOutputChart title={title} samples={samples} referenceValue={chart.referenceValue} runtimeS={chart.runtimeS} />;
    case 'power':
      return <PowerChart title={title} samples={samples} deliveredWh={chart.deliveredWh} ratedEnergyWh={chart.ratedEnergyWh} />;
    case 'solar':
      return <SolarChart title={title} samples={samples} meanW={chart.meanW} peakW={chart.peakW} ratedW={chart.ratedW} conditions={conditions} />;
    case 'charge':
      return <PowerChart title={title} samples={samples} deliveredWh={0} />;
  }
}
