// HTTP load on the project routes: autocannon against a real server process (server/main.ts, via
// bench/http-load-server.ts) on loopback, 50 connections for 30 s per run:
//  - read: GET /api/projects/:id, one signed-in user, one project;
//  - save: PATCH /api/projects/:id with baseVersion, each connection on a project of its own and
//    sending the version its last answer gave, so every save is a real write (version bump, log
//    row from the trigger, notification), not a 409;
//  - contended save (10 s): all connections on one project, so most answers are 409; the 200s
//    and 409s are counted separately.
// Reported: requests per second, latency p50/p99, status counts, and the server's memory (RSS,
// V8 heap before and after a full GC) before and after the runs. Afterwards the stored versions
// are checked against the acknowledged saves. autocannon, the server and PostgreSQL share this
// machine's cores, so the figures are a floor for a dedicated server.
//
// Env (set by `npm run bench`): TAPLINE_BENCH_ADMIN_URL. Tunables: TAPLINE_BENCH_HTTP_CONNECTIONS
// (50), TAPLINE_BENCH_HTTP_SECONDS (30).
import { spawn, type ChildProcess } from 'node:child_process';
import { randomBytes } from 'node:crypto';
import fs from 'node:fs';
import path from 'node:path';
import autocannon, { type Client, type Result } from 'autocannon';
import pg from 'pg';
import { openDatabase } from '../server/db/client';
import { applyMigrations } from '../server/db/migrate';
import { freePort } from '../tests/server/realtime-processes';

const CONNECTIONS = Number(process.env.TAPLINE_BENCH_HTTP_CONNECTIONS ?? 50);
const SECONDS = Number(process.env.TAPLINE_BENCH_HTTP_SECONDS ?? 30);
const CONTENDED_SECONDS = Math.min(10, SECONDS);
const root = path.resolve(import.meta.dirname, '..');
/** The sheet every project holds and every save sends (an example, 6 parts, ~1.4 kB). */
const SHEET = JSON.parse(fs.readFileSync(path.join(root, 'examples/battery-divider.json'), 'utf8')) as Record<string, unknown>;

interface Memory { rss: number; heapUsed: number; heapTotal: number; external: number }
interface MemoryReport { before: Memory; afterGc: Memory }

interface Server {
  url: string;
  memory(): Promise<MemoryReport>;
  stop(): Promise<void>;
}

/** server/main.ts in a process of its own, with an IPC channel for its memory figures. */
async function startServer(databaseUrl: string): Promise<Server> {
  const port = await freePort();
  const child: ChildProcess = spawn(process.execPath, ['--expose-gc', '--import', 'tsx', 'bench/http-load-server.ts'], {
    cwd: root,
    env: { ...process.env, DATABASE_URL: databaseUrl, PORT: String(port), HOST: '127.0.0.1', NODE_ENV: 'development', RATE_LIMIT_SIGNIN: '10000', TAPLINE_STATIC_DIR: path.join(root, '.local', 'no-client') },
    stdio: ['ignore', 'pipe', 'pipe', 'ipc'],
  });
  let out = '';
  child.stdout!.on('data', (d) => (out += d));
  child.stderr!.on('data', (d) => (out += d));
  const url = `http://127.0.0.1:${port}`;
  for (const until = Date.now() + 30_000; ; ) {
    if (child.exitCode !== null) throw new Error(`the server exited at start:\n${out}`);
    if ((await fetch(`${url}/api/health`).catch(() => null))?.ok) break;
    if (Date.now() > until) throw new Error(`the server did not answer in 30 s:\n${out}`);
    await new Promise((r) => setTimeout(r, 100));
  }
  const exited = new Promise<void>((r) => child.once('exit', () => r()));
  return {
    url,
    memory: () => new Promise((resolve) => {
      child.once('message', (m) => resolve(m as MemoryReport));
      child.send('memory');
    }),
    async stop() {
      if (child.exitCode === null) child.kill('SIGTERM');
      await exited;
    },
  };
}

