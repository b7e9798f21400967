// A sweep must give, at every point, what an independent operating-point solve of the sheet with
// that value gives (to 1e-12, relative to the value or 1 V / 1 A / 1 W): warm starts change how
// the solution is reached, not the solution. Independent solves use the engine's
// solveOperatingPoint on an edited copy of the sheet, without overrides or warm starts.
import { describe, expect, it } from 'vitest';
import { prepareCircuit, runSweep, type SweepTable } from '../../../shared/analysis';
import { solveOperatingPoint } from '../../../shared/engine';
import type { SheetInput } from '../../../shared/sheet/schema';
import npnBias from '../../../examples/npn-bias.json';
import ldrNightLight from '../../../examples/ldr-night-light.json';
import { divider, resistorMesh } from './fixtures';

function withParam(sheet: SheetInput, sets: Array<[string, string, number]>): SheetInput {
  const copy = structuredClone(sheet);
  for (const [part, param, v] of sets) {
    const p = copy.parts!.find((q) => q.id === part)!;
    (p.params as Record<string, unknown>)[param] = v;
  }
  return copy;
}

function expectMatchesIndependent(t: SweepTable, sheet: SheetInput, axes: Array<[string, string]>): number {
  let worst = 0;
  for (let pt = 0; pt < t.points; pt++) {
    const r = solveOperatingPoint(withParam(sheet, axes.map(([part, param], a) => [part, param, t.axisColumns[a][pt]])));
    expect(t.ok[pt]).toBe(r.ok ? 1 : 0);
    if (!r.ok) continue;
    for (const [net, v] of Object.entries(r.nets)) worst = Math.max(worst, Math.abs(t.columns[`V(${net})`][pt] - v) / Math.max(1, Math.abs(v)));
    for (const [id, pr] of Object.entries(r.parts)) {
      for (const [pin, i] of Object.entries(pr.pinCurrents)) worst = Math.max(worst, Math.abs(t.columns[`I(${id}.${pin})`][pt] - i) / Math.max(1, Math.abs(i)));
      worst = Math.max(worst, Math.abs(t.columns[`P(${id})`][pt] - pr.power) / Math.max(1, Math.abs(pr.power)));
    }
  }
  expect(worst).toBeLessThan(1e-12);
  return worst;
}

