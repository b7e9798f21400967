// The sync client over an in-memory network: random concurrent edits, random delivery order
// (FIFO per connection, as socket.io guarantees), dropped connections. Every client must end
// with the server's document, and every batch the server acknowledged must be in its log.
import { describe, expect, it } from 'vitest';
import fc from 'fast-check';
import { produce } from 'immer';
import { parseSheet } from '../../../shared/sheet';
import { applyOps, diffSheets, SyncClient, type JsonObject, type SyncNotice } from '../../../shared/sync';
import { MemoryServer, MemoryTransport, rng, settle } from './memory-net';
import { applyEdit, divider, editArb, type Edit } from './sheets';

interface Peer {
  client: SyncClient;
  transport: MemoryTransport;
  notices: SyncNotice[];
}

async function startPeers(server: MemoryServer, n: number): Promise<Peer[]> {
  const peers: Peer[] = [];
  for (let i = 0; i < n; i++) {
    const transport = new MemoryTransport(server, `user${i}`);
    const client = new SyncClient({ projectId: '00000000-0000-4000-8000-000000000000', transport, validate: (d) => parseSheet(d).ok, clientId: `client${i}` });
    const notices: SyncNotice[] = [];
    client.on('notice', (x) => notices.push(x));
    const started = client.start();
    await settle();
    for (const f of transport.toServer.splice(0)) f();
    for (const f of transport.toClient.splice(0)) f();
    await started;
    peers.push({ client, transport, notices });
  }
  return peers;
}

/** One local edit, as the editor binding would push it: diff of the user's document before and after. */
function edit(p: Peer, e: Edit, prefix: string): void {
  const before = p.client.document!;
  let ok = false;
  const after = produce(before, (d) => {
    ok = applyEdit(d as JsonObject, e, prefix);
  });
  if (!ok || !parseSheet(after).ok) return;
  p.client.push(diffSheets(before, after));
}

async function deliverAll(peers: Peer[]): Promise<void> {
  for (let guard = 0; guard < 10_000; guard++) {
    await settle();
    const busy = peers.find((p) => p.transport.toServer.length || p.transport.toClient.length);
    if (!busy) return;
    for (const f of busy.transport.toServer.splice(0)) f();
    await settle();
    for (const f of busy.transport.toClient.splice(0)) f();
  }
  throw new Error('network did not go quiet');
}

function replayLog(server: MemoryServer): JsonObject {
  let doc = server.initial;
  for (const b of server.log) {
    const r = applyOps(doc, b.ops);
    if (!r.ok) throw new Error(`log does not replay at version ${b.version}: ${r.error.message}`);
    doc = r.doc;
  }
  return doc;
}

async function run(seed: number, edits: Edit[], clients: number, withDrops: boolean, sharedIds: boolean) {
  const random = rng(seed);
  const server = new MemoryServer(divider());
  const peers = await startPeers(server, clients);
  for (const e of edits) {
    const p = peers[Math.floor(random() * peers.length)];
    const roll = random();
    if (roll < 0.45 && p.transport.connected) edit(p, e, sharedIds ? 'RS' : `R${p.transport.user}x`);
    else if (roll < 0.9) {
      const q = peers[Math.floor(random() * peers.length)];
      const f = (random() < 0.5 ? q.transport.toServer : q.transport.toClient).shift();
      f?.();
    } else if (withDrops && p.transport.connected) p.transport.drop(random() < 0.5);
    else if (!p.transport.connected) p.transport.reconnect();
    await settle();
  }
  for (const p of peers) if (!p.transport.connected) p.transport.reconnect();
  await deliverAll(peers);
  await Promise.all(peers.map((p) => p.client.whenIdle()));
  await deliverAll(peers);
  return { server, peers };
}

