'use client';

import { useState, useTransition } from 'react';
import { useForm } from 'react-hook-form';
import { zodResolver } from '@hookform/resolvers/zod';
import { Button, FormMessage } from '@/components/ui/form';
import { saveNotificationSettingsAction } from '@/lib/reviews/actions';
import { NOTIFICATION_LABELS, notificationSettingsSchema, type NotificationSettings } from '@/lib/reviews/schemas';

/** Checkboxes for each workflow mail; editors see the desk switch too. */
export function NotificationSettingsForm({ initial, isEditor }: { initial: NotificationSettings; isEditor: boolean }) {
  const form = useForm<NotificationSettings>({ resolver: zodResolver(notificationSettingsSchema), defaultValues: initial });
  const [result, setResult] = useState<{ ok?: boolean; message?: string } | null>(null);
  const [pending, startTransition] = useTransition();
  const keys = (Object.keys(NOTIFICATION_LABELS) as (keyof NotificationSettings)[]).filter((k) => isEditor || NOTIFICATION_LABELS[k].who === 'authors');
  return (
    <form
      onSubmit={form.handleSubmit((data) => startTransition(async () => setResult(await saveNotificationSettingsAction(data))))}
      className="space-y-4"
      data-testid="notification-settings"
    >
      <FormMessage message={result?.message} tone={result?.ok ? 'ok' : 'danger'} />
      <fieldset className="space-y-2">
        <legend className="text-sm font-semibold">E-mail me when…</legend>
        {keys.map((key) => (
          <label key={key} className="flex items-center gap-2">
            <input type="checkbox" {...form.register(key)} />
            <span>{NOTIFICATION_LABELS[key].label}</span>
          </label>
        ))}
      </fieldset>
      <Button type="submit" disabled={pending}>
        Save mail settings
      </Button>
    </form>
  );
}
