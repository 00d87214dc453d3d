/**
 * Browse SQL for multi-role gear and feature checklists (used by db/browse.ts): a category filter that
 * includes items also serving as the category, per-category facet counts on the same rule, and
 * `feature.<name>=true` conditions. Conditions are on the item `g` of db/browse.ts.
 */
import { sql, type SQL } from 'drizzle-orm';
import type { Category } from '@/lib/measure';
import { FEATURE_DEFS, type FeatureName } from '@/lib/gear/features';

/** The item's primary category is `category`, or its also-serves list holds it. */
export function servesAsCondition(category: Category): SQL {
  return sql`(g.category = ${category} OR EXISTS (SELECT 1 FROM json_each(g.also_serves_as) j WHERE j.value = ${category}))`;
}

/** The item states it has the feature (the IP rating: it has a water rating). */
export function featureCondition(name: FeatureName): SQL {
  if (FEATURE_DEFS[name].derived === 'water-rating') return sql`g.water_rating IS NOT NULL`;
  return sql`EXISTS (SELECT 1 FROM gear_features f WHERE f.gear_item_id = g.id AND f.name = ${name} AND f.present = 1)`;
}

/** Every condition of a list of feature filters (empty: none). */
export function featureConditions(names: readonly FeatureName[]): SQL[] {
  return names.map(featureCondition);
}

/**
 * Facet rows: for each category, how many items matching `where` serve as it (primary or also-serves),
 * each item counted once per category.
 */
export function categoryFacetQuery(where: SQL): SQL {
  return sql`SELECT category, count(DISTINCT id) AS n FROM (
      SELECT g.id AS id, g.category AS category FROM gear_items g WHERE ${where}
      UNION ALL
      SELECT g.id AS id, j.value AS category FROM gear_items g, json_each(g.also_serves_as) j WHERE ${where}
    ) GROUP BY category`;
}
