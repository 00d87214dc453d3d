'use client';

import { useState } from 'react';
import { MAX_SIDE_BY_SIDE } from '@/lib/side-by-side/selection';
import { useStoredSelection } from './selection-store';

/** "Add to side-by-side" (or "Remove from side-by-side" once added), with a polite status line. */
export function AddToSideBySide({ slug, name, compact = false }: { slug: string; name: string; compact?: boolean }) {
  const { slugs, add, remove } = useStoredSelection();
  const [message, setMessage] = useState('');
  const added = slugs.includes(slug);
  const full = !added && slugs.length >= MAX_SIDE_BY_SIDE;

  const toggle = () => {
    if (added) {
      remove(slug);
      setMessage(`${name} removed from the side-by-side.`);
      return;
    }
    const result = add(slug);
    setMessage(
      result.ok
        ? `${name} added to the side-by-side (${result.slugs.length} of ${MAX_SIDE_BY_SIDE}).`
        : result.reason === 'full'
          ? `The side-by-side holds ${MAX_SIDE_BY_SIDE} items: remove one first.`
          : `${name} could not be added.`,
    );
  };

  return (
    <span className="inline-flex flex-col gap-1">
      <button
        type="button"
        onClick={toggle}
        aria-pressed={added}
        aria-disabled={full || undefined}
        data-testid={`add-to-side-by-side-${slug}`}
        className={`rounded-md border px-3 font-semibold print:hidden ${compact ? 'py-1 text-xs' : 'py-1.5 text-sm'} ${
          added ? 'border-lichen bg-lichen-tint text-ink' : 'border-rule hover:bg-card'
        } ${full ? 'cursor-not-allowed opacity-70' : ''}`}
      >
        {added ? (
          <>
            <span aria-hidden="true">✓ </span>In side-by-side
          </>
        ) : (
          <>
            <span aria-hidden="true">+ </span>Add to side-by-side
          </>
        )}
        <span className="sr-only">: {name}</span>
      </button>
      <span role="status" className="sr-only">
        {message}
      </span>
      {full && message ? <span className="text-xs text-danger">{message}</span> : null}
    </span>
  );
}
