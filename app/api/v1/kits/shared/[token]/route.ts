import { NextResponse } from 'next/server';
import { getDb } from '@/db';
import { getSharedKit } from '@/db/kits';
import { optionalApiCaller } from '@/lib/auth/api-caller';
import { apiHandler } from '@/lib/http/api';
import { kitResponse, NO_STORE } from '../../view';

export const dynamic = 'force-dynamic';

/** A kit behind a share link, read-only; 404 for a wrong or revoked token. Never cached (`private, no-store`). */
export const GET = apiHandler(async (request: Request, context: { params: Promise<{ token: string }> }) => {
  const { token } = await context.params;
  const user = await optionalApiCaller(request);
  const { kit, catalog } = getSharedKit(getDb(), user, token);
  return NextResponse.json(kitResponse({ kit, catalog }), { headers: NO_STORE });
});
