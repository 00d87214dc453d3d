import { getDb } from '@/db';
import { requireApiCaller } from '@/lib/auth/api-caller';
import { apiHandler } from '@/lib/http/api';
import { handleNoteTransition } from '@/lib/long-term-notes/handlers';

export const dynamic = 'force-dynamic';

/** Submit, withdraw, send back (request-changes, with a comment) or approve: JSON `{ action, comment? }` (lib/workflow decides). */
export const POST = apiHandler(async (request: Request, context: { params: Promise<{ id: string }> }) =>
  handleNoteTransition(getDb(), await requireApiCaller(request, { scope: 'write' }), (await context.params).id, request),
);
