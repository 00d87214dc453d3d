/**
 * Workflow mail: editors on submission; the author on changes requested, approved, published and
 * retracted. Plain text plus HTML, links built from AUTH_URL. `buildNotifications` is pure (tested
 * directly); `notifyTransition` looks up recipients and sends after the transaction has committed —
 * a mail failure is logged and never undoes or fails the transition.
 */
import type { Db } from '@/db/connection';
import { authorRecipient, editorRecipients, type TransitionOutcome } from '@/db/reviews';
import { sendMail } from '@/lib/mail';

export interface Recipient {
  id: string;
  email: string;
  name: string;
}

export interface Notification {
  to: string;
  subject: string;
  text: string;
  html: string;
}

export function siteUrl(): string {
  return (process.env.AUTH_URL ?? 'http://localhost:3000').replace(/\/+$/, '');
}

function escapeHtml(text: string): string {
  return text.replace(/[&<>"']/g, (c) => ({ '&': '&amp;', '<': '&lt;', '>': '&gt;', '"': '&quot;', "'": '&#39;' })[c]!);
}

function message(to: Recipient, subject: string, lines: string[], quote: string | null, link: { label: string; url: string }): Notification {
  const text = [`Hello ${to.name},`, '', ...lines, ...(quote ? ['', ...quote.split('\n').map((l) => `> ${l}`)] : []), '', `${link.label}: ${link.url}`, '', '— Trailbench'].join('\n');
  const html = [
    `<p>Hello ${escapeHtml(to.name)},</p>`,
    ...lines.map((l) => `<p>${escapeHtml(l)}</p>`),
    quote ? `<blockquote style="border-left:3px solid #d6cfbf;margin:0;padding-left:12px">${escapeHtml(quote).replace(/\n/g, '<br>')}</blockquote>` : '',
    `<p><a href="${escapeHtml(link.url)}">${escapeHtml(link.label)}</a></p>`,
    '<p>— Trailbench</p>',
  ].join('\n');
  return { to: to.email, subject, text, html };
}

/** The messages one transition sends (none for withdraw and start-correction). */
export function buildNotifications(
  outcome: Pick<TransitionOutcome, 'action' | 'reviewId' | 'slug' | 'title' | 'comment' | 'revisionNumber'>,
  recipients: { editors: Recipient[]; author: Recipient | null },
  actorName: string,
  base = siteUrl(),
): Notification[] {
  const title = `“${outcome.title}”`;
  const rev = outcome.revisionNumber > 1 ? ` (revision ${outcome.revisionNumber}, a correction)` : '';
  const deskUrl = `${base}/desk/reviews/${encodeURIComponent(outcome.reviewId)}`;
  const writeUrl = `${base}/write/${encodeURIComponent(outcome.reviewId)}`;
  const readUrl = `${base}/reviews/${encodeURIComponent(outcome.slug)}`;
  const author = recipients.author;
  switch (outcome.action) {
    case 'submit':
      return recipients.editors.map((editor) =>
        message(editor, `Review submitted: ${outcome.title}`, [`${actorName} submitted the review ${title}${rev} for the review desk.`], null, { label: 'Read it on the review desk', url: deskUrl }),
      );
    case 'request-changes':
      return author ? [message(author, `Changes requested: ${outcome.title}`, [`${actorName} asked for changes to your review ${title}${rev}. It is back in your hands to edit and resubmit.`], outcome.comment, { label: 'Open the draft', url: writeUrl })] : [];
    case 'approve':
      return author ? [message(author, `Approved: ${outcome.title}`, [`${actorName} approved your review ${title}${rev}. An editor will publish it.`], null, { label: 'See your review', url: writeUrl })] : [];
    case 'publish':
      return author ? [message(author, `Published: ${outcome.title}`, [`${actorName} published your review ${title}${rev}. Readers can see it now.`], null, { label: 'Read it', url: readUrl })] : [];
    case 'retract':
      return author ? [message(author, `Retracted: ${outcome.title}`, [`${actorName} retracted your review ${title}. Readers see this public note in its place:`], outcome.comment, { label: 'See the review', url: readUrl })] : [];
    default:
      return [];
  }
}

const AUTHOR_SETTING: Partial<Record<TransitionOutcome['action'], 'changesRequested' | 'approved' | 'published' | 'retracted'>> = {
  'request-changes': 'changesRequested',
  approve: 'approved',
  publish: 'published',
  retract: 'retracted',
};

/** Sends the mail of a committed transition, to those who have not turned it off. Never throws. */
export async function notifyTransition(db: Db, outcome: TransitionOutcome, actor: { id: string; name: string }): Promise<number> {
  try {
    const editors = outcome.action === 'submit' ? editorRecipients(db, outcome.authorId) : [];
    const setting = AUTHOR_SETTING[outcome.action];
    const author = setting ? authorRecipient(db, outcome.authorId, setting) : null;
    const messages = buildNotifications(outcome, { editors, author: author && author.id !== actor.id ? author : null }, actor.name);
    const results = await Promise.allSettled(messages.map((m) => sendMail(m)));
    for (const r of results) if (r.status === 'rejected') console.error('Review notification not sent', r.reason);
    return results.filter((r) => r.status === 'fulfilled').length;
  } catch (error) {
    console.error('Review notifications failed', error);
    return 0;
  }
}
