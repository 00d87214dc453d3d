/**
 * The browse page's URL parameters are those of `GET /api/v1/gear` (a shared browse link is also an API
 * query). This module names them and builds the API query string in one fixed order, on the server
 * (first page) and in the client (TanStack Query key), so both agree on what the first page is.
 */

import { FEATURE_PARAM_KEYS } from '@/lib/browse/feature-filters';

export const BROWSE_FIXED_KEYS = ['category', 'kind', 'q', 'sort', 'order', 'measured', 'reviewed', 'currency', 'min.mass', 'max.mass', 'radioQuiet', ...FEATURE_PARAM_KEYS] as const;

/** Range parameters of the sorted figure (`min.lm-per-g`, `max.lm-per-g`), when it is not mass. */
export function sortRangeKeys(sort: string | null | undefined): string[] {
  return sort && sort !== 'mass' ? [`min.${sort}`, `max.${sort}`] : [];
}

export function browseKeys(sort: string | null | undefined): string[] {
  return [...BROWSE_FIXED_KEYS, ...sortRangeKeys(sort)];
}

/** Items per browse page. */
export const BROWSE_PAGE_SIZE = 24;

/**
 * `category=light&sort=lm-per-g&…&limit=24` from the browse values (blank and null values left out).
 * The units are the reader's site-wide choice, not part of a shared link.
 */
export function browseApiQuery(values: Readonly<Record<string, string | null | undefined>>, units: 'metric' | 'imperial' = 'metric'): string {
  const params = new URLSearchParams();
  for (const key of browseKeys(values.sort)) {
    const value = values[key];
    if (value !== null && value !== undefined && value.trim() !== '') params.set(key, value.trim());
  }
  if (units === 'imperial') params.set('units', 'imperial');
  params.set('limit', String(BROWSE_PAGE_SIZE));
  return params.toString();
}

/** The browse values of a page's search params (first value of each known key; others ignored). */
export function browseValuesFromSearchParams(searchParams: Readonly<Record<string, string | string[] | undefined>>): Record<string, string | null> {
  const first = (v: string | string[] | undefined) => (Array.isArray(v) ? (v[0] ?? null) : (v ?? null));
  const sort = first(searchParams.sort);
  return Object.fromEntries(browseKeys(sort).map((key) => [key, first(searchParams[key])]));
}
