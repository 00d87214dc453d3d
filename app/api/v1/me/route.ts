import { NextResponse } from 'next/server';
import { optionalApiCaller } from '@/lib/auth/api-caller';
import { callerView } from '@/lib/auth/caller-view';
import { apiHandler } from '@/lib/http/api';
import { AppError } from '@/lib/http/errors';

export const dynamic = 'force-dynamic';

/** Who the request acts as (token or session), with the role and scope in force now; 401 for a guest or a bad token. */
export const GET = apiHandler(async (request: Request) => {
  const caller = await optionalApiCaller(request);
  if (!caller) throw new AppError('unauthenticated', 'Sign in, or send a personal API token as “Authorization: Bearer <token>”.');
  return NextResponse.json(callerView(caller), { headers: { 'Cache-Control': 'private, no-store', Vary: 'Authorization, Cookie' } });
});
