import { getDb } from '@/db';
import { optionalApiCaller, requireApiCaller } from '@/lib/auth/api-caller';
import { apiHandler } from '@/lib/http/api';
import { handleGetNote, handleUpdateNote } from '@/lib/long-term-notes/handlers';

export const dynamic = 'force-dynamic';

/** One long-term note with its history. */
export const GET = apiHandler(async (request: Request, context: { params: Promise<{ id: string }> }) => {
  const { id } = await context.params;
  return handleGetNote(getDb(), await optionalApiCaller(request), id);
});

/** Change the author's draft (or sent-back) note: the whole `longTermNoteInputSchema` again. */
export const PATCH = apiHandler(async (request: Request, context: { params: Promise<{ id: string }> }) => {
  const { id } = await context.params;
  return handleUpdateNote(getDb(), await requireApiCaller(request, { scope: 'write' }), id, request);
});
