export const dynamic = 'force-dynamic';

/** The public revision of one review with its Markdown body; 404 for drafts and unknown slugs. */
export { handleReview as GET } from '@/lib/browse/handlers';
