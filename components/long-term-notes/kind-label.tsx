import { longTermNoteKindLabel } from '@/lib/long-term-notes/kinds';

/** The kind of a note as a text label (never colour alone): "Repair", "Wear" … */
export function KindLabel({ kind }: { kind: string }) {
  return (
    <span className="inline-flex items-center rounded border border-ink/40 px-1.5 py-0.5 font-mono text-[11px] uppercase tracking-wide text-ink" data-testid="long-term-note-kind">
      {longTermNoteKindLabel(kind)}
    </span>
  );
}
