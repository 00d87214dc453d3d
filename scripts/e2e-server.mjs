// Starts the production build for the e2e run on a fresh temporary database in demo mode.
import { spawn } from 'node:child_process';
import { mkdtempSync } from 'node:fs';
import { tmpdir } from 'node:os';
import path from 'node:path';

const port = process.env.E2E_PORT ?? '3100';
const dir = mkdtempSync(path.join(tmpdir(), 'trailbench-e2e-'));
const env = {
  ...process.env,
  DATABASE_PATH: path.join(dir, 'e2e.db'),
  UPLOADS_DIR: path.join(dir, 'uploads'),
  TRAILBENCH_DEMO: '1',
  AUTH_SECRET: process.env.AUTH_SECRET ?? 'e2e-only-secret-not-for-production-0123456789',
  AUTH_URL: `http://localhost:${port}`,
  AUTH_TRUST_HOST: 'true',
  SIGNIN_LIMIT_PER_ACCOUNT: process.env.SIGNIN_LIMIT_PER_ACCOUNT ?? '5',
  SIGNIN_LIMIT_PER_IP: process.env.SIGNIN_LIMIT_PER_IP ?? '50',
  TRAILBENCH_TEST_HOOKS: '1',
  NODE_ENV: 'production',
};
const child = spawn('npx', ['next', 'start', '--hostname', 'localhost', '--port', port], { env, stdio: 'inherit' });
const stop = () => child.kill('SIGTERM');
process.on('SIGTERM', stop);
process.on('SIGINT', stop);
child.on('exit', (code) => process.exit(code ?? 0));
