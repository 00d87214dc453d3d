import type { Metadata } from 'next';
import Link from 'next/link';
import { NotificationSettingsForm } from '@/components/reviews/notification-settings-form';
import { getDb } from '@/db';
import { getNotificationSettings } from '@/db/reviews';
import { requirePageRole } from '@/lib/auth/guard';
import { hasRole } from '@/lib/auth/roles';

export const metadata: Metadata = { title: 'Review mail settings' };
export const dynamic = 'force-dynamic';

export default async function NotificationSettingsPage() {
  const user = await requirePageRole('reviewer', '/write/notifications');
  const settings = getNotificationSettings(getDb(), user.id);
  return (
    <main className="mx-auto w-full max-w-2xl px-4 py-10 sm:px-6">
      <p className="text-sm text-slate">
        <Link href="/write" className="hover:underline">
          Reviews
        </Link>{' '}
        / Mail settings
      </p>
      <h1 className="mt-1 text-3xl font-bold tracking-tight">Review mail</h1>
      <p className="mt-2 text-slate">Mail goes to {user.email}. Every switch is on until you turn it off; the writing page and the review desk show the same news either way.</p>
      <div className="mt-6 rounded-md border border-rule bg-card p-5">
        <NotificationSettingsForm initial={settings} isEditor={hasRole(user, 'editor')} />
      </div>
    </main>
  );
}
