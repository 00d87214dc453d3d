'use client';

import { useRouter } from 'next/navigation';
import { useTransition } from 'react';
import clsx from 'clsx';
import { setUnitSystemAction } from '@/app/account/actions';
import type { UnitSystem } from '@/lib/units/display';

const OPTIONS: { system: UnitSystem; label: string; hint: string }[] = [
  { system: 'metric', label: 'Metric', hint: 'g, kg, mm, m, °C' },
  { system: 'imperial', label: 'Imperial', hint: 'oz, lb, in, ft, °F' },
];

/**
 * Metric / imperial display switch: two pressed-state buttons (a plain form post without JavaScript would
 * need a page per option; the server action saves the profile or the guest cookie and refreshes).
 */
export function UnitsToggle({ current, size = 'small' }: { current: UnitSystem; size?: 'small' | 'large' }) {
  const router = useRouter();
  const [pending, startTransition] = useTransition();
  return (
    <div role="group" aria-label="Units for figures" className="inline-flex rounded-md border border-rule" data-testid="units-toggle">
      {OPTIONS.map((o) => (
        <button
          key={o.system}
          type="button"
          aria-pressed={current === o.system}
          disabled={pending}
          title={o.hint}
          onClick={() =>
            startTransition(async () => {
              await setUnitSystemAction(o.system);
              router.refresh();
            })
          }
          className={clsx(
            'first:rounded-l-md last:rounded-r-md',
            size === 'small' ? 'px-2 py-1 text-xs' : 'px-3 py-1.5 text-sm',
            current === o.system ? 'bg-ink font-semibold text-paper' : 'text-slate hover:bg-card hover:text-ink',
          )}
        >
          {o.label}
          {size === 'large' ? <span className="ml-1 font-mono text-[11px] opacity-80">({o.hint})</span> : null}
        </button>
      ))}
    </div>
  );
}
