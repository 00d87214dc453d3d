import type { GearSummary } from '@/lib/browse/contract';
import { kindLabel } from '@/lib/gear/categories';
import { cleanAlsoServes, roleNote } from '@/lib/gear/roles';
import { isCategory, type Category } from '@/lib/measure';

/** A browse card's line for multi-role gear: "A lantern serving as a power bank" or "Also serves as a power bank". */
export function RoleNote({ item, listedAs }: { item: Pick<GearSummary, 'category' | 'kind' | 'alsoServesAs'>; listedAs: Category | null }) {
  if (!isCategory(item.category)) return null;
  const text = roleNote({ category: item.category, kindLabel: kindLabel(item.category, item.kind), alsoServesAs: cleanAlsoServes(item.category, item.alsoServesAs ?? []) }, listedAs);
  if (!text) return null;
  return (
    <p className="text-xs font-semibold text-lichen-dark" data-testid="role-note">
      {text}
    </p>
  );
}
