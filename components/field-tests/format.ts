import type { FigureSummary, MethodNote } from '@/lib/field-tests/analysis';
import { formatNumber, formatQuantity } from '@/lib/gear/format';

/** A figure with its unit; ratios ('' unit) as a percentage. */
export function formatFigure(value: number, unit: string): string {
  if (unit === '') return `${formatNumber(value * 100)} %`;
  return formatQuantity(value, unit);
}

/** "9 h 40 min ± 12 min (n = 2)"; sd only when there is more than one trial. */
export function formatSummary(s: FigureSummary): string {
  const { mean, sd, n } = s.summary;
  const main = formatFigure(mean, s.unit);
  if (sd === null || n < 2) return `${main} (n = ${n})`;
  return `${main} ± ${formatFigure(sd, s.unit)} (n = ${n})`;
}

/** The section of /how-we-test that explains a method (heading ids from lib/markdown, prefixed `user-content-`). */
const METHOD_ANCHORS: Record<MethodNote['id'], string> = {
  'fl1-runtime': 'runtime',
  'inverse-square': 'peak-intensity-and-beam-distance',
  'trapezoid-energy': 'energy-delivered',
  'solar-output': 'output-as-a-share-of-rating',
  'charge-time': 'batteries-and-power-banks',
  typed: 'claimed-and-measured',
  'repeat-trials': 'field-tests-and-trials',
};

export function methodHref(id: MethodNote['id']): string {
  return `/how-we-test#user-content-${METHOD_ANCHORS[id]}`;
}

export function formatTestedAt(d: Date): string {
  return `${d.toISOString().slice(0, 10)} ${d.toISOString().slice(11, 16)} UTC`;
}
