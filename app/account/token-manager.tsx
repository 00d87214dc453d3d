'use client';

import { zodResolver } from '@hookform/resolvers/zod';
import { useRouter } from 'next/navigation';
import { useState, useTransition } from 'react';
import { useForm } from 'react-hook-form';
import { Button, Field, TextInput } from '@/components/ui/form';
import { createApiTokenAction, revokeApiTokenAction, type TokenActionState } from './actions';
import { apiTokenInputSchema, type ApiTokenInput } from './schemas';

const SCOPE_CHOICES = [
  { scope: 'read', label: 'Read', hint: 'Public data plus your own drafts, kits and field tests.' },
  { scope: 'write', label: 'Write', hint: 'Also create and change your gear items, field tests, readings and kits.' },
] as const;

/** Create a named token; the secret is shown once, with a copy button. */
export function CreateTokenForm() {
  const router = useRouter();
  const [state, setState] = useState<TokenActionState>({});
  const [copied, setCopied] = useState(false);
  const [pending, startTransition] = useTransition();
  const form = useForm<ApiTokenInput>({ resolver: zodResolver(apiTokenInputSchema), defaultValues: { name: '', scope: 'write' } });
  const errors = { ...Object.fromEntries(Object.entries(form.formState.errors).map(([k, v]) => [k, v?.message ? [v.message] : []])), ...state.fields };

  const submit = form.handleSubmit((values) =>
    startTransition(async () => {
      setCopied(false);
      const result = await createApiTokenAction(values);
      setState(result);
      if (result.ok) {
        form.reset({ name: '', scope: values.scope });
        router.refresh();
      }
    }),
  );

  return (
    <div className="space-y-4">
      <form onSubmit={submit} noValidate className="space-y-4 rounded-lg border border-rule bg-card p-4" aria-labelledby="new-token-heading">
        <h3 id="new-token-heading" className="font-bold">
          New token
        </h3>
        <Field id="token-name" label="Name" hint="What will use it, so you can tell tokens apart later." errors={errors.name}>
          <TextInput id="token-name" autoComplete="off" invalid={!!errors.name?.length} aria-describedby={errors.name?.length ? 'token-name-error' : 'token-name-hint'} {...form.register('name')} />
        </Field>
        <fieldset className="space-y-2">
          <legend className="text-sm font-semibold">Scope</legend>
          {SCOPE_CHOICES.map((c) => (
            <label key={c.scope} className="flex items-start gap-2 text-sm">
              <input type="radio" value={c.scope} className="mt-1" {...form.register('scope')} />
              <span>
                <span className="font-semibold">{c.label}</span> — <span className="text-slate">{c.hint}</span>
              </span>
            </label>
          ))}
        </fieldset>
        <Button type="submit" disabled={pending}>
          {pending ? 'Creating…' : 'Create token'}
        </Button>
        {state.message && !state.ok ? (
          <p role="alert" className="text-sm text-danger" data-testid="token-error">
            {state.message}
          </p>
        ) : null}
      </form>

      {state.ok && state.token ? (
        <div className="space-y-2 rounded-lg border-2 border-lichen p-4" role="status" data-testid="new-token">
          <p className="font-semibold">{state.message}</p>
          <p className="text-sm text-slate">Anyone holding it can act as you within its scope. Keep it in your script&apos;s secret store, never in a shared file.</p>
          <div className="flex flex-wrap items-center gap-2">
            <label htmlFor="new-token-value" className="sr-only">
              New API token
            </label>
            <input id="new-token-value" readOnly value={state.token} onFocus={(e) => e.currentTarget.select()} className="min-w-0 flex-1 rounded-md border border-rule bg-paper px-3 py-2 font-mono text-sm" data-testid="new-token-value" />
            <Button
              type="button"
              variant="quiet"
              onClick={async () => {
                await navigator.clipboard.writeText(state.token!);
                setCopied(true);
              }}
            >
              {copied ? 'Copied' : 'Copy'}
            </Button>
          </div>
          <p aria-live="polite" className="sr-only">
            {copied ? 'Token copied to the clipboard.' : ''}
          </p>
        </div>
      ) : null}
    </div>
  );
}

/** Revokes at once: the next request with the token gets 401. */
export function RevokeTokenButton({ tokenId, name }: { tokenId: string; name: string }) {
  const router = useRouter();
  const [pending, startTransition] = useTransition();
  const [message, setMessage] = useState<string>();
  return (
    <span className="inline-flex items-center gap-2">
      <Button
        type="button"
        variant="danger"
        className="px-2 py-1"
        disabled={pending}
        aria-label={`Revoke token ${name}`}
        onClick={() =>
          startTransition(async () => {
            const result = await revokeApiTokenAction({ tokenId });
            setMessage(result.ok ? undefined : result.message);
            router.refresh();
          })
        }
      >
        Revoke
      </Button>
      {message ? (
        <span role="alert" className="text-xs text-danger">
          {message}
        </span>
      ) : null}
    </span>
  );
}
