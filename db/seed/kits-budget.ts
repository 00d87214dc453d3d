/*
 * Power budget settings for the demo kits (db/seed/demo-data.ts DEMO_KITS). Invented demo figures:
 * the peak sun hours and hours of use below are plausible for an autumn camp, not measurements.
 * Idempotent: fills only settings that are still empty, so a kit someone has edited is left alone.
 */
import { and, eq, isNull } from 'drizzle-orm';
import type { Db } from '../connection';
import { kitEntries, kits } from '../schema';

interface EntrySettings {
  loadMode?: string;
  hoursPerDay?: number;
  dutyCycle?: number;
  chemistry?: 'lead-acid' | 'agm' | 'lifepo4' | 'li-ion' | 'nimh';
}

interface KitSettings {
  peakSunHours?: number;
  sky?: 'clear' | 'thin-cloud' | 'broken-cloud' | 'overcast' | 'rain';
  skyShare?: number;
  entries: Record<string, EntrySettings>;
}

export const DEMO_KIT_BUDGETS: Readonly<Record<string, KitSettings>> = {
  'demo-kit-base-camp': {
    // Upper Meadow in late September: 4.5 clear-day peak sun hours (invented), broken cloud expected.
    // Sky share 0.5: the common-practice default for broken cloud (no paired demo test under broken cloud).
    peakSunHours: 4.5,
    sky: 'broken-cloud',
    skyShare: 0.5,
    entries: {
      'demo-kit-base-camp-3': { chemistry: 'lifepo4' },
      'demo-kit-base-camp-4': { loadMode: 'transmit', hoursPerDay: 6, dutyCycle: 0.1 },
      'demo-kit-base-camp-5': { loadMode: 'high', hoursPerDay: 4 },
      'demo-kit-base-camp-7': { hoursPerDay: 1 },
    },
  },
  'demo-kit-two-night-hike': {
    entries: {
      'demo-kit-two-night-hike-1': { loadMode: 'high', hoursPerDay: 2 },
      'demo-kit-two-night-hike-2': { chemistry: 'li-ion' },
    },
  },
};

/** Fills the demo kits' empty budget settings; returns how many kits and entries it changed. Safe to run any number of times. */
export function seedKitBudgets(db: Db): { kits: number; entries: number } {
  const changed = { kits: 0, entries: 0 };
  db.transaction(
    (tx) => {
      for (const [kitId, settings] of Object.entries(DEMO_KIT_BUDGETS)) {
        const kit = tx.select().from(kits).where(eq(kits.id, kitId)).get();
        if (!kit) continue;
        if (settings.peakSunHours !== undefined && kit.peakSunHours === null && kit.sky === null && kit.skyShare === null) {
          tx.update(kits).set({ peakSunHours: settings.peakSunHours, sky: settings.sky ?? null, skyShare: settings.skyShare ?? null }).where(eq(kits.id, kitId)).run();
          changed.kits += 1;
        }
        for (const [entryId, e] of Object.entries(settings.entries)) {
          const result = tx
            .update(kitEntries)
            .set({ loadMode: e.loadMode ?? null, hoursPerDay: e.hoursPerDay ?? null, dutyCycle: e.dutyCycle ?? null, chemistry: e.chemistry ?? null })
            .where(
              and(
                eq(kitEntries.id, entryId),
                eq(kitEntries.kitId, kitId),
                isNull(kitEntries.loadMode),
                isNull(kitEntries.hoursPerDay),
                isNull(kitEntries.dutyCycle),
                isNull(kitEntries.chemistry),
              ),
            )
            .run();
          changed.entries += result.changes;
        }
      }
    },
    { behavior: 'immediate' },
  );
  return changed;
}
