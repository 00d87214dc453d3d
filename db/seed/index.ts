/*
 * Loads the invented demo scenario (./demo-data.ts) into a database, idempotently.
 *
 * Every demo row has a stable id (and slug or e-mail); the seed inserts only what is missing
 * (INSERT … ON CONFLICT DO NOTHING, after checking which accounts exist), so running it again
 * changes nothing. State events, which have no natural key, are written only together with a
 * revision inserted in the same run. Everything is written in one synchronous better-sqlite3
 * transaction; passwords are hashed before it starts.
 *
 * Callers decide whether demo mode is on (TRAILBENCH_DEMO=1): this module creates accounts with
 * documented passwords whenever it is called.
 */
import { inArray, sql } from 'drizzle-orm';
import type { SQLiteTable } from 'drizzle-orm/sqlite-core';
import { hashPassword } from '../../lib/auth/password';
import type { Db } from '../connection';
import {
  fieldTestItems,
  fieldTests,
  gearItems,
  kitEntries,
  kits,
  readings,
  reviewItems,
  reviewRevisions,
  reviews,
  reviewStateEvents,
  specs,
  trials,
  users,
} from '../schema';
import { DEMO_ACCOUNTS, DEMO_FIELD_TESTS, DEMO_GEAR, DEMO_KITS, DEMO_MEASURED_SPECS, DEMO_REVIEWS, type DemoUserKey } from './demo-data';

export { DEMO_ACCOUNTS, DEMO_EMAIL_DOMAIN, DEMO_MAKERS, DEMO_PLACES, demoAccount, type DemoAccount } from './demo-data';

/** Rows inserted by one run of `seedDemo`, per table. */
export interface SeedCounts {
  users: number;
  gearItems: number;
  specs: number;
  fieldTests: number;
  fieldTestItems: number;
  trials: number;
  readings: number;
  reviews: number;
  reviewItems: number;
  reviewRevisions: number;
  reviewStateEvents: number;
  kits: number;
  kitEntries: number;
}

export interface SeedResult {
  /** True when this run inserted anything; false when the demo data was already complete. */
  created: boolean;
  inserted: SeedCounts;
}

/** True when the database holds no accounts and no catalog content (a fresh install). */
export function isDatabaseEmpty(db: Db): boolean {
  const row = db.get<{ n: number }>(
    sql`select (select count(*) from ${users}) + (select count(*) from ${gearItems}) + (select count(*) from ${fieldTests}) + (select count(*) from ${reviews}) + (select count(*) from ${kits}) as n`,
  );
  return row.n === 0;
}

const READINGS_CHUNK = 500;

function specId(itemId: string, key: string, mode: string, basis: 'claimed' | 'measured'): string {
  return `${itemId}-${basis}-${key}${mode ? `-${mode}` : ''}`;
}

