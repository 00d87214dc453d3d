import { hash, verify } from '@node-rs/argon2';

// argon2id (the library's default algorithm) with the OWASP Password Storage Cheat Sheet minimum: m=19 MiB, t=2, p=1.
const OPTIONS = { memoryCost: 19456, timeCost: 2, parallelism: 1 } as const;

export function hashPassword(password: string): Promise<string> {
  return hash(password, OPTIONS);
}

export async function verifyPassword(passwordHash: string, password: string): Promise<boolean> {
  try {
    return await verify(passwordHash, password);
  } catch {
    return false;
  }
}

/** A fixed hash checked when no account matches, so a miss costs as long as a wrong password. */
let dummyHash: Promise<string> | undefined;
export function dummyPasswordCheck(password: string): Promise<boolean> {
  dummyHash ??= hashPassword('trailbench-timing-equaliser');
  return dummyHash.then((h) => verifyPassword(h, password)).then(() => false);
}
