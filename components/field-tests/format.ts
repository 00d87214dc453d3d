import type { FigureSummary, MethodNote } from '@/lib/field-tests/analysis';
import { formatNumber, formatQuantity } from '@/lib/gear/format';

const RATIO_KEYS = new Set(['deliveredVsRated', 'shareOfRating']);

/** A figure with its unit; ratios as a percentage; the reference output in the log's own unit (lx or relative). */
export function formatFigure(value: number, unit: string, key?: string): string {
  if (key !== undefined && RATIO_KEYS.has(key)) return `${formatNumber(value * 100)} %`;
  if (unit === '') return formatNumber(value);
  return formatQuantity(value, unit);
}

/** Stored size: "122 bytes", "301 KB". */
export function formatBytes(bytes: number): string {
  return bytes < 1024 ? `${bytes} bytes` : `${formatNumber(bytes / 1024)} KB`;
}

/** "9 h 40 min ± 12 min (n = 2)"; sd only when there is more than one trial. */
export function formatSummary(s: FigureSummary): string {
  const { mean, sd, n } = s.summary;
  const main = formatFigure(mean, s.unit, s.key);
  if (sd === null || n < 2) return `${main} (n = ${n})`;
  return `${main} ± ${formatFigure(sd, s.unit, s.key)} (n = ${n})`;
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
