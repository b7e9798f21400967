// Live co-editing over real socket.io connections and a real PostgreSQL: joining, the order of
// operations, refusals, roles, sign-out, and the REST API's changes in the same log.
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { io as connect } from 'socket.io-client';
import { eq, and } from 'drizzle-orm';
import { memberships } from '../../server/db/schema';
import type { JsonObject, OpAck } from '../../shared/sync';
import { dividerSheet } from './fixtures';
import { createSharedProject, eventually, openSheet, replay, signInLive, storedProject, startLiveServer, type LiveServer, type LiveUser } from './realtime-harness';

let live: LiveServer;
let ada: LiveUser;
let ben: LiveUser;
let cyd: LiveUser;
let dee: LiveUser;

beforeAll(async () => {
  live = await startLiveServer();
  ada = await signInLive(live.url, 'ada-demo');
  ben = await signInLive(live.url, 'ben-demo');
  cyd = await signInLive(live.url, 'cyd-rt');
  dee = await signInLive(live.url, 'dee-rt');
});
afterAll(async () => {
  await live?.close();
});

const sheet = () => dividerSheet('Live divider (test)') as unknown as JsonObject;
const partIds = (doc: JsonObject | null) => (doc!.parts as JsonObject[]).map((p) => p.id);
const param = (doc: JsonObject | null, id: string, name: string) => ((doc!.parts as JsonObject[]).find((p) => p.id === id)!.params as JsonObject)[name];

describe('joining a sheet', () => {
  it('gives a member the sheet, version, role and who else is there; wire ids are filled in', async () => {
    const projectId = await createSharedProject(live, ada, sheet(), [[ben, 'editor']]);
    const a = await openSheet(live.url, ada, projectId);
    const b = await openSheet(live.url, ben, projectId);
    expect(b.client.version).toBe(1);
    expect(b.client.role).toBe('editor');
    expect(partIds(b.client.document)).toEqual(['V1', 'R1', 'R2', 'GND']);
    expect((b.client.document!.wires as JsonObject[]).map((w) => w.id)).toEqual(['w1', 'w2', 'w3', 'w4']);
    expect(b.client.peers.map((p) => p.user.login)).toEqual(['ada-demo']);
    await eventually('ada sees ben arrive', () => a.client.peers.some((p) => p.user.login === 'ben-demo'));
    b.stop();
    await eventually('ben fades from ada’s list', () => a.client.peers.every((p) => p.user.login !== 'ben-demo' || p.leftAt !== null));
    a.stop();
  });

  it('answers not_found to a non-member, who receives nothing of the project', async () => {
    const projectId = await createSharedProject(live, ada, sheet(), []);
    await expect(openSheet(live.url, dee, projectId)).rejects.toThrow(/not shared with you/);
    const a = await openSheet(live.url, ada, projectId);
    const socket = connect(live.url, { transports: ['websocket'], extraHeaders: { cookie: dee.cookie }, forceNew: true });
    const seen: unknown[] = [];
    socket.onAny((...args) => seen.push(args));
    const ack = await socket.timeout(5000).emitWithAck('sheet:join', { projectId });
    expect(ack).toEqual({ ok: false, error: { code: 'not_found', message: expect.any(String) } });
    const op = await socket.timeout(5000).emitWithAck('sheet:op', { projectId, baseVersion: 1, batchId: 'intruder-1', ops: [{ op: 'remove', coll: 'parts', id: 'R1' }] });
    expect(op).toMatchObject({ ok: false, error: { code: 'not_joined' } });
    a.client.push([{ op: 'set', target: 'sheet', path: ['title'], value: 'members only' }]);
    await a.client.whenIdle();
    await new Promise((r) => setTimeout(r, 200));
    expect(seen).toEqual([]);
    socket.close();
    a.stop();
  });

  it('refuses a socket without a signed-in session at the handshake, and a foreign Origin', async () => {
    const anon = connect(live.url, { transports: ['websocket'], forceNew: true, reconnection: false });
    const err = await new Promise<Error & { data?: { code: string } }>((resolve) => anon.on('connect_error', resolve));
    expect(err.data?.code).toBe('signed_out');
    anon.close();
    const foreign = connect(live.url, { transports: ['websocket'], forceNew: true, reconnection: false, extraHeaders: { cookie: ada.cookie, origin: 'https://elsewhere.example' } });
    await new Promise((resolve) => foreign.on('connect_error', resolve));
    expect(foreign.connected).toBe(false);
    foreign.close();
  });
});

