/**
 * One zod schema per input of the review workflow, shared by the writing form (react-hook-form +
 * zodResolver), the server actions and the data layer (db/reviews.ts). Browser-safe: no server imports.
 */
import { z } from 'zod';
import type { DISCLOSURES as DB_DISCLOSURES } from '@/db/schema';

/** The same list as db/schema.ts (kept here so client bundles need not load the schema module). */
export const DISCLOSURES = ['bought-retail', 'loaned-by-maker', 'given-by-maker', 'sponsored'] as const;
export type Disclosure = (typeof DISCLOSURES)[number];
// Compile-time check that both lists agree.
const sameList: typeof DB_DISCLOSURES extends typeof DISCLOSURES ? (typeof DISCLOSURES extends typeof DB_DISCLOSURES ? true : never) : never = true;
void sameList;

/** How the tester got the gear, in plain words (shown at the top of a review). 16 CFR Part 255 spirit: clear and near the claim. */
export const DISCLOSURE_LABELS: Record<Disclosure, string> = {
  'bought-retail': 'Bought at retail with our own money',
  'loaned-by-maker': 'Loaned by the maker',
  'given-by-maker': 'Given to us by the maker',
  sponsored: 'Sponsored by the maker',
};

/** The disclosure sentence readers see: "How we got this gear: loaned by the maker. <note>". */
export function disclosureSentence(disclosure: Disclosure, note: string): string {
  const label = DISCLOSURE_LABELS[disclosure];
  const lead = `How we got this gear: ${label.charAt(0).toLowerCase()}${label.slice(1)}.`;
  return note.trim() ? `${lead} ${note.trim()}` : lead;
}

export const MAX_BODY = 100_000;
export const MAX_ITEMS = 12;

const id = z.string().trim().min(1).max(100);

export const titleField = z.string().trim().min(3, 'Give the review a title of at least 3 characters.').max(160, 'Use at most 160 characters.');
export const itemIdsField = z
  .array(id)
  .min(1, 'Pick at least one gear item.')
  .max(MAX_ITEMS, `Pick at most ${MAX_ITEMS} gear items.`)
  .refine((ids) => new Set(ids).size === ids.length, 'Each gear item only once.');

/** Starting a review: a title and the gear item(s) it covers. */
export const createReviewSchema = z.strictObject({
  title: titleField,
  itemIds: itemIdsField,
});
export type CreateReviewInput = z.input<typeof createReviewSchema>;

/** The whole editable text of a draft (autosave sends all of it). Completeness is checked on submit. */
export const reviewDraftSchema = z.strictObject({
  title: titleField,
  summary: z.string().trim().max(600, 'Keep the summary under 600 characters.'),
  verdict: z.string().trim().max(600, 'Keep the verdict under 600 characters.'),
  body: z.string().max(MAX_BODY, `The body may be at most ${MAX_BODY.toLocaleString('en-US')} characters.`),
  disclosure: z.enum(DISCLOSURES, 'Choose how you got the gear.').nullable(),
  disclosureNote: z.string().trim().max(1000, 'Use at most 1000 characters.'),
  correctionNote: z.string().trim().max(1000, 'Use at most 1000 characters.'),
  itemIds: itemIdsField,
});
export type ReviewDraftInput = z.input<typeof reviewDraftSchema>;
export type ReviewDraftData = z.output<typeof reviewDraftSchema>;

/**
 * What a revision needs before it can be submitted (and, for the disclosure, before it can be
 * published). Returns field errors, empty when complete.
 */
export function submitProblems(rev: {
  title: string;
  summary: string;
  verdict: string;
  body: string;
  disclosure: Disclosure | null;
  disclosureNote: string;
  correctionNote: string | null;
  isCorrection: boolean;
  itemCount: number;
}): Record<string, string[]> {
  const fields: Record<string, string[]> = {};
  const need = (key: string, ok: boolean, message: string) => {
    if (!ok) (fields[key] ??= []).push(message);
  };
  need('title', rev.title.trim().length >= 3, 'Give the review a title.');
  need('summary', rev.summary.trim().length > 0, 'Write a one- or two-sentence summary.');
  need('verdict', rev.verdict.trim().length > 0, 'Write the verdict.');
  need('body', rev.body.trim().length > 0, 'Write the review.');
  need('disclosure', rev.disclosure !== null, 'Say how you got the gear: readers see it at the top of the review.');
  need(
    'disclosureNote',
    rev.disclosure === null || rev.disclosure === 'bought-retail' || rev.disclosureNote.trim().length > 0,
    'Name the maker and any other connection (loan, gift, sponsorship) in a sentence.',
  );
  need('correctionNote', !rev.isCorrection || (rev.correctionNote ?? '').trim().length > 0, 'Say what this correction changes: readers see the note.');
  need('itemIds', rev.itemCount > 0, 'Pick at least one gear item.');
  return fields;
}

/** An editor's comment when requesting changes. */
export const requestChangesSchema = z.strictObject({
  comment: z.string().trim().min(3, 'Say what the author should change.').max(2000, 'Use at most 2000 characters.'),
});
export type RequestChangesInput = z.input<typeof requestChangesSchema>;

/** The public note shown on a retracted review. */
export const retractSchema = z.strictObject({
  note: z.string().trim().min(10, 'Write a public note of at least 10 characters saying why.').max(2000, 'Use at most 2000 characters.'),
});
export type RetractInput = z.input<typeof retractSchema>;

/** Desk filters (query string). */
export const DESK_KINDS = ['review', 'gear-item', 'field-test', 'long-term-note'] as const;
export type DeskKind = (typeof DESK_KINDS)[number];
export const deskFilterSchema = z.object({
  author: z.string().max(100).optional().catch(undefined),
  kind: z.enum(DESK_KINDS).optional().catch(undefined),
});

/** Word count as readers would count: runs of letters/digits, Markdown punctuation ignored. */
export function wordCount(markdown: string): number {
  const words = markdown.match(/[\p{L}\p{N}][\p{L}\p{N}'’.-]*/gu);
  return words ? words.length : 0;
}

/** Per-user switches for workflow mail (the notification settings form, its action and db/reviews.ts). */
export const notificationSettingsSchema = z.strictObject({
  reviewSubmitted: z.boolean(),
  changesRequested: z.boolean(),
  approved: z.boolean(),
  published: z.boolean(),
  retracted: z.boolean(),
});
export type NotificationSettings = z.output<typeof notificationSettingsSchema>;

export const NOTIFICATION_LABELS: Record<keyof NotificationSettings, { label: string; who: string }> = {
  reviewSubmitted: { label: 'A review is submitted to the desk', who: 'editors' },
  changesRequested: { label: 'An editor asks for changes to my review', who: 'authors' },
  approved: { label: 'My review is approved', who: 'authors' },
  published: { label: 'My review is published', who: 'authors' },
  retracted: { label: 'My review is retracted', who: 'authors' },
};
