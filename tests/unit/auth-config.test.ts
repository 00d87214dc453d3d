import { afterEach, describe, expect, it, vi } from 'vitest';
import { buildAuthConfig, mayUseAccount } from '@/lib/auth/config';
import { safeNextPath } from '@/lib/auth/next-path';
import { hasRole } from '@/lib/auth/roles';
import { signUpSchema } from '@/lib/auth/schemas';

afterEach(() => vi.unstubAllEnvs());

describe('auth configuration (security-tests SE-01)', () => {
  it('uses JWT sessions and a __Secure- HttpOnly SameSite=Lax Secure cookie when served over HTTPS', () => {
    vi.stubEnv('AUTH_URL', 'https://trailbench.example');
    const config = buildAuthConfig();
    expect(config.session?.strategy).toBe('jwt');
    const cookie = config.cookies?.sessionToken;
    expect(cookie?.name).toBe('__Secure-authjs.session-token');
    expect(cookie?.options).toMatchObject({ httpOnly: true, sameSite: 'lax', secure: true });
  });

  it('keeps the cookie HttpOnly and Lax over plain-HTTP localhost', () => {
    vi.stubEnv('AUTH_URL', 'http://localhost:3000');
    const cookie = buildAuthConfig().cookies?.sessionToken;
    expect(cookie?.options).toMatchObject({ httpOnly: true, sameSite: 'lax', secure: false });
  });

  it('lets demo accounts sign in only in demo mode and never disabled accounts', () => {
    vi.stubEnv('TRAILBENCH_DEMO', '');
    expect(mayUseAccount({ isDemo: true, disabledAt: null })).toBe(false);
    expect(mayUseAccount({ isDemo: false, disabledAt: null })).toBe(true);
    vi.stubEnv('TRAILBENCH_DEMO', '1');
    expect(mayUseAccount({ isDemo: true, disabledAt: null })).toBe(true);
    expect(mayUseAccount({ isDemo: false, disabledAt: new Date() })).toBe(false);
  });
});

describe('roles and redirects', () => {
  it('orders roles reader < reviewer < editor < admin', () => {
    expect(hasRole({ role: 'admin' }, 'editor')).toBe(true);
    expect(hasRole({ role: 'reviewer' }, 'editor')).toBe(false);
    expect(hasRole(null, 'reader')).toBe(false);
  });

  it('allows only same-site paths after sign-in', () => {
    expect(safeNextPath('/logbook')).toBe('/logbook');
    expect(safeNextPath('//evil.example')).toBe('/');
    expect(safeNextPath('https://evil.example')).toBe('/');
    expect(safeNextPath('/\\evil.example')).toBe('/');
    expect(safeNextPath(undefined)).toBe('/');
  });
});

describe('sign-up schema (ASVS 5.0 6.2.1, 6.2.9)', () => {
  it('needs 8+ characters, allows 64+, and refuses extra keys such as a role', () => {
    expect(signUpSchema.safeParse({ name: 'A', email: 'a@example.org', password: 'short' }).success).toBe(false);
    expect(signUpSchema.safeParse({ name: 'A', email: 'a@example.org', password: 'x'.repeat(64) }).success).toBe(true);
    expect(signUpSchema.safeParse({ name: 'A', email: 'not-an-email', password: 'long enough' }).success).toBe(false);
    expect(signUpSchema.safeParse({ name: 'A', email: 'a@example.org', password: 'long enough', role: 'admin' }).success).toBe(false);
  });
});
