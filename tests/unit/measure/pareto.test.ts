import { describe, expect, it } from 'vitest';
import fc from 'fast-check';
import { paretoFront, type ParetoDirections } from '@/lib/measure';
import { expectCode } from './helpers';

// Pareto dominance (definition): a dominates b when a is at least as good on both axes and strictly
// better on at least one; the front is the set of non-dominated points. Fixtures worked by hand.

interface Item {
  id: string;
  mass: number | null;
  lumens: number | null;
}

const items: Item[] = [
  { id: 'A', mass: 100, lumens: 300 },
  { id: 'B', mass: 150, lumens: 500 },
  { id: 'C', mass: 150, lumens: 400 }, // dominated by B (same mass, less light)
  { id: 'D', mass: 200, lumens: 450 }, // dominated by B (lighter and brighter)
  { id: 'E', mass: 80, lumens: 100 },
  { id: 'F', mass: 100, lumens: 300 }, // identical to A: both kept
  { id: 'G', mass: null, lumens: 2000 }, // no mass: left out
  { id: 'H', mass: 300, lumens: 1000 },
  { id: 'I', mass: 90, lumens: null }, // no output: left out
];
const ids = (xs: Item[]) => xs.map((i) => i.id);

describe('paretoFront', () => {
  it('mass (min) vs light output (max)', () => {
    expect(ids(paretoFront(items, (i) => i.mass, (i) => i.lumens, { x: 'min', y: 'max' }))).toEqual(['E', 'A', 'F', 'B', 'H']);
  });

  it('both axes maximised: only the top corner', () => {
    expect(ids(paretoFront(items, (i) => i.mass, (i) => i.lumens, { x: 'max', y: 'max' }))).toEqual(['H']);
  });

  it('both minimised', () => {
    expect(ids(paretoFront(items, (i) => i.mass, (i) => i.lumens, { x: 'min', y: 'min' }))).toEqual(['E']);
  });

  it('x maximised, y minimised; ordered by x ascending', () => {
    // price-like y to minimise: (x=1,y=5) (x=2,y=5) (x=3,y=9) (x=3,y=7) → front: (2,5), (3,7).
    const pts = [
      { id: 'p', x: 1, y: 5 },
      { id: 'q', x: 2, y: 5 },
      { id: 'r', x: 3, y: 9 },
      { id: 's', x: 3, y: 7 },
    ];
    expect(paretoFront(pts, (p) => p.x, (p) => p.y, { x: 'max', y: 'min' }).map((p) => p.id)).toEqual(['q', 's']);
  });

  it('empty and all-null inputs give an empty front', () => {
    expect(paretoFront([], () => 1, () => 1, { x: 'min', y: 'max' })).toEqual([]);
    expect(paretoFront([1, 2], () => null, () => 1, { x: 'min', y: 'max' })).toEqual([]);
  });

  it('throws for non-finite values and bad directions', () => {
    expectCode(() => paretoFront([1], () => Number.NaN, () => 1, { x: 'min', y: 'max' }), 'not-finite');
    expectCode(() => paretoFront([1], () => 1, () => Infinity, { x: 'min', y: 'max' }), 'not-finite');
    expectCode(() => paretoFront([1], () => 1, () => 1, { x: 'up', y: 'max' } as unknown as ParetoDirections), 'out-of-range');
  });
});

describe('paretoFront properties', () => {
  const pointArb = fc.record({
    x: fc.option(fc.integer({ min: -5, max: 5 }), { freq: 8 }),
    y: fc.option(fc.integer({ min: -5, max: 5 }), { freq: 8 }),
  });
  const dirArb = fc.record({ x: fc.constantFrom('min', 'max'), y: fc.constantFrom('min', 'max') }) as fc.Arbitrary<ParetoDirections>;

  /** Brute-force dominance, written independently of the library. */
  function dominates(a: { x: number; y: number }, b: { x: number; y: number }, d: ParetoDirections): boolean {
    const gx = (v: number) => (d.x === 'max' ? v : -v);
    const gy = (v: number) => (d.y === 'max' ? v : -v);
    const geq = gx(a.x) >= gx(b.x) && gy(a.y) >= gy(b.y);
    const gt = gx(a.x) > gx(b.x) || gy(a.y) > gy(b.y);
    return geq && gt;
  }

  it('members are never dominated; every other complete item is dominated; order is x ascending then input order', () => {
    fc.assert(
      fc.property(fc.array(pointArb, { maxLength: 40 }), dirArb, (pts, d) => {
        const indexed = pts.map((p, index) => ({ ...p, index }));
        const complete = indexed.filter((p): p is { x: number; y: number; index: number } => p.x !== null && p.y !== null);
        const front = paretoFront(indexed, (p) => p.x, (p) => p.y, d);
        const inFront = new Set(front.map((p) => p.index));
        for (const p of front) {
          expect(p.x).not.toBeNull();
          expect(complete.some((q) => dominates(q, p as { x: number; y: number }, d))).toBe(false);
        }
        for (const p of complete) {
          if (!inFront.has(p.index)) expect(complete.some((q) => dominates(q, p, d))).toBe(true);
        }
        for (let i = 1; i < front.length; i++) {
          const a = front[i - 1]!;
          const b = front[i]!;
          expect(a.x! < b.x! || (a.x === b.x && a.index < b.index)).toBe(true);
        }
      }),
      { numRuns: 300 },
    );
  });

  it('keeps every copy of an identical point', () => {
    fc.assert(
      fc.property(fc.array(pointArb, { maxLength: 20 }), dirArb, fc.nat(), (pts, d, k) => {
        const complete = pts.filter((p) => p.x !== null && p.y !== null);
        if (complete.length === 0) return;
        const dup = complete[k % complete.length]!;
        const withDup = [...pts, { ...dup }];
        const front = paretoFront(withDup, (p) => p.x, (p) => p.y, d);
        const copies = front.filter((p) => p.x === dup.x && p.y === dup.y).length;
        expect(copies === 0 || copies === withDup.filter((p) => p.x === dup.x && p.y === dup.y).length).toBe(true);
      }),
      { numRuns: 200 },
    );
  });
});
