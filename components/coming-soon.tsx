import type { ReactNode } from 'react';

/** A page whose feature is being built: says so plainly, shows no invented data and no dead controls. */
export function ComingSoon({ title, children }: { title: string; children: ReactNode }) {
  return (
    <main className="mx-auto max-w-3xl px-4 py-12 sm:px-6">
      <h1 className="text-3xl font-bold tracking-tight">{title}</h1>
      <div className="mt-6 rounded-lg border border-dashed border-rule bg-card/40 p-6 text-slate">
        <p className="font-mono text-xs uppercase tracking-wide text-amber">Coming</p>
        <div className="mt-2 space-y-2">{children}</div>
      </div>
    </main>
  );
}
