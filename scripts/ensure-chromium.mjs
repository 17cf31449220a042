// The browser tests need a real Chromium. Find it; install Debian's package when we
// are root on Debian; otherwise stop with a one-line instruction. Never skip silently.
import { existsSync } from 'node:fs';
import { execFileSync } from 'node:child_process';

export const chromiumPath = process.env.CHROMIUM_PATH || '/usr/bin/chromium';

function works(path) {
  if (!existsSync(path)) return false;
  try {
    execFileSync(path, ['--version'], { stdio: 'pipe' });
    return true;
  } catch {
    return false;
  }
}

if (!works(chromiumPath)) {
  const isRoot = typeof process.getuid === 'function' && process.getuid() === 0;
  if (isRoot && existsSync('/usr/bin/apt-get') && !process.env.CHROMIUM_PATH) {
    console.log('Chromium not found: installing Debian package "chromium" (apt-get, about a minute)…');
    const env = { ...process.env, DEBIAN_FRONTEND: 'noninteractive' };
    execFileSync('apt-get', ['update', '-qq'], { stdio: 'inherit', env });
    execFileSync('apt-get', ['install', '-y', '-qq', 'chromium'], { stdio: 'inherit', env });
  }
  if (!works(chromiumPath)) {
    console.error(
      `Browser tests need Chromium at ${chromiumPath}: install it (Debian: sudo apt-get install -y chromium) or set CHROMIUM_PATH.`,
    );
    process.exit(1);
  }
}
console.log(`Chromium for browser tests: ${chromiumPath}`);
