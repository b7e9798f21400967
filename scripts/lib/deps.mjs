// Installs npm dependencies when node_modules is missing or older than package-lock.json.
import { spawnSync } from 'node:child_process';
import fs from 'node:fs';
import path from 'node:path';
import { fail, note } from './say.mjs';

export function ensureDependencies(root) {
  const lock = path.join(root, 'package-lock.json');
  const marker = path.join(root, 'node_modules', '.package-lock.json');
  const fresh = fs.existsSync(marker) && fs.statSync(marker).mtimeMs >= fs.statSync(lock).mtimeMs - 1000;
  if (fresh) return;
  note('Installing dependencies (npm ci)...');
  const r = spawnSync('npm', ['ci', '--no-audit', '--no-fund', '--loglevel=warn'], { cwd: root, stdio: 'inherit' });
  if (r.status !== 0) fail('`npm ci` failed (see above).', 'Check the network access to the npm registry and your Node.js version (20.19 or newer).');
}
