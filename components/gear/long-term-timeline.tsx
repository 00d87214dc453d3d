import Link from 'next/link';
import { getDb } from '@/db';
import type { Actor } from '@/db/gear';
import { countOwnPendingNotes, listPublicLongTermNotes, mayAddLongTermNote } from '@/db/long-term-notes';
import type { GearItem } from '@/db/schema';
import { KindLabel } from '@/components/long-term-notes/kind-label';
import { NoteBody } from '@/components/long-term-notes/note-body';
import { newNotePath } from '@/lib/long-term-notes/paths';
import { monthsInServiceText, notedOnText } from '@/lib/long-term-notes/render';

/**
 * The item page's "In service" timeline: approved long-term notes, oldest first, as an ordered list with
 * real dates. Eligible reviewers (owner, or author of a field test of the item) get "Add a long-term note".
 * Renders nothing when there is neither a note nor anything the viewer could add.
 */
export async function LongTermTimeline({ item, viewer }: { item: Pick<GearItem, 'id' | 'slug' | 'name' | 'maker' | 'ownerId' | 'approvedAt'>; viewer: Actor | null }) {
  const db = getDb();
  const notes = listPublicLongTermNotes(db, item);
  const mayAdd = mayAddLongTermNote(db, viewer, item);
  const pending = viewer ? countOwnPendingNotes(db, viewer.id, item.id) : 0;
  if (notes.length === 0 && !mayAdd && pending === 0) return null;

  return (
    <section aria-labelledby="long-term-heading" className="space-y-4" data-testid="long-term-timeline">
      <div className="flex flex-wrap items-baseline justify-between gap-3">
        <h2 id="long-term-heading" className="text-xl font-bold">
          In service: long-term notes
        </h2>
        {mayAdd ? (
          <Link href={newNotePath(item.slug)} className="rounded-md border border-rule px-3 py-1.5 text-sm font-semibold hover:bg-card" data-testid="add-long-term-note">
            Add a long-term note
          </Link>
        ) : null}
      </div>
      {notes.length === 0 ? (
        <p className="text-sm text-slate">No long-term notes are public yet. Reviewers who own or have tested this item add them as the months go by.</p>
      ) : (
        <ol className="ml-1.5 space-y-6 border-l-2 border-rule pl-5" aria-label="Long-term notes, oldest first">
          {notes.map((n) => (
            <li key={n.id} className="relative" data-testid="long-term-note">
              <span aria-hidden="true" className="absolute top-1.5 -left-[1.72rem] h-3 w-3 rounded-full border-2 border-paper bg-lichen" />
              <p className="flex flex-wrap items-center gap-x-3 gap-y-1 text-sm">
                <time dateTime={n.notedOn} className="figure font-mono font-semibold">
                  {notedOnText(n.notedOn)}
                </time>
                <span className="figure font-mono text-slate">{monthsInServiceText(n.monthsInService)}</span>
                <KindLabel kind={n.kind} />
              </p>
              <h3 className="mt-1 font-semibold">{n.title}</h3>
              <NoteBody markdown={n.body} className="mt-1" />
              <p className="mt-2 text-xs text-slate">Noted by {n.authorName}</p>
            </li>
          ))}
        </ol>
      )}
      {pending > 0 ? (
        <p className="text-sm text-slate" data-testid="own-pending-notes">
          You have {pending} {pending === 1 ? 'note' : 'notes'} on this item not public yet:{' '}
          <Link href="/logbook#long-term-notes" className="text-lichen underline">
            see your logbook
          </Link>
          .
        </p>
      ) : null}
    </section>
  );
}
