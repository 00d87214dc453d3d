import { NextResponse } from 'next/server';
import { resetRateLimits } from '@/lib/auth/rate-limit';
import { errorBody } from '@/lib/http/errors';

/** Test hook: exists only when TRAILBENCH_TEST_HOOKS=1 (the e2e server sets it); 404 otherwise. */
export function POST() {
  if (process.env.TRAILBENCH_TEST_HOOKS !== '1') {
    return NextResponse.json(errorBody('not_found', 'Not found.'), { status: 404 });
  }
  resetRateLimits();
  return new NextResponse(null, { status: 204 });
}
