import { describe, expect, it } from 'vitest';
import { createTestDb } from '@/db/test-db';
import { seedDemo } from '@/db/seed';
import { seedKitBudgets } from '@/db/seed/kits-budget';
import { getOwnKit } from '@/db/kits';
import { kitBudget } from '@/lib/kits';

describe('seedKitBudgets', () => {
  it('fills the demo kits once and leaves them alone afterwards', async () => {
    const { db } = createTestDb();
    await seedDemo(db);
    expect(seedKitBudgets(db)).toEqual({ kits: 1, entries: 6 });
    expect(seedKitBudgets(db)).toEqual({ kits: 0, entries: 0 });
    const { kit, catalog } = getOwnKit(db, { id: 'demo-user-reviewer' }, 'demo-kit-base-camp');
    const budget = kitBudget(kit, catalog);
    // Invented demo figures (db/seed/kits-budget.ts) through lib/measure powerBudget:
    // loads 2 × 3.8 × 4 = 30.4; radio 82.8 × 6 × 0.1 = 49.68 and 8.28 × 6 × 0.9 = 44.712; phones 6 × 7.5 × 1 = 45
    // → 169.792 Wh; ÷ 0.9 = 188.658 Wh drawn. Solar 60 × 4.5 × 0.5 × 0.86 = 116.1 Wh. Net −72.558 Wh a day.
    // Storage: the Campcore 256 Wh (LiFePO4, 0.8 → 204.8 usable) and the two lanterns, which also serve as
    // power banks (issue 9 multi-role): 2 × 19.24 = 38.48 Wh (Li-ion, 0.8 → 30.784 usable). Capacity 294.48 Wh,
    // floor 294.48 − 235.584 = 58.896 Wh. Day 3: 294.48 − 3 × 72.558 = 76.806 (above the floor);
    // day 4: 294.48 − 4 × 72.558 = 4.248 < 58.896 → the base camp runs short on day 4 of 5.
    expect(budget.result?.dailyLoadWh).toBeCloseTo(169.792, 6);
    expect(budget.result?.dailySolarWh).toBeCloseTo(116.1, 6);
    expect(budget.result?.capacityWh).toBeCloseTo(294.48, 6);
    expect(budget.result?.usableBatteryWh).toBeCloseTo(235.584, 6);
    expect(budget.warnings.find((w) => w.code === 'does-not-close')?.day).toBe(4);
    const hike = getOwnKit(db, { id: 'demo-user-reader' }, 'demo-kit-two-night-hike');
    // Headlamp 2.1 W × 2 h = 4.2 Wh ÷ 0.9 = 4.667 Wh a day from a 37 Wh Li-ion bank (29.6 Wh usable): closes.
    expect(kitBudget(hike.kit, hike.catalog).result?.closes).toBe(true);
  }, 60_000);
});
