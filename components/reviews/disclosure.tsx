import { DISCLOSURE_LABELS, type Disclosure } from '@/lib/reviews/schemas';

/**
 * How the tester got the gear, at the top of the review in plain words (16 CFR Part 255 spirit:
 * clear and conspicuous, next to the claims, not in a footer).
 */
export function DisclosureNotice({ disclosure, note }: { disclosure: Disclosure | null; note: string }) {
  if (!disclosure) {
    return (
      <p role="note" className="rounded-md border border-amber bg-amber-tint px-4 py-3 text-sm" data-testid="disclosure">
        <strong>No disclosure yet.</strong> A review cannot be published until it says how the tester got the gear.
      </p>
    );
  }
  return (
    <aside role="note" aria-label="Disclosure" className="rounded-md border border-rule bg-card px-4 py-3 text-sm leading-relaxed" data-testid="disclosure">
      <p>
        <strong>How we got this gear:</strong> {DISCLOSURE_LABELS[disclosure]}.{note.trim() ? ` ${note.trim()}` : ''}
      </p>
    </aside>
  );
}
