import { StatusBadge } from '@/components/gear/status-badge';
import type { RecordState } from '@/db/schema';

/** A note's state in words (the gear badge: same states, same words). */
export function NoteStatus({ status }: { status: RecordState }) {
  return <StatusBadge status={status} />;
}
