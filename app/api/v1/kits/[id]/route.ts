import { NextResponse } from 'next/server';
import { getDb } from '@/db';
import { deleteKit, getOwnKit, updateKit } from '@/db/kits';
import { requireApiCaller } from '@/lib/auth/api-caller';
import { apiHandler, readJson, RECORD_JSON_MAX_BYTES } from '@/lib/http/api';
import { kitResponse, NO_STORE } from '../view';

export const dynamic = 'force-dynamic';

type Context = { params: Promise<{ id: string }> };

/** The caller's own kit with totals and budget; 404 for anyone else's (or no such kit). */
export const GET = apiHandler(async (request: Request, context: Context) => {
  const { id } = await context.params;
  const user = await requireApiCaller(request, { scope: 'read' });
  return NextResponse.json(kitResponse(getOwnKit(getDb(), user, id)), { headers: NO_STORE });
});

/** Change the caller's kit: JSON body of `kitPatchSchema` (at most 256 KB); `entries` replaces the list. 404 before the body is read. */
export const PATCH = apiHandler(async (request: Request, context: Context) => {
  const { id } = await context.params;
  const user = await requireApiCaller(request, { scope: 'write' });
  getOwnKit(getDb(), user, id);
  const body = await readJson(request, { maxBytes: RECORD_JSON_MAX_BYTES });
  updateKit(getDb(), user, id, body);
  return NextResponse.json(kitResponse(getOwnKit(getDb(), user, id)), { headers: NO_STORE });
});

export const DELETE = apiHandler(async (request: Request, context: Context) => {
  const { id } = await context.params;
  const user = await requireApiCaller(request, { scope: 'write' });
  deleteKit(getDb(), user, id);
  return new Response(null, { status: 204 });
});