describe('operations', () => {
  it('applies in one order, stores every batch before acknowledging, and broadcasts it with its author', async () => {
    const projectId = await createSharedProject(live, ada, sheet(), [[ben, 'editor']]);
    const a = await openSheet(live.url, ada, projectId);
    const b = await openSheet(live.url, ben, projectId);
    const seen: { version: number; author: string | undefined }[] = [];
    b.transport.listen({ op: (m) => seen.push({ version: m.version, author: m.author?.login }) });
    a.client.push([{ op: 'set', target: { coll: 'parts', id: 'R2' }, path: ['params', 'resistance'], value: 2200 }]);
    await a.client.whenIdle();
    const stored = await storedProject(live, projectId);
    expect(stored.version).toBe(2);
    expect(stored.log).toEqual([{ version: 2, ops: [{ op: 'set', target: { coll: 'parts', id: 'R2' }, path: ['params', 'resistance'], value: 2200 }], batch_id: [...a.acked.keys()][0] }]);
    await eventually('ben receives it', () => b.client.version === 2);
    expect(seen).toEqual([{ version: 2, author: 'ada-demo' }]);
    expect(param(b.client.document, 'R2', 'resistance')).toBe(2200);
    a.stop();
    b.stop();
  });

  it('refuses a change to a part someone deleted, with the reason, and the client drops it', async () => {
    const projectId = await createSharedProject(live, ada, sheet(), [[ben, 'editor']]);
    const a = await openSheet(live.url, ada, projectId);
    const b = await openSheet(live.url, ben, projectId);
    b.client.push([{ op: 'remove', coll: 'parts', id: 'R1' }]);
    await b.client.whenIdle();
    // ada has not seen the removal yet when she sends (baseVersion 1).
    const raw = await a.transport.sendOps({ projectId, baseVersion: 1, batchId: 'manual-batch-1', ops: [{ op: 'set', target: { coll: 'parts', id: 'R1' }, path: ['position'], value: { x: 5, y: 5 } }] });
    expect(raw).toEqual({ ok: false, error: { code: 'conflict', message: expect.stringMatching(/part R1 is no longer on the sheet/), opIndex: 0, currentVersion: 2 } });
    // through the client: shown at once, then taken back with a notice
    await eventually('ada is at version 2', () => a.client.version === 2);
    expect((await storedProject(live, projectId)).version).toBe(2);
    a.stop();
    b.stop();
  });

  it('refuses a batch whose result is not a valid sheet, naming the part and field', async () => {
    const projectId = await createSharedProject(live, ada, sheet(), []);
    const a = await openSheet(live.url, ada, projectId);
    const ack = (await a.transport.sendOps({
      projectId,
      baseVersion: 1,
      batchId: 'bad-value-1',
      ops: [{ op: 'set', target: { coll: 'parts', id: 'R1' }, path: ['params', 'resistance'], value: '10k' }],
    })) as Extract<OpAck, { ok: false }>;
    expect(ack.ok).toBe(false);
    expect(ack.error.code).toBe('invalid_sheet');
    expect(ack.error.issues?.[0]).toMatchObject({ partId: 'R1', field: 'resistance' });
    const malformed = await a.transport.sendOps({ projectId, baseVersion: 1, batchId: 'bad-shape-1', ops: [{ op: 'explode' } as never] });
    expect(malformed).toMatchObject({ ok: false, error: { code: 'invalid_request' } });
    expect((await storedProject(live, projectId)).version).toBe(1);
    a.stop();
  });

  it('limits how fast one socket may send: the excess is answered unavailable (the client sends it again later)', async () => {
    const projectId = await createSharedProject(live, ada, sheet(), []);
    const a = await openSheet(live.url, ada, projectId);
    const answers = await Promise.all(
      Array.from({ length: 360 }, (_, k) =>
        a.transport.sendOps({ projectId, baseVersion: 1, batchId: `flood-batch-${k}`, ops: [{ op: 'set', target: 'sheet', path: ['title'], value: `t${k}` }] }),
      ),
    );
    const unavailable = answers.filter((x) => !x.ok && x.error.code === 'unavailable').length;
    expect(unavailable).toBeGreaterThan(20);
    expect(answers.filter((x) => x.ok).length).toBe(360 - unavailable);
    a.stop();
  });

  it('commits a batch sent twice (a reconnect) once', async () => {
    const projectId = await createSharedProject(live, ada, sheet(), []);
    const a = await openSheet(live.url, ada, projectId);
    const req = { projectId, baseVersion: 1, batchId: 'twice-sent-1', ops: [{ op: 'set' as const, target: 'sheet' as const, path: ['title'], value: 'once' }] };
    expect(await a.transport.sendOps(req)).toEqual({ ok: true, version: 2 });
    expect(await a.transport.sendOps(req)).toEqual({ ok: true, version: 2, duplicate: true });
    expect((await storedProject(live, projectId)).log).toHaveLength(1);
    a.stop();
  });
});

