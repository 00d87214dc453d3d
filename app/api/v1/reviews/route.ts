export const dynamic = 'force-dynamic';

/** Published reviews, newest first, paged (query and answer: lib/browse/query.ts, lib/browse/contract.ts). */
export { handleReviewList as GET } from '@/lib/browse/handlers';
