'use client';

import { useId } from 'react';
import { canonicalToTyped, typedToCanonical } from '@/lib/units/filter';

interface Props {
  /** Legend without the unit ("Mass"); the typed unit is added in brackets unless it is "ratio" or blank. */
  label: string;
  /** The unit the reader types in (oz for an imperial reader's mass). */
  typedUnit: string;
  /** The unit of the API's `min.<key>` / `max.<key>` (g for mass). */
  canonicalUnit: string;
  min: string | null | undefined;
  max: string | null | undefined;
  /** Called with the API value (canonical units) or null when the input is emptied. */
  onChange: (bound: 'min' | 'max', value: string | null) => void;
  className: string;
  nonNegative?: boolean;
}

const BOUNDS = [
  { bound: 'min', words: 'at least' },
  { bound: 'max', words: 'at most' },
] as const;

/**
 * "at least / at most" inputs for one figure, typed in the reader's display unit and sent to the API
 * in canonical units. Inputs are uncontrolled: the parent remounts this (key) when the unit changes.
 */
export function RangeFilter({ label, typedUnit, canonicalUnit, min, max, onChange, className, nonNegative }: Props) {
  const ids = { min: useId(), max: useId() };
  const shownUnit = typedUnit && typedUnit !== 'ratio' ? ` (${typedUnit})` : '';
  return (
    <fieldset>
      <legend className="mb-1 font-semibold">
        {label}
        {shownUnit}
      </legend>
      <div className="grid grid-cols-2 gap-2">
        {BOUNDS.map(({ bound, words }) => (
          <label key={bound} htmlFor={ids[bound]} className="text-xs text-slate">
            {words}
            <input
              id={ids[bound]}
              type="number"
              min={nonNegative ? 0 : undefined}
              step="any"
              inputMode="decimal"
              className={className}
              defaultValue={canonicalToTyped(bound === 'min' ? min : max, typedUnit, canonicalUnit)}
              onChange={(e) => onChange(bound, typedToCanonical(e.target.value, typedUnit, canonicalUnit))}
            />
          </label>
        ))}
      </div>
    </fieldset>
  );
}
