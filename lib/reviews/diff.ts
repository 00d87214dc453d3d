import { diffLines, diffWords, type ChangeObject } from 'diff';

/**
 * Word-level differences between two revisions of a review, for readers (issue 6: "readers can see
 * earlier revisions with a diff"). Pure: text in, parts out; the page renders them as <del>/<ins>.
 * Built on jsdiff's `diffWords` (npm `diff` 9), which treats each word and punctuation mark as a
 * token and whitespace as a separator. A very different pair of long texts would be costly word by
 * word, so past MAX_WORD_EDITS the comparison falls back to whole lines.
 */
export type DiffPartKind = 'same' | 'added' | 'removed' | 'elided';

export interface DiffPart {
  kind: DiffPartKind;
  text: string;
}

export interface TextDiff {
  parts: DiffPart[];
  /** 'word', or 'line' when the texts differed too much for a word diff. */
  granularity: 'word' | 'line';
  changed: boolean;
  added: number;
  removed: number;
}

/** Most word edits computed before falling back to a line diff (keeps a 100 000-character body fast). */
export const MAX_WORD_EDITS = 800;
/** Unchanged runs longer than this are shortened to their ends, with the middle marked as elided. */
export const LONG_UNCHANGED = 480;
const CONTEXT = 160;

const wordCount = (text: string) => (text.match(/\S+/g) ?? []).length;

function toParts(changes: ChangeObject<string>[]): DiffPart[] {
  return changes.filter((c) => c.value.length > 0).map((c) => ({ kind: c.added ? 'added' : c.removed ? 'removed' : 'same', text: c.value }));
}

/** Cuts the middle out of long unchanged runs, keeping CONTEXT characters at each end (the whole run at the start or end of the text keeps only the side next to a change). */
export function elideUnchanged(parts: DiffPart[], limit = LONG_UNCHANGED): DiffPart[] {
  return parts.flatMap((part, i): DiffPart[] => {
    if (part.kind !== 'same' || part.text.length <= limit) return [part];
    const first = i === 0;
    const last = i === parts.length - 1;
    const head = first ? '' : cutAtSpace(part.text.slice(0, CONTEXT), 'end');
    const tail = last ? '' : cutAtSpace(part.text.slice(-CONTEXT), 'start');
    const hidden = part.text.slice(head.length, part.text.length - tail.length);
    return [
      ...(head ? [{ kind: 'same' as const, text: head }] : []),
      { kind: 'elided' as const, text: `${wordCount(hidden).toLocaleString('en-US')} unchanged words` },
      ...(tail ? [{ kind: 'same' as const, text: tail }] : []),
    ];
  });
}

function cutAtSpace(text: string, side: 'start' | 'end'): string {
  if (side === 'end') {
    const at = text.lastIndexOf(' ');
    return at > 0 ? text.slice(0, at + 1) : text;
  }
  const at = text.indexOf(' ');
  return at >= 0 ? text.slice(at) : text;
}

/** Differences from `older` to `newer`, word by word (or line by line past MAX_WORD_EDITS). */
export function diffText(older: string, newer: string, options: { elide?: boolean } = {}): TextDiff {
  const words = diffWords(older, newer, { maxEditLength: MAX_WORD_EDITS });
  const granularity = words ? 'word' : 'line';
  const parts = toParts(words ?? diffLines(older, newer));
  const added = parts.filter((p) => p.kind === 'added').reduce((n, p) => n + wordCount(p.text), 0);
  const removed = parts.filter((p) => p.kind === 'removed').reduce((n, p) => n + wordCount(p.text), 0);
  return { parts: options.elide === false ? parts : elideUnchanged(parts), granularity, changed: older !== newer, added, removed };
}

export interface RevisionText {
  title: string;
  summary: string;
  verdict: string;
  body: string;
  disclosureLabel: string;
  disclosureNote: string;
}

export const DIFF_FIELDS = [
  ['title', 'Title'],
  ['summary', 'Summary'],
  ['verdict', 'Verdict'],
  ['disclosureLabel', 'How the tester got the gear'],
  ['disclosureNote', 'Disclosure note'],
  ['body', 'Review text (Markdown)'],
] as const satisfies readonly (readonly [keyof RevisionText, string])[];

export interface FieldDiff extends TextDiff {
  field: keyof RevisionText;
  label: string;
}

/** One diff per field of a revision, in reading order. */
export function diffRevisions(older: RevisionText, newer: RevisionText): FieldDiff[] {
  return DIFF_FIELDS.map(([field, label]) => ({ field, label, ...diffText(older[field], newer[field]) }));
}
