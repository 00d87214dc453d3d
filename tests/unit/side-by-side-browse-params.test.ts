import { describe, expect, it } from 'vitest';
import { browseApiQuery, browseKeys, browseValuesFromSearchParams } from '@/components/browse/browse-params';
import { parseGearListQuery } from '@/lib/browse/query';

// The browse page and its client share one query builder so the server-rendered first page is the
// page the client would fetch; these check that both sides build the same, valid API query.

describe('browse parameters', () => {
  it('builds the API query in a fixed order, leaving out blanks, with the page size', () => {
    expect(browseApiQuery({ sort: 'lm-per-g', category: 'light', 'max.mass': '300', q: '  ', kind: null })).toBe('category=light&sort=lm-per-g&max.mass=300&limit=24');
    expect(browseApiQuery({ category: 'light' }, 'imperial')).toBe('category=light&units=imperial&limit=24');
  });

  it('adds the range keys of the sorted figure, not of other figures', () => {
    expect(browseKeys('lm-per-g')).toEqual(expect.arrayContaining(['min.lm-per-g', 'max.lm-per-g']));
    expect(browseKeys('mass').filter((k) => k.includes('mass'))).toEqual(['min.mass', 'max.mass']);
    const values = browseValuesFromSearchParams({ sort: 'lm-per-g', 'min.lm-per-g': '2', 'min.wh-per-kg': '100', category: ['light', 'radio'], cursor: 'abc' });
    expect(values['min.lm-per-g']).toBe('2');
    expect(values.category).toBe('light'); // first of a repeated parameter
    expect('min.wh-per-kg' in values).toBe(false); // not the sorted figure: ignored
    expect('cursor' in values).toBe(false); // the first page never starts at a cursor
  });

  it('what the page builds is a query the API accepts', () => {
    const query = browseApiQuery(browseValuesFromSearchParams({ category: 'light', sort: 'lm-per-money', currency: 'USD', 'min.lm-per-money': '5', measured: 'only' }));
    const parsed = parseGearListQuery(new URLSearchParams(query));
    expect(parsed).toMatchObject({ category: 'light', sort: 'lm-per-money', currency: 'USD', measuredOnly: true, limit: 24, ranges: [{ key: 'lm-per-money', min: 5 }] });
  });
});
