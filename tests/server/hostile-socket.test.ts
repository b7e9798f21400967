// Hostile socket.io traffic against a real server process (`server/main.ts`, so a crash shows as
// a dead process rather than a failed test runner): malformed and wrongly typed payloads for
// sheet:join, sheet:op and presence:update, unknown projects, oversized batches and messages,
// nesting deep enough to overflow a recursive validator, text the database cannot store.
// Each must get a structured refusal `{ ok: false, error: { code, message } }` (presence, which
// has no answer, must be dropped without a broadcast) and leave the database unchanged.
import { randomUUID } from 'node:crypto';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { io as connect, type Socket } from 'socket.io-client';
import { memberships } from '../../server/db/schema';
import { MAX_OPS_PER_BATCH, SYNC_PROTOCOL_VERSION } from '../../shared/sync/protocol';
import { createTestDatabase, type TestDatabase } from '../support/db';
import { dividerSheet } from './fixtures';
import { snapshotTables } from './hostile-support';
import { signInLive, type LiveUser } from './realtime-harness';
import { startServerProcess, type ServerProcess } from './realtime-processes';

let t: TestDatabase;
let srv: ServerProcess;
let ada: LiveUser;
let ben: LiveUser;
let dee: LiveUser;
let projectId: string;
const open: Socket[] = [];

type Ack = { ok: boolean; error?: { code: string; message: string }; version?: number };

/** A socket for `user`, connected (or the connect_error it got). */
function socketFor(user: LiveUser | null, opts: { origin?: string; protocol?: number } = {}): Socket {
  const headers: Record<string, string> = {};
  if (user) headers.cookie = user.cookie;
  if (opts.origin) headers.origin = opts.origin;
  const s = connect(srv.url, { transports: ['websocket'], extraHeaders: headers, forceNew: true, reconnection: false, auth: opts.protocol === undefined ? {} : { protocol: opts.protocol } });
  open.push(s);
  return s;
}

async function connected(user: LiveUser): Promise<Socket> {
  const s = socketFor(user);
  await new Promise<void>((resolve, reject) => {
    s.once('connect', () => resolve());
    s.once('connect_error', reject);
  });
  return s;
}

const ask = (s: Socket, event: string, payload: unknown): Promise<Ack> => s.timeout(5000).emitWithAck(event, payload);

/**
 * Writes a socket.io EVENT packet as raw text with ack id `id` (for payloads the client library
 * cannot encode itself, such as 50 000 nested arrays), and resolves with the ack or null.
 */
function rawAsk(s: Socket, id: number, text: string, waitMs = 2000): Promise<Ack | null> {
  const engine = (s.io as unknown as { engine: { write(m: string): void; on(e: string, f: (p: { type: string; data?: unknown }) => void): void; off(e: string, f: unknown): void } }).engine;
  return new Promise((resolve) => {
    const onPacket = (p: { type: string; data?: unknown }) => {
      const m = p.type === 'message' && typeof p.data === 'string' ? /^3(\d+)(.*)$/s.exec(p.data) : null;
      if (m && Number(m[1]) === id) {
        engine.off('packet', onPacket);
        resolve((JSON.parse(m[2]) as Ack[])[0]);
      }
    };
    engine.on('packet', onPacket);
    engine.write(`2${id}${text}`);
    setTimeout(() => { engine.off('packet', onPacket); resolve(null); }, waitMs);
  });
}

async function serverAlive(): Promise<boolean> {
  if (srv.child.exitCode !== null) return false;
  const res = await fetch(`${srv.url}/api/health`).catch(() => null);
  return res?.status === 200;
}

function expectRefused(ack: Ack | null, what: string, code?: string) {
  expect(ack, `${what}: an answer`).not.toBeNull();
  expect(ack!.ok, `${what}: ${JSON.stringify(ack).slice(0, 200)}`).toBe(false);
  expect(ack!.error?.code, `${what}: error.code`).toEqual(code ?? expect.any(String));
  expect(ack!.error?.message, `${what}: error.message`).toEqual(expect.any(String));
  expect(JSON.stringify(ack), `${what}: no stack trace`).not.toMatch(/node_modules|\.ts:\d+|\n\s+at /);
}

