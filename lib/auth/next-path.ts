/** Only same-site relative paths may be a post-sign-in destination (no open redirects). */
export function safeNextPath(next: unknown): string {
  if (typeof next !== 'string' || !next.startsWith('/') || next.startsWith('//') || next.startsWith('/\\')) return '/';
  if (next.startsWith('/api/') || next.startsWith('/signin') || next.startsWith('/signup')) return '/';
  return next;
}
