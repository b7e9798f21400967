// The designer's parts go into the sheet as one undo step and make the circuit they promise:
// checked by solving the result with the engine against the closed-form divider
// (V·R2/(R1+R2); /work/shared/references.md worked example 12 V, 27 kΩ over 10 kΩ → 3.24324324324 V).
import { describe, expect, it } from 'vitest';
import { solveOperatingPoint } from '../../../shared/engine';
import { createEditor } from '../../../src/editor/store/actions';
import { insertCombination, insertDivider, placementProblem } from '../../../src/editor/tools/designer/insertParts';
import { networkOf, networkSize } from '../../../src/editor/tools/designer/network';
import { supplyOnly } from './helpers';

const opts = { tolerance: 0.01, powerRating: 0.25 };
const leg = (topology: 'single' | 'series' | 'parallel', parts: number[], expression: string) => ({ topology, parts, value: 0, expression });

function solved(doc: unknown) {
  const r = solveOperatingPoint(doc);
  if (!r.ok) throw new Error(r.error.message);
  return r;
}

describe('insertDivider', () => {
  it('wires 27 kΩ / 10 kΩ between the supply and ground with a labelled tap, in one undo step', () => {
    const editor = createEditor(supplyOnly());
    const before = JSON.stringify(editor.getDoc());
    const supplyNet = 'N1';
    const r = insertDivider(editor, { top: leg('single', [27000], '27K'), bottom: leg('single', [10000], '10K') }, { kind: 'between', top: supplyNet, bottom: '0', tap: '' }, opts);
    expect(r.ok).toBe(true);
    expect(r.tapNet).toBe('tap');
    const res = solved(editor.getDoc());
    expect(res.nets.tap).toBeCloseTo(3.24324324324, 9);
    const added = editor.getDoc().parts.filter((p) => p.type === 'resistor');
    expect(added.map((p) => (p.params as { tolerance: number }).tolerance)).toEqual([0.01, 0.01]);
    expect([...editor.getSession().selection.parts].sort()).toEqual([...r.ids].sort());
    expect(editor.undo()).toBe(true);
    expect(JSON.stringify(editor.getDoc())).toBe(before);
    expect(editor.store.getState().history.canUndo).toBe(false);
  });

  it('builds pair legs: 54k ∥ 54k over 5k + 5k is the same 27 kΩ / 10 kΩ divider', () => {
    const editor = createEditor(supplyOnly());
    const r = insertDivider(editor, { top: leg('parallel', [54000, 54000], '54K ∥ 54K'), bottom: leg('series', [5000, 5000], '5K0 + 5K0') }, { kind: 'between', top: 'N1', bottom: '0', tap: '' }, opts);
    expect(r.ids.filter((id) => id.startsWith('R'))).toHaveLength(4);
    expect(solved(editor.getDoc()).nets.tap).toBeCloseTo(3.24324324324, 9);
  });

  it('places a free divider without wiring it to the rest of the sheet', () => {
    const editor = createEditor(supplyOnly());
    const r = insertDivider(editor, { top: leg('single', [1000], '1K0'), bottom: leg('single', [1000], '1K0') }, { kind: 'free' }, opts);
    const doc = editor.getDoc();
    const wiredOutside = doc.wires.filter((w) => [w.from, w.to].some((p) => p.startsWith('V1.')) && [w.from, w.to].some((p) => r.ids.includes(p.split('.')[0])));
    expect(wiredOutside).toHaveLength(0);
  });

  it('refuses placements that would short the divider or name missing nets, with what to do', () => {
    const sheet = supplyOnly();
    expect(placementProblem(sheet, { kind: 'between', top: '0', bottom: '0', tap: '' })).toMatch(/same net/);
    expect(placementProblem(sheet, { kind: 'between', top: 'nope', bottom: '0', tap: '' })).toMatch(/no net "nope"/);
    const editor = createEditor(sheet);
    const r = insertDivider(editor, { top: leg('single', [1], '1R0'), bottom: leg('single', [1], '1R0') }, { kind: 'between', top: 'nope', bottom: '0', tap: '' }, opts);
    expect(r.ok).toBe(false);
    expect(editor.store.getState().history.canUndo).toBe(false);
  });
});

describe('insertCombination', () => {
  it('a + (b ∥ c) across 12 V draws V / (a + b·c/(b+c)) (Ohm’s law, series and parallel rules)', () => {
    const editor = createEditor(supplyOnly());
    const r = insertCombination(editor, { topology: 'series-parallel', parts: [1000, 10000, 22000], expression: '1K0 + (10K ∥ 22K)' }, opts);
    expect(r.ids).toHaveLength(3);
    // wire the combination's two ends (the first part's a, and the parallel pair's bottoms) to the supply
    const [a, b] = r.ids;
    editor.actions.connect('V1.pos', `${a}.a`);
    editor.actions.connect(`${b}.b`, 'GND1.g');
    const res = solved(editor.getDoc());
    const expected = 12 / (1000 + (10000 * 22000) / 32000);
    expect(-res.parts.V1.pinCurrents.pos).toBeCloseTo(expected, 12);
    editor.undo();
    editor.undo();
    expect(editor.undo()).toBe(true); // the insertion itself is one step
    expect(editor.getDoc().parts).toHaveLength(2);
  });
  it('lays trees out on the grid', () => {
    expect(networkSize(networkOf('single', [1]))).toEqual({ width: 80, height: 80 });
    expect(networkSize(networkOf('series3', [1, 2, 3]))).toEqual({ width: 80, height: 320 });
    expect(networkSize(networkOf('parallel-series', [1, 2, 3]))).toEqual({ width: 160, height: 200 });
  });
});
