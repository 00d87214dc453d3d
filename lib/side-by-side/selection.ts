/**
 * The side-by-side selection: an ordered list of gear slugs (at most six), kept in the URL
 * (`items=a,b,c`) and in localStorage so it follows the reader across pages. Pure list operations.
 */

export const MAX_SIDE_BY_SIDE = 6;

/** Slugs as the catalog makes them: lower-case letters, digits and hyphens. */
const SLUG = /^[a-z0-9](?:[a-z0-9-]{0,118}[a-z0-9])?$/;

export function isSlug(value: string): boolean {
  return SLUG.test(value);
}

/** Reads `a,b,c` (or a stored JSON array) into distinct valid slugs, first six kept. */
export function parseSelection(raw: string | readonly unknown[] | null | undefined): string[] {
  if (raw === null || raw === undefined) return [];
  const parts = typeof raw === 'string' ? raw.split(',') : raw;
  const out: string[] = [];
  for (const part of parts) {
    if (typeof part !== 'string') continue;
    const slug = part.trim();
    if (!isSlug(slug) || out.includes(slug)) continue;
    out.push(slug);
    if (out.length === MAX_SIDE_BY_SIDE) break;
  }
  return out;
}

export function serializeSelection(slugs: readonly string[]): string {
  return slugs.join(',');
}

export type AddResult = { ok: true; slugs: string[] } | { ok: false; reason: 'full' | 'present' | 'invalid'; slugs: string[] };

export function addToSelection(slugs: readonly string[], slug: string): AddResult {
  const current = [...slugs];
  if (!isSlug(slug)) return { ok: false, reason: 'invalid', slugs: current };
  if (current.includes(slug)) return { ok: false, reason: 'present', slugs: current };
  if (current.length >= MAX_SIDE_BY_SIDE) return { ok: false, reason: 'full', slugs: current };
  return { ok: true, slugs: [...current, slug] };
}

export function removeFromSelection(slugs: readonly string[], slug: string): string[] {
  return slugs.filter((s) => s !== slug);
}

/** Moves the item at `index` by `delta` places (−1 left, +1 right); unchanged at the ends. */
export function moveInSelection(slugs: readonly string[], index: number, delta: -1 | 1): string[] {
  const target = index + delta;
  if (index < 0 || index >= slugs.length || target < 0 || target >= slugs.length) return [...slugs];
  const next = [...slugs];
  [next[index], next[target]] = [next[target]!, next[index]!];
  return next;
}

/** The side-by-side page for a selection. */
export function sideBySidePath(slugs: readonly string[]): string {
  return slugs.length === 0 ? '/side-by-side' : `/side-by-side?items=${slugs.map(encodeURIComponent).join(',')}`;
}
