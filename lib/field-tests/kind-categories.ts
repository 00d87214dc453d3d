import type { Category } from '@/lib/measure';
import { KINDS, type FieldTestKind } from './kinds';

/**
 * Which gear categories a field test of each kind can measure (issue 5): a runtime or output needs a
 * light, energy delivered a bank or 12 V battery, solar output a panel, a charge time something with
 * a battery that charges; a mass check or "other" suits any item. `null` means any category.
 */
export const KIND_CATEGORIES: Record<FieldTestKind, readonly Category[] | null> = {
  'light-runtime': ['light'],
  'light-output': ['light'],
  'energy-delivered': ['power-bank', 'battery-12v'],
  'solar-output': ['solar-panel'],
  'charge-time': ['power-bank', 'battery-12v', 'light'],
  'mass-check': null,
  // Any item with an output port (a lantern's USB out, a car charger, a bank); the port itself is checked per trial.
  'port-output': null,
  // Anything powered that may switch (chargers, converters, controllers, LED drivers); not the receiver itself.
  'radio-noise': ['power-bank', 'battery-12v', 'solar-panel', 'cable-adapter', 'light', 'other'],
  other: null,
};

export function kindFitsCategory(kind: FieldTestKind, category: string): boolean {
  const allowed = KIND_CATEGORIES[kind];
  return allowed === null || (allowed as readonly string[]).includes(category);
}

const CATEGORY_WORDS: Record<Category, string> = {
  light: 'a light',
  'power-bank': 'a power bank',
  'battery-12v': 'a 12 V battery',
  'solar-panel': 'a solar panel',
  radio: 'a radio',
  'cable-adapter': 'a cable or adapter',
  other: 'another kind of item',
};

/** "light, power bank or 12 V battery" style list for messages. */
function orList(words: string[]): string {
  return words.length <= 1 ? (words[0] ?? '') : `${words.slice(0, -1).join(', ')} or ${words.at(-1)}`;
}

/** A message naming the item and the kind when they do not fit, else null. */
export function kindCategoryProblem(kind: FieldTestKind, item: { name: string; maker?: string; category: string }): string | null {
  if (kindFitsCategory(kind, item.category)) return null;
  const allowed = KIND_CATEGORIES[kind] ?? [];
  const name = item.maker ? `${item.maker} ${item.name}` : item.name;
  return `A ${KINDS[kind].label.toLowerCase()} test measures ${orList(allowed.map((c) => CATEGORY_WORDS[c]))}; “${name}” is not one. Choose another item or another kind of test.`;
}
