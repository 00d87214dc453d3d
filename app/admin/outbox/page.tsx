import type { Metadata } from 'next';
import { AdminNav } from '@/components/admin/admin-nav';
import { getDb } from '@/db';
import { listCapturedEmails } from '@/db/outbox';
import { requirePageRole } from '@/lib/auth/guard';

export const metadata: Metadata = { title: 'Outbox' };

export default async function OutboxPage() {
  await requirePageRole('admin', '/admin/outbox');
  const messages = listCapturedEmails(getDb());
  return (
    <main className="mx-auto max-w-6xl px-4 py-10 sm:px-6">
      <h1 className="text-3xl font-bold tracking-tight">Admin</h1>
      <AdminNav current="outbox" />
      <p className="mt-6 max-w-2xl text-slate">
        {process.env.SMTP_URL
          ? 'Mail goes to the SMTP server set in SMTP_URL; nothing is captured here.'
          : 'No SMTP_URL is set, so the app keeps every message it sends here instead of delivering it: sign-in links and notifications.'}
      </p>
      {messages.length === 0 ? (
        <p className="mt-8 rounded-lg border border-dashed border-rule p-6 text-slate">No messages yet.</p>
      ) : (
        <ol className="mt-6 space-y-4" data-testid="outbox">
          {messages.map((m) => (
            <li key={m.id} className="rounded-lg border border-rule p-4" data-to={m.toAddress}>
              <div className="flex flex-wrap justify-between gap-2 text-sm">
                <span className="font-semibold">{m.subject}</span>
                <time className="figure text-slate" dateTime={m.createdAt.toISOString()}>
                  {m.createdAt.toISOString().replace('T', ' ').slice(0, 19)} UTC
                </time>
              </div>
              <p className="mt-1 text-xs text-slate">
                To <span className="font-mono">{m.toAddress}</span>
              </p>
              <pre className="mt-3 whitespace-pre-wrap break-all font-mono text-xs" data-testid="outbox-body">{m.textBody}</pre>
            </li>
          ))}
        </ol>
      )}
    </main>
  );
}
