import { NextResponse, type NextRequest } from 'next/server';

/**
 * Optimistic only: sends visitors without any session cookie to sign-in before rendering guarded areas.
 * Every page, action and route handler checks access itself (lib/auth/guard.ts); this saves a render, nothing more.
 */
const GUARDED = ['/logbook', '/desk', '/admin'];

export function proxy(request: NextRequest) {
  const { pathname, search } = request.nextUrl;
  const hasSessionCookie = request.cookies.getAll().some((c) => c.name.endsWith('authjs.session-token'));
  if (!hasSessionCookie && GUARDED.some((p) => pathname === p || pathname.startsWith(`${p}/`))) {
    const url = request.nextUrl.clone();
    url.pathname = '/signin';
    url.search = `?next=${encodeURIComponent(pathname + search)}`;
    return NextResponse.redirect(url);
  }
  const response = NextResponse.next();
  response.headers.delete('x-middleware-subrequest');
  return response;
}

export const config = {
  matcher: ['/logbook/:path*', '/desk/:path*', '/admin/:path*'],
};
