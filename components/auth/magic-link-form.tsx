'use client';

import { zodResolver } from '@hookform/resolvers/zod';
import { useState, useTransition } from 'react';
import { useForm } from 'react-hook-form';
import type { z } from 'zod';
import { requestMagicLinkAction, type FormState } from '@/lib/auth/actions';
import { magicLinkRequestSchema } from '@/lib/auth/schemas';
import { Button, Field, FormMessage, TextInput } from '@/components/ui/form';

type Input = z.input<typeof magicLinkRequestSchema>;

export function MagicLinkForm() {
  const [state, setState] = useState<FormState>({});
  const [pending, startTransition] = useTransition();
  const form = useForm<Input, unknown, z.output<typeof magicLinkRequestSchema>>({ resolver: zodResolver(magicLinkRequestSchema), defaultValues: { email: '' } });
  const emailErrors = form.formState.errors.email?.message ? [form.formState.errors.email.message] : state.fields?.email;

  const onSubmit = form.handleSubmit((values) => {
    startTransition(async () => setState(await requestMagicLinkAction(values)));
  });

  return (
    <form onSubmit={onSubmit} noValidate className="space-y-4" aria-label="Sign in with an e-mail link">
      <Field id="magic-email" label="E-mail" hint="We send a link that works once, within 10 minutes." errors={emailErrors}>
        <TextInput id="magic-email" type="email" autoComplete="email" invalid={!!emailErrors?.length} {...form.register('email')} />
      </Field>
      <FormMessage message={state.message} tone={state.ok ? 'ok' : 'danger'} testId="magic-link-message" />
      <Button type="submit" variant="quiet" disabled={pending} className="w-full">
        {pending ? 'Sending…' : 'E-mail me a sign-in link'}
      </Button>
    </form>
  );
}
