import type { ReactNode } from 'react';

export function AuthCard({ title, intro, children }: { title: string; intro?: ReactNode; children: ReactNode }) {
  return (
    <main className="mx-auto max-w-md px-4 py-12 sm:px-6">
      <h1 className="text-3xl font-bold tracking-tight">{title}</h1>
      {intro ? <div className="mt-2 text-slate">{intro}</div> : null}
      <div className="mt-8 space-y-8">{children}</div>
    </main>
  );
}
