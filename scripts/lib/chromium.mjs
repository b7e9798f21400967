// Debian's Chromium for the browser tests (no test tool may download a browser of its own).
import { spawnSync } from 'node:child_process';
import fs from 'node:fs';
import { fail, note } from './say.mjs';

export const chromiumPath = process.env.CHROMIUM_PATH ?? '/usr/bin/chromium';

export function ensureChromium() {
  if (fs.existsSync(chromiumPath)) return chromiumPath;
  const isRoot = process.getuid?.() === 0;
  if (!isRoot || !fs.existsSync('/usr/bin/apt-get')) {
    fail(`Chromium is not installed at ${chromiumPath}; the browser tests need it.`,
      'Install Debian\'s package (`sudo apt-get install -y chromium`) or set CHROMIUM_PATH to a Chromium binary.');
  }
  note('Installing Debian\'s chromium for the browser tests (apt-get)...');
  const env = { ...process.env, DEBIAN_FRONTEND: 'noninteractive' };
  spawnSync('apt-get', ['update', '-qq'], { stdio: 'inherit', env });
  const r = spawnSync('apt-get', ['install', '-y', '-qq', 'chromium'], { stdio: 'inherit', env });
  if (r.status !== 0 || !fs.existsSync(chromiumPath)) fail('Installing chromium with apt-get failed (see above).', 'Install it by hand, or set CHROMIUM_PATH.');
  return chromiumPath;
}
