/** Dates as the review pages show them: "2 October 2026" and "2 October 2026, 08:41 UTC". Fixed to UTC so server and client agree. */
const day = new Intl.DateTimeFormat('en-GB', { day: 'numeric', month: 'long', year: 'numeric', timeZone: 'UTC' });
const time = new Intl.DateTimeFormat('en-GB', { hour: '2-digit', minute: '2-digit', hour12: false, timeZone: 'UTC' });

export function formatDate(date: Date): string {
  return day.format(date);
}

export function formatDateTime(date: Date): string {
  return `${day.format(date)}, ${time.format(date)} UTC`;
}
