// Several real socket.io clients editing one sheet at the same time (moves, value edits, wiring,
// deletes of parts others are editing): every client must end with the document in the database,
// every acknowledged batch must be in the log, and the log must rebuild the stored sheet.
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { produce } from 'immer';
import { parseSheet } from '../../shared/sheet';
import { diffSheets, type JsonObject } from '../../shared/sync';
import { applyEdit, type Edit } from '../unit/sync/sheets';
import { dividerSheet } from './fixtures';
import { createSharedProject, eventually, openSheet, replay, signInLive, storedProject, startLiveServer, type LiveClient, type LiveServer, type LiveUser } from './realtime-harness';

let live: LiveServer;
let users: LiveUser[];

beforeAll(async () => {
  live = await startLiveServer();
  users = [];
  for (const login of ['ada-demo', 'ben-demo', 'cyd-cc', 'dee-cc', 'eve-cc']) users.push(await signInLive(live.url, login));
});
afterAll(async () => {
  await live?.close();
});

const initial = () => dividerSheet('Concurrent divider (test)') as unknown as JsonObject;
const pause = (ms: number) => new Promise((r) => setTimeout(r, ms));

/** Deterministic pseudo-random numbers (mulberry32), so a failure can be replayed. */
function rng(seed: number): () => number {
  let a = seed >>> 0;
  return () => {
    a = (a + 0x6d2b79f5) >>> 0;
    let t = Math.imul(a ^ (a >>> 15), a | 1);
    t ^= t + Math.imul(t ^ (t >>> 7), t | 61);
    return ((t ^ (t >>> 14)) >>> 0) / 4294967296;
  };
}

function randomEdit(r: () => number): Edit {
  const n = () => Math.floor(r() * 1000);
  const pick = r();
  if (pick < 0.3) return { kind: 'move', pick: n(), x: n() - 500, y: n() - 500 };
  if (pick < 0.55) return { kind: 'value', pick: n(), value: 100 + n() * 10 };
  if (pick < 0.7) return { kind: 'add', at: n(), value: 1000 + n() };
  if (pick < 0.82) return { kind: 'wire', a: n(), b: n() };
  if (pick < 0.92) return { kind: 'delete', pick: n() };
  return { kind: 'unwire', pick: n() };
}

/** One local edit, as the editor would make it: on the user's current document, pushed as a diff. */
function edit(c: LiveClient, e: Edit, prefix: string): void {
  const before = c.client.document!;
  let changed = false;
  const after = produce(before, (d) => {
    changed = applyEdit(d as JsonObject, e, prefix);
  });
  if (changed && parseSheet(after).ok) c.client.push(diffSheets(before, after));
}

async function settleAll(clients: LiveClient[], projectId: string) {
  await Promise.all(clients.map((c) => c.client.whenIdle()));
  const { version } = await storedProject(live, projectId);
  await eventually('every client reaches the stored version', () => clients.every((c) => c.client.version === version));
}

async function expectConverged(clients: LiveClient[], projectId: string) {
  await settleAll(clients, projectId);
  const stored = await storedProject(live, projectId);
  for (const c of clients) {
    expect(c.client.confirmedDocument, `${c.user.login}'s copy of the server document`).toEqual(stored.sheet);
    expect(c.client.document, `${c.user.login}'s view`).toEqual(stored.sheet);
    for (const [batchId, version] of c.acked) expect(stored.log.find((l) => l.batch_id === batchId)?.version, `acknowledged batch ${batchId}`).toBe(version);
  }
  expect(replay(initial(), stored.log)).toEqual(stored.sheet);
  expect(parseSheet(stored.sheet).ok).toBe(true);
  return stored;
}

async function randomSession(n: number, editsEach: number, seed: number) {
  const projectId = await createSharedProject(live, users[0], initial(), users.slice(1, n).map((u) => [u, 'editor'] as [LiveUser, 'editor']));
  const clients = await Promise.all(users.slice(0, n).map((u) => openSheet(live.url, u, projectId)));
  await Promise.all(
    clients.map(async (c, i) => {
      const r = rng(seed + i);
      for (let k = 0; k < editsEach; k++) {
        edit(c, randomEdit(r), `R${i}x`);
        await pause(r() * 8);
      }
    }),
  );
  const stored = await expectConverged(clients, projectId);
  for (const c of clients) c.stop();
  return { stored, clients };
}

describe('concurrent editing over real sockets', () => {
  it('two clients, 80 random edits each, converge on the stored document', async () => {
    const { stored, clients } = await randomSession(2, 80, 1001);
    // Batches queued while one is in flight go out as one, so there are fewer versions than edits.
    expect(stored.log.length).toBeGreaterThan(20);
    expect([...clients[0].acked.keys()].length + [...clients[1].acked.keys()].length).toBe(stored.log.length);
  });

  it('five clients, 50 random edits each, converge on the stored document', async () => {
    const { stored, clients } = await randomSession(5, 50, 2002);
    expect(stored.log.length).toBeGreaterThan(20);
    expect(clients.reduce((n, c) => n + c.acked.size, 0)).toBe(stored.log.length);
  });

  it('a part deleted while others move it and change its value is gone everywhere', async () => {
    const projectId = await createSharedProject(live, users[0], initial(), [
      [users[1], 'editor'],
      [users[2], 'editor'],
    ]);
    const [mover, deleter, valuer] = await Promise.all(users.slice(0, 3).map((u) => openSheet(live.url, u, projectId)));
    const drag = (async () => {
      for (let k = 0; k < 40 && mover.client.document && (mover.client.document.parts as JsonObject[]).some((p) => p.id === 'R1'); k++) {
        mover.client.push([{ op: 'set', target: { coll: 'parts', id: 'R1' }, path: ['position'], value: { x: 100 + k, y: 0 } }]);
        await pause(3);
      }
    })();
    const values = (async () => {
      for (let k = 0; k < 20; k++) {
        if (!(valuer.client.document!.parts as JsonObject[]).some((p) => p.id === 'R1')) break;
        valuer.client.push([{ op: 'set', target: { coll: 'parts', id: 'R1' }, path: ['params', 'resistance'], value: 1000 + k }]);
        await pause(5);
      }
    })();
    await pause(40);
    deleter.client.push([
      { op: 'remove', coll: 'wires', id: 'w1' },
      { op: 'remove', coll: 'wires', id: 'w2' },
      { op: 'remove', coll: 'parts', id: 'R1' },
    ]);
    await Promise.all([drag, values]);
    const stored = await expectConverged([mover, deleter, valuer], projectId);
    expect((stored.sheet.parts as JsonObject[]).map((p) => p.id)).toEqual(['V1', 'R2', 'GND']);
    expect((stored.sheet.wires as JsonObject[]).map((w) => w.id)).toEqual(['w3', 'w4']);
    // Any notice the others got names the part (whether one had an edit on the wire at that moment depends on timing).
    for (const n of [...mover.notices, ...valuer.notices]) expect(n).toMatch(/part R1 is no longer on the sheet/);
    for (const c of [mover, deleter, valuer]) c.stop();
  });
});
