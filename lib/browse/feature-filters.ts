/**
 * Feature filters of `GET /api/v1/gear`: `feature.<name>=true` keeps items that state they have the
 * feature (the IP rating: items with a water rating). One optional parameter per feature of
 * lib/gear/features.ts, so the OpenAPI document lists them; only `true` is accepted. Pure: no
 * framework imports.
 */
import { z } from 'zod';
import { CATEGORY_FEATURES, FEATURE_DEFS, FEATURE_NAMES, FEATURE_PARAM_PREFIX, isFeatureName, type FeatureName } from '@/lib/gear/features';
import { isCategory } from '@/lib/measure';

export const featureParamShape = Object.fromEntries(
  FEATURE_NAMES.map((name) => [
    `${FEATURE_PARAM_PREFIX}${name}`,
    z
      .literal('true', { message: 'The only value is `true`.' })
      .optional()
      .meta({
        description:
          FEATURE_DEFS[name].derived === 'water-rating'
            ? '`true`: only items with an IEC 60529 water rating.'
            : `\`true\`: only items stated to have “${FEATURE_DEFS[name].label}” (${FEATURE_DEFS[name].hint.replace(/\.$/, '')}).`,
      }),
  ]),
) as Record<string, z.ZodOptional<z.ZodLiteral<'true'>>>;

/** The features a parsed query asks for, in checklist-definition order. */
export function featureFiltersOf(parsed: Record<string, unknown>): FeatureName[] {
  return FEATURE_NAMES.filter((name) => parsed[`${FEATURE_PARAM_PREFIX}${name}`] === 'true');
}

/** The 400 message for an unknown parameter that looks like a feature filter, or null for any other parameter. */
export function unknownFeatureParamMessage(param: string): string | null {
  if (!param.startsWith(FEATURE_PARAM_PREFIX)) return null;
  const name = param.slice(FEATURE_PARAM_PREFIX.length);
  if (isFeatureName(name)) return null;
  return `Is not a feature of any checklist. Known features: ${FEATURE_NAMES.join(', ')}.`;
}

/** URL keys of the feature filters (`feature.red-mode` …), one per feature; the value is `true` or absent. */
export const FEATURE_PARAM_KEYS = FEATURE_NAMES.map((name) => `${FEATURE_PARAM_PREFIX}${name}` as const) as readonly `feature.${FeatureName}`[];

/** The feature filters a category offers (its checklist); none without a category. */
export function offeredFeatures(category: string | null): readonly FeatureName[] {
  return category && isCategory(category) ? CATEGORY_FEATURES[category] : [];
}

/** Feature keys to clear when the category changes: those the new category's checklist lacks. */
export function featureKeysOutside(category: string | null): string[] {
  const keep = new Set(offeredFeatures(category));
  return FEATURE_NAMES.filter((n) => !keep.has(n)).map((n) => `${FEATURE_PARAM_PREFIX}${n}`);
}

