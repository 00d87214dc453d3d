import { getDb } from '@/db';
import { requireApiCaller } from '@/lib/auth/api-caller';
import { apiHandler } from '@/lib/http/api';
import { handleReadingsUpload } from '../../handlers';

export const dynamic = 'force-dynamic';

/**
 * A trial's readings: multipart/form-data (`file` = logger CSV ≤ READINGS_MAX_BYTES, `item`, `label`, `selection`,
 * `switchOn`, `dropRows`) or application/json typed-in readings. The server re-parses and decides.
 */
export const POST = apiHandler(async (request: Request, context: { params: Promise<{ id: string }> }) =>
  handleReadingsUpload(getDb(), await requireApiCaller(request, { scope: 'write' }), (await context.params).id, request),
);
