import { z } from 'zod';
import { CATEGORIES } from '@/lib/measure';
import { FEATURE_NAMES } from '@/lib/gear/features';

/** The also-serves list and feature checklist of a gear summary (lib/browse/contract.ts), for the GearSummary schema. */
export const gearRolesAndFeaturesShape = {
  alsoServesAs: z
    .array(z.string())
    .optional()
    .meta({
      description: `Present in every gear answer: other categories the item also serves as (${CATEGORIES.join(', ')}), never its primary one. The item is listed and counted under each of them when browsing by \`category\`.`,
    }),
  features: z
    .array(
      z.object({
        name: z.string().meta({ description: `Feature name (${FEATURE_NAMES.join(', ')}); filter with \`feature.<name>=true\`.` }),
        label: z.string(),
        state: z.enum(['has', 'has-not', 'not-stated']).meta({ description: '`not-stated`: nobody has said either way (never read it as "has not"). `ip-rating` comes from the water rating.' }),
        detail: z.string().nullable().meta({ description: 'A short detail when the item has it: a hanging hook’s material, an antenna connector, a fuse rating, the IP code.' }),
      }),
    )
    .optional()
    .meta({ description: 'Present in every gear answer: the feature checklist of the item’s primary and also-serves categories, in checklist order.' }),
};
