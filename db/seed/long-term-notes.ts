import { inArray } from 'drizzle-orm';
import type { LongTermNoteKind, RecordState } from '../schema';
import { gearItems, longTermNotes, longTermNoteStateEvents } from '../schema';
import type { DemoUserKey } from './demo-data';

/**
 * Invented long-term notes of the demo scenario (Cedar Hollow Field School, autumn 2026): how demo items
 * held up over the months after they were bought. Mostly approved (the item pages' timelines), one
 * waiting on the review desk, one draft in a reviewer's logbook. Invented and plausible, not real reports.
 */
export interface DemoLongTermNote {
  id: string;
  item: string;
  author: DemoUserKey;
  notedOn: string;
  monthsInService: number;
  kind: LongTermNoteKind;
  title: string;
  body: string;
  status: RecordState;
  /** When it was written, submitted and (for approved notes) approved, UTC. */
  written: string;
  submitted?: string;
  approved?: string;
}

export const DEMO_LONG_TERM_NOTES: readonly DemoLongTermNote[] = [
  {
    id: 'demo-ltn-hearthglow-course',
    item: 'glowmere-hearthglow-400',
    author: 'reviewer',
    notedOn: '2026-09-12',
    monthsInService: 0,
    kind: 'use',
    title: 'Every evening of the first autumn course',
    body: 'Both lanterns hung from the ridge pole of the mess tent for eleven evenings at **Upper Meadow camp**, on medium for about three hours a night. One USB-C charge every second day from the camp bank kept them going; neither ran flat.',
    status: 'approved',
    written: '2026-09-12T19:30',
    submitted: '2026-09-12T19:40',
    approved: '2026-09-14T09:15',
  },
  {
    id: 'demo-ltn-hearthglow-hook',
    item: 'glowmere-hearthglow-400',
    author: 'reviewer',
    notedOn: '2026-11-08',
    monthsInService: 2,
    kind: 'failure',
    title: 'Hanging hook cracked after the first hard frosts',
    body: [
      'After a week of nights down to about −6 °C the moulded plastic hook of one lantern split at its root while a student unhooked it. The lantern dropped onto the groundsheet; the globe and the light were fine.',
      '',
      '- The crack started where the hook meets the cap, on the inside of the bend.',
      '- The second lantern’s hook shows a fine white stress line in the same place.',
      '',
      'Until it is replaced we hang both from a loop of 3 mm cord through the base handle.',
    ].join('\n'),
    status: 'approved',
    written: '2026-11-08T20:10',
    submitted: '2026-11-08T20:15',
    approved: '2026-11-10T08:40',
  },
  {
    id: 'demo-ltn-hearthglow-repair',
    item: 'glowmere-hearthglow-400',
    author: 'reviewer',
    notedOn: '2026-11-26',
    monthsInService: 3,
    kind: 'repair',
    title: 'Replacement hooks from the maker are metal',
    body: 'Glowmere sent two replacement caps under warranty within ten days. The new hook is bent steel wire with a rubber sleeve; it clicks into the same cap. Two frosty nights since, no marks. We will report again after the winter course.',
    status: 'in-review',
    written: '2026-11-26T18:00',
    submitted: '2026-11-26T18:05',
  },
  {
    id: 'demo-ltn-tarn-bellows',
    item: 'northcairn-tarn-collapsible-lantern',
    author: 'reviewer',
    notedOn: '2026-10-18',
    monthsInService: 2,
    kind: 'wear',
    title: 'Silicone bellows turning tacky at the folds',
    body: 'Packed collapsed in a food bag for most of two months, the silicone body has gone slightly tacky along the fold lines and picks up grit. It still seals and lights evenly. Wiping it with a damp cloth and storing it extended between trips seems to help.',
    status: 'approved',
    written: '2026-10-18T17:20',
    submitted: '2026-10-18T17:30',
    approved: '2026-10-20T10:05',
  },
  {
    id: 'demo-ltn-cellhive-week',
    item: 'voltmoth-cellhive-20',
    author: 'reviewer2',
    notedOn: '2026-09-20',
    monthsInService: 1,
    kind: 'use',
    title: 'A week of phones and the camp radio',
    body: 'Over the course week it charged six phones a day on rotation and ran the handheld radio’s charger each evening. Recharged from the 60 W panel on four of the seven days; the display never showed less than two bars.',
    status: 'approved',
    written: '2026-09-20T21:00',
    submitted: '2026-09-20T21:10',
    approved: '2026-09-22T08:30',
  },
  {
    id: 'demo-ltn-cellhive-port',
    item: 'voltmoth-cellhive-20',
    author: 'reviewer2',
    notedOn: '2026-11-15',
    monthsInService: 3,
    kind: 'wear',
    title: 'USB-C port worn loose',
    body: [
      'The USB-C port now holds a plug only loosely: moving the bank can interrupt charging, and one cable drops out under its own weight. The USB-A ports are unaffected. Plugged in and out perhaps three hundred times so far.',
      '',
      'We have taken it off phone duty. A loose port can arc or heat up: if a port or the pack gets hot, smells, or the case swells, stop using it and follow the maker’s instructions for disposal.',
    ].join('\n'),
    status: 'approved',
    written: '2026-11-15T16:45',
    submitted: '2026-11-15T16:50',
    approved: '2026-11-17T09:20',
  },
  {
    id: 'demo-ltn-heathray-kickstand',
    item: 'brackenfold-heathray-60',
    author: 'reviewer',
    notedOn: '2026-09-28',
    monthsInService: 1,
    kind: 'failure',
    title: 'Kickstand strap tore at its stitching',
    body: 'A gust caught the panel on the meadow and the webbing strap that sets the kickstand angle tore out of its stitching. The panel fell face down onto grass, no damage to the cells. Until it is fixed we prop it against a pack.',
    status: 'approved',
    written: '2026-09-28T15:30',
    submitted: '2026-09-28T15:40',
    approved: '2026-09-30T08:50',
  },
  {
    id: 'demo-ltn-heathray-repair',
    item: 'brackenfold-heathray-60',
    author: 'reviewer',
    notedOn: '2026-10-24',
    monthsInService: 2,
    kind: 'repair',
    title: 'Kickstand strap re-stitched with a bar tack',
    body: 'Re-stitched by hand with bonded nylon thread and a bar tack at each end (about forty minutes). Three weeks of daily use since, holding well. We now guy the panel down on windy days.',
    status: 'approved',
    written: '2026-10-24T18:10',
    submitted: '2026-10-24T18:15',
    approved: '2026-10-26T09:00',
  },
  {
    id: 'demo-ltn-deepwell-bench',
    item: 'voltmoth-deepwell-50',
    author: 'reviewer2',
    notedOn: '2026-11-29',
    monthsInService: 3,
    kind: 'use',
    title: 'Three months on the base camp bench',
    body: 'Draft: cycled most days between about 40 % and full; terminals still clean. To add: the capacity check we plan for December.',
    status: 'draft',
    written: '2026-11-29T17:00',
  },
];

