// Bundle-size budget of the editor route (/sheets/:id, /projects/:id), read from the client build
// in dist/: the gzip size of the JavaScript and CSS the route loads (the entry from index.html,
// everything it imports statically, and the chunks it imports lazily), and separately of the web
// worker chunks it starts. gzip at zlib's default level 6, what a compressing proxy or CDN
// typically sends (common practice). `npm test` builds the client before the tests; a bare run
// without dist/ skips with a message.
//
// The budgets were set from the measured sizes plus about 10 % (README, "Quality gates"). When a
// change needs more, raise them deliberately in the same commit and say why.
import fs from 'node:fs';
import path from 'node:path';
import { gzipSync } from 'node:zlib';
import { describe, expect, it } from 'vitest';

/** Editor route, JS + CSS, gzip bytes (measured 423 119 B on 2026-12-01, +9.9 %). */
export const EDITOR_ROUTE_BUDGET_BYTES = 465_000;
/** Web workers (solver, analyses), JS, gzip bytes (measured 137 108 B on 2026-12-01, +9.4 %). */
export const WORKERS_BUDGET_BYTES = 150_000;

const dist = path.resolve(import.meta.dirname, '../../dist');
const built = fs.existsSync(path.join(dist, 'index.html'));

interface Chunk { file: string; raw: number; gzip: number }
interface RouteFiles { route: Chunk[]; workers: Chunk[] }

// References to other build files inside a chunk: static `from"./x.js"` / `import"./x.js"`,
// lazy `import("./x.js")` (quotes or backticks), Vite's preload lists ("assets/x.css"), and
// workers as `new Worker(new URL("/assets/x.worker-….js", import.meta.url))`.
const IMPORT = /(?:\bfrom\s*|\bimport\s*\(?\s*)["'`]\.\/([\w.-]+\.js)["'`]/g;
const PRELOAD = /["'`](?:\.\/|\/?assets\/)([\w.-]+\.(?:js|css))["'`]/g;
const WORKER = /new URL\(\s*["'`](?:\.\/|\/?assets\/)([\w.-]+\.js)["'`]/g;

function chunk(file: string): Chunk {
  const bytes = fs.readFileSync(path.join(dist, 'assets', file));
  return { file, raw: bytes.length, gzip: gzipSync(bytes, { level: 6 }).length };
}

/** Every file reachable from `start` through imports and preload lists, but not through worker URLs. */
function closure(start: string[], workers: Set<string>): Set<string> {
  const seen = new Set<string>();
  const todo = [...start];
  while (todo.length) {
    const file = todo.pop()!;
    if (seen.has(file)) continue;
    seen.add(file);
    if (!file.endsWith('.js')) continue;
    const text = fs.readFileSync(path.join(dist, 'assets', file), 'utf8');
    for (const m of text.matchAll(WORKER)) workers.add(m[1]);
    for (const re of [IMPORT, PRELOAD]) for (const m of text.matchAll(re)) if (!workers.has(m[1])) todo.push(m[1]);
  }
  for (const w of workers) seen.delete(w);
  return seen;
}

/** What the editor route loads, from dist/index.html down. */
function editorRouteFiles(): RouteFiles {
  const html = fs.readFileSync(path.join(dist, 'index.html'), 'utf8');
  const entries = [...html.matchAll(/(?:src|href)="\/assets\/([\w.-]+\.(?:js|css))"/g)].map((m) => m[1]);
  if (!entries.some((f) => f.endsWith('.js'))) throw new Error('dist/index.html names no script: is it a Vite build?');
  const workerNames = new Set<string>();
  const route = closure(entries, workerNames);
  const workers = closure([...workerNames], new Set());
  return { route: [...route].sort().map(chunk), workers: [...workers].sort().map(chunk) };
}

/** Reads the build, again if another build replaced dist/ in the middle (a shared checkout). */
async function measure(): Promise<RouteFiles> {
  for (let attempt = 1; ; attempt++) {
    try {
      return editorRouteFiles();
    } catch (err) {
      if ((err as NodeJS.ErrnoException).code !== 'ENOENT' || attempt >= 5) throw err;
      await new Promise((r) => setTimeout(r, 2000));
    }
  }
}

const total = (cs: Chunk[]) => cs.reduce((n, c) => n + c.gzip, 0);
const table = (cs: Chunk[]) => cs.map((c) => `  ${c.file.padEnd(40)} ${String(c.raw).padStart(9)} B raw ${String(c.gzip).padStart(8)} B gzip`).join('\n');

if (built) describe('bundle-size budget (dist/)', () => {
  it('the editor route and its workers stay within budget', async () => {
    const { route, workers } = await measure();
    const routeBytes = total(route);
    const workerBytes = total(workers);
    console.log(`editor route: ${routeBytes} B gzip (budget ${EDITOR_ROUTE_BUDGET_BYTES})\n${table(route)}\nworkers: ${workerBytes} B gzip (budget ${WORKERS_BUDGET_BYTES})\n${table(workers)}`);
    expect(route.some((c) => c.file.endsWith('.css')), 'the route loads its stylesheet').toBe(true);
    expect(workers.length, 'the solver and analysis workers are found').toBeGreaterThanOrEqual(2);
    const advice = 'Split what the route does not need at first paint into lazy chunks (import()), or raise the budget in tests/unit/bundle-budget.test.ts and the README with a reason.';
    expect(routeBytes, `editor route is ${routeBytes} B gzip, over its budget of ${EDITOR_ROUTE_BUDGET_BYTES} B.\n${table(route)}\n${advice}`).toBeLessThanOrEqual(EDITOR_ROUTE_BUDGET_BYTES);
    expect(workerBytes, `workers are ${workerBytes} B gzip, over their budget of ${WORKERS_BUDGET_BYTES} B.\n${table(workers)}\n${advice}`).toBeLessThanOrEqual(WORKERS_BUDGET_BYTES);
  });
});

else describe('bundle-size budget', () => {
  it.skip('skipped: dist/ is absent — build the client first (`npx vite build`; `npm test` does it)', () => {});
});
