import type { Metadata } from 'next';
import { AdminNav } from '@/components/admin/admin-nav';
import { UserRowActions } from '@/components/admin/user-row-actions';
import { getDb } from '@/db';
import { listUsers } from '@/db/users';
import { requirePageRole } from '@/lib/auth/guard';
import { ROLE_LABELS } from '@/lib/auth/roles';

export const metadata: Metadata = { title: 'Accounts and roles' };

export default async function AdminUsersPage() {
  const admin = await requirePageRole('admin', '/admin/users');
  const accounts = listUsers(getDb());
  return (
    <main className="mx-auto max-w-6xl px-4 py-10 sm:px-6">
      <h1 className="text-3xl font-bold tracking-tight">Admin</h1>
      <AdminNav current="users" />
      <p className="mt-6 max-w-2xl text-slate">
        Every role change is logged and ends that person&apos;s open sessions, so the new role applies from their next
        sign-in. Disabling an account signs it out everywhere.
      </p>
      <div className="mt-6 overflow-x-auto rounded-lg border border-rule">
        <table className="w-full text-left text-sm" data-testid="user-table">
          <caption className="sr-only">Accounts</caption>
          <thead className="bg-card text-xs uppercase tracking-wide text-slate">
            <tr>
              <th scope="col" className="px-3 py-2">Name</th>
              <th scope="col" className="px-3 py-2">E-mail</th>
              <th scope="col" className="px-3 py-2">Role</th>
              <th scope="col" className="px-3 py-2">Joined</th>
              <th scope="col" className="px-3 py-2">Change</th>
            </tr>
          </thead>
          <tbody>
            {accounts.map((account) => (
              <tr key={account.id} className="border-t border-rule align-middle" data-email={account.email}>
                <th scope="row" className="px-3 py-2 font-semibold">
                  {account.name}
                  {account.isDemo ? <span className="ml-2 rounded border border-rule px-1 font-mono text-[10px] uppercase text-slate">demo</span> : null}
                  {account.disabledAt ? <span className="ml-2 rounded bg-danger-tint px-1 font-mono text-[10px] uppercase text-danger">disabled</span> : null}
                </th>
                <td className="px-3 py-2 font-mono text-xs">{account.email}</td>
                <td className="px-3 py-2" data-testid="role-cell">{ROLE_LABELS[account.role]}</td>
                <td className="px-3 py-2 figure text-slate">{account.createdAt.toISOString().slice(0, 10)}</td>
                <td className="px-3 py-2">
                  <UserRowActions userId={account.id} email={account.email} role={account.role} disabled={!!account.disabledAt} isSelf={account.id === admin.id} />
                </td>
              </tr>
            ))}
          </tbody>
        </table>
      </div>
    </main>
  );
}