describe('SyncClient convergence (in-memory server)', () => {
  it('two and five clients end with the server document; every accepted batch is in the log', async () => {
    // fast-check drives the edits and the seed of the delivery order; the oracle is the server's
    // document and a replay of its log from the first version.
    await fc.assert(
      fc.asyncProperty(fc.integer(), fc.array(editArb, { minLength: 5, maxLength: 60 }), fc.constantFrom(2, 5), fc.boolean(), async (seed, edits, n, drops) => {
        const { server, peers } = await run(seed, edits, n, drops, false);
        expect(replayLog(server)).toEqual(server.doc);
        for (const p of peers) {
          expect(p.client.version).toBe(server.version);
          expect(p.client.confirmedDocument).toEqual(server.doc);
          expect(p.client.document).toEqual(server.doc);
          expect(p.client.pendingCount).toBe(0);
          const logged = new Map(server.log.map((b) => [b.batchId, b.version]));
          for (const [batchId, version] of p.transport.accepted) expect(logged.get(batchId)).toBe(version);
        }
        for (const p of peers) p.client.stop();
      }),
      { numRuns: 150 },
    );
  });

  it('converges when clients race for the same new part id (one wins, the other is told)', async () => {
    await fc.assert(
      fc.asyncProperty(fc.integer(), fc.array(editArb, { minLength: 5, maxLength: 40 }), async (seed, edits) => {
        const { server, peers } = await run(seed, edits, 3, false, true);
        for (const p of peers) expect(p.client.document).toEqual(server.doc);
        for (const p of peers) p.client.stop();
      }),
      { numRuns: 80 },
    );
  });
});

describe('SyncClient pending edits', () => {
  it('shows a local edit at once and keeps it on top of a remote edit that arrives first', async () => {
    const server = new MemoryServer(divider());
    const [a, b] = await startPeers(server, 2);
    a.client.push([{ op: 'set', target: { coll: 'parts', id: 'R1' }, path: ['position'], value: { x: 1, y: 1 } }]);
    b.client.push([{ op: 'set', target: { coll: 'parts', id: 'R1' }, path: ['position'], value: { x: 2, y: 2 } }]);
    const pos = (doc: JsonObject | null) => (doc!.parts as JsonObject[]).find((p) => p.id === 'R1')!.position;
    expect(pos(a.client.document)).toEqual({ x: 1, y: 1 });
    // b's batch reaches the server first; a then sees b's move under its own pending one...
    for (const f of b.transport.toServer.splice(0)) f();
    for (const f of a.transport.toClient.splice(0)) f();
    await settle();
    expect(pos(a.client.document)).toEqual({ x: 1, y: 1 });
    expect(pos(a.client.confirmedDocument)).toEqual({ x: 2, y: 2 });
    // ...and the server applies a's after b's, so a's move wins everywhere.
    await deliverAll([a, b]);
    expect(pos(b.client.document)).toEqual({ x: 1, y: 1 });
    expect(server.doc).toEqual(a.client.document);
  });

  it('drops a change to a part another user removed, with a notice naming the part', async () => {
    const server = new MemoryServer(divider());
    const [a, b] = await startPeers(server, 2);
    b.client.push([{ op: 'remove', coll: 'parts', id: 'R2' }]);
    for (const f of b.transport.toServer.splice(0)) f();
    a.client.push([{ op: 'set', target: { coll: 'parts', id: 'R2' }, path: ['params', 'resistance'], value: 4700 }]);
    await deliverAll([a, b]);
    expect(a.client.document).toEqual(server.doc);
    expect((server.doc.parts as JsonObject[]).map((p) => p.id)).toEqual(['V1', 'R1', 'GND']);
    expect(a.notices.map((n) => n.message).join('\n')).toMatch(/part R2 is no longer on the sheet/);
  });

  it('after a dropped connection, a batch the server did commit is not sent twice', async () => {
    const server = new MemoryServer(divider());
    const [a, b] = await startPeers(server, 2);
    a.client.push([{ op: 'set', target: 'sheet', path: ['title'], value: 'first' }]);
    a.transport.drop(true); // the batch reached the server, the answer was lost
    b.client.push([{ op: 'set', target: 'sheet', path: ['title'], value: 'second' }]);
    await deliverAll([a, b]);
    a.transport.reconnect();
    await deliverAll([a, b]);
    await a.client.whenIdle();
    expect(server.log.map((l) => l.ops[0])).toEqual([
      { op: 'set', target: 'sheet', path: ['title'], value: 'first' },
      { op: 'set', target: 'sheet', path: ['title'], value: 'second' },
    ]);
    expect(a.client.document!.title).toBe('second');
  });

  it('a viewer cannot queue edits', async () => {
    const server = new MemoryServer(divider());
    server.roles.set('user0', 'viewer');
    const [v] = await startPeers(server, 1);
    expect(v.client.role).toBe('viewer');
    expect(v.client.push([{ op: 'set', target: 'sheet', path: ['title'], value: 'x' }])).toBe(false);
    expect(v.transport.toServer).toHaveLength(0);
  });
});
