/**
 * Downsampling for charts: min/max per bucket. The series is cut into equal-count buckets and
 * each bucket keeps its lowest and its highest point (in time order), so every peak and dip
 * survives and the outline of the curve is the same at chart resolution. The first and last
 * points are always kept. Only the chart uses this; every computation uses all rows.
 */

/** Default number of points drawn. */
export const CHART_POINTS = 2000;

/**
 * Picks at most `target` (≥ 4) points of `points`, in order, keeping the first and last and the
 * lowest and highest of each bucket by `y`. Returns the points themselves (no new ones); a
 * series already short enough comes back as a copy. Non-finite y values are never picked as
 * extremes unless a bucket has nothing else.
 */
export function downsample<T>(points: readonly T[], y: (p: T) => number, target: number = CHART_POINTS): T[] {
  const n = points.length;
  const limit = Math.max(4, Math.floor(target));
  if (n <= limit) return points.slice();
  const inner = n - 2;
  const buckets = Math.floor((limit - 2) / 2);
  const out: T[] = [points[0]!];
  for (let b = 0; b < buckets; b++) {
    const start = 1 + Math.floor((b * inner) / buckets);
    const end = 1 + Math.floor(((b + 1) * inner) / buckets);
    if (end <= start) continue;
    let lo = start;
    let hi = start;
    let loY = Infinity;
    let hiY = -Infinity;
    for (let i = start; i < end; i++) {
      const v = y(points[i]!);
      if (v < loY) [lo, loY] = [i, v];
      if (v > hiY) [hi, hiY] = [i, v];
    }
    if (lo === hi) out.push(points[lo]!);
    else if (lo < hi) out.push(points[lo]!, points[hi]!);
    else out.push(points[hi]!, points[lo]!);
  }
  out.push(points[n - 1]!);
  return out;
}