beforeAll(async () => {
  t = await createTestDatabase();
  srv = await startServerProcess(t.url);
  ada = await signInLive(srv.url, 'ada-demo');
  ben = await signInLive(srv.url, 'ben-demo');
  dee = await signInLive(srv.url, 'dee-hostile');
  const res = await ada.post('/api/projects').send({ title: 'Hostile sockets (test)', sheet: dividerSheet() });
  expect(res.status).toBe(201);
  projectId = res.body.id;
  await t.database.db.insert(memberships).values({ projectId, userId: ben.id, role: 'viewer' });
}, 60_000);

afterAll(async () => {
  for (const s of open) s.close();
  await srv?.stop();
  await t?.drop();
});

describe('the handshake', () => {
  it('refuses a socket without a session, of another protocol, or from another site', async () => {
    const anon = socketFor(null);
    const e1 = await new Promise<Error & { data?: { code: string } }>((r) => anon.once('connect_error', r));
    expect(e1.data?.code).toBe('signed_out');
    const old = socketFor(ada, { protocol: SYNC_PROTOCOL_VERSION + 99 });
    const e2 = await new Promise<Error & { data?: { code: string } }>((r) => old.once('connect_error', r));
    expect(e2.data?.code).toBe('protocol');
    const foreign = socketFor(ada, { origin: 'https://evil.example' });
    await new Promise((r) => foreign.once('connect_error', r));
    expect(foreign.connected).toBe(false);
  });
});

describe('sheet:join', () => {
  const malformed: [string, unknown][] = [
    ['nothing', undefined], ['null', null], ['a number', 42], ['a string', 'join me'], ['a list', [projectId]], ['an empty object', {}],
    ['a project id that is not a UUID', { projectId: 'project-1' }],
    ['SQL as the project id', { projectId: "' OR '1'='1'; DROP TABLE projects; --" }],
    ['a number as the project id', { projectId: 1 }],
    ['an unknown field', { get projectId() { return projectId; }, admin: true }],
    ['a negative sinceVersion', { get projectId() { return projectId; }, sinceVersion: -1 }],
    ['a string sinceVersion', { get projectId() { return projectId; }, sinceVersion: '1' }],
    ['1001 pending batch ids', { get projectId() { return projectId; }, pendingBatchIds: Array.from({ length: 1001 }, (_, i) => `batch-${i}-xxxx`) }],
    ['a pending batch id that is a number', { get projectId() { return projectId; }, pendingBatchIds: [12345678] }],
  ];
  it.each(malformed)('%s: invalid_request, database unchanged', async (what, payload) => {
    const s = await connected(ada);
    const before = await snapshotTables(t.database);
    expectRefused(await ask(s, 'sheet:join', payload && typeof payload === 'object' && !Array.isArray(payload) ? { ...payload } : payload), what, 'invalid_request');
    expect(await snapshotTables(t.database)).toBe(before);
  });

  it('an unknown project, and a project one is not a member of, are both not_found', async () => {
    const s = await connected(dee);
    expectRefused(await ask(s, 'sheet:join', { projectId: randomUUID() }), 'unknown project', 'not_found');
    expectRefused(await ask(s, 'sheet:join', { projectId }), 'non-member', 'not_found');
  });
});

/** A socket of ada's joined to the project at its current version. */
async function joined(user: LiveUser = ada): Promise<{ s: Socket; version: number }> {
  const s = await connected(user);
  const ack = (await ask(s, 'sheet:join', { projectId })) as Ack & { version: number };
  expect(ack.ok, JSON.stringify(ack).slice(0, 200)).toBe(true);
  return { s, version: ack.version };
}

let batch = 0;
const batchId = () => `hostile-${process.pid}-${++batch}`;
const setTitle = (value: unknown) => [{ op: 'set', target: 'sheet', path: ['title'], value }];

