import { getDb } from '@/db';
import { requireApiCaller } from '@/lib/auth/api-caller';
import { apiHandler } from '@/lib/http/api';
import { handleTransition } from '../../handlers';

export const dynamic = 'force-dynamic';

/** Submit, withdraw, request changes or approve: JSON `{ action, comment? }` (lib/workflow decides). */
export const POST = apiHandler(async (request: Request, context: { params: Promise<{ id: string }> }) =>
  handleTransition(getDb(), await requireApiCaller(request, { scope: 'write' }), (await context.params).id, request),
);
