import type { Metadata } from 'next';
import Link from 'next/link';
import { AuthCard } from '@/components/auth/auth-card';
import { ConfirmLinkForm } from '@/components/auth/confirm-link-form';
import { getDb } from '@/db';
import { peekMagicLinkToken } from '@/db/magic-links';

export const metadata: Metadata = { title: 'Confirm sign-in', robots: { index: false } };

function maskEmail(email: string): string {
  const [local = '', domain = ''] = email.split('@');
  return `${local.slice(0, 2)}${'•'.repeat(Math.max(1, local.length - 2))}@${domain}`;
}

/** Opening this page (as mail scanners do) spends nothing; the button does. */
export default async function ConfirmSignInPage({ searchParams }: { searchParams: Promise<{ token?: string }> }) {
  const { token } = await searchParams;
  const pending = typeof token === 'string' && token.length <= 100 ? peekMagicLinkToken(getDb(), token) : null;
  if (!token || !pending) {
    return (
      <AuthCard title="This link no longer works">
        <p>Sign-in links work once and expire after 10 minutes.</p>
        <Link href="/signin" className="font-semibold text-lichen underline">
          Ask for a new link
        </Link>
      </AuthCard>
    );
  }
  return (
    <AuthCard title="Confirm sign-in" intro={<>Sign in as <span className="font-mono">{maskEmail(pending.email)}</span>?</>}>
      <ConfirmLinkForm token={token} />
    </AuthCard>
  );
}
