import { getDb } from '@/db';
import { optionalApiCaller, requireApiCaller } from '@/lib/auth/api-caller';
import { apiHandler } from '@/lib/http/api';
import { handleCreateNote, handleListNotes } from '@/lib/long-term-notes/handlers';

export const dynamic = 'force-dynamic';

/** The item's approved long-term notes, oldest first; the caller's own notes in any state too. */
export const GET = apiHandler(async (request: Request, context: { params: Promise<{ slug: string }> }) => {
  const { slug } = await context.params;
  return handleListNotes(getDb(), await optionalApiCaller(request), slug, request);
});

/** Add a draft long-term note: JSON `longTermNoteInputSchema` (lib/long-term-notes/schemas.ts); owners and testers of the item. */
export const POST = apiHandler(async (request: Request, context: { params: Promise<{ slug: string }> }) => {
  const { slug } = await context.params;
  return handleCreateNote(getDb(), await requireApiCaller(request, { scope: 'write' }), slug, request);
});
