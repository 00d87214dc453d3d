import { mkdtempSync } from 'node:fs';
import { tmpdir } from 'node:os';
import path from 'node:path';
import { openDatabase, type Db } from './connection';

/** A fresh database file with every migration applied, for one integration test file. */
export function createTestDb(): { db: Db; file: string } {
  const dir = mkdtempSync(path.join(tmpdir(), 'trailbench-test-'));
  const file = path.join(dir, 'test.db');
  return { db: openDatabase(file), file };
}
