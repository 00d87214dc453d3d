import { RateLimiterMemory, RateLimiterRes } from 'rate-limiter-flexible';

/**
 * Failed sign-in throttling per account and per client address (ASVS 6.3.1). Thresholds come from the environment
 * so tests can set them; one limiter set per server process, kept on globalThis because Next bundles route
 * handlers and server actions separately.
 */
interface Limiters {
  perAccount: RateLimiterMemory;
  perIp: RateLimiterMemory;
  magicLinkPerAccount: RateLimiterMemory;
}

const WINDOW_S = Number(process.env.SIGNIN_LIMIT_WINDOW_S ?? 15 * 60);

function build(): Limiters {
  return {
    perAccount: new RateLimiterMemory({ keyPrefix: 'acct', points: Number(process.env.SIGNIN_LIMIT_PER_ACCOUNT ?? 5), duration: WINDOW_S }),
    perIp: new RateLimiterMemory({ keyPrefix: 'ip', points: Number(process.env.SIGNIN_LIMIT_PER_IP ?? 30), duration: WINDOW_S }),
    magicLinkPerAccount: new RateLimiterMemory({ keyPrefix: 'ml', points: Number(process.env.MAGIC_LINK_LIMIT_PER_ACCOUNT ?? 5), duration: WINDOW_S }),
  };
}

const store = globalThis as unknown as { trailbenchLimiters?: Limiters };
function limiters(): Limiters {
  return (store.trailbenchLimiters ??= build());
}

export function resetRateLimits(): void {
  store.trailbenchLimiters = build();
}

/** Seconds until the caller may try again, or 0 when not blocked. */
export async function signInBlockedFor(email: string, ip: string): Promise<number> {
  const { perAccount, perIp } = limiters();
  const [account, address] = await Promise.all([perAccount.get(email), perIp.get(ip)]);
  const waits = [account, address]
    .filter((r): r is RateLimiterRes => r !== null && r.remainingPoints <= 0)
    .map((r) => Math.ceil(r.msBeforeNext / 1000));
  return waits.length ? Math.max(...waits) : 0;
}

export async function recordSignInFailure(email: string, ip: string): Promise<void> {
  const { perAccount, perIp } = limiters();
  await Promise.all([perAccount.penalty(email, 1), perIp.penalty(ip, 1)]);
}

export async function clearAccountFailures(email: string): Promise<void> {
  await limiters().perAccount.delete(email);
}

/** Consumes one magic-link request for the address; returns seconds to wait when over the limit. */
export async function magicLinkBlockedFor(email: string): Promise<number> {
  try {
    await limiters().magicLinkPerAccount.consume(email, 1);
    return 0;
  } catch (result) {
    if (result instanceof RateLimiterRes) return Math.ceil(result.msBeforeNext / 1000);
    throw result;
  }
}

/**
 * The client address. Behind a reverse proxy that appends to X-Forwarded-For set TRUST_PROXY=1 and the last hop
 * is used. Without one, `next start` only fills the header when the client sent none, so a client can forge it:
 * the per-account limit still holds whatever address is claimed (see DEVELOPERS.md).
 */
export function clientAddress(headers: Headers): string {
  const forwarded = headers.get('x-forwarded-for');
  if (!forwarded) return 'unknown';
  const hops = forwarded.split(',').map((h) => h.trim()).filter(Boolean);
  if (process.env.TRUST_PROXY === '1') return hops[hops.length - 1] ?? 'unknown';
  return hops[0] ?? 'unknown';
}
