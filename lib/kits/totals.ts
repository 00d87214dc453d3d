/** A kit's totals: mass by category, price per currency (never mixed), light output, stored energy. Pure. */
import { CATEGORIES, type Category } from '@/lib/measure';
import { entryName, pickSpec, resolveEntries, storesEnergy } from './resolve';
import type { KitEntryInput } from './schemas';
import type { KitCatalog, SpecBasis } from './types';

export type MassGroup = Category | 'free-form';

export const MASS_GROUP_LABELS: Readonly<Record<MassGroup, string>> = {
  light: 'Lights',
  'power-bank': 'Power banks',
  'battery-12v': '12 V batteries',
  'solar-panel': 'Solar panels',
  radio: 'Radios',
  'cable-adapter': 'Cables and adapters',
  other: 'Other catalog gear',
  'free-form': 'Your own entries',
};

export interface KitTotals {
  massG: number;
  /** 'mixed' when some masses are measured and some claimed or typed. */
  massBasis: SpecBasis | 'typed' | 'mixed' | null;
  massByGroup: { group: MassGroup; label: string; massG: number }[];
  /** Names of entries whose mass is unknown (not counted). */
  massMissing: string[];
  /** One total per currency, in minor units; currencies are never added together. */
  prices: { currency: string; amountMinor: number }[];
  priceMissing: string[];
  /** Σ highest-mode light output × quantity, lm. */
  lightLm: number;
  /** Σ rated energy × quantity of the batteries and power banks (and items that also serve as one, and free-form ones with a typed energy), Wh. */
  storedWh: number;
  /** Σ rated energy × quantity of the cells inside other devices (lanterns, radios), Wh. */
  deviceCellsWh: number;
  /** Entries shown as "unpublished item": not counted anywhere. */
  hiddenCount: number;
}

export function kitTotals(entries: readonly KitEntryInput[], catalog: KitCatalog): KitTotals {
  const byGroup = new Map<MassGroup, number>();
  const bases = new Set<SpecBasis | 'typed'>();
  const prices = new Map<string, number>();
  const totals: KitTotals = { massG: 0, massBasis: null, massByGroup: [], massMissing: [], prices: [], priceMissing: [], lightLm: 0, storedWh: 0, deviceCellsWh: 0, hiddenCount: 0 };
  const addMass = (group: MassGroup, grams: number, basis: SpecBasis | 'typed') => {
    byGroup.set(group, (byGroup.get(group) ?? 0) + grams);
    totals.massG += grams;
    bases.add(basis);
  };
  const addPrice = (currency: string, minor: number) => prices.set(currency, (prices.get(currency) ?? 0) + minor);

  for (const e of resolveEntries(entries, catalog)) {
    const name = entryName(e);
    if (e.kind === 'hidden') {
      totals.hiddenCount += 1;
      continue;
    }
    if (e.kind === 'free') {
      if (e.entry.freeMassG != null) addMass('free-form', e.entry.freeMassG * e.quantity, 'typed');
      else totals.massMissing.push(name);
      if (e.entry.freePrice) addPrice(e.entry.freePrice.currency, e.entry.freePrice.amountMinor * e.quantity);
      else totals.priceMissing.push(name);
      if (e.entry.freeRole === 'storage' && e.entry.freeEnergyWh != null) totals.storedWh += e.entry.freeEnergyWh * e.quantity;
      continue;
    }
    const { item } = e;
    const mass = pickSpec(item, 'mass');
    if (mass) addMass(item.category, mass.value * e.quantity, mass.basis);
    else totals.massMissing.push(name);
    if (item.priceMinor != null && item.priceCurrency) addPrice(item.priceCurrency, item.priceMinor * e.quantity);
    else totals.priceMissing.push(name);
    const flux = pickSpec(item, 'luminousFlux');
    if (flux) totals.lightLm += flux.value * e.quantity;
    const energy = pickSpec(item, 'ratedEnergy');
    if (energy) {
      if (storesEnergy(item)) totals.storedWh += energy.value * e.quantity;
      else totals.deviceCellsWh += energy.value * e.quantity;
    }
  }
  const groups: MassGroup[] = [...CATEGORIES, 'free-form'];
  totals.massByGroup = groups.filter((g) => byGroup.has(g)).map((g) => ({ group: g, label: MASS_GROUP_LABELS[g], massG: byGroup.get(g) ?? 0 }));
  totals.massBasis = bases.size === 0 ? null : bases.size === 1 ? ([...bases][0] ?? null) : 'mixed';
  totals.prices = [...prices.entries()].sort(([a], [b]) => a.localeCompare(b)).map(([currency, amountMinor]) => ({ currency, amountMinor }));
  return totals;
}
