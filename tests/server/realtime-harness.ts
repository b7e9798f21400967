// Live co-editing test set-up: the app on a real HTTP port with socket.io attached, users signed
// in through the fake OAuth provider, projects with members, and sync clients over real sockets.
import http from 'node:http';
import type { AddressInfo } from 'node:net';
import request from 'supertest';
import { expect } from 'vitest';
import { sessionHandlersOf } from '../../server/app';
import { memberships } from '../../server/db/schema';
import { attachRealtime, type Realtime } from '../../server/realtime/attach';
import { parseSheet } from '../../shared/sheet';
import { applyOps, normalizeForSync, SyncClient, type JsonObject, type SheetOp } from '../../shared/sync';
import { SocketTransport } from '../../src/collab/socketTransport';
import { fetchCsrf, signInAgent } from '../support/auth';
import { startTestApp, type TestApp } from './test-app';

type Agent = ReturnType<typeof request.agent>;

export interface LiveServer {
  s: TestApp;
  url: string;
  realtime: Realtime;
  close(): Promise<void>;
}

/** The app with socket.io on a loopback port of its own, on a fresh database. */
export async function startLiveServer(): Promise<LiveServer> {
  const s = await startTestApp();
  const server = http.createServer(s.app);
  const realtime = attachRealtime(server, { config: s.config, database: s.t.database, sessionHandlers: sessionHandlersOf(s.app) });
  await new Promise<void>((resolve) => server.listen(0, '127.0.0.1', resolve));
  const url = `http://127.0.0.1:${(server.address() as AddressInfo).port}`;
  return {
    s,
    url,
    realtime,
    async close() {
      await realtime.close();
      server.closeAllConnections();
      await s.close();
    },
  };
}

export interface LiveUser {
  login: string;
  id: number;
  agent: Agent;
  cookie: string;
  csrf: string;
  /** an HTTP client on a server URL or app with this user's cookie and CSRF token */
  patch(path: string): request.Test;
  post(path: string): request.Test;
}

/** Sign in (fake provider) against a server URL; the session lives in the shared database. */
export async function signInLive(url: string, login: string): Promise<LiveUser> {
  const agent = request.agent(url);
  const { cookie } = await signInAgent(agent, login);
  const me = await agent.get('/api/me');
  expect(me.status).toBe(200);
  const csrf = await fetchCsrf(agent);
  return {
    login,
    id: me.body.id,
    agent,
    cookie,
    csrf,
    patch: (p) => agent.patch(p).set('X-CSRF-Token', csrf),
    post: (p) => agent.post(p).set('X-CSRF-Token', csrf),
  };
}

/** A project owned by `owner` with the sheet, and the other users as members with their roles. */
export async function createSharedProject(live: { s: TestApp }, owner: LiveUser, sheet: JsonObject, members: [LiveUser, 'owner' | 'editor' | 'viewer'][]) {
  const res = await owner.post('/api/projects').send({ title: 'Live sheet (test)', sheet });
  expect(res.status).toBe(201);
  const projectId = res.body.id as string;
  // Invitations are tested elsewhere; here members are added directly.
  for (const [u, role] of members) await live.s.t.database.db.insert(memberships).values({ projectId, userId: u.id, role });
  return projectId;
}

export interface LiveClient {
  user: LiveUser;
  transport: SocketTransport;
  client: SyncClient;
  notices: string[];
  /** batchId → version of every batch the server acknowledged as accepted */
  acked: Map<string, number>;
  stop(): void;
}

/** A sync client over a real socket.io connection, joined to the project. */
export async function openSheet(url: string, user: LiveUser, projectId: string, options: { reconnectMs?: number } = {}): Promise<LiveClient> {
  const transport = new SocketTransport({
    url,
    cookie: user.cookie,
    socket: { reconnectionDelay: options.reconnectMs ?? 100, reconnectionDelayMax: options.reconnectMs ?? 500, forceNew: true },
  });
  const client = new SyncClient({ projectId, transport, validate: (d) => parseSheet(d).ok, gapTimeoutMs: 1000 });
  const notices: string[] = [];
  client.on('notice', (n) => notices.push(n.message));
  const acked = new Map<string, number>();
  const send = transport.sendOps.bind(transport);
  transport.sendOps = async (req) => {
    const ack = await send(req);
    if (ack.ok) acked.set(req.batchId, ack.version);
    return ack;
  };
  await client.start();
  return {
    user,
    transport,
    client,
    notices,
    acked,
    stop() {
      client.stop();
      transport.close();
    },
  };
}

/** Wait until `check` holds (polling), or fail with `what`. */
export async function eventually(what: string, check: () => boolean | Promise<boolean>, timeoutMs = 10_000): Promise<void> {
  const until = Date.now() + timeoutMs;
  while (Date.now() < until) {
    if (await check()) return;
    await new Promise((r) => setTimeout(r, 20));
  }
  throw new Error(`timed out waiting for: ${what}`);
}

/** The project row and its whole operation log, as stored. */
export async function storedProject(live: { s: TestApp }, projectId: string) {
  const pool = live.s.t.database.pool;
  const p = await pool.query<{ version: number; sheet: JsonObject }>('select version, sheet from projects where id = $1', [projectId]);
  const log = await pool.query<{ version: number; ops: SheetOp[]; batch_id: string | null }>('select version, ops, batch_id from sheet_ops where project_id = $1 order by version', [projectId]);
  return { version: p.rows[0].version, sheet: p.rows[0].sheet, log: log.rows };
}

/** The sheet rebuilt from the first version and the log: must equal the stored snapshot. */
export function replay(initial: JsonObject, log: { version: number; ops: SheetOp[] }[]): JsonObject {
  let doc = normalizeForSync(initial);
  for (const row of log) {
    const r = applyOps(doc, row.ops);
    if (!r.ok) throw new Error(`the log does not replay at version ${row.version}: ${r.error.message}`);
    doc = r.doc;
  }
  return doc;
}
