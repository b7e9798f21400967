// Several server processes (real `tsx server/main.ts` children) on one database, sharing rooms
// through the socket.io PostgreSQL adapter; and a process killed with SIGKILL mid-stream.
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { parseSheet } from '../../shared/sheet';
import type { JsonObject } from '../../shared/sync';
import { createTestDatabase, type TestDatabase } from '../support/db';
import { dividerSheet } from './fixtures';
import { eventually, openSheet, replay, signInLive, type LiveClient, type LiveUser } from './realtime-harness';
import { startServerProcess, type ServerProcess } from './realtime-processes';
import { memberships } from '../../server/db/schema';

let t: TestDatabase;
let a: ServerProcess;
let b: ServerProcess;
let ada: LiveUser;
let ben: LiveUser;

beforeAll(async () => {
  t = await createTestDatabase();
  [a, b] = await Promise.all([startServerProcess(t.url), startServerProcess(t.url)]);
  ada = await signInLive(a.url, 'ada-demo');
  ben = await signInLive(b.url, 'ben-demo');
}, 90_000);
afterAll(async () => {
  await Promise.all([a?.stop(), b?.stop()]);
  await t?.drop();
});

const initial = () => dividerSheet('Two-process divider (test)') as unknown as JsonObject;

async function sharedProject(): Promise<string> {
  const res = await ada.post('/api/projects').send({ title: 'Cluster (test)', sheet: initial() });
  expect(res.status).toBe(201);
  await t.database.db.insert(memberships).values({ projectId: res.body.id, userId: ben.id, role: 'editor' });
  return res.body.id;
}

async function stored(projectId: string) {
  const p = await t.database.pool.query<{ version: number; sheet: JsonObject }>('select version, sheet from projects where id = $1', [projectId]);
  const log = await t.database.pool.query('select version, ops, batch_id from sheet_ops where project_id = $1 order by version', [projectId]);
  return { version: p.rows[0].version, sheet: p.rows[0].sheet, log: log.rows as { version: number; ops: never; batch_id: string }[] };
}

const r1x = (c: LiveClient) => ((c.client.document!.parts as JsonObject[]).find((p) => p.id === 'R1')!.position as JsonObject).x;

describe('two server processes behind the PostgreSQL adapter', () => {
  it('an edit on one process reaches a client of the other, both ways, with presence', async () => {
    const projectId = await sharedProject();
    const onA = await openSheet(a.url, ada, projectId);
    const onB = await openSheet(b.url, ben, projectId);
    await eventually('ada (on A) sees ben (on B) arrive', () => onA.client.peers.some((p) => p.user.login === 'ben-demo'));
    onA.client.push([{ op: 'set', target: { coll: 'parts', id: 'R1' }, path: ['position'], value: { x: 321, y: 0 } }]);
    await eventually('the move reaches process B', () => onB.client.version === 2 && r1x(onB) === 321);
    onB.client.push([{ op: 'set', target: 'sheet', path: ['title'], value: 'edited on B' }]);
    await eventually('the title reaches process A', () => onA.client.document?.title === 'edited on B');
    onB.client.updatePresence({ cursor: { x: 40, y: 60 } });
    await eventually('ben’s cursor reaches process A', () => onA.client.peers.some((p) => p.user.login === 'ben-demo' && p.cursor?.x === 40));
    onA.stop();
    onB.stop();
  });

  it('SIGKILL of a process in the middle of a stream of edits: no acknowledged batch is lost, clients reconnect and converge', async () => {
    const projectId = await sharedProject();
    const onA = await openSheet(a.url, ada, projectId);
    const onB = await openSheet(b.url, ben, projectId);
    let stop = false;
    const last: Record<string, number> = {};
    const stream = (c: LiveClient, id: string) =>
      (async () => {
        for (let k = 1; !stop && k < 2000; k++) {
          c.client.push([{ op: 'set', target: { coll: 'parts', id }, path: ['position'], value: { x: k, y: k % 7 } }]);
          last[id] = k;
          await new Promise((r) => setTimeout(r, 4));
        }
      })();
    const streams = [stream(onA, 'R1'), stream(onB, 'R2')];
    await eventually('edits flow', () => onA.acked.size > 20 && onB.acked.size > 20);
    const port = a.port;
    await a.kill();
    await eventually('the client of the killed process notices', () => onA.client.status === 'offline');
    await new Promise((r) => setTimeout(r, 300)); // ada keeps editing while offline
    a = await startServerProcess(t.url, port);
    await eventually('ada reconnects', () => onA.client.status === 'live', 20_000);
    await new Promise((r) => setTimeout(r, 300));
    stop = true;
    await Promise.all(streams);
    await Promise.all([onA.client.whenIdle(), onB.client.whenIdle()]);
    const { version } = await stored(projectId);
    await eventually('both at the stored version', () => onA.client.version === version && onB.client.version === version);
    const s = await stored(projectId);
    for (const c of [onA, onB]) {
      expect(c.client.document).toEqual(s.sheet);
      for (const [batchId, v] of c.acked) expect(s.log.find((l) => l.batch_id === batchId)?.version, `acknowledged ${batchId}`).toBe(v);
    }
    expect(replay(initial(), s.log)).toEqual(s.sheet);
    expect(parseSheet(s.sheet).ok).toBe(true);
    // Each user's last move is the stored one: edits made while offline were kept and sent.
    expect(r1x(onA)).toBe(last.R1);
    expect(((s.sheet.parts as JsonObject[]).find((p) => p.id === 'R2')!.position as JsonObject).x).toBe(last.R2);
    onA.stop();
    onB.stop();
  }, 90_000);
});
