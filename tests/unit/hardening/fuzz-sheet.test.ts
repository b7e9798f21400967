// Property-based fuzzing of the sheet reader and the solver's front door (fast-check): arbitrary
// values, valid sheets broken by hostile mutations (wrong types, NaN and Infinity from JS callers,
// missing fields, duplicate ids, wires to unknown pins, "__proto__" keys and ids, very long strings)
// and corrupted JSON text. Every input must end in a result or a structured error, never an
// exception, and a result never holds a non-finite number (support/result-shape.ts).
import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { solveOperatingPoint } from '../../../shared/engine';
import { parseSheet, parseSheetJson } from '../../../shared/sheet';
import { fuzzRun } from './support/fuzz-config';
import { resultProblems } from './support/result-shape';
import { buildSheet, circuitShape, mutate, mutation } from './support/sheet-arbitraries';

function expectParseShape(r: ReturnType<typeof parseSheet>): void {
  if (r.ok) return;
  expect(r.error.code).toBe('invalid_sheet');
  expect(r.error.issues.length).toBeGreaterThan(0);
  for (const i of r.error.issues) {
    expect(typeof i.message).toBe('string');
    expect(typeof i.path).toBe('string');
  }
}

describe('fuzz: sheet reader and solver front door', () => {
  it('any value at all: a parse result and a structured solve result, never an exception', () => {
    const { seed, numRuns } = fuzzRun('arbitrary values', 8101, 1500);
    fc.assert(
      fc.property(fc.anything({ withNullPrototype: true, withBoxedValues: true, withSparseArray: true, maxDepth: 4 }), (v) => {
        expectParseShape(parseSheet(v));
        expect(resultProblems(solveOperatingPoint(v))).toEqual([]);
      }),
      { seed, numRuns },
    );
  }, 600_000);

  it('valid sheets broken by hostile mutations', () => {
    const { seed, numRuns } = fuzzRun('mutated sheets', 8102, 1500);
    fc.assert(
      fc.property(circuitShape(6), fc.array(mutation, { minLength: 1, maxLength: 4 }), (shape, muts) => {
        const broken = mutate(buildSheet(shape), muts);
        expectParseShape(parseSheet(broken));
        const r = solveOperatingPoint(broken);
        expect(resultProblems(r)).toEqual([]);
        // nothing may leak onto Object.prototype
        expect(Object.keys(Object.prototype)).toEqual([]);
        expect(({} as Record<string, unknown>).voltage).toBeUndefined();
      }),
      { seed, numRuns },
    );
  }, 600_000);

  it('corrupted JSON text', () => {
    const { seed, numRuns } = fuzzRun('corrupted JSON text', 8103, 600);
    fc.assert(
      fc.property(circuitShape(4), fc.nat(), fc.nat(), fc.string({ maxLength: 4 }), (shape, cut, at, insert) => {
        const text = JSON.stringify(buildSheet(shape));
        const k = at % (text.length + 1);
        for (const t of [text.slice(0, cut % (text.length + 1)), text.slice(0, k) + insert + text.slice(k)]) {
          const r = parseSheetJson(t);
          expectParseShape(r);
          if (r.ok) expect(resultProblems(solveOperatingPoint(r.sheet))).toEqual([]);
        }
      }),
      { seed, numRuns },
    );
  }, 600_000);

  it('very long strings as ids, labels, titles and params', () => {
    const long = 'Q'.repeat(200_000);
    const sheet = {
      format: 'tapline.sheet',
      version: 1,
      title: 't'.repeat(1_000_000),
      parts: [
        { id: 'V' + long, type: 'dc_voltage_source', params: { voltage: 5 } },
        { id: 'R' + long, type: 'resistor', params: { resistance: 1000, note: 'n'.repeat(100_000) } },
        { id: 'L1', type: 'net_label', params: { name: 'x'.repeat(300_000) } },
        { id: 'G', type: 'ground' },
      ],
      wires: [
        { from: `V${long}.pos`, to: `R${long}.a` },
        { from: `R${long}.a`, to: 'L1.n' },
        { from: `R${long}.b`, to: 'G.g' },
        { from: `V${long}.neg`, to: 'G.g' },
      ],
    };
    const r = solveOperatingPoint(sheet);
    expect(resultProblems(r)).toEqual([]);
    expect(r.ok).toBe(true);
    if (r.ok) expect(r.nets['x'.repeat(300_000)]).toBe(5);
    // an error message quotes a long value shortened, not whole
    const bad = parseSheet({ ...sheet, parts: [{ id: 'R1', type: 'resistor', params: { resistance: 'k'.repeat(1_000_000) } }] });
    expect(bad.ok).toBe(false);
    if (!bad.ok) expect(bad.error.message.length).toBeLessThan(500);
  });
});
