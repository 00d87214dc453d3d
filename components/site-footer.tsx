import Link from 'next/link';

export function SiteFooter() {
  return (
    <footer className="mt-16 border-t border-rule">
      <div className="mx-auto flex max-w-6xl flex-wrap gap-x-6 gap-y-2 px-4 py-6 text-sm text-slate sm:px-6">
        <span>Trailbench — measured gear tests</span>
        <Link href="/about" className="hover:text-ink hover:underline">About</Link>
        <Link href="/how-we-test" className="hover:text-ink hover:underline">How we test</Link>
        <Link href="/safety" className="hover:text-ink hover:underline">Safety cautions</Link>
        <Link href="/help" className="hover:text-ink hover:underline">Help</Link>
        <Link href="/disclosure" className="hover:text-ink hover:underline">Disclosure</Link>
        <Link href="/api-guide" className="hover:text-ink hover:underline">API guide</Link>
      </div>
    </footer>
  );
}
