import type { Metadata } from 'next';
import { ComingSoon } from '@/components/coming-soon';

export const metadata: Metadata = { title: 'Reviews' };

export default function ReviewsPage() {
  return (
    <ComingSoon title="Reviews">
      <p>Published reviews, each with its disclosure of how the tester got the gear and links to the field tests behind its figures.</p>
    </ComingSoon>
  );
}
