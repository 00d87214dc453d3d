/**
 * Opaque keyset cursors: base64url of a small JSON payload (the last item's sort value and slug, and
 * the sort they belong to). Anything that does not decode to the expected shape is a 400 naming
 * `cursor` — never a 500 and never a silently different page.
 */
import { z } from 'zod';
import { AppError } from '@/lib/http/errors';

const invalid = (why: string) =>
  new AppError('bad_request', `Query parameter "cursor": ${why} Start again from the first page.`, {
    fields: { cursor: [why] },
  });

export function encodeCursor(payload: unknown): string {
  return Buffer.from(JSON.stringify(payload), 'utf8').toString('base64url');
}

export function decodeCursor<S extends z.ZodType>(text: string, schema: S): z.output<S> {
  let json: unknown;
  try {
    const raw = Buffer.from(text, 'base64url');
    // Node's decoder skips stray characters: only accept text that round-trips exactly.
    if (raw.toString('base64url') !== text) throw new Error('not canonical base64url');
    json = JSON.parse(raw.toString('utf8'));
  } catch {
    throw invalid('Is not a cursor this API gave out.');
  }
  const result = schema.safeParse(json);
  if (!result.success) throw invalid('Is not a cursor this API gave out.');
  return result.data;
}

/** The cursor of `GET /api/v1/gear`: sort key and order it was made for, last sort value (null: missing) and slug. */
export const gearCursorSchema = z.strictObject({
  k: z.string().max(80).nullable(),
  o: z.enum(['asc', 'desc']),
  v: z.number().finite().nullable(),
  s: z.string().min(1).max(200),
});
export type GearCursor = z.output<typeof gearCursorSchema>;

/** Decodes a gear cursor and checks it belongs to the same sort and order (400 otherwise). */
export function decodeGearCursor(text: string, sort: string | null, order: 'asc' | 'desc'): GearCursor {
  const cursor = decodeCursor(text, gearCursorSchema);
  if (cursor.k !== sort || cursor.o !== order) throw invalid('Belongs to another sort or order.');
  return cursor;
}

/** The cursor of `GET /api/v1/reviews`: last review's update time (ms) and slug. */
export const reviewCursorSchema = z.strictObject({ t: z.number().int().nonnegative(), s: z.string().min(1).max(200) });
