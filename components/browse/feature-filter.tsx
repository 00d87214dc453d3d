'use client';

import { offeredFeatures } from '@/lib/browse/feature-filters';
import { FEATURE_DEFS, FEATURE_PARAM_PREFIX } from '@/lib/gear/features';

/** "Features" checkboxes of browse: the chosen category's checklist; a ticked box keeps items stated to have it. */
export function FeatureFilterChecklist({
  category,
  values,
  onChange,
}: {
  category: string | null;
  values: Readonly<Record<string, string | null>>;
  onChange: (key: string, value: string | null) => void;
}) {
  const names = offeredFeatures(category);
  if (names.length === 0) return null;
  return (
    <fieldset className="space-y-1" data-testid="feature-filters" aria-describedby="feature-filters-hint">
      <legend className="mb-1 font-semibold">Features</legend>
      {names.map((name) => {
        const key = `${FEATURE_PARAM_PREFIX}${name}`;
        return (
          <label key={name} className="flex items-start gap-2">
            <input type="checkbox" className="mt-0.5" checked={values[key] === 'true'} onChange={(e) => onChange(key, e.target.checked ? 'true' : null)} />
            {FEATURE_DEFS[name].label}
          </label>
        );
      })}
      <p id="feature-filters-hint" className="text-xs text-slate">
        Only items whose author says they have it; “not stated” does not count.
      </p>
    </fieldset>
  );
}
