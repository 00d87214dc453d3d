import { Fragment } from 'react';

/** Text with `code` spans, as the document's descriptions write them. */
export function InlineText({ text }: { text: string }) {
  const parts = text.split('`');
  return (
    <>
      {parts.map((part, i) =>
        i % 2 === 1 ? (
          <code key={i} className="rounded bg-card px-1 font-mono text-[0.92em]">
            {part}
          </code>
        ) : (
          <Fragment key={i}>{part}</Fragment>
        ),
      )}
    </>
  );
}

/** A description: paragraphs, and lines starting with "- " as a list. */
export function DescriptionText({ text, className = '' }: { text: string; className?: string }) {
  const blocks: { list: boolean; lines: string[] }[] = [];
  for (const line of text.split('\n').map((l) => l.trim()).filter(Boolean)) {
    const isItem = line.startsWith('- ');
    const last = blocks.at(-1);
    if (isItem && last?.list) last.lines.push(line.slice(2));
    else blocks.push({ list: isItem, lines: [isItem ? line.slice(2) : line] });
  }
  return (
    <div className={`space-y-2 leading-relaxed ${className}`}>
      {blocks.map((block, i) =>
        block.list ? (
          <ul key={i} className="list-disc space-y-1 pl-5">
            {block.lines.map((line, j) => (
              <li key={j}>
                <InlineText text={line} />
              </li>
            ))}
          </ul>
        ) : (
          <p key={i}>
            <InlineText text={block.lines[0]!} />
          </p>
        ),
      )}
    </div>
  );
}
