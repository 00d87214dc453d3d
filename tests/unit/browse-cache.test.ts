import { describe, expect, it } from 'vitest';
import { cachedJson, etagOf, ifNoneMatchMatches } from '@/lib/http/cache';

describe('If-None-Match', () => {
  // RFC 9110 §13.1.2: If-None-Match uses the weak comparison (W/"x" matches "x"); a list matches when
  // any member matches; "*" matches any current representation.
  it('compares weakly, member by member', () => {
    const tag = '"abc"';
    expect(ifNoneMatchMatches('"abc"', tag)).toBe(true);
    expect(ifNoneMatchMatches('W/"abc"', tag)).toBe(true);
    expect(ifNoneMatchMatches('"x", W/"abc"', tag)).toBe(true);
    expect(ifNoneMatchMatches('"x","y"', tag)).toBe(false);
    expect(ifNoneMatchMatches('*', tag)).toBe(true);
    expect(ifNoneMatchMatches('', tag)).toBe(false);
    expect(ifNoneMatchMatches(null, tag)).toBe(false);
    expect(ifNoneMatchMatches('abc', tag)).toBe(false); // unquoted: not the same opaque tag
  });

  it('gives a strong, quoted tag that changes with the body', () => {
    expect(etagOf('{"a":1}')).toMatch(/^"[A-Za-z0-9_-]{22}"$/);
    expect(etagOf('{"a":1}')).toBe(etagOf('{"a":1}'));
    expect(etagOf('{"a":1}')).not.toBe(etagOf('{"a":2}'));
  });
});

describe('cachedJson', () => {
  const request = (headers: Record<string, string> = {}) => new Request('http://localhost/api/v1/gear', { headers });

  it('answers anonymous reads publicly with an ETag, and 304 without a body on a match', async () => {
    const first = cachedJson(request(), { a: 1 }, false);
    expect(first.status).toBe(200);
    expect(first.headers.get('cache-control')).toBe('public, max-age=60');
    expect(first.headers.get('vary')).toBe('Authorization, Cookie');
    expect(await first.json()).toEqual({ a: 1 });
    const again = cachedJson(request({ 'if-none-match': first.headers.get('etag')! }), { a: 1 }, false);
    expect(again.status).toBe(304);
    expect(await again.text()).toBe('');
  });

  it('answers signed-in reads privately, never from a tag', () => {
    const tag = etagOf(JSON.stringify({ a: 1 }));
    const res = cachedJson(request({ 'if-none-match': tag }), { a: 1 }, true);
    expect(res.status).toBe(200);
    expect(res.headers.get('cache-control')).toBe('private, no-store');
    expect(res.headers.get('etag')).toBeNull();
    expect(res.headers.get('vary')).toBe('Authorization, Cookie');
  });
});
