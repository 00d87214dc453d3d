import { getDb } from '@/db';
import { requireApiCaller } from '@/lib/auth/api-caller';
import { apiHandler } from '@/lib/http/api';
import { handleCreateFieldTest } from './handlers';

export const dynamic = 'force-dynamic';

/** Create a draft field test: JSON body of `fieldTestInputSchema` (lib/field-tests/schemas.ts); 201 with its id and pages. */
export const POST = apiHandler(async (request: Request) => handleCreateFieldTest(getDb(), await requireApiCaller(request, { scope: 'write' }), request));
