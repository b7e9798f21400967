#!/usr/bin/env node
// `npm run bench`: same set-up as npm test where a bench needs it, then bench/run.ts.
import path from 'node:path';
import { fileURLToPath } from 'node:url';
import { spawnSync } from 'node:child_process';
import { ensureDependencies } from './lib/deps.mjs';
import { prepareDatabase } from './lib/database.mjs';

const root = path.resolve(path.dirname(fileURLToPath(import.meta.url)), '..');
ensureDependencies(root);
const db = await prepareDatabase(root, 'tapline_bench');
const r = spawnSync(path.join(root, 'node_modules/.bin/tsx'), ['bench/run.ts', ...process.argv.slice(2)], {
  cwd: root, stdio: 'inherit', env: { ...process.env, TAPLINE_BENCH_ADMIN_URL: db.adminUrl, TAPLINE_BENCH_DB_URL: db.url },
});
db.stop();
process.exit(r.status ?? 1);