describe('roles and sessions', () => {
  it('refuses a viewer’s operations with forbidden, and the viewer still sees others’ edits', async () => {
    const projectId = await createSharedProject(live, ada, sheet(), [[cyd, 'viewer']]);
    const a = await openSheet(live.url, ada, projectId);
    const v = await openSheet(live.url, cyd, projectId);
    expect(v.client.role).toBe('viewer');
    const ack = await v.transport.sendOps({ projectId, baseVersion: 1, batchId: 'viewer-try-1', ops: [{ op: 'remove', coll: 'parts', id: 'R1' }] });
    expect(ack).toEqual({ ok: false, error: { code: 'forbidden', message: expect.stringMatching(/editor role/) } });
    a.client.push([{ op: 'set', target: 'sheet', path: ['title'], value: 'seen by viewers' }]);
    await eventually('viewer receives the edit', () => v.client.document?.title === 'seen by viewers');
    expect(partIds((await storedProject(live, projectId)).sheet)).toContain('R1');
    a.stop();
    v.stop();
  });

  it('checks the role on every batch: demoted to viewer, the next batch is refused and the client is told', async () => {
    const projectId = await createSharedProject(live, ada, sheet(), [[ben, 'editor']]);
    const b = await openSheet(live.url, ben, projectId);
    await live.s.t.database.db.update(memberships).set({ role: 'viewer' }).where(and(eq(memberships.projectId, projectId), eq(memberships.userId, ben.id)));
    await eventually('ben learns he is a viewer', () => b.client.role === 'viewer');
    const ack = await b.transport.sendOps({ projectId, baseVersion: 1, batchId: 'demoted-1', ops: [{ op: 'remove', coll: 'parts', id: 'R1' }] });
    expect(ack).toMatchObject({ ok: false, error: { code: 'forbidden' } });
    b.stop();
  });

  it('closes the sheet for a member who is removed', async () => {
    const projectId = await createSharedProject(live, ada, sheet(), [[ben, 'editor']]);
    const b = await openSheet(live.url, ben, projectId);
    await live.s.t.database.db.delete(memberships).where(and(eq(memberships.projectId, projectId), eq(memberships.userId, ben.id)));
    await eventually('ben’s sheet is closed', () => b.client.status === 'closed');
    expect(b.notices.join(' ')).toMatch(/removed from this project/);
    b.stop();
  });

  it('signing out closes the socket', async () => {
    const eve = await signInLive(live.url, 'eve-rt');
    const projectId = await createSharedProject(live, eve, sheet(), []);
    const e = await openSheet(live.url, eve, projectId);
    const closed = new Promise<string>((resolve) => e.transport.socket.on('disconnect', resolve));
    const out = await eve.post('/auth/logout');
    expect(out.status).toBe(204);
    expect(await closed).toBe('io server disconnect');
    await eventually('the client shows the sheet as closed', () => e.client.status === 'closed');
    expect(e.notices.join(' ')).toMatch(/signed out/);
    e.stop();
  });
});