/** Loads the demo scenario: accounts (marked `isDemo`), gear, field tests, reviews and kits. */
export async function seedDemo(db: Db): Promise<SeedResult> {
  const emails = DEMO_ACCOUNTS.map((a) => a.email);
  const existing = new Set(
    db
      .select({ email: users.email })
      .from(users)
      .where(inArray(users.email, emails))
      .all()
      .map((r) => r.email),
  );
  const missing = DEMO_ACCOUNTS.filter((a) => !existing.has(a.email));
  const hashes = new Map(await Promise.all(missing.map(async (a) => [a.email, await hashPassword(a.password)] as const)));

  const inserted: SeedCounts = {
    users: 0,
    gearItems: 0,
    specs: 0,
    fieldTests: 0,
    fieldTestItems: 0,
    trials: 0,
    readings: 0,
    reviews: 0,
    reviewItems: 0,
    reviewRevisions: 0,
    reviewStateEvents: 0,
    kits: 0,
    kitEntries: 0,
  };

  db.transaction((tx) => {
    /** Inserts rows that are not there yet; returns how many were new. */
    const insertNew = <T extends SQLiteTable>(table: T, rows: T['$inferInsert'][]): number => {
      if (rows.length === 0) return 0;
      return tx.insert(table).values(rows).onConflictDoNothing().run().changes;
    };

    // Accounts: keyed by e-mail. An account that already exists keeps its id, password and role.
    for (const account of DEMO_ACCOUNTS) {
      const passwordHash = hashes.get(account.email);
      if (passwordHash === undefined) continue;
      inserted.users += insertNew(users, [
        {
          id: account.id,
          email: account.email,
          name: account.name,
          passwordHash,
          role: account.role,
          isDemo: true,
          unitPreference: account.unitPreference,
          emailVerifiedAt: new Date(Date.UTC(2026, 7, 1, 9)),
          createdAt: new Date(Date.UTC(2026, 7, 1, 9)),
        },
      ]);
    }
    const idByEmail = new Map(
      tx
        .select({ id: users.id, email: users.email })
        .from(users)
        .where(inArray(users.email, emails))
        .all()
        .map((r) => [r.email, r.id]),
    );
    const userIds = new Map<DemoUserKey, string>();
    for (const account of DEMO_ACCOUNTS) {
      const id = idByEmail.get(account.email);
      if (id) userIds.set(account.key, id);
    }
    const userId = (key: DemoUserKey): string => {
      const id = userIds.get(key);
      if (!id) throw new Error(`Demo account ${key} is missing`);
      return id;
    };

    // Gear items and their claimed specs. A slug taken by someone else's item leaves that demo item out.
    for (const item of DEMO_GEAR) {
      inserted.gearItems += insertNew(gearItems, [
        {
          id: item.id,
          slug: item.slug,
          ownerId: userId(item.owner),
          name: item.name,
          maker: item.maker,
          category: item.category,
          kind: item.kind,
          modelYear: item.modelYear,
          priceMinor: item.priceMinor,
          priceCurrency: item.priceCurrency,
          pricePaidOn: item.pricePaidOn,
          notes: item.notes,
          status: item.status,
          approvedAt: item.approvedAt,
          createdAt: item.createdAt,
          updatedAt: item.approvedAt ?? item.createdAt,
        },
      ]);
    }
    const demoItemIds = DEMO_GEAR.map((g) => g.id);
    const presentItems = new Set(
      tx
        .select({ id: gearItems.id })
        .from(gearItems)
        .where(inArray(gearItems.id, demoItemIds))
        .all()
        .map((r) => r.id),
    );
    const itemIdBySlug = new Map(DEMO_GEAR.filter((g) => presentItems.has(g.id)).map((g) => [g.slug, g.id]));
    const itemId = (slug: string) => itemIdBySlug.get(slug);

    for (const item of DEMO_GEAR) {
      if (!presentItems.has(item.id)) continue;
      inserted.specs += insertNew(
        specs,
        item.claims.map((claim) => ({
          id: specId(item.id, claim.key, claim.mode, 'claimed'),
          gearItemId: item.id,
          key: claim.key,
          mode: claim.mode,
          basis: 'claimed' as const,
          value: claim.value,
          claimSource: claim.source ?? item.claimSource,
          updatedAt: item.createdAt,
        })),
      );
    }

    // Field tests, the items they cover, trials and readings.
    for (const test of DEMO_FIELD_TESTS) {
      inserted.fieldTests += insertNew(fieldTests, [
        {
          id: test.id,
          ownerId: userId(test.owner),
          kind: test.kind,
          testedAt: test.testedAt,
          placeLabel: test.placeLabel,
          sky: test.sky,
          ambientC: test.ambientC,
          instruments: test.instruments,
          methodNotes: test.methodNotes,
          status: test.status,
          approvedAt: test.approvedAt,
          createdAt: test.testedAt,
        },
      ]);
      const covered = test.items.map(itemId).filter((id): id is string => id !== undefined);
      inserted.fieldTestItems += insertNew(
        fieldTestItems,
        covered.map((gearItemId) => ({ fieldTestId: test.id, gearItemId })),
      );
      for (const t of test.trials) {
        const gearItemId = itemId(t.item);
        if (!gearItemId) continue;
        inserted.trials += insertNew(trials, [
          {
            id: t.id,
            fieldTestId: test.id,
            gearItemId,
            label: t.label,
            switchedOnAt: t.switchedOnAt,
            typedValues: t.typedValues,
            createdAt: test.testedAt,
          },
        ]);
        for (let start = 0; start < t.readings.length; start += READINGS_CHUNK) {
          inserted.readings += insertNew(
            readings,
            t.readings.slice(start, start + READINGS_CHUNK).map((r, i) => ({
              trialId: t.id,
              seq: start + i,
              t: r.t,
              value: r.value ?? null,
              watts: r.watts ?? null,
              volts: r.volts ?? null,
              amps: r.amps ?? null,
            })),
          );
        }
      }
    }

    // Measured specs, each linked to the approved field test that produced it.
    for (const spec of DEMO_MEASURED_SPECS) {
      const gearItemId = itemId(spec.item);
      if (!gearItemId) continue;
      const test = DEMO_FIELD_TESTS.find((t) => t.id === spec.fieldTestId);
      inserted.specs += insertNew(specs, [
        {
          id: specId(gearItemId, spec.key, spec.mode, 'measured'),
          gearItemId,
          key: spec.key,
          mode: spec.mode,
          basis: 'measured',
          value: spec.value,
          sd: spec.sd,
          n: spec.n,
          fieldTestId: spec.fieldTestId,
          updatedAt: test?.approvedAt ?? test?.testedAt,
        },
      ]);
    }

    // Reviews, their items, revisions and each revision's state events.
    for (const review of DEMO_REVIEWS) {
      inserted.reviews += insertNew(reviews, [{ id: review.id, slug: review.slug, authorId: userId(review.author), createdAt: review.createdAt }]);
      const present = tx.select({ id: reviews.id }).from(reviews).where(inArray(reviews.id, [review.id])).get();
      if (!present) continue; // the slug belongs to someone else's review
      inserted.reviewItems += insertNew(
        reviewItems,
        review.items
          .map(itemId)
          .filter((id): id is string => id !== undefined)
          .map((gearItemId) => ({ reviewId: review.id, gearItemId })),
      );
      for (const rev of review.revisions) {
        const added = insertNew(reviewRevisions, [
          {
            id: rev.id,
            reviewId: review.id,
            number: rev.number,
            title: rev.title,
            summary: rev.summary,
            verdict: rev.verdict,
            body: rev.body,
            disclosure: rev.disclosure,
            disclosureNote: rev.disclosureNote,
            correctionNote: rev.correctionNote,
            state: rev.state,
            publishedAt: rev.publishedAt,
            createdAt: rev.createdAt,
            updatedAt: rev.updatedAt,
          },
        ]);
        inserted.reviewRevisions += added;
        if (added === 0) continue;
        inserted.reviewStateEvents += insertNew(
          reviewStateEvents,
          rev.events.map((e) => ({
            revisionId: rev.id,
            fromState: e.from,
            toState: e.to,
            actorId: userId(e.actor),
            comment: e.comment,
            createdAt: e.at,
          })),
        );
      }
    }

    // Kits.
    for (const kit of DEMO_KITS) {
      inserted.kits += insertNew(kits, [
        {
          id: kit.id,
          ownerId: userId(kit.owner),
          name: kit.name,
          purpose: kit.purpose,
          tripDays: kit.tripDays,
          createdAt: kit.createdAt,
          updatedAt: kit.createdAt,
        },
      ]);
      inserted.kitEntries += insertNew(
        kitEntries,
        kit.entries
          .filter((e) => e.item === null || itemId(e.item) !== undefined)
          .map((e, position) => ({
            id: e.id,
            kitId: kit.id,
            gearItemId: e.item === null ? null : (itemId(e.item) ?? null),
            quantity: e.quantity,
            freeName: e.freeName ?? null,
            freeMassG: e.freeMassG ?? null,
            freePriceMinor: e.freePriceMinor ?? null,
            freePriceCurrency: e.freePriceCurrency ?? null,
            freeDrawW: e.freeDrawW ?? null,
            position,
          })),
      );
    }
  });

  const created = Object.values(inserted).some((n) => n > 0);
  return { created, inserted };
}
