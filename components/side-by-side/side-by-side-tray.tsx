'use client';

import Link from 'next/link';
import { usePathname } from 'next/navigation';
import { MAX_SIDE_BY_SIDE, sideBySidePath } from '@/lib/side-by-side/selection';
import { useStoredSelection } from './selection-store';

/** A small link to the side-by-side with the count of chosen items, on every page but its own. */
export function SideBySideTray() {
  const { slugs } = useStoredSelection();
  const pathname = usePathname();
  if (slugs.length === 0 || pathname === '/side-by-side') return null;
  return (
    <aside aria-label="Side-by-side selection" className="fixed bottom-4 right-4 z-40 print:hidden">
      <Link
        href={sideBySidePath(slugs)}
        data-testid="side-by-side-tray"
        className="flex items-center gap-2 rounded-full border border-lichen bg-paper px-4 py-2 text-sm font-semibold shadow-lg hover:bg-lichen-tint"
      >
        <span aria-hidden="true">⇆</span>
        Side-by-side
        <span className="rounded-full bg-lichen px-2 py-0.5 font-mono text-xs text-paper" data-testid="side-by-side-count">
          {slugs.length}
          <span className="sr-only"> of {MAX_SIDE_BY_SIDE} items</span>
        </span>
      </Link>
    </aside>
  );
}
