/**
 * Whole calendar months from one YYYY-MM-DD day to a later one (0 when the second is earlier or either is
 * not a date): 2026-08-14 → 2026-11-13 is 2, → 2026-11-14 is 3. A suggestion for the form, never stored
 * on its own: the reviewer confirms or changes it.
 */
export function wholeMonthsBetween(from: string, to: string): number {
  const a = /^(\d{4})-(\d{2})-(\d{2})$/.exec(from);
  const b = /^(\d{4})-(\d{2})-(\d{2})$/.exec(to);
  if (!a || !b) return 0;
  const months = (Number(b[1]) - Number(a[1])) * 12 + (Number(b[2]) - Number(a[2])) - (Number(b[3]) < Number(a[3]) ? 1 : 0);
  return Math.max(0, months);
}
