import { MeasureError } from './errors';

/** Which end of an axis is better. */
export type Direction = 'min' | 'max';

/** Directions of the two axes of a best-value plot. */
export interface ParetoDirections {
  x: Direction;
  y: Direction;
}

function read<T>(accessor: (item: T) => number | null | undefined, item: T, axis: string, index: number): number | null {
  const value = accessor(item);
  if (value === null || value === undefined) return null;
  if (typeof value !== 'number' || !Number.isFinite(value)) {
    throw new MeasureError('not-finite', `Item ${index + 1} has a ${axis} value that is not a finite number (${String(value)}).`);
  }
  return value;
}

/**
 * The best-value line (Pareto front) of `items` on two axes. An item is dominated when
 * another item is at least as good on both axes and strictly better on at least one; the
 * front is every item that is not dominated. Identical points are all kept. Items whose
 * `x` or `y` is null (or undefined) are left out; a non-finite value throws `not-finite`.
 *
 * Order: x ascending, then y best first, then input order. O(n log n).
 */
export function paretoFront<T>(
  items: readonly T[],
  x: (item: T) => number | null | undefined,
  y: (item: T) => number | null | undefined,
  directions: ParetoDirections,
): T[] {
  for (const axis of ['x', 'y'] as const) {
    const d = directions?.[axis];
    if (d !== 'min' && d !== 'max') {
      throw new MeasureError('out-of-range', `Direction for ${axis} must be 'min' or 'max', got ${String(d)}.`);
    }
  }
  const sx = directions.x === 'max' ? 1 : -1;
  const sy = directions.y === 'max' ? 1 : -1;
  const points: { item: T; index: number; x: number; y: number; gx: number; gy: number }[] = [];
  items.forEach((item, index) => {
    const vx = read(x, item, 'x', index);
    const vy = read(y, item, 'y', index);
    if (vx === null || vy === null) return;
    // gx, gy: "goodness", larger is better on both axes (0 normalised so -0 never appears).
    points.push({ item, index, x: vx, y: vy, gx: sx * vx + 0, gy: sy * vy + 0 });
  });
  // Best x first; within equal x, best y first.
  const byGoodness = [...points].sort((a, b) => b.gx - a.gx || b.gy - a.gy || a.index - b.index);
  const front: typeof points = [];
  let bestYOfBetterX = -Infinity;
  let i = 0;
  while (i < byGoodness.length) {
    const groupX = byGoodness[i]!.gx;
    const groupBestY = byGoodness[i]!.gy;
    let j = i;
    while (j < byGoodness.length && byGoodness[j]!.gx === groupX) {
      const p = byGoodness[j]!;
      // Non-dominated: best y within its x group, and no item with better x has y at least as good.
      if (p.gy === groupBestY && groupBestY > bestYOfBetterX) front.push(p);
      j++;
    }
    bestYOfBetterX = Math.max(bestYOfBetterX, groupBestY);
    i = j;
  }
  front.sort((a, b) => a.x - b.x || b.gy - a.gy || a.index - b.index);
  return front.map((p) => p.item);
}
