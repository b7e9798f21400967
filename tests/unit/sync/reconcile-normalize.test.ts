// patchesToReach (what the editor store is given) and normalizeForSync (wire ids every machine agrees on).
import { describe, expect, it } from 'vitest';
import fc from 'fast-check';
import { applyPatches, enablePatches, produce } from 'immer';
import { normalizeForSync, patchesToReach, type JsonObject } from '../../../shared/sync';
import { applyEdit, divider, editArb } from './sheets';

enablePatches();

describe('patchesToReach', () => {
  it('gives immer patches that turn one sheet into the other (fast-check, 500 cases)', () => {
    // Oracle: immer's own applyPatches (an independent npm implementation of patch application).
    fc.assert(
      fc.property(fc.array(editArb, { maxLength: 12 }), fc.array(editArb, { maxLength: 6 }), (first, second) => {
        const a = produce(divider(), (d) => void first.forEach((e) => applyEdit(d as JsonObject, e, 'RA')));
        const b = produce(divider(), (d) => void second.forEach((e) => applyEdit(d as JsonObject, e, 'RB')));
        expect(applyPatches(a, patchesToReach(a, b))).toEqual(b);
        expect(applyPatches(b, patchesToReach(b, a))).toEqual(a);
      }),
      { numRuns: 500 },
    );
  });

  it('touches only what changed: one value edit is one patch, other parts keep their identity', () => {
    const a = divider();
    const b = produce(a, (d) => void (((d.parts as JsonObject[])[2].params as JsonObject).resistance = 3300));
    expect(patchesToReach(a, b)).toEqual([{ op: 'replace', path: ['parts', 2, 'params', 'resistance'], value: 3300 }]);
    const after = applyPatches(a, patchesToReach(a, b));
    expect((after.parts as JsonObject[])[0]).toBe((a.parts as JsonObject[])[0]);
  });

  it('removes by index from the end first, so earlier indexes stay valid', () => {
    const a = divider();
    const b = produce(a, (d) => {
      (d.parts as JsonObject[]).splice(1, 2);
      (d.wires as JsonObject[]).splice(0, 3);
    });
    expect(patchesToReach(a, b).filter((p) => p.path[0] === 'parts')).toEqual([
      { op: 'remove', path: ['parts', 2] },
      { op: 'remove', path: ['parts', 1] },
    ]);
  });
});

describe('normalizeForSync', () => {
  it('fills in missing and duplicate wire ids deterministically and keeps good ones', () => {
    const raw: JsonObject = {
      format: 'tapline.sheet',
      version: 1,
      parts: [],
      wires: [{ from: 'A.a', to: 'B.b' }, { id: 'w1', from: 'A.b', to: 'B.a' }, { id: 'x', from: 'C.a', to: 'D.a' }, { id: 'x', from: 'C.b', to: 'D.b' }],
    };
    const once = normalizeForSync(raw);
    expect((once.wires as JsonObject[]).map((w) => w.id)).toEqual(['w1-2', 'w1', 'x', 'w4']);
    expect(normalizeForSync(structuredClone(raw))).toEqual(once);
    expect(normalizeForSync(once)).toBe(once);
    expect(raw.wires as JsonObject[]).not.toHaveProperty('0.id');
  });
});
