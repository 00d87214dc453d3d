/*
 * Feature checklists, multi-role lanterns and water ratings of the demo gear (db/seed/demo-data.ts).
 * Invented answers, consistent with each item's notes (the Bothy lantern's metal bail and red night mode,
 * the Hearthglow's plastic hook (see its long-term notes), the Fellbeam's red beam, the Campcore's battery management and low-temperature cut-off …).
 *
 * Two lanterns also serve as power banks through their USB-A output (db/seed/ports.ts): the Glowmere
 * Hearthglow 400 (19.24 Wh rated) and the Northcairn Tarn (11.1 Wh rated); their rated energy then
 * counts as stored energy in kits. Serving as a bank needs a stated chemistry: both are lithium-ion.
 *
 * Idempotent: an item gets its answers (and, in the same step, its roles, water rating and chemistry
 * where those are empty) only when it exists, has no answers and never had a feature change logged —
 * so answers an author removed are not brought back; databases seeded before checklists get them.
 */
import { and, eq, like } from 'drizzle-orm';
import type { Db } from '../connection';
import { gearFeatures, gearItems, specChanges } from '../schema';
import type { Category } from '@/lib/measure';
import { featuresField, type FeatureClaim } from '@/lib/gear/features';
import { DEMO_GEAR } from './demo-data';

type Answers = Record<string, boolean | { present: boolean; detail: string }>;
const has = (detail: string) => ({ present: true, detail });

export const DEMO_FEATURES: Readonly<Record<string, Answers>> = {
  // Lights
  'glowmere-hearthglow-400': { 'red-mode': false, 'flashing-modes': true, 'lock-out': true, 'hanging-hook': has('moulded plastic'), magnet: false, 'usb-output': true, 'pass-through-charging': true, 'charge-display': false, 'output-12v': false },
  'northcairn-tarn-collapsible-lantern': { 'red-mode': true, 'flashing-modes': false, 'lock-out': false, 'hanging-hook': has('silicone loop'), magnet: true, 'usb-output': true, 'pass-through-charging': false, 'charge-display': false, 'output-12v': false },
  'dunlow-bothy-aa-lantern': { 'red-mode': true, 'flashing-modes': false, 'lock-out': false, 'hanging-hook': has('steel bail'), magnet: false, 'usb-output': false, 'pass-through-charging': false },
  'northcairn-fellbeam-350': { 'red-mode': true, 'flashing-modes': true, 'lock-out': true, 'hanging-hook': false, magnet: false, 'usb-output': false, 'pass-through-charging': false },
  'glowmere-fernlight-180': { 'red-mode': false, 'flashing-modes': false, 'lock-out': false, 'hanging-hook': false, magnet: false, 'usb-output': false },
  'glowmere-scree-600': { 'red-mode': true, 'flashing-modes': true, 'lock-out': true, 'hanging-hook': false, magnet: false, 'usb-output': true, 'pass-through-charging': true },
  'northcairn-cairnlight-900': { 'red-mode': false, 'flashing-modes': true, 'lock-out': true, 'hanging-hook': false, magnet: true, 'usb-output': true, 'pass-through-charging': false },
  'dunlow-trailwarden-torch': { 'red-mode': false, 'flashing-modes': false, 'lock-out': false, magnet: false, 'usb-output': false },
  // Power banks
  'voltmoth-cellhive-20': { 'pass-through-charging': true, 'charge-display': true, 'output-12v': false, 'wireless-charging': false, 'built-in-light': false },
  'northcairn-pocketcell-10': { 'pass-through-charging': false, 'charge-display': false, 'output-12v': false, 'wireless-charging': false, 'built-in-light': false },
  'voltmoth-cellhive-27-pd': { 'pass-through-charging': true, 'charge-display': true, 'output-12v': false, 'wireless-charging': false, 'built-in-light': false },
  'glowmere-lumenbank-5': { 'pass-through-charging': false, 'charge-display': false, 'output-12v': false, 'wireless-charging': false, 'built-in-light': true },
  // 12 V batteries
  'dunlow-campcore-20-lifepo4': { 'battery-management': true, 'low-temperature-cutoff': true, 'charge-display': true, 'bluetooth-monitoring': false, 'terminal-covers': true },
  'voltmoth-deepwell-50': { 'battery-management': true, 'low-temperature-cutoff': false, 'charge-display': false, 'bluetooth-monitoring': true, 'terminal-covers': true },
  'dunlow-stoneway-35-agm': { 'battery-management': false, 'low-temperature-cutoff': false, 'charge-display': false, 'bluetooth-monitoring': false, 'terminal-covers': false },
  // Solar panels
  'brackenfold-heathray-60': { kickstand: true, 'junction-box-protection': true, 'built-in-controller': false, 'usb-output': true, 'mounting-grommets': true },
  'brackenfold-heathray-28': { kickstand: false, 'junction-box-protection': true, 'built-in-controller': false, 'usb-output': true, 'mounting-grommets': true },
  'brackenfold-heathray-120': { kickstand: true, 'junction-box-protection': true, 'built-in-controller': false, 'usb-output': false, 'mounting-grommets': false },
  // Radios
  'dunlow-ridgecall-h5': { 'dual-watch': true, 'battery-saver': true, 'external-antenna': has('SMA female'), 'gps-receiver': false },
  'northcairn-valecaster-m25': { 'dual-watch': false, 'battery-saver': false, 'external-antenna': has('SO-239'), 'gps-receiver': false },
  'voltmoth-stormlark-r1': { 'dual-watch': false, 'battery-saver': false, 'external-antenna': false, 'gps-receiver': false },
  // Cables and adapters
  'voltmoth-pd-trigger-12v-cable': { 'inline-fuse': false, 'strain-relief': true, 'polarity-marked': true },
  'dunlow-socket-to-usbc-60': { 'inline-fuse': has('8 A'), 'strain-relief': true, 'polarity-marked': false },
  'brackenfold-panel-extension-lead': { 'inline-fuse': false, 'strain-relief': true, 'polarity-marked': true },
  // Other
  'dunlow-coolcrate-25': { 'usb-output': true, 'pass-through-charging': false },
  'glowmere-eddy-tent-fan': { 'usb-output': false, 'pass-through-charging': false },
};

