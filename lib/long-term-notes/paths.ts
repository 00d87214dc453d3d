/** The author's (and editors') page of one long-term note. */
export const logbookNotePath = (id: string) => `/logbook/notes/${encodeURIComponent(id)}`;

/** Where a reviewer writes a new note on an item. */
export const newNotePath = (slug: string) => `/logbook/notes/new?item=${encodeURIComponent(slug)}`;
