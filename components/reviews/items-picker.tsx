'use client';

import { useId, useMemo, useState } from 'react';
import type { PickableItem } from '@/db/reviews';

/** Checkbox list of gear items a writer may cover: their own (any state) and the published catalog. */
export function ItemsPicker({
  items,
  value,
  onChange,
  disabled,
  invalid,
}: {
  items: PickableItem[];
  value: string[];
  onChange: (ids: string[]) => void;
  disabled?: boolean;
  invalid?: boolean;
}) {
  const [filter, setFilter] = useState('');
  const filterId = useId();
  const shown = useMemo(() => {
    const q = filter.trim().toLowerCase();
    return items.filter((i) => value.includes(i.id) || !q || `${i.maker} ${i.name} ${i.slug} ${i.category}`.toLowerCase().includes(q));
  }, [items, filter, value]);
  const groups: [string, PickableItem[]][] = [
    ['Your items', shown.filter((i) => i.mine)],
    ['Published catalog', shown.filter((i) => !i.mine)],
  ];
  const toggle = (id: string, on: boolean) => onChange(on ? [...value, id] : value.filter((v) => v !== id));
  return (
    <div className={`rounded-md border ${invalid ? 'border-danger' : 'border-rule'} bg-paper`}>
      <div className="border-b border-rule p-2">
        <label htmlFor={filterId} className="sr-only">
          Filter gear items
        </label>
        <input
          id={filterId}
          type="search"
          value={filter}
          onChange={(e) => setFilter(e.target.value)}
          placeholder="Filter by maker, name or category"
          className="w-full rounded border border-rule bg-paper px-2 py-1 text-sm"
          disabled={disabled}
        />
      </div>
      <div className="max-h-56 overflow-y-auto p-2 text-sm">
        {groups.map(([label, list]) =>
          list.length ? (
            <fieldset key={label} className="mb-2">
              <legend className="font-mono text-xs uppercase tracking-wide text-slate">{label}</legend>
              <ul className="mt-1 space-y-1">
                {list.map((item) => (
                  <li key={item.id}>
                    <label className="flex items-baseline gap-2">
                      <input type="checkbox" checked={value.includes(item.id)} onChange={(e) => toggle(item.id, e.target.checked)} disabled={disabled} data-testid={`pick-${item.slug}`} />
                      <span>
                        {item.maker} {item.name}
                        <span className="ml-2 font-mono text-xs text-slate">{item.slug}</span>
                        {!item.isPublic ? <span className="ml-2 text-xs text-amber">not yet public</span> : null}
                      </span>
                    </label>
                  </li>
                ))}
              </ul>
            </fieldset>
          ) : null,
        )}
        {shown.length === 0 ? <p className="text-slate">No gear item matches.</p> : null}
      </div>
    </div>
  );
}
