import { describe, expect, it } from 'vitest';
import { createElement } from 'react';
import { renderToStaticMarkup } from 'react-dom/server';
import { formatClock, lightChartData, powerChartData, solarChartData, timeTicks } from '@/components/charts/chart-data';
import { LightOutputChart } from '@/components/charts/light-output-chart';

// Flat 300 to 1 h, then linear to 0 at 11 h (runtime 36 000 s exact by hand, ANSI/PLATO FL 1 definition).
const lantern = [{ t: 0, value: 300 }, { t: 30, value: 300 }, { t: 3600, value: 300 }, { t: 39_600, value: 0 }];

describe('chart data', () => {
  it('h:mm time labels and round ticks', () => {
    expect(formatClock(36_000)).toBe('10:00');
    expect(formatClock(34_800)).toBe('9:40');
    expect(formatClock(95, true)).toBe('0:01:35');
    expect(timeTicks(39_600)).toEqual([0, 7200, 14_400, 21_600, 28_800, 36_000, 43_200]);
    expect(timeTicks(600)).toEqual([0, 120, 240, 360, 480, 600]);
  });

  it('light: output in % of the 30 s output, the 100 % and 10 % lines and the runtime in words', () => {
    const d = lightChartData(lantern, { referenceValue: 300, runtimeS: 36_000 });
    expect(d.points.map((p) => p.y)).toEqual([100, 100, 100, 0]);
    expect(d.refLines).toEqual([
      { axis: 'y', at: 100, label: 'Output at 30 s (100 %)' },
      { axis: 'y', at: 10, label: '10 % of the output at 30 s' },
      { axis: 'x', at: 30, label: '30 s' },
      { axis: 'x', at: 36_000, label: 'Runtime 10:00' },
    ]);
    expect(d.yLabel).toBe('Output (% of the output at 30 s)');
    expect(d.table.rows[2]).toEqual(['1:00', '100']);
  });

  it('power from V × A, thinned to 2 000 points but counting every reading', () => {
    const samples = Array.from({ length: 10_000 }, (_, i) => ({ t: i * 6, volts: 5, amps: i === 7777 ? 3 : 2 }));
    const d = powerChartData(samples);
    expect(d.totalReadings).toBe(10_000);
    expect(d.points.length).toBeLessThanOrEqual(2000);
    expect(Math.max(...d.points.map((p) => p.y))).toBe(15); // the one-sample peak survives
    expect(d.yLabel).toBe('Power (W)');
  });

  it('solar: rating line and mean line', () => {
    const d = solarChartData([{ t: 0, watts: 40 }, { t: 600, watts: 20 }], { ratedW: 60, meanW: 30 });
    expect(d.refLines).toEqual([
      { axis: 'y', at: 60, label: 'Rating 60 W (at STC)' },
      { axis: 'y', at: 30, label: 'Mean 30 W' },
    ]);
    expect(d.yMax).toBe(69);
  });

  it('renders on the server with the result in words and a data table disclosure', () => {
    const html = renderToStaticMarkup(createElement(LightOutputChart, { samples: lantern, referenceValue: 300, runtimeS: 36_000, unit: 'lx' }));
    expect(html).toContain('Runtime to 10 % of it (ANSI/PLATO FL 1): 10:00 (h:mm), 36000 s.');
    expect(html).toContain('<details');
    expect(html).toContain('Data table (4 of 4 readings shown)');
  });
});
