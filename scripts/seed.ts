/*
 * `npm run db:seed`: loads the invented Cedar Hollow Field School demo data into DATABASE_PATH
 * (default ./data/trailbench.db), applying migrations first. Demo accounts have documented
 * passwords, so this refuses to run unless demo mode is on (TRAILBENCH_DEMO=1).
 * Safe to run again: it only adds what is missing.
 */
import { openDatabase } from '../db/connection';
import { DEMO_ACCOUNTS, seedDemo } from '../db/seed';
import { finishDemo } from '../db/seed/finish';
import { uploadsDir } from '../lib/photos/config';

async function main(): Promise<number> {
  if (process.env.TRAILBENCH_DEMO !== '1') {
    console.error(
      'Refusing to seed: demo accounts are only created in demo mode.\n' +
        'Run it as `TRAILBENCH_DEMO=1 npm run db:seed`, and start the app with TRAILBENCH_DEMO=1 so the demo accounts can sign in.',
    );
    return 1;
  }
  const file = process.env.DATABASE_PATH ?? './data/trailbench.db';
  const db = openDatabase(file);
  try {
    const { created, inserted } = await seedDemo(db);
    const finished = await finishDemo(db, uploadsDir());
    console.log(`Kit budgets: ${finished.kits} kits set; stored ratios for ${finished.ratios} items; ${finished.photos} demo photos drawn.`);
    if (!created) {
      console.log(`Demo data already present in ${file}; nothing to add.`);
    } else {
      console.log(`Loaded the Cedar Hollow Field School demo data into ${file}:`);
      for (const [table, n] of Object.entries(inserted)) if (n > 0) console.log(`  ${table.padEnd(18)} ${n}`);
      if (inserted.users > 0) {
        console.log('Demo accounts (they sign in only while TRAILBENCH_DEMO=1):');
        for (const a of DEMO_ACCOUNTS) console.log(`  ${a.role.padEnd(9)} ${a.email.padEnd(32)} ${a.password}`);
      }
    }
    return 0;
  } finally {
    db.$client.close();
  }
}

main().then(
  (code) => process.exit(code),
  (error: unknown) => {
    console.error('Seeding failed:', error instanceof Error ? error.message : error);
    process.exit(1);
  },
);
