import Link from 'next/link';

export default function Forbidden() {
  return (
    <main className="mx-auto max-w-xl px-4 py-16 sm:px-6">
      <p className="font-mono text-sm text-slate">403</p>
      <h1 className="mt-2 text-3xl font-bold tracking-tight">Not open to your role</h1>
      <p className="mt-4 text-slate">Your account can see this area&apos;s entrance but not use it. An admin can change roles.</p>
      <Link href="/" className="mt-6 inline-block font-semibold text-lichen underline">
        Back to Trailbench
      </Link>
    </main>
  );
}
