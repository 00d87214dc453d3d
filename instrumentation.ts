/** Runs once when the server starts: migrations, demo data in demo mode, and the local mail capture server. */
export async function register() {
  if (process.env.NEXT_RUNTIME !== 'nodejs') return;
  const { startServer } = await import('./lib/startup');
  await startServer();
}
