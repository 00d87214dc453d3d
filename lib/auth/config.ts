import type { NextAuthConfig } from 'next-auth';
import { CredentialsSignin } from 'next-auth';
import Credentials from 'next-auth/providers/credentials';
import { getDb } from '@/db';
import { consumeMagicLinkToken } from '@/db/magic-links';
import { bumpSessionVersion, findUserByEmail, findUserById, logAuthEvent } from '@/db/users';
import type { Role, User } from '@/db/schema';
import { dummyPasswordCheck, verifyPassword } from './password';
import { clearAccountFailures, clientAddress, recordSignInFailure, signInBlockedFor } from './rate-limit';
import { signInSchema } from './schemas';

export class RateLimitedSignIn extends CredentialsSignin {
  code = 'rate_limited';
}
export class ExpiredLink extends CredentialsSignin {
  code = 'link_expired';
}

export const isDemoMode = () => process.env.TRAILBENCH_DEMO === '1';

/** Disabled accounts never sign in; demo accounts only while the app runs in demo mode. */
export function mayUseAccount(user: Pick<User, 'disabledAt' | 'isDemo'>): boolean {
  if (user.disabledAt) return false;
  if (user.isDemo && !isDemoMode()) return false;
  return true;
}

function sessionUser(user: User) {
  return { id: user.id, email: user.email, name: user.name, role: user.role, sessionVersion: user.sessionVersion };
}

export function buildAuthConfig(): NextAuthConfig {
  const secureCookies = (process.env.AUTH_URL ?? '').startsWith('https://');
  return {
    secret: process.env.AUTH_SECRET,
    trustHost: process.env.AUTH_TRUST_HOST === 'true' || process.env.NODE_ENV !== 'production',
    session: { strategy: 'jwt', maxAge: 7 * 24 * 60 * 60, updateAge: 60 * 60 },
    useSecureCookies: secureCookies,
    cookies: {
      sessionToken: {
        name: `${secureCookies ? '__Secure-' : ''}authjs.session-token`,
        options: { httpOnly: true, sameSite: 'lax', path: '/', secure: secureCookies },
      },
    },
    pages: { signIn: '/signin', error: '/signin' },
    providers: [
      Credentials({
        id: 'password',
        name: 'E-mail and password',
        credentials: { email: {}, password: {} },
        async authorize(raw, request) {
          const parsed = signInSchema.safeParse(raw);
          if (!parsed.success) return null;
          const { email, password } = parsed.data;
          const ip = clientAddress(request.headers);
          const db = getDb();
          const wait = await signInBlockedFor(email, ip);
          if (wait > 0) {
            logAuthEvent(db, { kind: 'sign-in-rate-limited', email, detail: `ip ${ip}` });
            throw new RateLimitedSignIn();
          }
          const user = findUserByEmail(db, email);
          const ok = user?.passwordHash ? await verifyPassword(user.passwordHash, password) : await dummyPasswordCheck(password);
          if (!user || !ok || !mayUseAccount(user)) {
            await recordSignInFailure(email, ip);
            logAuthEvent(db, { kind: 'sign-in-failed', email, userId: user?.id ?? null, detail: `ip ${ip}` });
            return null;
          }
          await clearAccountFailures(email);
          logAuthEvent(db, { kind: 'sign-in', email, userId: user.id, detail: 'password' });
          return sessionUser(user);
        },
      }),
      Credentials({
        id: 'magic-link',
        name: 'E-mail link',
        credentials: { token: {} },
        async authorize(raw) {
          const token = typeof raw.token === 'string' ? raw.token : '';
          if (!/^[A-Za-z0-9_-]{20,100}$/.test(token)) throw new ExpiredLink();
          const db = getDb();
          const user = consumeMagicLinkToken(db, token);
          if (!user || !mayUseAccount(user)) throw new ExpiredLink();
          logAuthEvent(db, { kind: 'sign-in', email: user.email, userId: user.id, detail: 'magic link' });
          return sessionUser(user);
        },
      }),
    ],
    callbacks: {
      async jwt({ token, user }) {
        if (user) {
          const u = user as ReturnType<typeof sessionUser>;
          token.uid = u.id;
          token.sv = u.sessionVersion;
        }
        if (typeof token.uid !== 'string') return null;
        // Re-checked on every request: sign-out, a role change or disabling ends sessions at once (ASVS 7.4.1).
        const current = findUserById(getDb(), token.uid);
        if (!current || !mayUseAccount(current) || current.sessionVersion !== token.sv) return null;
        token.role = current.role;
        token.name = current.name;
        token.email = current.email;
        return token;
      },
      async session({ session, token }) {
        session.user = {
          ...session.user,
          id: token.uid as string,
          role: token.role as Role,
          name: token.name ?? '',
          email: token.email ?? '',
        };
        return session;
      },
    },
    events: {
      async signOut(message) {
        const token = 'token' in message ? message.token : null;
        if (token && typeof token.uid === 'string') {
          bumpSessionVersion(getDb(), token.uid);
          logAuthEvent(getDb(), { kind: 'sign-out', userId: token.uid });
        }
      },
    },
  };
}
