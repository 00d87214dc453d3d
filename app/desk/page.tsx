import type { Metadata } from 'next';
import { ComingSoon } from '@/components/coming-soon';
import { requirePageRole } from '@/lib/auth/guard';

export const metadata: Metadata = { title: 'Review desk' };

export default async function ReviewDeskPage() {
  await requirePageRole('editor', '/desk');
  return (
    <ComingSoon title="Review desk">
      <p>Submitted drafts — reviews, gear items and field tests — will queue here for an editor to approve or send back with comments.</p>
    </ComingSoon>
  );
}
