/**
 * Multi-role gear: an item has a primary category and may also serve as others (a lantern with a USB
 * output also serves as a power bank). The roles of an item are its primary category then its
 * also-serves categories; the specs it records are the union of theirs (so a lantern serving as a bank
 * records a rated energy that counts in kits).
 *
 * Pure: no framework or database imports.
 */
import { z } from 'zod';
import { CATEGORIES, isCategory, type Category, type SpecKey } from '@/lib/measure';
import { CATEGORY_DEFS, type CategorySpec, type CautionKey } from './categories';

/** Categories an item may also serve as ("other" says nothing and is not offered). */
export const SECONDARY_ROLES: readonly Category[] = CATEGORIES.filter((c) => c !== 'other');

export const MAX_ALSO_SERVES = 3;

/** The also-serves field: a list of category ids (checked against the primary category by `checkRoles`). */
export const alsoServesAsField = z
  .array(z.enum(SECONDARY_ROLES as [Category, ...Category[]], { error: `Choose categories from: ${SECONDARY_ROLES.join(', ')}.` }), {
    error: 'Give the other categories as a list of category ids.',
  })
  .max(MAX_ALSO_SERVES, `Choose at most ${MAX_ALSO_SERVES} other categories.`)
  .meta({
    description:
      'Other categories the item also serves as (a lantern with a USB output also serves as a `power-bank`), never its primary one. Their specs may then be claimed (and their required specs must be), and their feature checklists apply.',
  });

/** The also-serves categories of stored data, keeping only known ids other than the primary, without repeats. */
export function cleanAlsoServes(primary: string, stored: unknown): Category[] {
  if (!Array.isArray(stored)) return [];
  const out: Category[] = [];
  for (const c of stored) if (typeof c === 'string' && isCategory(c) && c !== primary && c !== 'other' && !out.includes(c)) out.push(c);
  return out;
}

/** The roles of an item: its primary category first, then what it also serves as. */
export function rolesOf(primary: Category, alsoServesAs: readonly Category[]): Category[] {
  return [primary, ...alsoServesAs.filter((c) => c !== primary)];
}

/** Rules on the also-serves list given the primary category: not the primary itself, no repeats. */
export function checkRoles(
  primary: Category,
  alsoServesAs: readonly Category[],
  ctx: { addIssue: (issue: { code: 'custom'; path: (string | number)[]; message: string }) => void },
): void {
  const seen = new Set<Category>();
  alsoServesAs.forEach((c, i) => {
    if (c === primary) {
      ctx.addIssue({ code: 'custom', path: ['alsoServesAs', i], message: `A ${CATEGORY_DEFS[primary].label.toLowerCase()} is already its primary category; choose another.` });
    } else if (seen.has(c)) {
      ctx.addIssue({ code: 'custom', path: ['alsoServesAs', i], message: `${CATEGORY_DEFS[c].label} is listed twice.` });
    }
    seen.add(c);
  });
}

export interface RoleSpec extends CategorySpec {
  /** The role that brings this spec (the first one that lists it). */
  role: Category;
}

/** The specs of all roles, primary first, each key once (label and example of the first role that has it). */
export function roleSpecs(roles: readonly Category[]): RoleSpec[] {
  const out: RoleSpec[] = [];
  const seen = new Set<SpecKey>();
  for (const role of roles) {
    for (const s of CATEGORY_DEFS[role].specs) {
      if (seen.has(s.key)) continue;
      seen.add(s.key);
      out.push({ ...s, role });
    }
  }
  return out;
}

/** Specs the roles beyond the primary add (what the item page shows under "also serves as"). */
export function extraRoleSpecs(roles: readonly Category[]): RoleSpec[] {
  return roleSpecs(roles).filter((s) => s.role !== roles[0]);
}

/** "a power bank", "a 12 V battery": a category with its article, for sentences. */
export function roleNoun(category: Category): string {
  const label = CATEGORY_DEFS[category].label.toLowerCase().replace('12 v', '12 V');
  return `${/^[aeiou]/.test(label) ? 'an' : 'a'} ${label}`;
}

/** "Also serves as a power bank and a solar panel", or null when the item has one role. */
export function alsoServesText(alsoServesAs: readonly Category[]): string | null {
  if (alsoServesAs.length === 0) return null;
  const nouns = alsoServesAs.map(roleNoun);
  const list = nouns.length === 1 ? nouns[0] : `${nouns.slice(0, -1).join(', ')} and ${nouns.at(-1)}`;
  return `Also serves as ${list}`;
}

/** The safety cautions of every role, primary first, each once. */
export function roleCautions(roles: readonly Category[]): CautionKey[] {
  const out: CautionKey[] = [];
  for (const role of roles) for (const c of CATEGORY_DEFS[role].cautions) if (!out.includes(c)) out.push(c);
  return out;
}

/**
 * A browse card's note on an item listed under another role: "A lantern serving as a power bank" (the
 * kind's or category's label); "Also serves as a power bank" when listed under its own category; null
 * for a single-role item.
 */
export function roleNote(item: { category: Category; kindLabel: string | null; alsoServesAs: readonly Category[] }, listedAs: Category | null): string | null {
  if (item.alsoServesAs.length === 0) return null;
  if (listedAs && listedAs !== item.category && item.alsoServesAs.includes(listedAs)) {
    const own = (item.kindLabel ?? CATEGORY_DEFS[item.category].label).toLowerCase().replace('12 v', '12 V');
    return `${/^[aeiou]/.test(own) ? 'An' : 'A'} ${own} serving as ${roleNoun(listedAs)}`;
  }
  return alsoServesText(item.alsoServesAs);
}