/** Signs in through the fake provider with plain redirects; returns the cookie and CSRF token. */
async function signIn(url: string, login: string): Promise<{ cookie: string; csrf: string }> {
  let cookie = '';
  let next = `${url}/auth/github?login=${encodeURIComponent(login)}&returnTo=/projects`;
  for (let hop = 0; hop < 4 && new URL(next).pathname !== '/projects'; hop++) {
    const res = await fetch(next, { redirect: 'manual', headers: cookie ? { cookie } : {} });
    const set = res.headers.getSetCookie().find((c) => c.startsWith('tapline.sid='));
    if (set) cookie = set.split(';')[0];
    next = new URL(res.headers.get('location') ?? '/failed', url).toString();
  }
  if (!cookie) throw new Error(`signing in ${login} failed`);
  const { token } = (await (await fetch(`${url}/api/csrf`, { headers: { cookie } })).json()) as { token: string };
  return { cookie, csrf: token };
}

async function createProject(url: string, auth: { cookie: string; csrf: string }, title: string): Promise<string> {
  const res = await fetch(`${url}/api/projects`, {
    method: 'POST',
    headers: { cookie: auth.cookie, 'x-csrf-token': auth.csrf, 'content-type': 'application/json' },
    body: JSON.stringify({ title, sheet: SHEET }),
  });
  if (res.status !== 201) throw new Error(`creating a project failed: ${res.status} ${await res.text()}`);
  return ((await res.json()) as { id: string }).id;
}

const saveBody = (version: number) => JSON.stringify({ sheet: SHEET, baseVersion: version });

/**
 * Saves where each connection owns a project and sends the version its last answer gave.
 * autocannon gives no per-connection state, so `setupClient` keeps it in a closure; the
 * request's `onResponse` hands the body to the client's 'response' handler, which runs right
 * after it for the same client and sets the next body.
 */
function perConnectionSaves(projectIds: string[], headers: Record<string, string>, acked: Map<string, number>) {
  let next = 0;
  let lastBody = '';
  return {
    requests: [{ method: 'PATCH', onResponse: (_status: number, body: string) => { lastBody = body; } }],
    setupClient(client: Client) {
      const id = projectIds[next++ % projectIds.length];
      let version = 1;
      // Each client has its own copy of `requests`; its one request object is reused every cycle.
      (client as unknown as { requestIterator: { currentRequest: { path?: string } } }).requestIterator.currentRequest.path = `/api/projects/${id}`;
      const send = () => client.setHeadersAndBody(headers, saveBody(version));
      send();
      client.on('response', (status: number) => {
        try {
          const body = JSON.parse(lastBody) as { version?: number; error?: { currentVersion?: number } };
          if (status === 200 && body.version) {
            version = body.version;
            acked.set(id, version);
          } else if (status === 409 && body.error?.currentVersion) version = body.error.currentVersion;
        } catch {
          // a non-JSON answer: send the same body again
        }
        send();
      });
    },
  };
}

interface RunRow { label: string; result: Result }

function report(rows: RunRow[], memory: [string, MemoryReport][]): void {
  const mb = (b: number) => (b / 1024 / 1024).toFixed(1);
  console.log(`\n${CONNECTIONS} connections on loopback; autocannon, the server process and PostgreSQL share the machine`);
  console.log('run                            | seconds | req/s avg | p50 ms | p99 ms | max ms | status counts                 | errors/timeouts');
  for (const { label, result: r } of rows) {
    const codes = Object.entries(r.statusCodeStats).map(([c, s]) => `${c}: ${s.count}`).join(', ');
    console.log([
      label.padEnd(30), String(Math.round(r.duration)).padStart(7), r.requests.average.toFixed(0).padStart(9),
      r.latency.p50.toFixed(0).padStart(6), r.latency.p99.toFixed(0).padStart(6), r.latency.max.toFixed(0).padStart(6),
      codes.padEnd(29), `${r.errors}/${r.timeouts}`,
    ].join(' | '));
  }
  console.log('\nserver memory                  | RSS MB | heap used MB | heap used after GC MB | heap total MB | external MB');
  for (const [label, m] of memory) {
    console.log([label.padEnd(30), mb(m.before.rss).padStart(6), mb(m.before.heapUsed).padStart(12), mb(m.afterGc.heapUsed).padStart(21), mb(m.before.heapTotal).padStart(13), mb(m.before.external).padStart(11)].join(' | '));
  }
}

