import type { Metadata } from 'next';
import Link from 'next/link';
import { redirect } from 'next/navigation';
import { AuthCard } from '@/components/auth/auth-card';
import { MagicLinkForm } from '@/components/auth/magic-link-form';
import { SignInForm } from '@/components/auth/sign-in-form';
import { getCurrentUser } from '@/lib/auth/guard';
import { safeNextPath } from '@/lib/auth/next-path';

export const metadata: Metadata = { title: 'Sign in' };

export default async function SignInPage({ searchParams }: { searchParams: Promise<{ next?: string }> }) {
  const { next } = await searchParams;
  if (await getCurrentUser()) redirect(safeNextPath(next));
  return (
    <AuthCard
      title="Sign in"
      intro={
        <>
          New here?{' '}
          <Link href={next ? `/signup?next=${encodeURIComponent(next)}` : '/signup'} className="font-semibold text-lichen underline">
            Create an account
          </Link>
          .
        </>
      }
    >
      <section aria-labelledby="with-password" className="rounded-lg border border-rule bg-card/50 p-5">
        <h2 id="with-password" className="mb-4 text-base font-semibold">With your password</h2>
        <SignInForm next={next} />
      </section>
      <section aria-labelledby="with-link" className="rounded-lg border border-rule p-5">
        <h2 id="with-link" className="mb-4 text-base font-semibold">Or with a link by e-mail</h2>
        <MagicLinkForm />
      </section>
    </AuthCard>
  );
}
