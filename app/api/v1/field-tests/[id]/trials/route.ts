import { getDb } from '@/db';
import { requireApiCaller } from '@/lib/auth/api-caller';
import { apiHandler } from '@/lib/http/api';
import { handleTypedTrial } from '../../handlers';

export const dynamic = 'force-dynamic';

/** Add a trial of typed values (JSON body of `typedTrialSchema`), e.g. a scale reading. */
export const POST = apiHandler(async (request: Request, context: { params: Promise<{ id: string }> }) =>
  handleTypedTrial(getDb(), await requireApiCaller(request, { scope: 'write' }), (await context.params).id, request),
);
