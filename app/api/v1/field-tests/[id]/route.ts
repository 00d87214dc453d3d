import { getDb } from '@/db';
import { optionalApiCaller, requireApiCaller } from '@/lib/auth/api-caller';
import { apiHandler } from '@/lib/http/api';
import { handleGetFieldTest, handleUpdateFieldTest } from '../handlers';

export const dynamic = 'force-dynamic';

type Context = { params: Promise<{ id: string }> };

/** The record, its trials and results (404 unless the viewer may see it). */
export const GET = apiHandler(async (request: Request, context: Context) => handleGetFieldTest(getDb(), await optionalApiCaller(request), (await context.params).id));

/** Update the author's draft: JSON body of `fieldTestInputSchema`. */
export const PATCH = apiHandler(async (request: Request, context: Context) => handleUpdateFieldTest(getDb(), await requireApiCaller(request, { scope: 'write' }), (await context.params).id, request));
