import { renderMarkdownSync } from '@/lib/markdown/render';

/**
 * A long-term note's body as HTML: the one sanitizing Markdown pipeline (rehype-sanitize last, raw HTML
 * dropped). The only HTML a note's `dangerouslySetInnerHTML` may receive.
 */
export function longTermNoteBodyHtml(markdown: string): string {
  return renderMarkdownSync(markdown);
}

/** "1 month", "7 months", "under a month". */
export function monthsInServiceText(months: number): string {
  if (months === 0) return 'under a month in service';
  return `${months} ${months === 1 ? 'month' : 'months'} in service`;
}

/** A YYYY-MM-DD day in words, e.g. "20 November 2026" (read as a calendar day, no time zone shift). */
export function notedOnText(day: string): string {
  const d = new Date(`${day}T00:00:00Z`);
  if (Number.isNaN(d.getTime())) return day;
  return new Intl.DateTimeFormat('en-GB', { day: 'numeric', month: 'long', year: 'numeric', timeZone: 'UTC' }).format(d);
}
