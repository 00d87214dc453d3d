'use client';

import { zodResolver } from '@hookform/resolvers/zod';
import { useState, useTransition } from 'react';
import { useForm } from 'react-hook-form';
import type { z } from 'zod';
import { signInAction, type FormState } from '@/lib/auth/actions';
import { signInSchema } from '@/lib/auth/schemas';
import { Button, Field, FormMessage, TextInput } from '@/components/ui/form';

type Input = z.input<typeof signInSchema>;

export function SignInForm({ next }: { next?: string }) {
  const [state, setState] = useState<FormState>({});
  const [pending, startTransition] = useTransition();
  const form = useForm<Input, unknown, z.output<typeof signInSchema>>({ resolver: zodResolver(signInSchema), defaultValues: { email: '', password: '' } });
  const errors = { ...Object.fromEntries(Object.entries(form.formState.errors).map(([k, v]) => [k, v?.message ? [v.message] : []])), ...state.fields };

  const onSubmit = form.handleSubmit((values) => {
    startTransition(async () => setState((await signInAction(values, next)) ?? {}));
  });

  return (
    <form onSubmit={onSubmit} noValidate className="space-y-4" aria-label="Sign in with password">
      <Field id="signin-email" label="E-mail" errors={errors.email}>
        <TextInput id="signin-email" type="email" autoComplete="email" invalid={!!errors.email?.length} {...form.register('email')} />
      </Field>
      <Field id="signin-password" label="Password" errors={errors.password}>
        <TextInput id="signin-password" type="password" autoComplete="current-password" invalid={!!errors.password?.length} {...form.register('password')} />
      </Field>
      <FormMessage message={state.message} />
      <Button type="submit" disabled={pending} className="w-full">
        {pending ? 'Signing in…' : 'Sign in'}
      </Button>
    </form>
  );
}