describe('the REST API and the live log', () => {
  it('a REST save bumps the same version, is logged as a whole-sheet replace, and reaches live clients', async () => {
    const projectId = await createSharedProject(live, ada, sheet(), [[ben, 'editor']]);
    const b = await openSheet(live.url, ben, projectId);
    b.client.push([{ op: 'set', target: { coll: 'parts', id: 'R1' }, path: ['params', 'resistance'], value: 12000 }]);
    await b.client.whenIdle();
    const stale = await ada.patch(`/api/projects/${projectId}`).send({ sheet: sheet(), baseVersion: 1 });
    expect(stale.status).toBe(409);
    const changed = sheet();
    (changed.parts as JsonObject[]).splice(2, 1);
    (changed.wires as JsonObject[]).splice(1, 2);
    const saved = await ada.patch(`/api/projects/${projectId}`).send({ sheet: changed, baseVersion: 2 });
    expect(saved.status).toBe(200);
    expect(saved.body.version).toBe(3);
    const stored = await storedProject(live, projectId);
    expect(stored.log.map((l) => [l.version, l.ops[0].op])).toEqual([
      [2, 'set'],
      [3, 'replaceSheet'],
    ]);
    await eventually('ben receives the REST save', () => b.client.version === 3);
    expect(partIds(b.client.document)).toEqual(['V1', 'R1', 'GND']);
    // and live editing continues on top of it
    b.client.push([{ op: 'set', target: 'sheet', path: ['title'], value: 'after REST' }]);
    await b.client.whenIdle();
    const after = await storedProject(live, projectId);
    expect(after.version).toBe(4);
    expect(replay(sheet(), after.log)).toEqual(after.sheet);
    b.stop();
  });
});

describe('the database notice connection', () => {
  it('comes back after PostgreSQL drops it, and REST saves reach live clients again', async () => {
    const projectId = await createSharedProject(live, ada, sheet(), [[ben, 'editor']]);
    const b = await openSheet(live.url, ben, projectId);
    const pool = live.s.t.database.pool;
    const listeners = "select pid from pg_stat_activity where datname = current_database() and query ilike 'listen tapline_realtime%'";
    const before = (await pool.query<{ pid: number }>(listeners)).rows.map((r) => r.pid);
    expect(before.length).toBeGreaterThan(0);
    await pool.query('select pg_terminate_backend(pid) from unnest($1::int[]) as pid', [before]);
    // A terminated backend can linger in pg_stat_activity with its last query, so wait for a new
    // backend (another pid) that has finished running LISTEN (state idle).
    await eventually('the listener is back', async () =>
      (await pool.query(`${listeners} and state = 'idle' and not (pid = any($1::int[]))`, [before])).rowCount! > 0);
    const changed = sheet();
    changed.title = 'saved over REST after the reconnect';
    expect((await ada.patch(`/api/projects/${projectId}`).send({ sheet: changed, baseVersion: 1 })).status).toBe(200);
    await eventually('ben receives it', () => b.client.document?.title === 'saved over REST after the reconnect');
    b.stop();
  });
});