describe('sheet:op', () => {
  it('before joining, or for another project: not_joined', async () => {
    const s = await connected(ada);
    const before = await snapshotTables(t.database);
    expectRefused(await ask(s, 'sheet:op', { projectId, baseVersion: 1, batchId: batchId(), ops: setTitle('x') }), 'not joined', 'not_joined');
    expectRefused(await ask(s, 'sheet:op', { projectId: randomUUID(), baseVersion: 1, batchId: batchId(), ops: setTitle('x') }), 'unknown project', 'not_joined');
    expect(await snapshotTables(t.database)).toBe(before);
  });

  it('malformed batches: invalid_request each, database unchanged', async () => {
    const { s, version } = await joined();
    const ok = () => ({ projectId, baseVersion: version, batchId: batchId(), ops: setTitle('fine') });
    const cases: [string, unknown][] = [
      ['nothing', undefined], ['null', null], ['a string', 'ops'], ['a list', [ok()]], ['an empty object', {}],
      ['no ops', { ...ok(), ops: undefined }], ['empty ops', { ...ok(), ops: [] }], ['ops as a string', { ...ok(), ops: 'remove everything' }],
      ['baseVersion as a string', { ...ok(), baseVersion: String(version) }], ['a negative baseVersion', { ...ok(), baseVersion: -1 }], ['a fractional baseVersion', { ...ok(), baseVersion: 1.5 }],
      ['a short batchId', { ...ok(), batchId: 'b1' }], ['a 101-character batchId', { ...ok(), batchId: 'b'.repeat(101) }],
      ['an unknown field', { ...ok(), sudo: true }],
      ['a whole-sheet replace (server-only)', { ...ok(), ops: [{ op: 'replaceSheet', sheet: dividerSheet() }] }],
      ['an unknown op', { ...ok(), ops: [{ op: 'drop', coll: 'parts' }] }],
      ['an unknown collection', { ...ok(), ops: [{ op: 'remove', coll: 'users', id: '1' }] }],
      ['a __proto__ path', { ...ok(), ops: [{ op: 'set', target: 'sheet', path: ['__proto__', 'polluted'], value: true }] }],
      ['a constructor path', { ...ok(), ops: [{ op: 'set', target: { coll: 'parts', id: 'R1' }, path: ['constructor', 'prototype'], value: 1 }] }],
      ['an empty path', { ...ok(), ops: [{ op: 'set', target: 'sheet', path: [], value: 1 }] }],
      ['a 9-level path', { ...ok(), ops: [{ op: 'set', target: 'sheet', path: Array(9).fill('a'), value: 1 }] }],
      ['an extra key in an op', { ...ok(), ops: [{ op: 'remove', coll: 'parts', id: 'R1', force: true }] }],
      ['a 101-character element id', { ...ok(), ops: [{ op: 'remove', coll: 'parts', id: 'R'.repeat(101) }] }],
      [`${MAX_OPS_PER_BATCH + 1} ops in one batch`, { ...ok(), ops: Array.from({ length: MAX_OPS_PER_BATCH + 1 }, (_, i) => ({ op: 'set', target: 'sheet', path: ['title'], value: `t${i}` })) }],
      ['binary data as ops', { ...ok(), ops: Buffer.from('not ops') }],
    ];
    for (const [what, payload] of cases) {
      const before = await snapshotTables(t.database);
      expectRefused(await ask(s, 'sheet:op', payload), what, 'invalid_request');
      expect(await snapshotTables(t.database), `${what}: database unchanged`).toBe(before);
    }
    expect(({} as Record<string, unknown>).polluted, 'Object.prototype untouched').toBeUndefined();
  });

  it('batches that do not apply: conflict, invalid_sheet, stale; a viewer: forbidden; nothing stored', async () => {
    const { s, version } = await joined();
    const viewer = await joined(ben);
    const cases: [string, Socket, unknown, string][] = [
      // (Removing a part that is already gone succeeds by design: docs/co-editing.md.)
      ['changing a part that is not there', s, { projectId, baseVersion: version, batchId: batchId(), ops: [{ op: 'set', target: { coll: 'parts', id: 'R99' }, path: ['label'], value: 'x' }] }, 'conflict'],
      ['moving a part that is not there', s, { projectId, baseVersion: version, batchId: batchId(), ops: [{ op: 'move', coll: 'parts', id: 'R99', after: null }] }, 'conflict'],
      ['a negative resistance', s, { projectId, baseVersion: version, batchId: batchId(), ops: [{ op: 'set', target: { coll: 'parts', id: 'R1' }, path: ['params', 'resistance'], value: -5 }] }, 'invalid_sheet'],
      ['a part id with a space', s, { projectId, baseVersion: version, batchId: batchId(), ops: [{ op: 'set', target: { coll: 'parts', id: 'R1' }, path: ['id'], value: 'R 1' }] }, 'invalid_request'],
      ['a baseVersion from the future', s, { projectId, baseVersion: 2 ** 40, batchId: batchId(), ops: setTitle('future') }, 'stale'],
      ['a viewer editing', viewer.s, { projectId, baseVersion: version, batchId: batchId(), ops: setTitle('viewer was here') }, 'forbidden'],
    ];
    for (const [what, socket, payload, code] of cases) {
      const before = await snapshotTables(t.database);
      const ack = await ask(socket, 'sheet:op', payload);
      expect(ack.ok, `${what}: ${JSON.stringify(ack).slice(0, 200)}`).toBe(false);
      expect([code, 'invalid_sheet', 'invalid_request'], `${what}: code ${ack.error?.code}`).toContain(ack.error?.code);
      if (code !== 'invalid_request') expect(ack.error?.code, what).toBe(code);
      expect(await snapshotTables(t.database), `${what}: database unchanged`).toBe(before);
    }
  });

  it('SQL and script text in an op value is stored verbatim (the control: this path writes)', async () => {
    const { s, version } = await joined();
    const text = `Robert'); DROP TABLE sheet_ops; -- <script>alert(1)</script> 🔋`;
    const ack = await ask(s, 'sheet:op', { projectId, baseVersion: version, batchId: batchId(), ops: setTitle(text) });
    expect(ack, JSON.stringify(ack)).toMatchObject({ ok: true, version: version + 1 });
    const { rows } = await t.database.pool.query('select sheet->>\'title\' as title, version from projects where id = $1', [projectId]);
    expect(rows[0]).toEqual({ title: text, version: version + 1 });
  });

  it('a message over the 1 MB socket limit ends that connection only; nothing is stored and the server goes on', async () => {
    const { s, version } = await joined();
    const before = await snapshotTables(t.database);
    const gone = new Promise<string>((r) => s.once('disconnect', r));
    s.emit('sheet:op', { projectId, baseVersion: version, batchId: batchId(), ops: setTitle('x'.repeat(1_100_000)) }, () => undefined);
    expect(await gone).toMatch(/transport (close|error)/);
    expect(await snapshotTables(t.database)).toBe(before);
    expect(await serverAlive()).toBe(true);
    await joined();
  });

  it('an op sent without an ack callback, or an unknown event, is ignored without harm', async () => {
    const { s, version } = await joined();
    const before = await snapshotTables(t.database);
    s.emit('sheet:op', { nonsense: true });
    s.emit('sheet:op', { projectId, baseVersion: version, batchId: batchId(), ops: [{ op: 'move', coll: 'parts', id: 'R99', after: null }] });
    s.emit('admin:drop-all', { projectId });
    s.emit('sheet:join');
    await new Promise((r) => setTimeout(r, 300));
    expect(s.connected).toBe(true);
    expect(await snapshotTables(t.database)).toBe(before);
  });
});

