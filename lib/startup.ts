import { getDb } from '@/db';
import { useCaptureServer } from '@/lib/mail';
import { startCaptureServer } from '@/lib/mail/capture-server';

const store = globalThis as unknown as { trailbenchStarted?: Promise<void> };

export function startServer(): Promise<void> {
  store.trailbenchStarted ??= (async () => {
    const began = Date.now();
    const db = getDb(); // opening applies pending migrations
    const sqliteVersion = db.$client.prepare('select sqlite_version() as v').get() as { v: string };
    if (process.env.TRAILBENCH_DEMO === '1') {
      const { seedDemo, isDatabaseEmpty } = await import('@/db/seed');
      if (isDatabaseEmpty(db)) {
        await seedDemo(db);
        console.log('[trailbench] demo data loaded into the empty database');
      }
      const { finishDemo } = await import('@/db/seed/finish');
      await finishDemo(db, (await import('@/lib/photos/config')).uploadsDir());
    }
    if (!process.env.SMTP_URL) {
      const capture = await startCaptureServer(db, Number(process.env.CAPTURE_SMTP_PORT ?? 0));
      process.env.CAPTURE_SMTP_PORT = String(capture.port);
      useCaptureServer(capture.port);
      console.log(`[trailbench] no SMTP_URL: capturing outgoing mail on 127.0.0.1:${capture.port} (admin outbox)`);
    }
    console.log(`[trailbench] ready in ${Date.now() - began} ms (SQLite ${sqliteVersion.v}, demo mode ${process.env.TRAILBENCH_DEMO === '1' ? 'on' : 'off'})`);
  })();
  return store.trailbenchStarted;
}
