'use client';

import { Button } from '@/components/ui/form';

export default function ErrorPage({ reset }: { error: Error & { digest?: string }; reset: () => void }) {
  return (
    <main className="mx-auto max-w-xl px-4 py-16 sm:px-6">
      <p className="font-mono text-sm text-slate">500</p>
      <h1 className="mt-2 text-3xl font-bold tracking-tight">Something went wrong on our side</h1>
      <p className="mt-4 text-slate">Nothing you entered was saved twice or lost by this error. Try again in a moment.</p>
      <Button className="mt-6" onClick={() => reset()}>
        Try again
      </Button>
    </main>
  );
}
