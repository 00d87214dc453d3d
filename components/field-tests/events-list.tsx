import type { FieldTestView } from '@/db/field-tests-view';
import { FIELD_TEST_STATE_LABELS } from './status-badge';

/** State changes with who, when and the editor's comment (author, items' owners and editors only). */
export function FieldTestEvents({ events }: { events: FieldTestView['events'] }) {
  if (events.length === 0) return null;
  return (
    <section aria-labelledby="ft-history" className="space-y-2">
      <h2 id="ft-history" className="text-xl font-semibold">History</h2>
      <ol className="space-y-1 text-sm">
        {events.map((e, i) => (
          <li key={i}>
            <span className="figure text-slate">{e.createdAt.toISOString().slice(0, 16).replace('T', ' ')} UTC</span> — {e.actorName ?? 'Someone'}:{' '}
            {e.fromState ? `${FIELD_TEST_STATE_LABELS[e.fromState]} → ` : 'created as '}
            {FIELD_TEST_STATE_LABELS[e.toState]}
            {e.comment ? <q className="ml-1 italic">{e.comment}</q> : null}
          </li>
        ))}
      </ol>
    </section>
  );
}
