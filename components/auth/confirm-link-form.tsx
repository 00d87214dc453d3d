'use client';

import { useState, useTransition } from 'react';
import { confirmMagicLinkAction, type FormState } from '@/lib/auth/actions';
import { Button, FormMessage } from '@/components/ui/form';

/** The link in the e-mail only opens this page; the token is spent when the person presses the button. */
export function ConfirmLinkForm({ token }: { token: string }) {
  const [state, setState] = useState<FormState>({});
  const [pending, startTransition] = useTransition();
  return (
    <form
      className="space-y-4"
      onSubmit={(event) => {
        event.preventDefault();
        startTransition(async () => setState((await confirmMagicLinkAction(token)) ?? {}));
      }}
    >
      <FormMessage message={state.message} />
      <Button type="submit" disabled={pending} className="w-full">
        {pending ? 'Signing in…' : 'Sign in to Trailbench'}
      </Button>
    </form>
  );
}
