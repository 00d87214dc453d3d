/*
 * Pure data for the field-test charts: downsampled points (every computation uses all rows;
 * only the drawing is thinned), time ticks in h:mm, reference lines and the table alternative.
 * No React here, so it is tested directly.
 */
import { downsample, CHART_POINTS } from '@/lib/readings/downsample';
import type { Sample } from '@/lib/readings/types';
import { powerOf } from '@/lib/field-tests/analysis';

export interface ChartPoint {
  /** s since switch-on */
  t: number;
  y: number;
}

export interface RefLine {
  axis: 'x' | 'y';
  at: number;
  /** Words, drawn beside the dashed line. */
  label: string;
}

export interface ChartData {
  points: ChartPoint[];
  /** Readings in the whole log (the points are a thinned copy for drawing). */
  totalReadings: number;
  xTicks: number[];
  yMax: number;
  yLabel: string;
  refLines: RefLine[];
  table: { head: [string, string]; rows: [string, string][] };
}

/** Time as h:mm (h:mm:ss when `seconds`), e.g. 34 800 s → "9:40". */
export function formatClock(s: number, seconds = false): string {
  const sign = s < 0 ? '−' : '';
  const total = Math.round(Math.abs(s));
  const h = Math.floor(total / 3600);
  const m = Math.floor((total % 3600) / 60);
  const sec = total % 60;
  return `${sign}${h}:${String(m).padStart(2, '0')}${seconds ? `:${String(sec).padStart(2, '0')}` : ''}`;
}

const STEPS_S = [10, 30, 60, 120, 300, 600, 900, 1800, 3600, 7200, 10800, 21600, 43200, 86400];

/** About six evenly spaced ticks from 0 to at least `maxS`, on round clock steps. */
export function timeTicks(maxS: number): number[] {
  const span = Math.max(maxS, 1);
  const step = STEPS_S.find((s) => span / s <= 7) ?? Math.ceil(span / 6 / 86400) * 86400;
  const ticks: number[] = [];
  for (let t = 0; t <= span + step - 1e-9; t += step) {
    ticks.push(t);
    if (t >= span) break;
  }
  return ticks;
}

/** Short readable number: 3 significant figures, trailing zeros dropped. */
export function formatNumber(x: number): string {
  if (x === 0) return '0';
  const abs = Math.abs(x);
  const digits = abs >= 100 ? 0 : abs >= 10 ? 1 : abs >= 1 ? 2 : 3;
  return String(Number(x.toFixed(digits)));
}

function maxY(points: ChartPoint[]): number {
  let m = 0;
  for (const p of points) if (p.y > m) m = p.y;
  return m;
}

function tableOf(points: ChartPoint[], yHead: string, seconds: boolean): ChartData['table'] {
  return { head: [`Time since switch-on (${seconds ? 'h:mm:ss' : 'h:mm'})`, yHead], rows: points.map((p) => [formatClock(p.t, seconds), formatNumber(p.y)]) };
}

function thin(raw: ChartPoint[], target: number): ChartPoint[] {
  return downsample(raw, (p) => p.y, target);
}

/** Light output relative to the output at 30 s (%), with the 30 s reference, the 10 % line and the runtime. */
export function lightChartData(
  samples: readonly Sample[],
  facts: { referenceValue: number; runtimeS: number | null },
  target = CHART_POINTS,
): ChartData {
  const ref = facts.referenceValue;
  const raw = samples.filter((s) => s.value !== undefined).map((s) => ({ t: s.t, y: (s.value! / ref) * 100 }));
  const points = thin(raw, target);
  const lastT = raw.at(-1)?.t ?? 0;
  const seconds = lastT < 1200;
  const refLines: RefLine[] = [
    { axis: 'y', at: 100, label: 'Output at 30 s (100 %)' },
    { axis: 'y', at: 10, label: '10 % of the output at 30 s' },
    { axis: 'x', at: 30, label: '30 s' },
  ];
  if (facts.runtimeS !== null) refLines.push({ axis: 'x', at: facts.runtimeS, label: `Runtime ${formatClock(facts.runtimeS, seconds)}` });
  return {
    points,
    totalReadings: raw.length,
    xTicks: timeTicks(lastT),
    yMax: Math.max(110, Math.ceil(maxY(points) / 10) * 10),
    yLabel: 'Output (% of the output at 30 s)',
    refLines,
    table: tableOf(points, 'Output (% of the output at 30 s)', seconds),
  };
}

function powerPoints(samples: readonly Sample[]): ChartPoint[] {
  const raw: ChartPoint[] = [];
  for (const s of samples) {
    const w = powerOf(s);
    if (w !== undefined) raw.push({ t: s.t, y: w });
  }
  return raw;
}

/** Power (W) against time; the delivered energy is stated by the component. */
export function powerChartData(samples: readonly Sample[], target = CHART_POINTS): ChartData {
  const raw = powerPoints(samples);
  const points = thin(raw, target);
  const lastT = raw.at(-1)?.t ?? 0;
  const seconds = lastT < 1200;
  const top = maxY(points);
  return {
    points,
    totalReadings: raw.length,
    xTicks: timeTicks(lastT),
    yMax: top > 0 ? Number((top * 1.15).toPrecision(2)) : 1,
    yLabel: 'Power (W)',
    refLines: [],
    table: tableOf(points, 'Power (W)', seconds),
  };
}

/** Panel output (W) against time, with the rating line (and the mean) when known. */
export function solarChartData(samples: readonly Sample[], facts: { ratedW: number | null; meanW: number }, target = CHART_POINTS): ChartData {
  const data = powerChartData(samples, target);
  const refLines: RefLine[] = [{ axis: 'y', at: facts.meanW, label: `Mean ${formatNumber(facts.meanW)} W` }];
  if (facts.ratedW !== null) refLines.unshift({ axis: 'y', at: facts.ratedW, label: `Rating ${formatNumber(facts.ratedW)} W (at STC)` });
  const top = Math.max(maxY(data.points), facts.ratedW ?? 0);
  return { ...data, refLines, yMax: top > 0 ? Number((top * 1.15).toPrecision(2)) : 1 };
}
