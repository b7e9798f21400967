// diffSheets + applyOps: the operations a diff produces rebuild the edited document exactly
// (order included), and applyOps refuses what no longer applies with a reason a person reads.
import { describe, expect, it } from 'vitest';
import fc from 'fast-check';
import { produce } from 'immer';
import { applyOps, applyOpsLenient, diffSheets, type JsonObject, type SheetOp } from '../../../shared/sync';
import { applyEdit, divider, editArb } from './sheets';

function edited(base: JsonObject, edits: Parameters<typeof applyEdit>[1][]): JsonObject {
  return produce(base, (d) => {
    for (const e of edits) applyEdit(d as JsonObject, e);
  });
}

describe('diffSheets then applyOps', () => {
  it('rebuilds any edited sheet exactly (fast-check, 500 random edit sequences)', () => {
    // Property-based check with fast-check (a general-purpose npm library): the oracle is the
    // edited document itself, compared with toEqual (deep, order-sensitive for arrays).
    fc.assert(
      fc.property(fc.array(editArb, { maxLength: 12 }), (edits) => {
        const before = divider();
        const after = edited(before, edits);
        const ops = diffSheets(before, after);
        const r = applyOps(before, ops);
        expect(r.ok).toBe(true);
        if (r.ok) expect(r.doc).toEqual(after);
      }),
      { numRuns: 500 },
    );
  });

  it('names parts and wires by id, never by index', () => {
    const before = divider();
    const after = produce(before, (d) => {
      const parts = d.parts as JsonObject[];
      parts.splice(1, 1); // R1
      (d.wires as JsonObject[]).splice(0, 2); // its wires
      (parts[1].params as JsonObject).resistance = 4700; // R2
    });
    expect(diffSheets(before, after)).toEqual([
      { op: 'set', target: { coll: 'parts', id: 'R2' }, path: ['params', 'resistance'], value: 4700 },
      { op: 'remove', coll: 'wires', id: 'w1' },
      { op: 'remove', coll: 'wires', id: 'w2' },
      { op: 'remove', coll: 'parts', id: 'R1' },
    ]);
  });

  it('gives nothing for equal documents and moves for a reorder', () => {
    const d = divider();
    expect(diffSheets(d, structuredClone(d))).toEqual([]);
    const swapped = produce(d, (x) => {
      const p = x.parts as JsonObject[];
      p.push(p.shift()!);
    });
    expect(diffSheets(d, swapped)).toEqual([{ op: 'move', coll: 'parts', id: 'V1', after: 'GND' }]);
  });

  it('keeps untouched parts as the same objects (structural sharing)', () => {
    const d = divider();
    const r = applyOps(d, [{ op: 'set', target: { coll: 'parts', id: 'R1' }, path: ['position'], value: { x: 5, y: 5 } }]);
    expect(r.ok && r.doc.parts).not.toBe(d.parts);
    if (r.ok) {
      expect((r.doc.parts as JsonObject[])[0]).toBe((d.parts as JsonObject[])[0]);
      expect((r.doc.parts as JsonObject[])[1]).not.toBe((d.parts as JsonObject[])[1]);
    }
  });
});

