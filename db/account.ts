import { eq } from 'drizzle-orm';
import type { Db } from './connection';
import { users } from './schema';
import type { UnitSystem } from '@/lib/units/display';

/** The signed-in user's display units (metric unless they chose imperial). */
export function getUnitPreference(db: Db, userId: string): UnitSystem {
  return db.select({ unitPreference: users.unitPreference }).from(users).where(eq(users.id, userId)).get()?.unitPreference ?? 'metric';
}

export function setUnitPreference(db: Db, userId: string, system: UnitSystem): void {
  db.update(users).set({ unitPreference: system }).where(eq(users.id, userId)).run();
}
