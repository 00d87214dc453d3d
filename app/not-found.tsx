import Link from 'next/link';

export default function NotFound() {
  return (
    <main className="mx-auto max-w-xl px-4 py-16 sm:px-6">
      <p className="font-mono text-sm text-slate">404</p>
      <h1 className="mt-2 text-3xl font-bold tracking-tight">Nothing here</h1>
      <p className="mt-4 text-slate">This page does not exist, or it is not yours to see.</p>
      <Link href="/" className="mt-6 inline-block font-semibold text-lichen underline">
        Back to Trailbench
      </Link>
    </main>
  );
}
