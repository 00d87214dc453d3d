import type { Metadata } from 'next';
import Link from 'next/link';
import { UnitsToggle } from '@/components/units-toggle';
import { getDb } from '@/db';
import { getUnitPreference } from '@/db/account';
import { listApiTokens } from '@/db/api-tokens';
import { requirePageUser } from '@/lib/auth/guard';
import { hasRole, ROLE_LABELS } from '@/lib/auth/roles';
import { CreateTokenForm, RevokeTokenButton } from './token-manager';

export const metadata: Metadata = { title: 'Your account' };

const when = (d: Date | null) => (d ? `${d.toISOString().slice(0, 16).replace('T', ' ')} UTC` : 'never');

export default async function AccountPage() {
  const user = await requirePageUser('/account');
  const units = getUnitPreference(getDb(), user.id);
  const mayHaveTokens = hasRole(user, 'reviewer');
  const tokens = mayHaveTokens ? listApiTokens(getDb(), user.id) : [];
  const active = tokens.filter((t) => !t.revokedAt);
  const revoked = tokens.filter((t) => t.revokedAt);

  return (
    <main className="mx-auto max-w-4xl space-y-10 px-4 py-10 sm:px-6">
      <header className="space-y-1">
        <h1 className="text-3xl font-bold tracking-tight">Your account</h1>
        <p className="text-slate">
          {user.name} · {user.email} · <span className="font-mono text-xs uppercase tracking-wide">{ROLE_LABELS[user.role]}</span>
        </p>
      </header>

      <section aria-labelledby="units-heading" className="space-y-3">
        <h2 id="units-heading" className="text-xl font-bold">
          Units
        </h2>
        <p className="max-w-2xl text-sm text-slate">
          Masses, lengths and temperatures on gear pages and kits are shown in the units you choose. Stored figures, filters and
          the API stay in metric units.
        </p>
        <UnitsToggle current={units} size="large" />
      </section>

      <section aria-labelledby="tokens-heading" className="space-y-4">
        <h2 id="tokens-heading" className="text-xl font-bold">
          Personal API tokens
        </h2>
        {mayHaveTokens ? (
          <>
            <p className="max-w-2xl text-sm text-slate">
              A token lets a logger script or a spreadsheet export use the{' '}
              <Link href="/api-guide" className="text-lichen underline">
                Trailbench API
              </Link>{' '}
              as you, with your current role: send it as <code className="font-mono">Authorization: Bearer &lt;token&gt;</code>. It
              stops working the moment you revoke it. Only a hash is stored, so a lost token cannot be shown again: revoke it and
              create another.
            </p>
            <CreateTokenForm />
            <div className="overflow-x-auto rounded-lg border border-rule">
              <table className="w-full text-left text-sm" data-testid="token-table">
                <caption className="sr-only">Your API tokens</caption>
                <thead className="bg-card text-xs uppercase tracking-wide text-slate">
                  <tr>
                    <th scope="col" className="px-3 py-2">Name</th>
                    <th scope="col" className="px-3 py-2">Scope</th>
                    <th scope="col" className="px-3 py-2">Starts with</th>
                    <th scope="col" className="px-3 py-2">Created</th>
                    <th scope="col" className="px-3 py-2">Last used</th>
                    <th scope="col" className="px-3 py-2">
                      <span className="sr-only">Revoke</span>
                    </th>
                  </tr>
                </thead>
                <tbody>
                  {active.length === 0 ? (
                    <tr className="border-t border-rule">
                      <td colSpan={6} className="px-3 py-3 text-slate">
                        No active tokens.
                      </td>
                    </tr>
                  ) : null}
                  {active.map((t) => (
                    <tr key={t.id} className="border-t border-rule" data-testid="token-row" data-token-name={t.name}>
                      <th scope="row" className="px-3 py-2 font-semibold">
                        {t.name}
                      </th>
                      <td className="px-3 py-2">{t.scope === 'write' ? 'Write' : 'Read'}</td>
                      <td className="px-3 py-2 font-mono text-xs">{t.prefix}…</td>
                      <td className="px-3 py-2 figure text-slate">{when(t.createdAt)}</td>
                      <td className="px-3 py-2 figure" data-testid="token-last-used">
                        {when(t.lastUsedAt)}
                      </td>
                      <td className="px-3 py-2 text-right">
                        <RevokeTokenButton tokenId={t.id} name={t.name} />
                      </td>
                    </tr>
                  ))}
                </tbody>
              </table>
            </div>
            {revoked.length > 0 ? (
              <details className="text-sm">
                <summary className="cursor-pointer text-slate">Revoked tokens ({revoked.length})</summary>
                <ul className="mt-2 space-y-1" data-testid="revoked-tokens">
                  {revoked.map((t) => (
                    <li key={t.id}>
                      <span className="font-semibold">{t.name}</span> <span className="font-mono text-xs">{t.prefix}…</span> · revoked{' '}
                      {when(t.revokedAt)} · last used {when(t.lastUsedAt)}
                    </li>
                  ))}
                </ul>
              </details>
            ) : null}
          </>
        ) : (
          <p className="max-w-2xl text-sm text-slate">
            API tokens are for reviewers, who push gear figures and field-test readings from scripts. Reading the public API needs
            no token.
          </p>
        )}
      </section>
    </main>
  );
}
