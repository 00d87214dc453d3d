import type { Metadata } from 'next';
import { ComingSoon } from '@/components/coming-soon';
import { requirePageRole } from '@/lib/auth/guard';

export const metadata: Metadata = { title: 'Logbook' };

export default async function LogbookPage() {
  const user = await requirePageRole('reviewer', '/logbook');
  return (
    <ComingSoon title={`${user.name}'s logbook`}>
      <p>Your gear items, field tests, readings uploads and review drafts will be listed and edited here.</p>
    </ComingSoon>
  );
}