describe('text the database cannot store, in an op', () => {
  // Once (server/realtime/commit.ts): the op passed validation, the INSERT into jsonb failed
  // (22P05 for \u0000, 22P02 for a lone surrogate), and the batch was answered 'unavailable',
  // which tells the client to send it again, for ever.
  it('leaves the database unchanged', async () => {
    const { s, version } = await joined();
    for (const value of ['a\u0000b', 'lone\uD800']) {
      const before = await snapshotTables(t.database);
      const ack = await ask(s, 'sheet:op', { projectId, baseVersion: version, batchId: batchId(), ops: setTitle(value) });
      expect(ack.ok).toBe(false);
      expect(await snapshotTables(t.database)).toBe(before);
    }
  });

  it('is refused as a bad request, not as "database unavailable, send again"', async () => {
    const { s, version } = await joined();
    for (const value of ['a\u0000b', 'lone\uD800']) {
      const ack = await ask(s, 'sheet:op', { projectId, baseVersion: version, batchId: batchId(), ops: setTitle(value) });
      expect(['invalid_request', 'invalid_sheet']).toContain(ack.error?.code);
    }
  });
});

describe('nesting deep enough to overflow a recursive validator', () => {
  const deep = `${'['.repeat(50_000)}${']'.repeat(50_000)}`;
  const packets = () => [
    ['sheet:op', `["sheet:op",{"projectId":"${projectId}","baseVersion":1,"batchId":"deep-batch-1","ops":[{"op":"set","target":"sheet","path":["x"],"value":${deep}}]}]`],
    ['sheet:join', `["sheet:join",{"projectId":"${projectId}","sinceVersion":${deep}}]`],
    ['presence:update', `["presence:update",{"projectId":"${projectId}","cursor":${deep}}]`],
  ] as const;

  it('the server process survives, stores nothing, and serves the next request', async () => {
    const { s } = await joined();
    const before = await snapshotTables(t.database);
    let id = 7000;
    for (const [, text] of packets()) await rawAsk(s, ++id, text, 500);
    expect(await serverAlive(), `server output:\n${srv.output().slice(-1500)}`).toBe(true);
    expect(await snapshotTables(t.database)).toBe(before);
    await joined();
  });

  // Once (server/realtime/handlers.ts, via shared/sync/protocol.ts z.json()): zod's recursive
  // JSON schema overflowed the stack on ~100 kB of nested arrays inside the async handler; the
  // rejection was unhandled, so one message from any signed-in user ended the whole process.
  it('is answered with invalid_request', async () => {
    const { s } = await joined();
    const [, opText] = packets()[0];
    expectRefused(await rawAsk(s, 8001, opText), 'deep sheet:op', 'invalid_request');
  });
});

