import { getDb } from '@/db';
import { requireApiCaller } from '@/lib/auth/api-caller';
import { apiHandler } from '@/lib/http/api';
import { handleTrialDelete } from '../../../handlers';

export const dynamic = 'force-dynamic';

/** Delete a trial of the author's draft. */
export const DELETE = apiHandler(async (request: Request, context: { params: Promise<{ id: string; trialId: string }> }) => {
  const { id, trialId } = await context.params;
  return handleTrialDelete(getDb(), await requireApiCaller(request, { scope: 'write' }), id, trialId, request);
});
