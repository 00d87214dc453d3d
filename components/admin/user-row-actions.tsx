'use client';

import { useState, useTransition } from 'react';
import { changeRoleAction, setDisabledAction, type FormState } from '@/lib/auth/actions';
import { ROLE_LABELS } from '@/lib/auth/roles';
import type { Role } from '@/db/schema';

const ROLES: Role[] = ['reader', 'reviewer', 'editor', 'admin'];

export function UserRowActions({ userId, email, role, disabled, isSelf }: { userId: string; email: string; role: Role; disabled: boolean; isSelf: boolean }) {
  const [selected, setSelected] = useState<Role>(role);
  const [state, setState] = useState<FormState>({});
  const [pending, startTransition] = useTransition();
  if (isSelf) return <span className="text-xs text-slate">You</span>;
  return (
    <div className="flex flex-wrap items-center gap-2">
      <form
        className="flex items-center gap-2"
        onSubmit={(event) => {
          event.preventDefault();
          startTransition(async () => setState(await changeRoleAction({ userId, role: selected })));
        }}
      >
        <label className="sr-only" htmlFor={`role-${userId}`}>
          Role of {email}
        </label>
        <select
          id={`role-${userId}`}
          value={selected}
          onChange={(event) => setSelected(event.target.value as Role)}
          className="rounded-md border border-rule bg-paper px-2 py-1 text-sm"
        >
          {ROLES.map((r) => (
            <option key={r} value={r}>
              {ROLE_LABELS[r]}
            </option>
          ))}
        </select>
        <button type="submit" disabled={pending || selected === role} className="rounded-md border border-rule px-2 py-1 text-sm font-semibold hover:bg-card disabled:opacity-50">
          Save role
        </button>
      </form>
      <button
        type="button"
        disabled={pending}
        onClick={() => startTransition(async () => setState(await setDisabledAction({ userId, disabled: !disabled })))}
        className="rounded-md border border-rule px-2 py-1 text-sm hover:bg-card disabled:opacity-50"
      >
        {disabled ? 'Enable' : 'Disable'}
      </button>
      {state.message ? (
        <span role="status" className={state.ok ? 'text-xs text-lichen' : 'text-xs text-danger'}>
          {state.message}
        </span>
      ) : null}
    </div>
  );
}
