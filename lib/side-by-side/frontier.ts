/**
 * The best-value line of a set of items on two axes: every plottable point, which points lie on
 * the Pareto front (lib/measure `paretoFront`), and the front in plotting order (x ascending).
 */
import type { GearSummary } from '@/lib/browse/contract';
import { paretoFront } from '@/lib/measure';
import { axisValue, type AxisOption } from './axes';
import type { UnitSystem } from './table-model';

export interface PlotPoint {
  slug: string;
  name: string;
  maker: string;
  path: string;
  x: number;
  y: number;
  onFront: boolean;
}

export interface BestValuePlot {
  points: PlotPoint[];
  /** Points on the front, x ascending (the order the line joins them). */
  front: PlotPoint[];
  /** Items left out because they lack the x or y figure. */
  missing: { slug: string; name: string; maker: string }[];
}

export function bestValuePlot(
  items: readonly GearSummary[],
  axes: { x: AxisOption; y: AxisOption },
  options: { currency: string | null; units: UnitSystem },
): BestValuePlot {
  const points: PlotPoint[] = [];
  const missing: BestValuePlot['missing'] = [];
  for (const item of items) {
    const x = axisValue(item, axes.x, options.currency, options.units);
    const y = axisValue(item, axes.y, options.currency, options.units);
    if (x === null || y === null) {
      missing.push({ slug: item.slug, name: item.name, maker: item.maker });
      continue;
    }
    points.push({ slug: item.slug, name: item.name, maker: item.maker, path: item.path, x, y, onFront: false });
  }
  const front = paretoFront(points, (p) => p.x, (p) => p.y, { x: axes.x.better, y: axes.y.better });
  for (const p of front) p.onFront = true;
  return { points, front, missing };
}
