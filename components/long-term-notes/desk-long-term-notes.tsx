import Link from 'next/link';
import { getDb } from '@/db';
import { listLongTermNotesInReview, longTermNoteAnchor } from '@/db/long-term-notes';
import { getCurrentUser } from '@/lib/auth/guard';
import { hasRole } from '@/lib/auth/roles';
import { gearPath } from '@/lib/gear/paths';
import { monthsInServiceText, notedOnText } from '@/lib/long-term-notes/render';
import { availableActions } from '@/lib/workflow/transitions';
import { KindLabel } from './kind-label';
import { NoteBody } from './note-body';
import { NoteWorkflowButtons } from './workflow-buttons';

/**
 * The review desk's long-term notes in review, each in full with approve / send back (the desk page
 * checks the editor role; the API checks it again on every move). Filtered like the queue above it.
 */
export async function DeskLongTermNotes({ filters }: { filters: { author?: string; kind?: string } }) {
  const viewer = await getCurrentUser();
  if (!viewer || !hasRole(viewer, 'editor')) return null;
  if (filters.kind && filters.kind !== 'long-term-note') return null;
  const notes = listLongTermNotesInReview(getDb()).filter((n) => !filters.author || n.authorId === filters.author);
  if (notes.length === 0) return null;
  return (
    <section aria-labelledby="desk-long-term-notes" className="mt-10 space-y-4" data-testid="desk-long-term-notes">
      <h2 id="desk-long-term-notes" className="text-xl font-bold">
        Long-term notes to review
      </h2>
      <p className="max-w-[70ch] text-sm text-slate">Short notes on how an item held up in service. Approving one makes it public in the item’s timeline; send it back with a comment to ask for changes.</p>
      <ul className="space-y-4">
        {notes.map((n) => (
          <li key={n.id} id={longTermNoteAnchor(n.id)} className="scroll-mt-6 rounded-lg border border-rule bg-card p-4" data-testid="desk-long-term-note">
            <article aria-labelledby={`${longTermNoteAnchor(n.id)}-title`} className="space-y-2">
              <p className="flex flex-wrap items-center gap-x-3 gap-y-1 text-sm">
                <time dateTime={n.notedOn} className="figure font-mono font-semibold">
                  {notedOnText(n.notedOn)}
                </time>
                <span className="figure font-mono text-slate">{monthsInServiceText(n.monthsInService)}</span>
                <KindLabel kind={n.kind} />
              </p>
              <h3 id={`${longTermNoteAnchor(n.id)}-title`} className="font-semibold">
                {n.title}
              </h3>
              <p className="text-xs text-slate">
                On{' '}
                <Link href={gearPath(n.item.slug)} className="text-lichen underline">
                  {n.item.maker} {n.item.name}
                </Link>{' '}
                · by {n.authorName}
              </p>
              <NoteBody markdown={n.body} className="rounded border border-rule bg-paper p-3" />
              <NoteWorkflowButtons id={n.id} title={n.title} actions={availableActions({ kind: 'record', state: n.status, actor: viewer, authorId: n.authorId })} />
            </article>
          </li>
        ))}
      </ul>
    </section>
  );
}
