import { and, count, eq } from 'drizzle-orm';
import type { Db } from './connection';
import { fieldTests, gearItems, reviewRevisions } from './schema';

/** Public figures for the home page: only approved items and tests, only published reviews. */
export function homeFigures(db: Db) {
  const byCategory = db
    .select({ category: gearItems.category, n: count() })
    .from(gearItems)
    .where(eq(gearItems.status, 'approved'))
    .groupBy(gearItems.category)
    .all();
  const tests = db.select({ n: count() }).from(fieldTests).where(and(eq(fieldTests.status, 'approved'))).get()?.n ?? 0;
  const reviews = db.select({ n: count() }).from(reviewRevisions).where(eq(reviewRevisions.state, 'published')).get()?.n ?? 0;
  return { byCategory, tests, reviews };
}
