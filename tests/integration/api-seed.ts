/**
 * A small catalog for the public read API tests, written through the services (create, submit,
 * approve by another editor; reviews submitted, approved and published). Measured figures are
 * written as an approved field test would write them (one approved test row, measured spec rows
 * linked to it, stored ratios recomputed) without going through a readings log.
 * Invented makers and items only (brief: Northcairn, Glowmere, Voltmoth, Brackenfold, Dunlow Outfitters).
 */
import { randomUUID } from 'node:crypto';
import { eq } from 'drizzle-orm';
import type { Db } from '@/db/connection';
import { approveGear, createGear, recomputeStoredRatios, submitGear } from '@/db/gear';
import { createReviewDraft, transitionReview, updateReviewDraft } from '@/db/reviews';
import { fieldTestItems, fieldTests, gearItems, specs, type Role } from '@/db/schema';
import { createUser } from '@/db/users';

export type SeedUser = { id: string; email: string; name: string; role: Role };

export interface Seeded {
  users: Record<'author' | 'other' | 'editor' | 'admin' | 'reader', SeedUser>;
  /** Slug by short name. */
  slug: Record<string, string>;
  /** Item id by short name. */
  id: Record<string, string>;
  fieldTestId: string;
}

type Specs = Record<string, { value: string }>;
interface ItemSpec {
  short: string;
  category: string;
  name: string;
  maker: string;
  kind?: string;
  price?: { amount: string; currency: string };
  chemistry?: string;
  specs: Specs;
  /** Approve (public) unless false. */
  approve?: boolean;
  owner?: 'author' | 'other';
}

/**
 * The catalog (canonical values in the comments):
 * - lights: ember 250 g 300 lm 40 USD (lm/g 1.2); beacon 300 g 600 lm 60 USD (lm/g 2); pocket 100 g
 *   200 lm 30 EUR (lm/g 2, ties with beacon); trail 200 g claimed / 210 g measured, 400 lm claimed /
 *   380 lm measured, no price (lm/g from measured figures 380/210).
 * - power banks: cell 200 g 37 Wh 25 USD; brick 400 g 74 Wh 50 GBP; stack 300 g 50 Wh 25 USD.
 * - solar panel: sheet 2000 g 100 W, no price.
 * - cable: lead, no mass at all (missing values sort last).
 * - drafts: the author's lamp (draft, 150 g 500 lm) and the other reviewer's hidden lamp.
 */
export const ITEMS: ItemSpec[] = [
  { short: 'ember', category: 'light', name: 'Ember 300', maker: 'Northcairn', kind: 'lantern', price: { amount: '40.00', currency: 'USD' }, specs: { mass: { value: '250 g' }, luminousFlux: { value: '300 lm' } } },
  { short: 'beacon', category: 'light', name: 'Beacon 600', maker: 'Glowmere', kind: 'headlamp', price: { amount: '60.00', currency: 'USD' }, specs: { mass: { value: '300 g' }, luminousFlux: { value: '600 lm' } } },
  { short: 'pocket', category: 'light', name: 'Pocket_100%', maker: 'Voltmoth', kind: 'hand-torch', price: { amount: '30.00', currency: 'EUR' }, specs: { mass: { value: '100 g' }, luminousFlux: { value: '200 lm' } } },
  { short: 'trail', category: 'light', name: 'Trail 400', maker: 'Brackenfold', kind: 'headlamp', specs: { mass: { value: '200 g' }, luminousFlux: { value: '400 lm' }, beamDistance: { value: '0.2 m' } } },
  { short: 'cell', category: 'power-bank', name: 'Cell 10', maker: 'Dunlow Outfitters', kind: 'pocket', chemistry: 'li-ion', price: { amount: '25.00', currency: 'USD' }, specs: { mass: { value: '200 g' }, ratedEnergy: { value: '37 Wh' } } },
  { short: 'brick', category: 'power-bank', name: 'Brick 20', maker: 'Northcairn', kind: 'pocket', chemistry: 'li-ion', price: { amount: '50.00', currency: 'GBP' }, specs: { mass: { value: '400 g' }, ratedEnergy: { value: '74 Wh' } } },
  { short: 'stack', category: 'power-bank', name: 'Stack 13', maker: 'Glowmere', kind: 'pocket', chemistry: 'li-ion', price: { amount: '25.00', currency: 'USD' }, specs: { mass: { value: '300 g' }, ratedEnergy: { value: '50 Wh' } } },
  { short: 'sheet', category: 'solar-panel', name: 'Sheet 100', maker: 'Voltmoth', kind: 'folding', specs: { mass: { value: '2000 g' }, ratedPower: { value: '100 W' } } },
  { short: 'lead', category: 'cable-adapter', name: 'Lead 12', maker: 'Dunlow Outfitters', kind: 'cable', specs: {} },
  { short: 'lamp', category: 'light', name: 'Draft Lamp', maker: 'Northcairn', kind: 'lantern', specs: { mass: { value: '150 g' }, luminousFlux: { value: '500 lm' } }, approve: false },
  { short: 'hidden', category: 'light', name: 'Hidden Lamp', maker: 'Glowmere', kind: 'lantern', specs: { mass: { value: '120 g' }, luminousFlux: { value: '900 lm' } }, approve: false, owner: 'other' },
];

