export const dynamic = 'force-dynamic';

/** Side-by-side of 2–6 items, rows aligned by spec (query and answer: lib/browse/query.ts, lib/browse/contract.ts). */
export { handleCompare as GET } from '@/lib/browse/handlers';
