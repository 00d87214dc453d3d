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

/**
 * "at least / at most" inputs for one figure, typed in the reader's display unit and sent to the API
 * in canonical units. Inputs are uncontrolled: the parent remounts this (key) when the unit changes.
 */
export function RangeFilter({ label, typedUnit, canonicalUnit, min, max, onChange, className, nonNegative }: Props) {
  const minId = useId();
  const maxId = useId();
  const shownUnit = typedUnit && typedUnit !== 'ratio' ? ` (${typedUnit})` : '';
  return (
    <fieldset>
      <legend className="mb-1 font-semibold">
        {label}
        {shownUnit}
      </legend>
      <div className="grid grid-cols-2 gap-2">
        <label htmlFor={minId} className="text-xs text-slate">
          at least
          <input
            id={minId}
            type="number"
            min={nonNegative ? 0 : undefined}
            step="any"
            inputMode="decimal"
            className={className}
            defaultValue={canonicalToTyped(min, typedUnit, canonicalUnit)}
            onChange={(e) => onChange('min', typedToCanonical(e.target.value, typedUnit, canonicalUnit))}
          />
        </label>
        <label htmlFor={maxId} className="text-xs text-slate">
          at most
          <input
            id={maxId}
            type="number"
            min={nonNegative ? 0 : undefined}
            step="any"
            inputMode="decimal"
            className={className}
            defaultValue={canonicalToTyped(max, typedUnit, canonicalUnit)}
            onChange={(e) => onChange('max', typedToCanonical(e.target.value, typedUnit, canonicalUnit))}
          />
        </label>
      </div>
    </fieldset>
  );
}
