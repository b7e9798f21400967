// Reusing a compiled circuit across value edits must give exactly what a fresh solve gives: the
// reference here is the engine's own plain solveOperatingPoint, and the divider's closed form.
import fs from 'node:fs';
import path from 'node:path';
import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import * as engine from '../../../shared/engine';
import { parseSheet, type Sheet } from '../../../shared/sheet';
import { createIncrementalSolver, structureKey } from '../../../src/editor/solve/incrementalSolve';

function example(name: string): Sheet {
  const r = parseSheet(JSON.parse(fs.readFileSync(path.resolve(import.meta.dirname, '../../../examples', `${name}.json`), 'utf8')));
  if (!r.ok) throw new Error(r.error.message);
  return r.sheet;
}

const withParam = (sheet: Sheet, id: string, name: string, value: unknown): Sheet => ({
  ...sheet,
  parts: sheet.parts.map((p) => (p.id === id ? ({ ...p, params: { ...p.params, [name]: value } } as typeof p) : p)),
});

/** Counts how often the sheet had to be compiled. */
function counting() {
  const n = { compile: 0 };
  return { n, solver: createIncrementalSolver({ compileCircuit: (s, o) => (n.compile++, engine.compileCircuit(s, o)), solveOperatingPoint: engine.solveOperatingPoint }) };
}

describe('incremental solve', () => {
  it('gives a fresh solve’s exact result for any wiper position and light level, compiling once', () => {
    const base = example('ldr-night-light');
    const { n, solver } = counting();
    fc.assert(
      fc.property(fc.double({ min: 0, max: 1, noNaN: true }), fc.double({ min: 0.1, max: 1000, noNaN: true }), (position, lux) => {
        const sheet = { ...withParam(base, 'RV1', 'position', position), conditions: { ...base.conditions, illuminanceLux: lux } };
        expect(solver.solve(sheet)).toEqual(engine.solveOperatingPoint(sheet));
      }),
      { numRuns: 60 },
    );
    expect(n.compile).toBe(1);
  });

  it('recompiles when the wiring changes, then reuses the new compile', () => {
    const base = example('battery-divider');
    const { n, solver } = counting();
    solver.solve(base);
    const rewired = { ...base, wires: base.wires.slice(0, -1) };
    expect(structureKey(rewired)).not.toBe(structureKey(base));
    expect(solver.solve(rewired)).toEqual(engine.solveOperatingPoint(rewired));
    expect(n.compile).toBe(2);
    // a value edit after that reuses the new compile
    const edited = withParam(rewired, rewired.parts.find((p) => p.type === 'resistor')!.id, 'resistance', 4700);
    expect(solver.solve(edited)).toEqual(engine.solveOperatingPoint(edited));
    expect(n.compile).toBe(2);
  });

  it('words a value the engine refuses exactly as a fresh solve does', () => {
    const base = example('ldr-night-light');
    const { solver } = counting();
    solver.solve(base);
    const bad = withParam(base, 'RB', 'resistance', -5);
    const r = solver.solve(bad);
    expect(r).toEqual(engine.solveOperatingPoint(bad));
    expect(r.ok).toBe(false);
  });

  it('solves a 12 V, 27 k over 10 k divider to 3.24324324324 V and follows value edits (references.md, computed)', () => {
    const parsed = parseSheet({
      format: 'tapline.sheet',
      version: 1,
      parts: [
        { id: 'V1', type: 'dc_voltage_source', params: { voltage: 12 } },
        { id: 'R1', type: 'resistor', params: { resistance: 27_000 } },
        { id: 'R2', type: 'resistor', params: { resistance: 10_000 } },
        { id: 'GND1', type: 'ground' },
      ],
      wires: [
        { from: 'V1.pos', to: 'R1.a' },
        { from: 'R1.b', to: 'R2.a' },
        { from: 'R2.b', to: 'GND1.g' },
        { from: 'V1.neg', to: 'GND1.g' },
      ],
    });
    if (!parsed.ok) throw new Error(parsed.error.message);
    const sheet = parsed.sheet;
    const { solver } = counting();
    const tap = (s: Sheet) => {
      const r = solver.solve(s);
      if (!r.ok) throw new Error(r.error.message);
      const net = Object.keys(r.nets).find((k) => k !== '0' && Math.abs(r.nets[k] - 12) > 1e-9)!;
      return r.nets[net];
    };
    expect(tap(sheet)).toBeCloseTo(3.24324324324, 9);
    // ideal divider formula (common practice): 12 · 4.7k / (27k + 4.7k) = 1.77917981073 V
    expect(tap(withParam(sheet, 'R2', 'resistance', 4700))).toBeCloseTo((12 * 4700) / 31_700, 9);
  });
});
