import 'server-only';
import { openDatabase, type Db } from './connection';

export type { Db } from './connection';

const globalForDb = globalThis as unknown as { trailbenchDb?: Db };

/** The one shared connection of this server process, opened lazily (never at import time: `next build` imports routes). */
export function getDb(): Db {
  if (!globalForDb.trailbenchDb) {
    globalForDb.trailbenchDb = openDatabase(process.env.DATABASE_PATH ?? './data/trailbench.db');
  }
  return globalForDb.trailbenchDb;
}