export async function run(): Promise<void> {
  const adminUrl = process.env.TAPLINE_BENCH_ADMIN_URL;
  if (!adminUrl) {
    console.log('skipped: TAPLINE_BENCH_ADMIN_URL is not set (run it through `npm run bench`)');
    return;
  }
  const name = `tapline_bench_http_${randomBytes(4).toString('hex')}`;
  const admin = new pg.Client({ connectionString: adminUrl });
  await admin.connect();
  await admin.query(`create database "${name}"`);
  const u = new URL(adminUrl);
  u.pathname = `/${name}`;
  const database = openDatabase(u.toString(), 2);
  let server: Server | null = null;
  try {
    await applyMigrations(database);
    server = await startServer(u.toString());
    const auth = await signIn(server.url, 'ada-demo');
    const headers = { cookie: auth.cookie, 'x-csrf-token': auth.csrf, 'content-type': 'application/json' };
    const readId = await createProject(server.url, auth, 'HTTP bench read (demo)');
    const saveIds: string[] = [];
    for (let i = 0; i < CONNECTIONS; i++) saveIds.push(await createProject(server.url, auth, `HTTP bench save ${i} (demo)`));
    const contendedId = await createProject(server.url, auth, 'HTTP bench contended (demo)');
    const memory: [string, MemoryReport][] = [['before (after set-up)', await server.memory()]];

    // Warm-up (not reported): JIT, pools, caches.
    await autocannon({ url: `${server.url}/api/projects/${readId}`, connections: 10, duration: 3, headers: { cookie: auth.cookie } });

    const rows: RunRow[] = [];
    rows.push({ label: 'read GET /api/projects/:id', result: await autocannon({ url: `${server.url}/api/projects/${readId}`, connections: CONNECTIONS, duration: SECONDS, headers: { cookie: auth.cookie } }) });
    memory.push(['after read', await server.memory()]);

    const acked = new Map<string, number>();
    const saves = perConnectionSaves(saveIds, headers, acked);
    rows.push({ label: 'save PATCH, own project each', result: await autocannon({ url: `${server.url}/api/projects/${saveIds[0]}`, connections: CONNECTIONS, duration: SECONDS, ...saves }) });
    memory.push(['after save', await server.memory()]);

    const contended = perConnectionSaves([contendedId], headers, new Map());
    rows.push({ label: 'save PATCH, one shared project', result: await autocannon({ url: `${server.url}/api/projects/${contendedId}`, connections: CONNECTIONS, duration: CONTENDED_SECONDS, ...contended }) });
    memory.push(['after contended save', await server.memory()]);

    report(rows, memory);

    // Every acknowledged save is stored: each project's version is at least the last one acknowledged.
    const { rows: stored } = await database.pool.query<{ id: string; version: number }>('select id, version from projects where id = any($1::uuid[])', [saveIds]);
    const behind = stored.filter((p) => p.version < (acked.get(p.id) ?? 1));
    const saved = stored.reduce((n, p) => n + p.version - 1, 0);
    const ok2xx = rows[1].result.statusCodeStats['200']?.count ?? 0;
    // Saves still in flight when a run ends are stored but never counted: at most one per connection.
    const consistent = behind.length === 0 && saved >= ok2xx && saved <= ok2xx + CONNECTIONS;
    console.log(`\nstored: ${saved} saves over ${stored.length} projects for ${ok2xx} answers 200 (up to ${CONNECTIONS} more were in flight at the end)` +
      (behind.length ? `; ${behind.length} projects BEHIND their last acknowledged version` : consistent ? '; every acknowledged save is stored' : '; COUNTS DO NOT MATCH'));
    if (!consistent) process.exitCode = 1;
  } finally {
    await server?.stop();
    await database.close();
    await admin.query(`drop database if exists "${name}" with (force)`);
    await admin.end();
  }
}
