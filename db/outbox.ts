import { desc } from 'drizzle-orm';
import type { Db } from './connection';
import { capturedEmails } from './schema';

export function listCapturedEmails(db: Db, limit = 100) {
  return db.select().from(capturedEmails).orderBy(desc(capturedEmails.id)).limit(limit).all();
}
