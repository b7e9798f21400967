// The server's decision on a group of batches (pure part of the commit path), and replayStep
// (an undo re-applied to a document others changed).
import { describe, expect, it } from 'vitest';
import { decideGroup, type LockedState, type QueuedBatch } from '../../../server/realtime/decide';
import { applyOps, renamePartInOps, replayStep, type JsonObject, type SheetOp } from '../../../shared/sync';
import { divider } from './sheets';

const author = (id: number) => ({ id, login: `u${id}`, name: null, avatarUrl: null });
const batch = (userId: number, batchId: string, ops: SheetOp[], baseVersion = 5): QueuedBatch => ({
  request: { projectId: '00000000-0000-4000-8000-000000000003', baseVersion, batchId, ops },
  author: author(userId),
  sessionId: `s${userId}`,
  socketId: `sock${userId}`,
});
const state = (over: Partial<LockedState> = {}): LockedState => ({
  version: 5,
  doc: divider(),
  roles: { 1: 'editor', 2: 'viewer', 3: 'owner' },
  liveSessions: new Set(['s1', 's2', 's3']),
  logged: {},
  ...over,
});
const title = (t: string): SheetOp[] => [{ op: 'set', target: 'sheet', path: ['title'], value: t }];

describe('decideGroup', () => {
  it('numbers accepted batches in arrival order and skips refused ones without stopping', () => {
    const d = decideGroup(state(), [
      batch(1, 'a-1', title('one')),
      batch(2, 'b-1', title('viewer')),
      batch(1, 'a-2', [{ op: 'remove', coll: 'parts', id: 'R1' }]),
      batch(3, 'c-1', [{ op: 'set', target: { coll: 'parts', id: 'R1' }, path: ['position'], value: { x: 1, y: 1 } }]),
      batch(3, 'c-2', title('three')),
    ]);
    expect(d.outcomes.map((o) => (o.ok ? o.version : o.error.code))).toEqual([6, 'forbidden', 7, 'conflict', 8]);
    expect(d.version).toBe(8);
    expect(d.doc.title).toBe('three');
    expect(d.accepted.map((a) => a.batch.request.batchId)).toEqual(['a-1', 'a-2', 'c-2']);
  });

  it('refuses a non-member, an ended session, a stale base, and an invalid result', () => {
    const d = decideGroup(state({ liveSessions: new Set(['s1']) }), [
      batch(9, 'x-1', title('x')),
      batch(3, 'c-1', title('x')),
      batch(1, 'a-1', title('x'), 6),
      batch(1, 'a-2', [{ op: 'set', target: { coll: 'parts', id: 'R1' }, path: ['params', 'resistance'], value: -5 }]),
    ]);
    expect(d.outcomes.map((o) => (o.ok ? o.version : o.error.code))).toEqual(['not_found', 'signed_out', 'stale', 'invalid_sheet']);
    const invalid = d.outcomes[3];
    expect(!invalid.ok && invalid.error.issues?.[0]).toMatchObject({ partId: 'R1', field: 'resistance' });
    expect(d.accepted).toEqual([]);
  });

  it('answers a batch already in the log with its version, once, even twice in one group', () => {
    const d = decideGroup(state({ logged: { 'a-1': 4 } }), [batch(1, 'a-1', title('again')), batch(1, 'a-9', title('new')), batch(1, 'a-9', title('new'))]);
    expect(d.outcomes).toEqual([{ ok: true, version: 4, duplicate: true }, { ok: true, version: 6 }, { ok: true, version: 6, duplicate: true }]);
    expect(d.accepted).toHaveLength(1);
  });
});

describe('replayStep', () => {
  const undoDeleteOfR2: SheetOp[] = [
    { op: 'insert', coll: 'parts', value: { id: 'R2', type: 'resistor', params: { resistance: 10000 } }, after: 'R1' },
    { op: 'insert', coll: 'wires', value: { id: 'w2', from: 'R1.b', to: 'R2.a' }, after: 'w1' },
    { op: 'insert', coll: 'wires', value: { id: 'w3', from: 'R2.b', to: 'GND.g' }, after: 'w2' },
  ];

  it('renames a part throughout a step: its insert, its edits and its wires', () => {
    const ops = renamePartInOps([...undoDeleteOfR2, { op: 'set', target: { coll: 'parts', id: 'R2' }, path: ['position'], value: { x: 0, y: 0 } }], 'R2', 'R7');
    expect(ops.map((o) => (o.op === 'insert' ? o.value : o.op === 'set' ? o.target : null))).toEqual([
      { id: 'R7', type: 'resistor', params: { resistance: 10000 } },
      { id: 'w2', from: 'R1.b', to: 'R7.a' },
      { id: 'w3', from: 'R7.b', to: 'GND.g' },
      { coll: 'parts', id: 'R7' },
    ]);
  });

  it('brings a part back under a fresh id when someone has taken its name, with its own wires', () => {
    const removed = applyOps(divider(), [{ op: 'remove', coll: 'parts', id: 'R2' }]);
    if (!removed.ok) throw new Error(removed.error.message);
    const taken = applyOps(removed.doc, [{ op: 'insert', coll: 'parts', value: { id: 'R2', type: 'resistor', params: { resistance: 1 } }, after: null }]);
    if (!taken.ok) throw new Error(taken.error.message);
    const r = replayStep(taken.doc, undoDeleteOfR2, (parts) => `R${parts.length + 10}`);
    expect(Object.keys(r.renamed)).toEqual(['R2']);
    const fresh = r.renamed.R2;
    const parts = r.doc.parts as JsonObject[];
    expect(parts.map((p) => p.id)).toEqual(['R2', 'V1', 'R1', fresh, 'GND']);
    expect((parts[0].params as JsonObject).resistance).toBe(1);
    expect((r.doc.wires as JsonObject[]).filter((w) => String(w.from).startsWith(`${fresh}.`) || String(w.to).startsWith(`${fresh}.`))).toHaveLength(2);
  });
});
