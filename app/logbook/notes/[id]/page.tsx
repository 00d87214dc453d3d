import type { Metadata } from 'next';
import Link from 'next/link';
import { getDb } from '@/db';
import { getLongTermNote } from '@/db/long-term-notes';
import { KindLabel } from '@/components/long-term-notes/kind-label';
import { NoteBody } from '@/components/long-term-notes/note-body';
import { LongTermNoteForm } from '@/components/long-term-notes/note-form';
import { NoteStatus } from '@/components/long-term-notes/status-badge';
import { NoteWorkflowButtons } from '@/components/long-term-notes/workflow-buttons';
import { requirePageUser } from '@/lib/auth/guard';
import { gearPath } from '@/lib/gear/paths';
import { orPageError } from '@/lib/gear/page-errors';
import { monthsInServiceText, notedOnText } from '@/lib/long-term-notes/render';
import { STATE_LABELS } from '@/lib/workflow/transitions';

export const metadata: Metadata = { title: 'Long-term note' };
export const dynamic = 'force-dynamic';

/** One long-term note for its author (edit while draft or sent back, submit, withdraw) and for editors (approve, send back). */
export default async function LongTermNotePage({ params }: { params: Promise<{ id: string }> }) {
  const { id } = await params;
  const user = await requirePageUser(`/logbook/notes/${encodeURIComponent(id)}`);
  const { note, events, actions, canEdit } = orPageError(() => getLongTermNote(getDb(), id, user));
  const sentBack = note.status === 'changes-requested' ? events.find((e) => e.to === 'changes-requested')?.comment : undefined;
  return (
    <main className="mx-auto max-w-3xl space-y-8 px-4 py-10 sm:px-6">
      <div>
        <Link href={gearPath(note.item.slug)} className="text-sm text-slate hover:underline">
          ← {note.item.name}
        </Link>
        <h1 className="mt-2 text-3xl font-bold tracking-tight" data-testid="long-term-note-title">
          {note.title}
        </h1>
        <p className="mt-2 flex flex-wrap items-center gap-2 text-sm text-slate">
          <NoteStatus status={note.status} />
          <KindLabel kind={note.kind} />
          <span>
            Long-term note on {note.item.maker} {note.item.name} by {note.authorName}
          </span>
        </p>
        <p className="mt-1 text-sm text-slate">{note.public ? 'Public: shown in the item’s timeline.' : 'Not public: only its author and the editors see it.'}</p>
      </div>
      {sentBack ? (
        <div className="rounded-md border border-danger bg-danger-tint px-3 py-2 text-sm" data-testid="send-back-comment">
          <strong>Editor&apos;s comment:</strong> {sentBack}
        </div>
      ) : null}
      <section aria-label="Review" className="rounded-lg border border-rule bg-card p-4">
        {actions.length ? <NoteWorkflowButtons id={note.id} actions={actions} title={note.title} /> : <p className="text-sm text-slate">{note.status === 'in-review' ? 'Waiting for an editor.' : 'Nothing to do here now.'}</p>}
      </section>
      {canEdit ? (
        <section aria-labelledby="ltn-edit" className="space-y-4">
          <h2 id="ltn-edit" className="text-xl font-semibold">
            Edit the note
          </h2>
          <LongTermNoteForm mode="edit" id={note.id} defaults={{ notedOn: note.notedOn, monthsInService: note.monthsInService, kind: note.kind, title: note.title, body: note.body }} />
        </section>
      ) : (
        <article className="space-y-2">
          <p className="flex flex-wrap gap-3 text-sm">
            <time dateTime={note.notedOn} className="figure font-mono font-semibold">
              {notedOnText(note.notedOn)}
            </time>
            <span className="figure font-mono text-slate">{monthsInServiceText(note.monthsInService)}</span>
          </p>
          <NoteBody markdown={note.body} />
        </article>
      )}
      <section aria-labelledby="ltn-history" className="space-y-2">
        <h2 id="ltn-history" className="text-lg font-semibold">
          History
        </h2>
        <ol className="space-y-1 text-sm" data-testid="long-term-note-history">
          {events.map((e, i) => (
            <li key={i}>
              <time dateTime={e.at.toISOString()} className="figure font-mono text-slate">
                {e.at.toISOString().slice(0, 16).replace('T', ' ')} UTC
              </time>{' '}
              {e.from ? `${STATE_LABELS[e.from]} → ` : 'created as '}
              {STATE_LABELS[e.to]}
              {e.actorName ? ` by ${e.actorName}` : ''}
              {e.comment ? <span className="block pl-4 text-slate">“{e.comment}”</span> : null}
            </li>
          ))}
        </ol>
      </section>
    </main>
  );
}
