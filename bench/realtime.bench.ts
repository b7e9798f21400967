// Live co-editing under load: 50 clients on one sheet, each sending 5 operations a second for
// 30 s over loopback, against one server process and against two behind the PostgreSQL adapter.
// Reported: the time from a client sending a batch to its acknowledgement (the server has
// applied, validated, committed and broadcast it) and to its arrival at the other clients, and
// the operations per second the server sustained. Target: p99 under 50 ms.
//
// Env (set by `npm run bench`): TAPLINE_BENCH_ADMIN_URL, a PostgreSQL URL allowed to create
// databases. Tunables: TAPLINE_BENCH_RT_CLIENTS (50), TAPLINE_BENCH_RT_RATE (5 per second),
// TAPLINE_BENCH_RT_SECONDS (30).
import { randomBytes } from 'node:crypto';
import { monitorEventLoopDelay, performance } from 'node:perf_hooks';
import pg from 'pg';
import { io, type Socket } from 'socket.io-client';
import { openDatabase } from '../server/db/client';
import { applyMigrations } from '../server/db/migrate';
import type { JoinAck, OpAck, OpBroadcast, SheetOp } from '../shared/sync';
import type { TimingSummary } from '../server/realtime/timings';
import { startServerProcess, type ServerProcess } from '../tests/server/realtime-processes';

const CLIENTS = Number(process.env.TAPLINE_BENCH_RT_CLIENTS ?? 50);
const RATE = Number(process.env.TAPLINE_BENCH_RT_RATE ?? 5);
const SECONDS = Number(process.env.TAPLINE_BENCH_RT_SECONDS ?? 30);
const PARTS = 60;

/** A ladder of resistors from a 12 V supply, PARTS parts in all (invented demo data). */
function benchSheet() {
  const parts: Record<string, unknown>[] = [
    { id: 'V1', type: 'dc_voltage_source', params: { voltage: 12 }, position: { x: 0, y: 0 } },
    { id: 'GND', type: 'ground', position: { x: 0, y: 400 } },
  ];
  const wires: Record<string, unknown>[] = [{ id: 'w0', from: 'V1.neg', to: 'GND.g' }];
  let prev = 'V1.pos';
  for (let i = 1; i <= PARTS - 2; i++) {
    parts.push({ id: `R${i}`, type: 'resistor', params: { resistance: 1000 * i, tolerance: 0.01 }, position: { x: 80 * i, y: 0 } });
    wires.push({ id: `w${i}`, from: prev, to: `R${i}.a` });
    prev = `R${i}.b`;
  }
  wires.push({ id: 'wend', from: prev, to: 'GND.g' });
  return { format: 'tapline.sheet', version: 1, title: 'Bench ladder (demo)', conditions: { temperatureC: 25, illuminanceLux: 100 }, parts, wires };
}

/** Sign in through the fake provider with plain redirects; returns the session cookie. */
async function signIn(url: string, login: string): Promise<string> {
  let cookie = '';
  let next = `${url}/auth/github?login=${encodeURIComponent(login)}&returnTo=/projects`;
  for (let hop = 0; hop < 4; hop++) {
    const res = await fetch(next, { redirect: 'manual', headers: cookie ? { cookie } : {} });
    const set = res.headers.getSetCookie().find((c) => c.startsWith('tapline.sid='));
    if (set) cookie = set.split(';')[0];
    const location = res.headers.get('location');
    if (res.status !== 302 || !location) break;
    if (location.startsWith('/projects')) return cookie;
    next = new URL(location, url).toString();
  }
  throw new Error(`signing in ${login} failed`);
}

async function createProject(url: string, cookie: string): Promise<string> {
  const csrf = (await (await fetch(`${url}/api/csrf`, { headers: { cookie } })).json()) as { token: string };
  const res = await fetch(`${url}/api/projects`, {
    method: 'POST',
    headers: { cookie, 'content-type': 'application/json', 'x-csrf-token': csrf.token },
    body: JSON.stringify({ title: 'Realtime bench', sheet: benchSheet() }),
  });
  if (res.status !== 201) throw new Error(`creating the project failed: ${res.status} ${await res.text()}`);
  return ((await res.json()) as { id: string }).id;
}

function percentile(sorted: number[], p: number): number {
  if (!sorted.length) return NaN;
  return sorted[Math.min(sorted.length - 1, Math.floor((p / 100) * sorted.length))];
}

