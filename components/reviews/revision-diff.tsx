import type { DiffPart, FieldDiff } from '@/lib/reviews/diff';

/**
 * A word-level diff rendered as <del>/<ins>. Not colour alone: removed text is struck through,
 * added text underlined, and each change carries hidden words for screen readers (most do not
 * announce <del>/<ins> by themselves) — "removed: … end removed".
 */
function Part({ part }: { part: DiffPart }) {
  switch (part.kind) {
    case 'removed':
      return (
        <del className="rounded-sm bg-danger-tint text-danger decoration-2">
          <span className="sr-only">[removed: </span>
          {part.text}
          <span className="sr-only"> :end removed]</span>
        </del>
      );
    case 'added':
      return (
        <ins className="rounded-sm bg-lichen-tint text-lichen-dark underline decoration-2 underline-offset-2">
          <span className="sr-only">[added: </span>
          {part.text}
          <span className="sr-only"> :end added]</span>
        </ins>
      );
    case 'elided':
      return <span className="mx-1 inline-block rounded border border-rule px-1.5 font-sans text-xs text-slate">… {part.text} …</span>;
    default:
      return <span>{part.text}</span>;
  }
}

export function DiffLegend() {
  return (
    <p className="flex flex-wrap items-center gap-x-4 gap-y-1 text-sm text-slate" data-testid="diff-legend">
      <span>
        <del className="rounded-sm bg-danger-tint px-1 text-danger decoration-2">struck through</del> = removed
      </span>
      <span>
        <ins className="rounded-sm bg-lichen-tint px-1 text-lichen-dark underline decoration-2 underline-offset-2">underlined</ins> = added
      </span>
    </p>
  );
}

export function FieldDiffView({ diff }: { diff: FieldDiff }) {
  return (
    <section className="border-t border-rule py-5" data-testid={`diff-${diff.field}`}>
      <h2 className="flex flex-wrap items-baseline gap-x-3 font-semibold">
        {diff.label}
        <span className="text-sm font-normal text-slate">
          {!diff.changed ? 'unchanged' : `${diff.removed} word${diff.removed === 1 ? '' : 's'} removed, ${diff.added} added${diff.granularity === 'line' ? ' (compared line by line: too many changes for word by word)' : ''}`}
        </span>
      </h2>
      {diff.changed ? (
        <div className={`mt-2 whitespace-pre-wrap break-words leading-relaxed ${diff.field === 'body' ? 'font-mono text-sm' : ''}`}>
          {diff.parts.map((part, i) => (
            <Part key={i} part={part} />
          ))}
        </div>
      ) : null}
    </section>
  );
}
