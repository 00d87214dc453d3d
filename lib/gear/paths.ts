/** The public page of a gear item. */
export function gearPath(slug: string): string {
  return `/gear/${encodeURIComponent(slug)}`;
}

/** The logbook edit form of a gear item. */
export function gearEditPath(slug: string): string {
  return `/logbook/gear/${encodeURIComponent(slug)}/edit`;
}
