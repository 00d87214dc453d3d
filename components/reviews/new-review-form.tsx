'use client';

import { zodResolver } from '@hookform/resolvers/zod';
import { useState, useTransition } from 'react';
import { Controller, useForm } from 'react-hook-form';
import type { PickableItem } from '@/db/reviews';
import { Button, Field, FormMessage, TextInput } from '@/components/ui/form';
import { createReviewAction } from '@/lib/reviews/actions';
import { createReviewSchema, type CreateReviewInput } from '@/lib/reviews/schemas';
import { ItemsPicker } from './items-picker';

/** Starts a review: a title and the gear item(s) it covers; opens the writing page. */
export function NewReviewForm({ items }: { items: PickableItem[] }) {
  const form = useForm<CreateReviewInput>({ resolver: zodResolver(createReviewSchema), defaultValues: { title: '', itemIds: [] } });
  const [message, setMessage] = useState<string | undefined>();
  const [pending, startTransition] = useTransition();
  const { errors } = form.formState;
  const onSubmit = form.handleSubmit((data) =>
    startTransition(async () => {
      const result = await createReviewAction(data);
      if (result && !result.ok) {
        setMessage(result.message);
        for (const [name, messages] of Object.entries(result.fields ?? {})) {
          if (name === 'title' || name === 'itemIds') form.setError(name, { type: 'server', message: messages.join(' ') });
        }
      }
    }),
  );
  return (
    <form onSubmit={onSubmit} noValidate className="space-y-4" data-testid="new-review-form">
      <FormMessage message={message} />
      <Field id="new-title" label="Title" errors={errors.title?.message ? [errors.title.message] : undefined}>
        <TextInput id="new-title" {...form.register('title')} invalid={!!errors.title} />
      </Field>
      <div className="space-y-1">
        <p className="text-sm font-semibold">Gear items (one, or several for a side-by-side)</p>
        <Controller control={form.control} name="itemIds" render={({ field }) => <ItemsPicker items={items} value={field.value} onChange={field.onChange} invalid={!!errors.itemIds} />} />
        {errors.itemIds ? <p className="text-sm text-danger">{String(errors.itemIds.message ?? 'Pick at least one gear item.')}</p> : null}
      </div>
      <Button type="submit" disabled={pending}>
        Start the draft
      </Button>
    </form>
  );
}