/** Demo items that also serve as other categories (the multi-role lanterns). */
export const DEMO_ALSO_SERVES: Readonly<Record<string, readonly Category[]>> = {
  'glowmere-hearthglow-400': ['power-bank'],
  'northcairn-tarn-collapsible-lantern': ['power-bank'],
};

/** IEC 60529 codes of demo items (the checklists' IP rating reads them). */
export const DEMO_WATER_RATINGS: Readonly<Record<string, string>> = {
  'glowmere-hearthglow-400': 'IPX4',
  'northcairn-tarn-collapsible-lantern': 'IPX4',
  'northcairn-fellbeam-350': 'IPX4',
  'glowmere-scree-600': 'IP67',
  'northcairn-cairnlight-900': 'IPX8',
  'voltmoth-cellhive-20': 'IP65',
  'brackenfold-heathray-60': 'IP65',
  'brackenfold-heathray-28': 'IPX4',
  'dunlow-ridgecall-h5': 'IP54',
};

/** The demo answers of one item as validated claims (the shared schema's parser, so a typo fails loudly). */
export function demoFeatureClaims(slug: string): FeatureClaim[] {
  return featuresField.parse(DEMO_FEATURES[slug] ?? {});
}

type Q = Pick<Db, 'select' | 'insert' | 'update'>;

/** Adds the demo answers (and roles, water ratings, chemistry) to each demo item that exists and never had any. Returns answers inserted. */
export function seedDemoFeatures(tx: Q): number {
  let inserted = 0;
  for (const item of DEMO_GEAR) {
    const claims = demoFeatureClaims(item.slug);
    if (claims.length === 0) continue;
    const row = tx.select().from(gearItems).where(eq(gearItems.id, item.id)).get();
    if (!row) continue;
    const hasAnswers = tx.select({ name: gearFeatures.name }).from(gearFeatures).where(eq(gearFeatures.gearItemId, item.id)).get();
    const touched = tx
      .select({ id: specChanges.id })
      .from(specChanges)
      .where(and(eq(specChanges.gearItemId, item.id), like(specChanges.key, 'Feature: %')))
      .get();
    if (hasAnswers || touched) continue;
    inserted += tx
      .insert(gearFeatures)
      .values(claims.map((c) => ({ gearItemId: item.id, name: c.name, present: c.present, detail: c.present ? (c.detail ?? null) : null })))
      .onConflictDoNothing()
      .run().changes;
    const also = DEMO_ALSO_SERVES[item.slug];
    const water = DEMO_WATER_RATINGS[item.slug];
    const set: Partial<typeof gearItems.$inferInsert> = {};
    if (also && (row.alsoServesAs ?? []).length === 0) {
      set.alsoServesAs = [...also];
      if (!row.chemistry) set.chemistry = 'li-ion';
    }
    if (water && !row.waterRating) set.waterRating = water;
    if (Object.keys(set).length) tx.update(gearItems).set(set).where(eq(gearItems.id, item.id)).run();
  }
  return inserted;
}
