// The e2e tests drive Debian's Chromium; Playwright never downloads a browser of its own.
import { existsSync } from 'node:fs';
import { execSync } from 'node:child_process';

const browser = process.env.CHROMIUM_PATH ?? '/usr/bin/chromium';
if (!existsSync(browser)) {
  const isRoot = typeof process.getuid === 'function' && process.getuid() === 0;
  if (isRoot) {
    console.log('Chromium is missing: installing Debian\'s chromium package with apt-get …');
    execSync('apt-get update && DEBIAN_FRONTEND=noninteractive apt-get install -y chromium', { stdio: 'inherit' });
  } else {
    console.error(
      `Chromium was not found at ${browser}. Install it with:\n  sudo apt-get update && sudo apt-get install -y chromium\n` +
        'or point CHROMIUM_PATH at an existing Chromium binary.',
    );
    process.exit(1);
  }
}
