import clsx from 'clsx';
import { STATE_LABELS, type WorkflowState } from '@/lib/workflow/transitions';

const TONE: Record<WorkflowState, string> = {
  draft: 'border-rule text-slate',
  'in-review': 'border-amber text-amber',
  'changes-requested': 'border-danger text-danger',
  approved: 'border-lichen text-lichen',
  published: 'border-lichen bg-lichen-tint text-ink',
  retracted: 'border-danger bg-danger-tint text-danger',
};

/** A review state as a labelled chip (text, not colour alone). */
export function StateBadge({ state }: { state: WorkflowState }) {
  return (
    <span className={clsx('inline-block rounded border px-1.5 py-0.5 font-mono text-[0.7rem] uppercase tracking-wide', TONE[state])} data-testid="review-state">
      {STATE_LABELS[state]}
    </span>
  );
}
