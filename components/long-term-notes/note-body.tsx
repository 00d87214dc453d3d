import { longTermNoteBodyHtml } from '@/lib/long-term-notes/render';

/** A note's Markdown, sanitized by lib/markdown (the only HTML source allowed here). */
export function NoteBody({ markdown, className = '' }: { markdown: string; className?: string }) {
  return <div className={`prose-content text-sm [&>*:last-child]:mb-0! ${className}`} data-testid="long-term-note-body" dangerouslySetInnerHTML={{ __html: longTermNoteBodyHtml(markdown) }} />;
}
