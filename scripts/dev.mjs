#!/usr/bin/env node
// `npm run dev`: Vite dev server (hot reload) with the API proxied to a server that restarts on change.
import path from 'node:path';
import { fileURLToPath } from 'node:url';
import { ensureDependencies } from './lib/deps.mjs';
import { prepareDatabase, runTsx } from './lib/database.mjs';
import { runUntilStopped, spawnChild } from './lib/serve.mjs';

const root = path.resolve(path.dirname(fileURLToPath(import.meta.url)), '..');
const apiPort = Number(process.env.API_PORT ?? 5174);

ensureDependencies(root);
const db = await prepareDatabase(root, 'tapline');
const env = { ...process.env, DATABASE_URL: db.url };
if (runTsx(root, 'server/db/migrate-cli.ts', env) !== 0) process.exit(1);
runTsx(root, 'server/db/seed-cli.ts', env);
const api = spawnChild(path.join(root, 'node_modules/.bin/tsx'), ['watch', '--clear-screen=false', 'server/main.ts'], {
  cwd: root,
  env: { ...env, PORT: String(apiPort), TAPLINE_STATIC_DIR: path.join(root, '.local', 'no-client') },
});
const vite = spawnChild(path.join(root, 'node_modules/.bin/vite'), [], { cwd: root, env: { ...env, API_PORT: String(apiPort) } });
runUntilStopped([api, vite], () => db.stop());