describe('presence:update', () => {
  it('malformed updates are dropped: nothing is broadcast and nothing stored; a valid one is broadcast (control)', async () => {
    const watcher = await joined();
    const sender = await joined(ben);
    const seen: unknown[] = [];
    watcher.s.on('presence', (m) => seen.push(m));
    await new Promise((r) => setTimeout(r, 200));
    seen.length = 0;
    const before = await snapshotTables(t.database);
    const bad: unknown[] = [
      undefined, null, 'here', 42, [], {},
      { projectId: 'not-a-uuid', cursor: { x: 1, y: 1 } },
      { projectId: randomUUID(), cursor: { x: 1, y: 1 } },
      { projectId, cursor: { x: 'left', y: 1 } },
      { projectId, cursor: { x: 1e9, y: 0 } },
      { projectId, cursor: { x: 1, y: 1, z: 1 } },
      { projectId, selection: { parts: Array(2001).fill('R1'), wires: [] } },
      { projectId, selection: { parts: ['<script>'.repeat(20)], wires: [] } },
      { projectId, selection: 'all' },
      { projectId, cursor: { x: 1, y: 1 }, user: { login: 'someone-else' } },
    ];
    for (const p of bad) sender.s.emit('presence:update', p);
    await new Promise((r) => setTimeout(r, 500));
    expect(seen, 'no broadcast for a malformed update').toEqual([]);
    sender.s.emit('presence:update', { projectId, cursor: { x: 10, y: 20 }, selection: { parts: ['R1'], wires: [] } });
    await new Promise((r) => setTimeout(r, 500));
    expect(seen).toEqual([{ projectId, peer: expect.objectContaining({ user: expect.objectContaining({ login: 'ben-demo' }), cursor: { x: 10, y: 20 } }) }]);
    expect(await snapshotTables(t.database)).toBe(before);
  });
});
