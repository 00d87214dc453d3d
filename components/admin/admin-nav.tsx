import Link from 'next/link';

export function AdminNav({ current }: { current: 'users' | 'outbox' }) {
  const item = (key: typeof current, href: string, label: string) => (
    <Link
      href={href}
      aria-current={current === key ? 'page' : undefined}
      className={current === key ? 'border-b-2 border-lichen pb-1 font-semibold' : 'pb-1 text-slate hover:text-ink'}
    >
      {label}
    </Link>
  );
  return (
    <nav aria-label="Admin" className="mt-4 flex gap-6 border-b border-rule text-sm">
      {item('users', '/admin/users', 'Accounts and roles')}
      {item('outbox', '/admin/outbox', 'Outbox')}
    </nav>
  );
}
