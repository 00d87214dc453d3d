'use client';

import Link from 'next/link';
import { RADIO_QUIET_BELOW_DB, RADIO_QUIET_FILTERS, type RadioQuietFilter } from '@/lib/browse/radio-quiet';
import { CATEGORY_DEFS } from '@/lib/gear/categories';
import { isCategory } from '@/lib/measure';

const OPTIONS: { value: RadioQuietFilter | null; label: string }[] = [
  { value: null, label: 'Any' },
  { value: 'below-30mhz', label: 'Below 30 MHz' },
  { value: 'above-30mhz', label: 'Above 30 MHz' },
  { value: 'both', label: 'Both' },
];

/** Whether a category's items can carry a measured noise rise (its specs list them); without a category, yes. */
export function offersRadioQuiet(category: string | null): boolean {
  if (!category || !isCategory(category)) return true;
  return CATEGORY_DEFS[category].specs.some((s) => s.key === 'noiseRiseBelow30' || s.key === 'noiseRiseAbove30');
}

/**
 * The "Radio-quiet" filter of browse: chips that are radio buttons (keyboard: arrow keys within the group),
 * the chosen one marked by a tick and weight as well as colour.
 */
export function RadioQuietFilterChips({ value, onChange }: { value: string | null; onChange: (value: RadioQuietFilter | null) => void }) {
  const current = value && (RADIO_QUIET_FILTERS as readonly string[]).includes(value) ? value : null;
  return (
    <fieldset data-testid="radio-quiet-filter">
      <legend className="mb-1 font-semibold">Radio-quiet</legend>
      <div className="flex flex-wrap gap-1.5">
        {OPTIONS.map((o) => {
          const checked = current === o.value;
          return (
            <label
              key={o.label}
              className={`cursor-pointer rounded-full border px-2.5 py-1 text-xs has-[:focus-visible]:outline has-[:focus-visible]:outline-2 has-[:focus-visible]:outline-lichen ${
                checked ? 'border-lichen bg-lichen-tint font-semibold text-ink' : 'border-rule text-slate hover:bg-card'
              }`}
            >
              <input type="radio" name="radioQuiet" className="sr-only" checked={checked} onChange={() => onChange(o.value)} />
              {checked ? <span aria-hidden="true">✓ </span> : null}
              {o.label}
            </label>
          );
        })}
      </div>
      <p className="mt-1 text-xs text-slate">
        Measured noise rise under {RADIO_QUIET_BELOW_DB} dB on every band checked in the range.{' '}
        <Link href="/how-we-test#user-content-radio-noise" className="underline">
          How we check
        </Link>
      </p>
    </fieldset>
  );
}