const at = (s: string) => new Date(`${s}:00Z`);

type Q = Pick<import('../connection').Db, 'select' | 'insert'>;

/**
 * Adds the demo notes whose item exists and that are not there yet, with their state events (written only
 * with a note inserted in the same run). Idempotent; returns the notes inserted.
 */
export function seedDemoLongTermNotes(tx: Q, userId: (key: DemoUserKey) => string): number {
  const present = new Set(
    tx
      .select({ id: gearItems.id })
      .from(gearItems)
      .where(
        inArray(
          gearItems.id,
          DEMO_LONG_TERM_NOTES.map((n) => `demo-gear-${n.item}`),
        ),
      )
      .all()
      .map((r) => r.id),
  );
  let inserted = 0;
  for (const n of DEMO_LONG_TERM_NOTES) {
    const gearItemId = `demo-gear-${n.item}`;
    if (!present.has(gearItemId)) continue;
    const authorId = userId(n.author);
    const last = n.approved ?? n.submitted ?? n.written;
    const added = tx
      .insert(longTermNotes)
      .values({
        id: n.id,
        gearItemId,
        authorId,
        notedOn: n.notedOn,
        monthsInService: n.monthsInService,
        kind: n.kind,
        title: n.title,
        body: n.body,
        status: n.status,
        approvedAt: n.approved ? at(n.approved) : null,
        createdAt: at(n.written),
        updatedAt: at(last),
      })
      .onConflictDoNothing()
      .run().changes;
    if (added === 0) continue;
    inserted += added;
    const events: (typeof longTermNoteStateEvents.$inferInsert)[] = [{ noteId: n.id, fromState: null, toState: 'draft', actorId: authorId, createdAt: at(n.written) }];
    if (n.submitted) events.push({ noteId: n.id, fromState: 'draft', toState: 'in-review', actorId: authorId, createdAt: at(n.submitted) });
    if (n.approved) events.push({ noteId: n.id, fromState: 'in-review', toState: 'approved', actorId: userId('editor'), createdAt: at(n.approved) });
    tx.insert(longTermNoteStateEvents).values(events).run();
  }
  return inserted;
}