describe('sweeps equal independent operating-point solves', () => {
  it('linear: the divider over R2 from 1 kΩ to 100 kΩ, logarithmic', () => {
    const sheet = divider();
    const t = runSweep(sheet, { axes: [{ target: { kind: 'param', part: 'R2', param: 'resistance' }, steps: { from: 1000, to: 100000, points: 21, scale: 'log' } }] });
    expect(t.errors).toEqual([]);
    // closed form at the ends: V·R2/(R1+R2)
    expect(t.columns['V(tap)'][0]).toBeCloseTo((12 * 1000) / 28000, 12);
    expectMatchesIndependent(t, sheet, [['R2', 'resistance']]);
  });

  it('linear with fill-in: a 9×9 resistor mesh over one resistor (sparse LU refactorisations)', () => {
    const sheet = resistorMesh(9);
    const t = runSweep(sheet, { axes: [{ target: { kind: 'param', part: 'R40', param: 'resistance' }, steps: { from: 10, to: 100000, points: 9, scale: 'log' } }] });
    expect(t.errors).toEqual([]);
    expectMatchesIndependent(t, sheet, [['R40', 'resistance']]);
  });

  it('non-linear: the NPN bias example over its supply voltage', () => {
    const sheet = npnBias as SheetInput;
    const t = runSweep(sheet, { axes: [{ target: { kind: 'param', part: 'V1', param: 'voltage' }, steps: { from: 5, to: 20, points: 31 } }] });
    expect(t.errors).toEqual([]);
    expectMatchesIndependent(t, sheet, [['V1', 'voltage']]);
  });

  it('non-linear, two nested axes: the dusk switch over pot position × supply', () => {
    const sheet = ldrNightLight as SheetInput;
    const t = runSweep(sheet, {
      axes: [
        { target: { kind: 'param', part: 'V1', param: 'voltage' }, steps: { from: 4.5, to: 5.5, points: 3 } },
        { target: { kind: 'param', part: 'RV1', param: 'position' }, steps: { from: 0.05, to: 0.95, points: 7 } },
      ],
    });
    expect(t.points).toBe(21);
    // row-major: point = outer × 7 + inner, whatever order they were solved in
    expect(t.axisColumns[0][8]).toBe(5);
    expect(t.axisColumns[1][8]).toBeCloseTo(0.2, 12);
    expectMatchesIndependent(t, sheet, [['V1', 'voltage'], ['RV1', 'position']]);
  });

  it('sweeps a sheet condition (illuminance) like a param', () => {
    const p = prepareCircuit(ldrNightLight);
    const t = runSweep(p, { axes: [{ target: { kind: 'condition', condition: 'illuminanceLux' }, steps: { from: 0.5, to: 500, points: 7, scale: 'log' } }] });
    expect(t.errors).toEqual([]);
    for (let pt = 0; pt < t.points; pt++) {
      const r = solveOperatingPoint({ ...(ldrNightLight as SheetInput), conditions: { temperatureC: 25, illuminanceLux: t.axisColumns[0][pt] } });
      if (!r.ok) throw new Error(r.error.message);
      expect(Math.abs(t.columns['I(D1.anode)'][pt] - r.parts.D1.pinCurrents.anode)).toBeLessThan(1e-12);
    }
  });

  it('records a per-point error and carries on', () => {
    // a resistance of 0 is not a valid value: that point fails, the others solve
    const t = runSweep(divider(), { axes: [{ target: { kind: 'param', part: 'R2', param: 'resistance' }, steps: { from: 0, to: 2000, points: 3 } }] });
    expect(t.errors.map((e) => e.point)).toEqual([0]);
    expect(t.errors[0].message).toMatch(/R2/);
    expect(Number.isNaN(t.columns['V(tap)'][0])).toBe(true);
    expect(t.columns['V(tap)'][2]).toBeCloseTo((12 * 2000) / 29000, 12);
  });

  it('names what is wrong with an axis', () => {
    expect(() => runSweep(divider(), { axes: [{ target: { kind: 'param', part: 'R9', param: 'resistance' }, steps: { from: 1, to: 2, points: 2 } }] })).toThrow(/no part "R9"/);
    expect(() => runSweep(divider(), { axes: [{ target: { kind: 'param', part: 'R1', param: 'ohms' }, steps: { from: 1, to: 2, points: 2 } }] })).toThrow(/no numeric param "ohms".*resistance/);
  });
});

describe('sweep over a declared supply range', () => {
  it('uses the supply min and max', () => {
    const t = runSweep(divider({ vMin: 10.8, vMax: 13.2 }), { axes: [{ target: { kind: 'param', part: 'V1', param: 'voltage' }, steps: { overRange: true, points: 3 } }] });
    expect(t.axes[0].values).toEqual([10.8, 12, 13.2]);
    expect(t.columns['V(tap)'][2]).toBeCloseTo((13.2 * 10) / 37, 12);
    expect(() => runSweep(divider(), { axes: [{ target: { kind: 'param', part: 'V1', param: 'voltage' }, steps: { overRange: true, points: 3 } }] })).toThrow(/no declared range/);
  });
});

describe('sweep cancellation', () => {
  it('stops at the next check after shouldStop turns true, keeping what it solved', () => {
    let calls = 0;
    const t = runSweep(divider(), { axes: [{ target: { kind: 'param', part: 'R2', param: 'resistance' }, steps: { from: 1000, to: 2000, points: 1000 } }] }, {
      checkEvery: 50,
      shouldStop: () => ++calls >= 3,
    });
    expect(t.stopped).toBe(true);
    expect(t.completed).toBe(150);
    expect(t.ok[149]).toBe(1);
    expect(t.ok[150]).toBe(0);
  });
});
