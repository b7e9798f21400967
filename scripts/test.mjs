#!/usr/bin/env node
// `npm test`: the same set-up as `npm start` (own database), then typecheck, lint and every test.
import path from 'node:path';
import fs from 'node:fs';
import { fileURLToPath } from 'node:url';
import { spawnSync } from 'node:child_process';
import { ensureDependencies } from './lib/deps.mjs';
import { prepareDatabase } from './lib/database.mjs';
import { ensureChromium } from './lib/chromium.mjs';
import { note } from './lib/say.mjs';

const root = path.resolve(path.dirname(fileURLToPath(import.meta.url)), '..');
const bin = (n) => path.join(root, 'node_modules/.bin', n);
const passthrough = process.argv.slice(2);

ensureDependencies(root);
const chromium = ensureChromium();
const db = await prepareDatabase(root, 'tapline_test');
const env = { ...process.env, TAPLINE_TEST_ADMIN_URL: db.adminUrl, CHROMIUM_PATH: chromium, NODE_ENV: 'test' };

function step(name, cmd, args, extraEnv = {}) {
  note(`${name}...`);
  const r = spawnSync(cmd, args, { cwd: root, stdio: 'inherit', env: { ...env, ...extraEnv } });
  return r.status ?? 1;
}

let failed = [];
if (passthrough.length === 0) {
  if (step('typecheck (tsc --noEmit)', bin('tsc'), ['-p', 'tsconfig.json', '--noEmit']) !== 0) failed.push('typecheck');
  if (step('lint (eslint)', bin('eslint'), ['.', '--max-warnings=0']) !== 0) failed.push('lint');
  // The browser tests and the bundle budget test what users get: the production bundle
  // (with NODE_ENV=test Vite would bundle React's development build).
  if (step('client build (vite build)', bin('vite'), ['build', '--logLevel', 'warn'], { NODE_ENV: 'production' }) !== 0) failed.push('build');
}
const report = path.join(root, '.local', 'vitest-report.json');
fs.mkdirSync(path.dirname(report), { recursive: true });
const code = step('tests (vitest)', bin('vitest'), ['run', '--reporter=default', '--reporter=json', `--outputFile.json=${report}`, ...passthrough]);
if (code !== 0) failed.push('tests');
db.stop();

let counts = { passed: 0, failed: 0, skipped: 0 };
try {
  const j = JSON.parse(fs.readFileSync(report, 'utf8'));
  counts = { passed: j.numPassedTests, failed: j.numFailedTests, skipped: j.numPendingTests + (j.numTodoTests ?? 0) };
} catch { /* the runner died before writing its report; the exit code says so */ }
if (failed.length) note(`failed steps: ${failed.join(', ')}`);
// The plain closing line CI reads: counts from the runner's own JSON report.
console.log(`\n${counts.passed} passed, ${counts.failed} failed, ${counts.skipped} skipped`);
process.exit(failed.length ? 1 : 0);