/** The server-side timings of each process since the last call (and start them afresh). */
async function serverTimings(servers: ServerProcess[], cookie: string): Promise<TimingSummary[]> {
  return Promise.all(
    servers.map(async (srv) => {
      const s = io(srv.url, { transports: ['websocket'], extraHeaders: { cookie }, forceNew: true, reconnection: false });
      await new Promise<void>((resolve) => s.once('connect', () => resolve()));
      const t = (await s.timeout(10_000).emitWithAck('debug:timings')) as TimingSummary;
      s.close();
      return t;
    }),
  );
}

interface RunResult {
  label: string;
  server: TimingSummary[];
  /** the bench process's own event-loop delay p99, ms: how much of the client-side figures is the clients' own lag */
  clientLagP99: number;
  acked: number;
  refused: number;
  seconds: number;
  ack: number[];
  delivery: number[];
}

async function runLoad(label: string, servers: ServerProcess[], cookies: string[], projectId: string): Promise<RunResult> {
  const sentAt = new Map<string, number>();
  const ack: number[] = [];
  const delivery: number[] = [];
  let acked = 0;
  let refused = 0;
  let measuring = false;
  const sockets: Socket[] = [];
  const versions: number[] = [];
  for (let i = 0; i < CLIENTS; i++) {
    const s = io(servers[i % servers.length].url, { transports: ['websocket'], extraHeaders: { cookie: cookies[i] }, forceNew: true, reconnection: false });
    await new Promise<void>((resolve, reject) => {
      s.once('connect', () => resolve());
      s.once('connect_error', reject);
    });
    const joined = (await s.timeout(10_000).emitWithAck('sheet:join', { projectId })) as JoinAck;
    if (!joined.ok) throw new Error(`join failed: ${joined.error.message}`);
    versions[i] = joined.version;
    s.on('sheet:op', (m: OpBroadcast) => {
      versions[i] = Math.max(versions[i], m.version);
      const t0 = m.batchId ? sentAt.get(m.batchId) : undefined;
      if (measuring && t0 !== undefined) delivery.push(performance.now() - t0);
    });
    sockets.push(s);
  }
  // Let the adapter's heartbeat see every process before measuring.
  await new Promise((r) => setTimeout(r, servers.length > 1 ? 6000 : 500));

  await serverTimings(servers, cookies[0]);
  const lag = monitorEventLoopDelay({ resolution: 5 });
  lag.enable();
  let seq = 0;
  const started = performance.now();
  measuring = true;
  const timers = sockets.map((s, i) => {
    const tick = () => {
      const k = 1 + Math.floor(Math.random() * (PARTS - 2));
      const ops: SheetOp[] =
        Math.random() < 0.6
          ? [{ op: 'set', target: { coll: 'parts', id: `R${k}` }, path: ['position'], value: { x: 80 * k + Math.round(Math.random() * 40), y: Math.round(Math.random() * 200) } }]
          : [{ op: 'set', target: { coll: 'parts', id: `R${k}` }, path: ['params', 'resistance'], value: 100 + Math.round(Math.random() * 1e5) }];
      const batchId = `bench-${i}-${++seq}`;
      const t0 = performance.now();
      sentAt.set(batchId, t0);
      s.timeout(10_000)
        .emitWithAck('sheet:op', { projectId, baseVersion: versions[i], batchId, ops })
        .then((a: OpAck) => {
          if (!measuring) return;
          ack.push(performance.now() - t0);
          if (a.ok) {
            acked++;
            versions[i] = Math.max(versions[i], a.version);
          } else refused++;
        })
        .catch(() => refused++);
    };
    // Spread the clients over the period so they do not all fire together.
    const period = 1000 / RATE;
    let interval: ReturnType<typeof setInterval> | undefined;
    const first = setTimeout(() => {
      tick();
      interval = setInterval(tick, period);
    }, Math.random() * period);
    return () => {
      clearTimeout(first);
      clearInterval(interval);
    };
  });
  await new Promise((r) => setTimeout(r, SECONDS * 1000));
  for (const stop of timers) stop();
  const seconds = (performance.now() - started) / 1000;
  await new Promise((r) => setTimeout(r, 1000)); // answers in flight
  measuring = false;
  lag.disable();
  const server = await serverTimings(servers, cookies[0]);
  for (const s of sockets) s.close();
  return { label, server, clientLagP99: lag.percentile(99) / 1e6, acked, refused, seconds, ack: ack.sort((a, b) => a - b), delivery: delivery.sort((a, b) => a - b) };
}

