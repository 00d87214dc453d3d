import type { ReviewEvent } from '@/db/reviews';
import { STATE_LABELS } from '@/lib/workflow/transitions';
import { formatDateTime } from '@/lib/reviews/dates';

/** The revision history of state changes, newest first, with editors' comments. */
export function EventLog({ events }: { events: ReviewEvent[] }) {
  return (
    <ol className="space-y-3 text-sm" data-testid="event-log">
      {[...events].reverse().map((e) => (
        <li key={e.id} className="border-l-2 border-rule pl-3">
          <p>
            <span className="font-semibold">{e.from ? `${STATE_LABELS[e.from]} → ${STATE_LABELS[e.to]}` : `revision ${e.revisionNumber} started`}</span>{' '}
            <span className="text-slate">
              · revision {e.revisionNumber} · {e.actorName ?? 'former member'} · <time dateTime={e.at.toISOString()}>{formatDateTime(e.at)}</time>
            </span>
          </p>
          {e.comment ? <p className="mt-1 whitespace-pre-line rounded bg-card px-2 py-1">{e.comment}</p> : null}
        </li>
      ))}
    </ol>
  );
}
