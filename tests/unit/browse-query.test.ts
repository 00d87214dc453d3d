import { describe, expect, it } from 'vitest';
import { decodeGearCursor, encodeCursor } from '@/lib/browse/cursor';
import { FIGURE_KEYS, higherIsBetter, isMoneyKey, parseCompareQuery, parseGearListQuery, parseReviewListQuery } from '@/lib/browse/query';
import { containsPattern } from '@/db/browse';
import { AppError } from '@/lib/http/errors';
import { SPEC_KEYS } from '@/lib/measure';

const parse = (query: string) => parseGearListQuery(new URLSearchParams(query));
function fieldsOf(run: () => unknown): Record<string, string[]> {
  try {
    run();
  } catch (error) {
    expect(error).toBeInstanceOf(AppError);
    expect((error as AppError).code).toBe('bad_request');
    return (error as AppError).fields ?? {};
  }
  throw new Error('expected a 400');
}

describe('GET /api/v1/gear query', () => {
  it('has defaults: 24 per page, slug order ascending, metric, no filters', () => {
    expect(parse('')).toEqual({ measuredOnly: false, reviewedOnly: false, order: 'asc', limit: 24, imperial: false, ranges: [], features: [] });
  });

  it('orders better values first by default, following lib/measure directions', () => {
    expect(parse('sort=mass').order).toBe('asc'); // SPECS.mass.higherIsBetter = false
    expect(parse('sort=lm-per-g').order).toBe('desc');
    expect(parse('sort=money-per-wh&currency=USD').order).toBe('asc'); // valueRatios money-per-wh higherIsBetter false
    expect(parse('sort=supplyVoltage').order).toBe('asc'); // no better direction
    expect(parse('sort=mass&order=desc').order).toBe('desc');
  });

  it('reads ranges for specs, ratios, measured ÷ claimed and price as numbers', () => {
    const q = parse('min.mass=100&max.mass=300.5&min.lm-per-g=2&max.measured-vs-claimed:mass=1.1&max.price=40&currency=USD');
    expect(q.ranges).toEqual([
      { key: 'mass', min: 100, max: 300.5 },
      { key: 'lm-per-g', min: 2, max: undefined },
      { key: 'measured-vs-claimed:mass', min: undefined, max: 1.1 },
      { key: 'price', min: undefined, max: 40 },
    ]);
    expect(parse('min.mass=1e2').ranges[0]!.min).toBe(100);
    expect(parse('min.mass=-.5').ranges[0]!.min).toBe(-0.5);
  });

  it('names every bad and unknown parameter at once', () => {
    const fields = fieldsOf(() => parse('sort=weight&colour=red&limit=0'));
    expect(Object.keys(fields).sort()).toEqual(['colour', 'limit', 'sort']);
  });

  it('knows which keys involve money and which direction is better', () => {
    expect(FIGURE_KEYS.filter(isMoneyKey).sort()).toEqual(['delivered-wh-per-money', 'lm-per-money', 'money-per-wh', 'price', 'w-per-money', 'wh-per-money']);
    for (const key of SPEC_KEYS) expect(FIGURE_KEYS).toContain(`measured-vs-claimed:${key}`);
    expect(higherIsBetter('measured-vs-claimed:chargeTime')).toBe(false);
    expect(higherIsBetter('price')).toBe(false);
  });
});

describe('other queries', () => {
  it('compare takes 2–6 distinct slugs', () => {
    expect(parseCompareQuery(new URLSearchParams('items=a-1,b-2&units=imperial'))).toEqual({ items: ['a-1', 'b-2'], imperial: true });
    expect(Object.keys(fieldsOf(() => parseCompareQuery(new URLSearchParams('items=a,b,c,d,e,f,g'))))).toEqual(['items']);
    expect(Object.keys(fieldsOf(() => parseCompareQuery(new URLSearchParams('items=-a,b'))))).toEqual(['items']);
  });

  it('reviews take limit, cursor and gear', () => {
    expect(parseReviewListQuery(new URLSearchParams('gear=northcairn-ember-300&limit=5'))).toEqual({ gear: 'northcairn-ember-300', limit: 5, cursor: undefined });
  });
});

describe('cursors', () => {
  it('round-trip, and are refused for another sort or when altered', () => {
    const cursor = encodeCursor({ k: 'mass', o: 'asc', v: 210.5, s: 'trail' });
    expect(cursor).toMatch(/^[A-Za-z0-9_-]+$/);
    expect(decodeGearCursor(cursor, 'mass', 'asc')).toEqual({ k: 'mass', o: 'asc', v: 210.5, s: 'trail' });
    expect(() => decodeGearCursor(cursor, 'mass', 'desc')).toThrow(AppError);
    expect(() => decodeGearCursor(cursor, null, 'asc')).toThrow(AppError);
    expect(() => decodeGearCursor(`${cursor}x`, 'mass', 'asc')).toThrow(AppError);
    expect(() => decodeGearCursor(encodeCursor({ k: 'mass', o: 'asc', v: 'big', s: 'trail' }), 'mass', 'asc')).toThrow(AppError);
  });
});

describe('text search pattern', () => {
  it('takes LIKE wildcards and the escape character literally', () => {
    // SQLite LIKE: % any run, _ one character; with ESCAPE '\' a backslash makes them literal (sqlite.org/lang_expr.html#like).
    expect(containsPattern('pocket_100%')).toBe('%pocket\\_100\\%%');
    expect(containsPattern('a\\b')).toBe('%a\\\\b%');
  });
});
