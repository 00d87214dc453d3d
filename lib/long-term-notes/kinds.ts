/**
 * Kinds of long-term note, in the order the form offers them. The same list as db/schema.ts's
 * column enum (kept apart so client components do not pull in the schema; a unit test keeps them equal).
 */
export const LONG_TERM_NOTE_KINDS = ['use', 'wear', 'failure', 'repair', 'retired'] as const;
export type LongTermNoteKind = (typeof LONG_TERM_NOTE_KINDS)[number];

/** Our own words for each kind of long-term note: a label (always shown as text) and a hint for the form. */
export const LONG_TERM_NOTE_KIND_INFO: Record<LongTermNoteKind, { label: string; hint: string }> = {
  use: { label: 'In use', hint: 'How it has served: trips, nights, weather, what it ran.' },
  wear: { label: 'Wear', hint: 'Something wearing out: a loose port, a fading seal, a frayed cable.' },
  failure: { label: 'Failure', hint: 'Something broke or stopped working.' },
  repair: { label: 'Repair', hint: 'A fix, by you or under warranty, and how it held up.' },
  retired: { label: 'Retired', hint: 'Taken out of service, and why.' },
};

export function longTermNoteKindLabel(kind: string): string {
  return (LONG_TERM_NOTE_KIND_INFO as Record<string, { label: string }>)[kind]?.label ?? kind;
}
