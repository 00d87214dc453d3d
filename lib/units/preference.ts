import 'server-only';
import { cookies } from 'next/headers';
import { getDb } from '@/db';
import { getUnitPreference } from '@/db/account';
import { getCurrentUser } from '@/lib/auth/guard';
import type { UnitSystem } from './display';

/** Guests keep their choice in this cookie; signed-in users in `users.unit_preference`. */
export const UNITS_COOKIE = 'tb-units';

export function parseUnitSystem(value: string | undefined | null): UnitSystem | null {
  return value === 'metric' || value === 'imperial' ? value : null;
}

/** The units the current viewer reads figures in: their saved preference, else the guest cookie, else metric. */
export async function getUnitSystem(): Promise<UnitSystem> {
  const user = await getCurrentUser();
  if (user) return getUnitPreference(getDb(), user.id);
  return parseUnitSystem((await cookies()).get(UNITS_COOKIE)?.value) ?? 'metric';
}
