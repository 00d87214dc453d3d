import { NextResponse } from 'next/server';
import { getDb } from '@/db';
import { createKit, getOwnKit, listOwnKits } from '@/db/kits';
import { requireApiCaller } from '@/lib/auth/api-caller';
import { apiHandler, readJson, RECORD_JSON_MAX_BYTES } from '@/lib/http/api';
import { kitResponse, NO_STORE } from './view';

export const dynamic = 'force-dynamic';

/** The caller's own kits (summaries). 401 without an account. */
export const GET = apiHandler(async (request: Request) => {
  const user = await requireApiCaller(request, { scope: 'read' });
  return NextResponse.json({ kits: listOwnKits(getDb(), user) }, { headers: NO_STORE });
});

/** Create a kit: JSON body of `kitInputSchema` (lib/kits/schemas.ts), at most 256 KB; 201 with the kit, its totals and budget. */
export const POST = apiHandler(async (request: Request) => {
  const user = await requireApiCaller(request, { scope: 'write' });
  const body = await readJson(request, { maxBytes: RECORD_JSON_MAX_BYTES });
  const kit = createKit(getDb(), user, body);
  const path = `/kits/${kit.id}`;
  return NextResponse.json(kitResponse(getOwnKit(getDb(), user, kit.id)), { status: 201, headers: { Location: path, ...NO_STORE } });
});
