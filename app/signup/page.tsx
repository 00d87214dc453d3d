import type { Metadata } from 'next';
import Link from 'next/link';
import { redirect } from 'next/navigation';
import { AuthCard } from '@/components/auth/auth-card';
import { SignUpForm } from '@/components/auth/sign-up-form';
import { getCurrentUser } from '@/lib/auth/guard';

export const metadata: Metadata = { title: 'Create an account' };

export default async function SignUpPage({ searchParams }: { searchParams: Promise<{ next?: string }> }) {
  const { next } = await searchParams;
  if (await getCurrentUser()) redirect('/');
  return (
    <AuthCard
      title="Create an account"
      intro={
        <>
          A reader account lets you save kits and follow reviews. Testers are given the reviewer role by an admin. Already
          have an account?{' '}
          <Link href="/signin" className="font-semibold text-lichen underline">
            Sign in
          </Link>
          .
        </>
      }
    >
      <SignUpForm next={next} />
    </AuthCard>
  );
}
