import clsx from 'clsx';
import type { RecordState } from '@/db/schema';

export const FIELD_TEST_STATE_LABELS: Record<RecordState, string> = {
  draft: 'Draft',
  'in-review': 'In review',
  'changes-requested': 'Changes requested',
  approved: 'Approved',
};

export function FieldTestStatus({ status }: { status: RecordState }) {
  return (
    <span
      data-testid="field-test-status"
      className={clsx(
        'inline-flex items-center rounded border px-1.5 py-0.5 font-mono text-[11px] uppercase tracking-wide',
        status === 'approved' && 'border-lichen text-lichen',
        status === 'in-review' && 'border-amber text-amber',
        status === 'changes-requested' && 'border-danger text-danger',
        status === 'draft' && 'border-rule text-slate',
      )}
    >
      {FIELD_TEST_STATE_LABELS[status]}
    </span>
  );
}
