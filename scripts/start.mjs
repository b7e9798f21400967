#!/usr/bin/env node
// `npm start`: everything a fresh clone needs, then the app and API on one port.
import path from 'node:path';
import { fileURLToPath } from 'node:url';
import { spawnSync } from 'node:child_process';
import { ensureDependencies } from './lib/deps.mjs';
import { prepareDatabase, runTsx } from './lib/database.mjs';
import { portInUse } from './lib/pg.mjs';
import { fail, note } from './lib/say.mjs';
import { runUntilStopped, spawnChild } from './lib/serve.mjs';

const root = path.resolve(path.dirname(fileURLToPath(import.meta.url)), '..');
const port = Number(process.env.PORT ?? 5173);
const host = process.env.HOST ?? '127.0.0.1';

ensureDependencies(root);
if (await portInUse(port, host)) fail(`Port ${port} on ${host} is already in use.`, `Stop the program using it, or pick another: PORT=5180 npm start`);
const db = await prepareDatabase(root, 'tapline');
const env = { DATABASE_URL: db.url };
if (runTsx(root, 'server/db/migrate-cli.ts', env) !== 0) { db.stop(); process.exit(1); }
if (runTsx(root, 'server/db/seed-cli.ts', env) !== 0) { db.stop(); process.exit(1); }
if (process.env.TAPLINE_SKIP_BUILD !== '1') {
  note('Building the client (vite build)...');
  const b = spawnSync(path.join(root, 'node_modules/.bin/vite'), ['build', '--logLevel', 'warn'], { cwd: root, stdio: 'inherit' });
  if (b.status !== 0) { db.stop(); fail('The client build failed (see above).', 'Fix the reported error, or run `npm run build` to see it again.'); }
}
const server = spawnChild(path.join(root, 'node_modules/.bin/tsx'), ['server/main.ts'], {
  cwd: root,
  env: { ...process.env, ...env, PORT: String(port), HOST: host, NODE_ENV: process.env.NODE_ENV ?? 'development' },
});
runUntilStopped([server], () => {
  db.stop();
  note('stopped.');
});