function report(results: RunResult[]): void {
  const ms = (v: number) => (Number.isFinite(v) ? v.toFixed(1) : '—');
  const three = (a: number, b: number, c: number) => `${ms(a)} / ${ms(b)} / ${ms(c)}`;
  console.log(`\n${CLIENTS} clients × ${RATE} ops/s for ${SECONDS} s, one sheet of ${PARTS} parts, loopback (target p99 < 50 ms)`);
  console.log('setup        | ops/s | refused | server apply+broadcast p50/p95/p99 ms | transaction p50/p99/max   | server lag p99 | ack p50/p95/p99 ms  | delivery p50/p95/p99 ms | client lag p99');
  for (const r of results) {
    r.server.forEach((t, k) => {
      const first = k === 0;
      console.log(
        [
          (first ? r.label : `  process ${k + 1}`).padEnd(12),
          (first ? (r.acked / r.seconds).toFixed(0) : '').padStart(5),
          (first ? String(r.refused) : '').padStart(7),
          `${r.server.length > 1 ? `p${k + 1}: ` : ''}${three(t.p50, t.p95, t.p99)} (n=${t.count})`.padEnd(37),
          `${ms(t.commit.p50)} / ${ms(t.commit.p99)} / ${ms(t.commit.max)} (n=${t.commit.count})`.padEnd(25),
          `${ms(t.loopLagP99)} ms`.padEnd(14),
          (first ? three(percentile(r.ack, 50), percentile(r.ack, 95), percentile(r.ack, 99)) : '').padEnd(19),
          (first ? three(percentile(r.delivery, 50), percentile(r.delivery, 95), percentile(r.delivery, 99)) : '').padEnd(23),
          first ? `${ms(r.clientLagP99)} ms` : '',
        ].join(' | '),
      );
    });
  }
  console.log('server: a batch arrives on its socket → applied, validated, committed (log + snapshot, one transaction) and handed to socket.io for the broadcast, measured in the server process.');
  console.log('ack: a client sends → its answer is back; delivery: a client sends → each other client has the broadcast (both ends in this bench process, so they include its own event-loop lag).');
}

export async function run(): Promise<void> {
  const adminUrl = process.env.TAPLINE_BENCH_ADMIN_URL;
  if (!adminUrl) {
    console.log('skipped: TAPLINE_BENCH_ADMIN_URL is not set (run it through `npm run bench`)');
    return;
  }
  const name = `tapline_bench_rt_${randomBytes(4).toString('hex')}`;
  const admin = new pg.Client({ connectionString: adminUrl });
  await admin.connect();
  await admin.query(`create database "${name}"`);
  const url = new URL(adminUrl);
  url.pathname = `/${name}`;
  const dbUrl = url.toString();
  const database = openDatabase(dbUrl, 3);
  const servers: ServerProcess[] = [];
  try {
    await applyMigrations(database);
    const env = { TAPLINE_REALTIME_TIMINGS: '1' };
    servers.push(await startServerProcess(dbUrl, undefined, env), await startServerProcess(dbUrl, undefined, env));
    const cookies: string[] = [];
    for (let i = 0; i < CLIENTS; i++) cookies.push(await signIn(servers[0].url, `bench-user-${i}`));
    const projectId = await createProject(servers[0].url, cookies[0]);
    const { rows } = await database.pool.query<{ id: number }>("select id from users where login like 'bench-user-%' order by id");
    for (const u of rows.slice(1)) await database.pool.query("insert into memberships (project_id, user_id, role) values ($1, $2, 'editor') on conflict do nothing", [projectId, u.id]);
    const results = [await runLoad('1 process', servers.slice(0, 1), cookies, projectId), await runLoad('2 processes', servers, cookies, projectId)];
    report(results);
    const { rows: v } = await database.pool.query<{ version: number; ops: string }>('select version, (select count(*) from sheet_ops where project_id = $1) as ops from projects where id = $1', [projectId]);
    console.log(`stored: project version ${v[0].version}, ${v[0].ops} rows in the operation log`);
  } finally {
    await Promise.all(servers.map((s) => s.stop()));
    await database.close();
    await admin.query(`drop database if exists "${name}" with (force)`);
    await admin.end();
  }
}
