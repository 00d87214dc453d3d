import type { GearListResponse, GearSummary } from '@/lib/browse/contract';
import { fetchJson } from '../browse/fetch-json';

/** Pages through `GET /api/v1/gear` (100 a page) up to `maxItems`; the plot needs the whole category. */
export async function fetchAllGear(query: URLSearchParams, signal: AbortSignal, maxItems = 1000): Promise<{ items: GearSummary[]; excludedOtherCurrency: number; complete: boolean }> {
  const items: GearSummary[] = [];
  let cursor: string | null = null;
  let excludedOtherCurrency = 0;
  do {
    const params = new URLSearchParams(query);
    params.set('limit', '100');
    if (cursor) params.set('cursor', cursor);
    const page: GearListResponse = await fetchJson<GearListResponse>(`/api/v1/gear?${params.toString()}`, signal);
    items.push(...page.items);
    excludedOtherCurrency = page.excludedOtherCurrency;
    cursor = page.nextCursor;
  } while (cursor && items.length < maxItems);
  return { items, excludedOtherCurrency, complete: cursor === null };
}
