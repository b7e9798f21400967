// Thousands of parts: every shape that used to cost parts × parts (static warnings per part, one
// scan per floating island, chains of ideal sources) must still end in a structured result. The
// time these take is measured in bench/, never here; a quadratic step would show up as a timeout.
import { describe, expect, it } from 'vitest';
import { solveOperatingPoint } from '../../../shared/engine';
import { checkCircuitLaws } from './support/circuit-laws';
import { resultProblems } from './support/result-shape';

const N = 5000;
type Part = { id: string; type: string; params?: Record<string, unknown> };
type Wire = { from: string; to: string };
const sheet = (parts: Part[], wires: Wire[]) => ({ format: 'tapline.sheet', version: 1, parts, wires });
const divider = (): [Part[], Wire[]] => [
  [{ id: 'V1', type: 'dc_voltage_source', params: { voltage: 5 } }, { id: 'R0', type: 'resistor', params: { resistance: 1e3 } }, { id: 'G', type: 'ground' }],
  [{ from: 'V1.pos', to: 'R0.a' }, { from: 'R0.b', to: 'G.g' }, { from: 'V1.neg', to: 'G.g' }],
];

describe(`sheets with ${N} parts`, () => {
  it('unconnected parts with unknown params: left out with a warning each', () => {
    const [parts, wires] = divider();
    for (let i = 0; i < N; i++) parts.push({ id: `X${i}`, type: 'resistor', params: { resistance: 1e3, tolerence: 0.01 } });
    const r = solveOperatingPoint(sheet(parts, wires));
    expect(resultProblems(r)).toEqual([]);
    if (!r.ok) return;
    expect(r.warnings.filter((w) => w.code === 'part_unconnected')).toHaveLength(N);
    expect(r.parts.X4999.warnings.map((w) => w.code).sort()).toEqual(['part_unconnected', 'unknown_param']);
  }, 60_000);

  it('thousands of floating islands: one floating_net error listing a few and counting the rest', () => {
    const [parts, wires] = divider();
    for (let i = 0; i < N / 2; i++) {
      parts.push({ id: `A${i}`, type: 'resistor', params: { resistance: 1e3 } }, { id: `B${i}`, type: 'resistor', params: { resistance: 1e3 } });
      wires.push({ from: `A${i}.a`, to: `B${i}.a` }, { from: `A${i}.b`, to: `B${i}.b` });
    }
    const r = solveOperatingPoint(sheet(parts, wires));
    expect(resultProblems(r)).toEqual([]);
    expect(r.ok).toBe(false);
    if (r.ok) return;
    expect(r.error.code).toBe('floating_net');
    expect(r.error.message).toMatch(/and 4994 more have no DC path/);
    expect(r.error.message).not.toMatch(/and and/);
  }, 60_000);

  it('a chain of ideal sources closed on itself: one loop error', () => {
    const parts: Part[] = [{ id: 'G', type: 'ground' }];
    const wires: Wire[] = [];
    let prev = 'G.g';
    for (let i = 0; i < N; i++) {
      parts.push({ id: `V${i}`, type: 'dc_voltage_source', params: { voltage: 1 } });
      wires.push({ from: prev, to: `V${i}.neg` });
      prev = `V${i}.pos`;
    }
    wires.push({ from: prev, to: 'G.g' });
    const r = solveOperatingPoint(sheet(parts, wires));
    expect(resultProblems(r)).toEqual([]);
    if (r.ok) return;
    expect(r.error.code).toBe('voltage_source_loop');
    expect(r.error.parts).toHaveLength(N);
    expect(r.error.message).toMatch(/and 4994 more form a loop but force different voltages/);
  }, 60_000);

  it('current sources into nothing, and junctions with one pin left open', () => {
    const [parts, wires] = divider();
    for (let i = 0; i < N; i++) {
      parts.push({ id: `I${i}`, type: 'dc_current_source', params: { current: 1e-3 } });
      wires.push({ from: `I${i}.neg`, to: 'G.g' });
    }
    const r = solveOperatingPoint(sheet(parts, wires));
    expect(resultProblems(r)).toEqual([]);
    expect(!r.ok && r.error.code).toBe('current_source_no_path');

    const [p2, w2] = divider();
    for (let i = 0; i < N; i++) {
      p2.push({ id: `D${i}`, type: 'diode' });
      w2.push({ from: `D${i}.anode`, to: 'G.g' });
    }
    const s2 = sheet(p2, w2);
    const r2 = solveOperatingPoint(s2);
    expect(resultProblems(r2)).toEqual([]);
    if (r2.ok) expect(checkCircuitLaws(s2, r2).violations).toEqual([]);
  }, 60_000);

  it(`a ${N}-part resistor–diode ladder solves (sparse LU) and obeys Kirchhoff's laws`, () => {
    const parts: Part[] = [{ id: 'V1', type: 'dc_voltage_source', params: { voltage: 10 } }, { id: 'G', type: 'ground' }];
    const wires: Wire[] = [{ from: 'V1.neg', to: 'G.g' }];
    let prev = 'V1.pos';
    for (let i = 0; i < N / 2; i++) {
      parts.push({ id: `R${i}`, type: 'resistor', params: { resistance: 10 } }, { id: `D${i}`, type: 'diode' });
      wires.push({ from: prev, to: `R${i}.a` }, { from: `R${i}.b`, to: `D${i}.anode` }, { from: `D${i}.cathode`, to: 'G.g' });
      prev = `R${i}.b`;
    }
    const s = sheet(parts, wires);
    const r = solveOperatingPoint(s);
    expect(resultProblems(r)).toEqual([]);
    expect(r.ok).toBe(true);
    if (!r.ok) return;
    expect(r.iterations).toBeLessThanOrEqual(40);
    expect(checkCircuitLaws(s, r).violations).toEqual([]);
  }, 60_000);
});
