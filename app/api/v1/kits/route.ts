import { NextResponse } from 'next/server';
import { getDb } from '@/db';
import { createKit, getOwnKit, listOwnKits } from '@/db/kits';
import { requireUser } from '@/lib/auth/guard';
import { apiHandler, readJson } from '@/lib/http/api';
import { kitResponse, NO_STORE } from './view';

export const dynamic = 'force-dynamic';

/** The caller's own kits (summaries). 401 without an account. */
export const GET = apiHandler(async () => {
  const user = await requireUser();
  return NextResponse.json({ kits: listOwnKits(getDb(), user) }, { headers: NO_STORE });
});

/** Create a kit: JSON body of `kitInputSchema` (lib/kits/schemas.ts); 201 with the kit, its totals and budget. */
export const POST = apiHandler(async (request: Request) => {
  const user = await requireUser();
  const body = await readJson(request);
  const kit = createKit(getDb(), user, body);
  const path = `/kits/${kit.id}`;
  return NextResponse.json(kitResponse(getOwnKit(getDb(), user, kit.id)), { status: 201, headers: { Location: path, ...NO_STORE } });
});
