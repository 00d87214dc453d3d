import clsx from 'clsx';
import type { ButtonHTMLAttributes, InputHTMLAttributes, ReactNode } from 'react';
import { forwardRef } from 'react';

export function Button({ className, variant = 'primary', ...props }: ButtonHTMLAttributes<HTMLButtonElement> & { variant?: 'primary' | 'quiet' | 'danger' }) {
  return (
    <button
      className={clsx(
        'inline-flex items-center justify-center gap-2 rounded-md px-4 py-2 text-sm font-semibold transition-colors disabled:cursor-not-allowed disabled:opacity-60',
        variant === 'primary' && 'bg-lichen text-paper hover:bg-lichen-dark',
        variant === 'quiet' && 'border border-rule bg-transparent text-ink hover:bg-card',
        variant === 'danger' && 'border border-danger bg-transparent text-danger hover:bg-danger-tint',
        className,
      )}
      {...props}
    />
  );
}

export const TextInput = forwardRef<HTMLInputElement, InputHTMLAttributes<HTMLInputElement> & { invalid?: boolean }>(
  function TextInput({ className, invalid, ...props }, ref) {
    return (
      <input
        ref={ref}
        aria-invalid={invalid || undefined}
        className={clsx(
          'block w-full rounded-md border bg-paper px-3 py-2 text-ink placeholder:text-slate/70',
          invalid ? 'border-danger' : 'border-rule',
          className,
        )}
        {...props}
      />
    );
  },
);

export function Field({ id, label, hint, errors, children }: { id: string; label: string; hint?: string; errors?: string[]; children: ReactNode }) {
  return (
    <div className="space-y-1">
      <label htmlFor={id} className="block text-sm font-semibold">
        {label}
      </label>
      {children}
      {hint && !errors?.length ? (
        <p id={`${id}-hint`} className="text-xs text-slate">
          {hint}
        </p>
      ) : null}
      {errors?.length ? (
        <p id={`${id}-error`} className="text-sm text-danger" data-testid={`${id}-error`}>
          {errors.join(' ')}
        </p>
      ) : null}
    </div>
  );
}

export function FormMessage({ message, tone = 'danger', testId = 'form-message' }: { message?: string; tone?: 'danger' | 'ok'; testId?: string }) {
  if (!message) return null;
  return (
    <p
      role="status"
      data-testid={testId}
      className={clsx('rounded-md px-3 py-2 text-sm', tone === 'ok' ? 'bg-lichen-tint text-ink' : 'bg-danger-tint text-danger')}
    >
      {message}
    </p>
  );
}
