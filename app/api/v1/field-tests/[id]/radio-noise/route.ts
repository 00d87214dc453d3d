import { getDb } from '@/db';
import { optionalApiCaller, requireApiCaller } from '@/lib/auth/api-caller';
import { apiHandler } from '@/lib/http/api';
import { handleGetRadioNoise, handlePutRadioNoise } from '../../radio-noise-handlers';

export const dynamic = 'force-dynamic';

type Context = { params: Promise<{ id: string }> };

/** A radio-noise check's band readings and radio-quiet summary (404 unless the viewer may see the test). */
export const GET = apiHandler(async (request: Request, context: Context) => handleGetRadioNoise(getDb(), await optionalApiCaller(request), (await context.params).id));

/** Replace the band readings of the author's draft: JSON body of `radioNoiseReadingsInputSchema`. */
export const PUT = apiHandler(async (request: Request, context: Context) => handlePutRadioNoise(getDb(), await requireApiCaller(request, { scope: 'write' }), (await context.params).id, request));