describe('applyOps under concurrency', () => {
  const setR1 = (value: number): SheetOp => ({ op: 'set', target: { coll: 'parts', id: 'R1' }, path: ['params', 'resistance'], value });
  const withoutR1 = (): JsonObject => {
    const r = applyOps(divider(), [{ op: 'remove', coll: 'parts', id: 'R1' }]);
    if (!r.ok) throw new Error(r.error.message);
    return r.doc;
  };

  it('a part removal takes the wires on its pins, including ones it did not know of', () => {
    const d = withoutR1();
    expect((d.parts as JsonObject[]).map((p) => p.id)).toEqual(['V1', 'R2', 'GND']);
    expect((d.wires as JsonObject[]).map((w) => w.id)).toEqual(['w3', 'w4']);
  });

  it('refuses a change to a part someone removed, naming it', () => {
    const r = applyOps(withoutR1(), [setR1(2200)]);
    expect(r).toEqual({ ok: false, error: { code: 'conflict', opIndex: 0, message: expect.stringMatching(/part R1 is no longer on the sheet/) } });
  });

  it('refuses a wire to a removed part, and a second part with a taken id', () => {
    const wire: SheetOp = { op: 'insert', coll: 'wires', value: { id: 'w9', from: 'R1.a', to: 'R2.b' }, after: null };
    const r = applyOps(withoutR1(), [wire]);
    expect(!r.ok && r.error.message).toMatch(/joins part R1/);
    const dup = applyOps(divider(), [{ op: 'insert', coll: 'parts', value: { id: 'R2', type: 'resistor' }, after: 'R1' }]);
    expect(!dup.ok && dup.error).toMatchObject({ code: 'conflict', message: expect.stringMatching(/already a part R2/) });
  });

  it('is all or nothing: a refused batch changes nothing', () => {
    const base = withoutR1();
    const r = applyOps(base, [{ op: 'set', target: 'sheet', path: ['title'], value: 'x' }, setR1(1)]);
    expect(r.ok).toBe(false);
    expect(base.title).toBe('Half-supply tap (demo)');
  });

  it('treats removing an element twice as done, and last writer wins on one field', () => {
    const d = withoutR1();
    expect(applyOps(d, [{ op: 'remove', coll: 'parts', id: 'R1' }])).toEqual({ ok: true, doc: d });
    const r = applyOps(divider(), [setR1(1000), setR1(2200)]);
    expect(r.ok && ((r.doc.parts as JsonObject[])[1].params as JsonObject).resistance).toBe(2200);
  });

  it('places an insert after its anchor, or last when the anchor is gone', () => {
    const r = applyOps(withoutR1(), [
      { op: 'insert', coll: 'parts', value: { id: 'R7', type: 'resistor' }, after: 'V1' },
      { op: 'insert', coll: 'parts', value: { id: 'R8', type: 'resistor' }, after: 'R1' },
    ]);
    expect(r.ok && (r.doc.parts as JsonObject[]).map((p) => p.id)).toEqual(['V1', 'R7', 'R2', 'GND', 'R8']);
  });

  it('refuses malformed operations: id changes, collection fields through set, prototype keys', () => {
    const bad: SheetOp[] = [
      { op: 'set', target: { coll: 'parts', id: 'R1' }, path: ['id'], value: 'R9' },
      { op: 'set', target: 'sheet', path: ['parts'], value: [] },
      { op: 'set', target: { coll: 'parts', id: 'R1' }, path: ['__proto__', 'x'], value: 1 },
      { op: 'set', target: { coll: 'parts', id: 'R1' }, path: [], value: 1 },
    ];
    for (const op of bad) {
      const r = applyOps(divider(), [op]);
      expect(!r.ok && r.error.code).toBe('invalid_request');
    }
    expect(({} as Record<string, unknown>).x).toBeUndefined();
  });

  it('creates missing objects on a set path but will not write through a number', () => {
    const d = divider();
    const r = applyOps(d, [{ op: 'set', target: { coll: 'parts', id: 'GND' }, path: ['params', 'note'], value: 'x' }]);
    expect(r.ok && (r.doc.parts as JsonObject[])[3].params).toEqual({ note: 'x' });
    const bad = applyOps(d, [{ op: 'set', target: { coll: 'parts', id: 'R1' }, path: ['params', 'resistance', 'x'], value: 1 }]);
    expect(!bad.ok && bad.error.code).toBe('conflict');
  });

  it('the lenient form applies what still applies (undo after a remote removal)', () => {
    const { doc, skipped } = applyOpsLenient(withoutR1(), [setR1(5), { op: 'set', target: 'sheet', path: ['title'], value: 'kept' }]);
    expect(skipped).toEqual([0]);
    expect(doc.title).toBe('kept');
  });

  it('replaceSheet swaps the whole document and fills in wire ids', () => {
    const r = applyOps(divider(), [
      { op: 'replaceSheet', sheet: { format: 'tapline.sheet', version: 1, parts: [{ id: 'A', type: 'ground' }, { id: 'B', type: 'ground' }], wires: [{ from: 'A.g', to: 'B.g' }] } },
      { op: 'set', target: { coll: 'wires', id: 'w1' }, path: ['points'], value: [{ x: 1, y: 2 }] },
    ]);
    expect(r.ok && r.doc.wires).toEqual([{ id: 'w1', from: 'A.g', to: 'B.g', points: [{ x: 1, y: 2 }] }]);
  });
});
