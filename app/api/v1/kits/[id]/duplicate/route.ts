import { NextResponse } from 'next/server';
import { getDb } from '@/db';
import { duplicateKit } from '@/db/kits';
import { requireApiCaller } from '@/lib/auth/api-caller';
import { apiHandler } from '@/lib/http/api';
import { NO_STORE } from '../../view';

export const dynamic = 'force-dynamic';

/** A private copy of the caller's kit; 201 with its id and page. */
export const POST = apiHandler(async (request: Request, context: { params: Promise<{ id: string }> }) => {
  const { id } = await context.params;
  const user = await requireApiCaller(request, { scope: 'write' });
  const copy = duplicateKit(getDb(), user, id);
  return NextResponse.json({ kit: { id: copy.id, name: copy.name, path: `/kits/${copy.id}` } }, { status: 201, headers: { Location: `/kits/${copy.id}`, ...NO_STORE } });
});
