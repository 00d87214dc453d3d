import Link from 'next/link';
import { LogoMark } from './logo-mark';
import { signOutAction } from '@/lib/auth/actions';
import { getCurrentUser } from '@/lib/auth/guard';
import { hasRole, ROLE_LABELS } from '@/lib/auth/roles';
import { UnitsToggle } from './units-toggle';
import { getUnitSystem } from '@/lib/units/preference';

const readerLinks = [
  { href: '/gear', label: 'Browse' },
  { href: '/side-by-side', label: 'Side-by-side' },
  { href: '/best-value', label: 'Best value' },
  { href: '/reviews', label: 'Reviews' },
  { href: '/kits', label: 'Kits' },
  { href: '/how-we-test', label: 'How we test' },
  { href: '/safety', label: 'Safety' },
  { href: '/search', label: 'Search' },
];

export async function SiteHeader() {
  const user = await getCurrentUser();
  const units = await getUnitSystem();
  const roleLinks = [
    hasRole(user, 'reviewer') && { href: '/logbook', label: 'Logbook' },
    hasRole(user, 'reviewer') && { href: '/write', label: 'Write' },
    hasRole(user, 'editor') && { href: '/desk', label: 'Review desk' },
    hasRole(user, 'admin') && { href: '/admin/users', label: 'Admin' },
  ].filter((l): l is { href: string; label: string } => Boolean(l));

  return (
    <header className="border-b border-rule bg-paper">
      <a href="#main" className="sr-only focus:not-sr-only focus:absolute focus:left-2 focus:top-2 focus:rounded focus:bg-lichen focus:px-3 focus:py-2 focus:text-paper">
        Skip to content
      </a>
      <div className="mx-auto flex max-w-6xl flex-wrap items-center gap-x-6 gap-y-2 px-4 py-3 sm:px-6">
        <Link href="/" className="flex items-center gap-2 text-ink" aria-label="Trailbench home">
          <LogoMark className="h-8 w-8" />
          <span className="text-lg font-bold tracking-tight">Trailbench</span>
        </Link>
        <nav aria-label="Main" className="order-3 w-full sm:order-none sm:w-auto">
          <ul className="flex flex-wrap gap-x-4 gap-y-1 text-sm">
            {[...readerLinks, ...roleLinks].map((link) => (
              <li key={link.href}>
                <Link href={link.href} className="rounded px-1 py-1 text-slate hover:text-ink hover:underline">
                  {link.label}
                </Link>
              </li>
            ))}
          </ul>
        </nav>
        <div className="ml-auto flex items-center gap-3 text-sm">
          <UnitsToggle current={units} />
          {user ? (
            <>
              <span className="hidden text-slate md:inline" data-testid="signed-in-as">
                {user.name} · <span className="font-mono text-xs uppercase tracking-wide">{ROLE_LABELS[user.role]}</span>
              </span>
              <Link href="/account" className="rounded-md px-2 py-1.5 font-semibold hover:bg-card" data-testid="account-link">
                Account
              </Link>
              <form action={signOutAction}>
                <button type="submit" className="rounded-md border border-rule px-3 py-1.5 font-semibold hover:bg-card">
                  Sign out
                </button>
              </form>
            </>
          ) : (
            <>
              <Link href="/signin" className="rounded-md px-3 py-1.5 font-semibold hover:bg-card">
                Sign in
              </Link>
              <Link href="/signup" className="rounded-md bg-lichen px-3 py-1.5 font-semibold text-paper hover:bg-lichen-dark">
                Create account
              </Link>
            </>
          )}
        </div>
      </div>
    </header>
  );
}
