'use client';

import { zodResolver } from '@hookform/resolvers/zod';
import { useState, useTransition } from 'react';
import { useForm } from 'react-hook-form';
import type { z } from 'zod';
import { signUpAction, type FormState } from '@/lib/auth/actions';
import { signUpSchema } from '@/lib/auth/schemas';
import { Button, Field, FormMessage, TextInput } from '@/components/ui/form';

type Input = z.input<typeof signUpSchema>;

export function SignUpForm({ next }: { next?: string }) {
  const [state, setState] = useState<FormState>({});
  const [pending, startTransition] = useTransition();
  const form = useForm<Input, unknown, z.output<typeof signUpSchema>>({
    resolver: zodResolver(signUpSchema),
    defaultValues: { name: '', email: '', password: '' },
  });
  const fieldErrors = (key: keyof Input) => {
    const client = form.formState.errors[key]?.message;
    return client ? [client] : state.fields?.[key];
  };

  const onSubmit = form.handleSubmit((values) => {
    startTransition(async () => setState((await signUpAction(values, next)) ?? {}));
  });

  return (
    <form onSubmit={onSubmit} noValidate className="space-y-4" aria-label="Create an account">
      <Field id="signup-name" label="Name shown on your reviews" errors={fieldErrors('name')}>
        <TextInput id="signup-name" autoComplete="name" invalid={!!fieldErrors('name')?.length} {...form.register('name')} />
      </Field>
      <Field id="signup-email" label="E-mail" errors={fieldErrors('email')}>
        <TextInput id="signup-email" type="email" autoComplete="email" invalid={!!fieldErrors('email')?.length} {...form.register('email')} />
      </Field>
      <Field id="signup-password" label="Password" hint="At least 8 characters; a long passphrase is best." errors={fieldErrors('password')}>
        <TextInput id="signup-password" type="password" autoComplete="new-password" invalid={!!fieldErrors('password')?.length} {...form.register('password')} />
      </Field>
      <FormMessage message={state.message} />
      <Button type="submit" disabled={pending} className="w-full">
        {pending ? 'Creating your account…' : 'Create account'}
      </Button>
    </form>
  );
}
