import { NextResponse } from 'next/server';
import { getDb } from '@/db';
import { revokeShare, shareKit } from '@/db/kits';
import { requireApiCaller } from '@/lib/auth/api-caller';
import { apiHandler } from '@/lib/http/api';
import { NO_STORE } from '../../view';

export const dynamic = 'force-dynamic';

type Context = { params: Promise<{ id: string }> };

/** A new share link for the caller's kit (any earlier link stops working). */
export const POST = apiHandler(async (request: Request, context: Context) => {
  const { id } = await context.params;
  const user = await requireApiCaller(request, { scope: 'write' });
  const token = shareKit(getDb(), user, id);
  return NextResponse.json({ token, path: `/kits/shared/${token}` }, { status: 201, headers: NO_STORE });
});

/** Revoke the share link at once. */
export const DELETE = apiHandler(async (request: Request, context: Context) => {
  const { id } = await context.params;
  const user = await requireApiCaller(request, { scope: 'write' });
  revokeShare(getDb(), user, id);
  return new Response(null, { status: 204 });
});