export function seedCatalog(db: Db): Seeded {
  const make = (key: string, role: Role): SeedUser => {
    const u = createUser(db, { email: `${key}@example.org`, name: key, passwordHash: null, role });
    return { id: u.id, email: u.email, name: u.name, role: u.role };
  };
  const users = { author: make('author', 'reviewer'), other: make('other', 'reviewer'), editor: make('editor', 'editor'), admin: make('admin', 'admin'), reader: make('reader', 'reader') };
  const slug: Record<string, string> = {};
  const id: Record<string, string> = {};
  for (const item of ITEMS) {
    const { short, approve = true, owner = 'author', ...input } = item;
    const created = createGear(db, users[owner], input);
    slug[short] = created.slug;
    id[short] = created.id;
    if (approve) {
      submitGear(db, users[owner], created.slug);
      approveGear(db, users.editor, created.slug);
    }
  }

  // Measured figures of the trail light, as an approved field test writes them.
  const fieldTestId = randomUUID();
  const testedAt = new Date('2026-10-03T18:00:00Z');
  db.insert(fieldTests)
    .values({ id: fieldTestId, ownerId: users.author.id, kind: 'light-runtime', testedAt, placeLabel: 'Cedar Hollow Field School', sky: 'clear', ambientC: 12.5, status: 'approved', approvedAt: testedAt })
    .run();
  db.insert(fieldTestItems).values({ fieldTestId, gearItemId: id.trail! }).run();
  for (const [key, value] of [['mass', 210], ['luminousFlux', 380]] as const) {
    db.insert(specs).values({ id: randomUUID(), gearItemId: id.trail!, key, mode: '', basis: 'measured', value, sd: null, n: 3, fieldTestId }).run();
  }
  db.transaction(
    (tx) => {
      const trail = tx.select().from(gearItems).where(eq(gearItems.id, id.trail!)).get()!;
      recomputeStoredRatios(tx, trail);
    },
    { behavior: 'immediate' },
  );

  // A published review of the beacon light.
  const review = createReviewDraft(db, users.author, { title: 'The Beacon on a long night', itemIds: [id.beacon!] });
  updateReviewDraft(db, users.author, review.id, {
    title: 'The Beacon on a long night',
    summary: 'Bright and light.',
    verdict: 'Recommended.',
    body: '## Test\n\nIt ran for five hours.',
    disclosure: 'bought-retail',
    disclosureNote: '',
    correctionNote: '',
    itemIds: [id.beacon!],
  });
  transitionReview(db, users.author, review.id, 'submit');
  transitionReview(db, users.editor, review.id, 'approve');
  transitionReview(db, users.admin, review.id, 'publish');

  return { users, slug, id, fieldTestId };
}
