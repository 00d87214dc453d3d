// One command for a newcomer: build (when needed) and start Trailbench on http://localhost:3000 in demo mode.
// The server applies migrations on start and seeds the demo data into an empty database.
import { spawnSync, spawn } from 'node:child_process';
import { existsSync } from 'node:fs';

const env = {
  ...process.env,
  TRAILBENCH_DEMO: process.env.TRAILBENCH_DEMO ?? '1',
  AUTH_URL: process.env.AUTH_URL ?? 'http://localhost:3000',
  AUTH_TRUST_HOST: process.env.AUTH_TRUST_HOST ?? 'true',
  AUTH_SECRET: process.env.AUTH_SECRET ?? 'demo-mode-secret-change-me-for-any-real-deployment',
};

if (!existsSync('.next/BUILD_ID') || process.argv.includes('--rebuild')) {
  console.log('Building Trailbench (about a minute on first run) …');
  const build = spawnSync('npx', ['next', 'build'], { stdio: 'inherit', env });
  if (build.status !== 0) process.exit(build.status ?? 1);
}

console.log('Starting Trailbench on http://localhost:3000 (demo mode) …');
const server = spawn('npx', ['next', 'start', '--hostname', 'localhost', '--port', '3000'], { stdio: 'inherit', env });
for (const signal of ['SIGINT', 'SIGTERM']) process.on(signal, () => server.kill(signal));
server.on('exit', (code) => process.exit(code ?? 0));
