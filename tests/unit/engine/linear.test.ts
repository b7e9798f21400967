// Linear networks against closed-form answers and against mathjs `lusolve` (an independent
// general-purpose solver from npm) on random resistor networks.
import { describe, expect, it } from 'vitest';
import { solveNodal, type RefElement } from '../../support/reference/nodal';
import { part, sheet, wire, type W } from '../../support/reference/sheets';
import { expectRel, rng, solveOk } from './helpers';

const REL = 1e-9;

describe('closed-form linear networks', () => {
  it('unloaded divider: V·R2/(R1+R2) (references.md worked example: 12 V, 27 kΩ over 10 kΩ = 3.24324324324 V)', () => {
    const s = sheet(
      [part('V1', 'dc_voltage_source', { voltage: 12 }), part('R1', 'resistor', { resistance: 27000 }), part('R2', 'resistor', { resistance: 10000 }), part('G', 'ground')],
      [wire('V1.pos', 'R1.a'), wire('R1.b', 'R2.a'), wire('R2.b', 'G.g'), wire('V1.neg', 'G.g')],
    );
    const r = solveOk(s);
    expectRel(r.pins['R2.a'], (12 * 10000) / 37000, REL);
    expectRel(r.pins['R2.a'], 3.24324324324, 1e-11);
    expect(r.iterations).toBe(1);
    expect(r.strategy).toBe('direct');
    // current and power
    expectRel(r.parts.R1.pinCurrents.a, 12 / 37000, REL);
    expectRel(r.parts.V1.power, -(12 * 12) / 37000, REL);
    expectRel(r.parts.R1.power + r.parts.R2.power, (12 * 12) / 37000, REL);
  });

  it('loaded divider: Thevenin V_th·R_L/(R_th + R_L) (references.md)', () => {
    const R1 = 27000, R2 = 10000, RL = 47000, V = 12;
    const s = sheet(
      [
        part('V1', 'dc_voltage_source', { voltage: V }),
        part('R1', 'resistor', { resistance: R1 }),
        part('R2', 'resistor', { resistance: R2 }),
        part('RL', 'load', { mode: 'resistance', value: RL }),
        part('G', 'ground'),
      ],
      [wire('V1.pos', 'R1.a'), wire('R1.b', 'R2.a'), wire('R2.a', 'RL.pos'), wire('R2.b', 'G.g'), wire('RL.neg', 'G.g'), wire('V1.neg', 'G.g')],
    );
    const vth = (V * R2) / (R1 + R2);
    const rth = (R1 * R2) / (R1 + R2);
    expectRel(solveOk(s).pins['RL.pos'], (vth * RL) / (rth + RL), REL);
  });

  it('source internal resistance and a current source into parallel resistors', () => {
    const s = sheet(
      [
        part('V1', 'dc_voltage_source', { voltage: 9, internalResistance: 2 }),
        part('R1', 'resistor', { resistance: 100 }),
        part('I1', 'dc_current_source', { current: 0.003 }),
        part('R2', 'resistor', { resistance: 1000 }),
        part('R3', 'resistor', { resistance: 4000 }),
        part('G', 'ground'),
      ],
      [wire('V1.pos', 'R1.a'), wire('R1.b', 'G.g'), wire('V1.neg', 'G.g'), wire('I1.pos', 'R2.a'), wire('R2.a', 'R3.a'), wire('R2.b', 'G.g'), wire('R3.b', 'G.g'), wire('I1.neg', 'G.g')],
    );
    const r = solveOk(s);
    expectRel(r.pins['R1.a'], (9 * 100) / 102, REL);
    expectRel(r.pins['R2.a'], 0.003 * 800, REL);
    expect(r.parts.I1.pinCurrents).toEqual({ pos: -0.003, neg: 0.003 });
    expectRel(r.parts.I1.power, -0.003 * 2.4, REL);
  });

  it('Wheatstone bridge: the bridge voltage from the two dividers', () => {
    const s = sheet(
      [
        part('V1', 'dc_voltage_source', { voltage: 5 }),
        part('R1', 'resistor', { resistance: 1000 }),
        part('R2', 'resistor', { resistance: 1200 }),
        part('R3', 'resistor', { resistance: 1500 }),
        part('R4', 'resistor', { resistance: 2000 }),
        part('R5', 'resistor', { resistance: 2200 }),
        part('G', 'ground'),
      ],
      [wire('V1.pos', 'R1.a'), wire('V1.pos', 'R3.a'), wire('R1.b', 'R2.a'), wire('R3.b', 'R4.a'), wire('R2.b', 'G.g'), wire('R4.b', 'G.g'), wire('V1.neg', 'G.g'), wire('R1.b', 'R5.a'), wire('R3.b', 'R5.b')],
    );
    // closed form via Thevenin of each side
    const va0 = (5 * 1200) / 2200, ra = (1000 * 1200) / 2200;
    const vb0 = (5 * 2000) / 3500, rb = (1500 * 2000) / 3500;
    const i5 = (va0 - vb0) / (ra + rb + 2200);
    const r = solveOk(s);
    expectRel(r.parts.R5.pinCurrents.a, i5, REL);
    expectRel(r.pins['R5.a'] - r.pins['R5.b'], i5 * 2200, REL);
  });

  it('potentiometer: linear and log taper, wiper at the ends (0 Ω sections)', () => {
    const mk = (position: number, taper: string) =>
      sheet(
        [part('V1', 'dc_voltage_source', { voltage: 10 }), part('RV1', 'potentiometer', { resistance: 10000, position, taper }), part('RL', 'resistor', { resistance: 1e6 }), part('G', 'ground')],
        [wire('V1.pos', 'RV1.a'), wire('RV1.b', 'G.g'), wire('RV1.w', 'RL.a'), wire('RL.b', 'G.g'), wire('V1.neg', 'G.g')],
      );
    for (const [pos, taper, frac] of [
      [0.3, 'linear', 0.3],
      [0.5, 'log', 0.1], // type A audio taper: 10 % at mid-rotation
      [0, 'linear', 0],
      [1, 'linear', 1],
      [0.25, 'log', (Math.pow(81, 0.25) - 1) / 80],
    ] as const) {
      const r1 = 10000 * frac, r2 = 10000 - r1, rl = 1e6;
      // wiper voltage: 10·(r2∥rl)/(r1 + r2∥rl)
      const par = r2 === 0 ? 0 : (r2 * rl) / (r2 + rl);
      const expected = r1 + par === 0 ? 10 : (10 * par) / (r1 + par);
      const r = solveOk(mk(pos, taper));
      expectRel(r.pins['RV1.w'], expected, REL, 1e-15);
      const pc = r.parts.RV1.pinCurrents;
      expect(Math.abs(pc.a + pc.w + pc.b)).toBeLessThan(1e-15);
    }
  });

  it('closed switch with zero on-resistance is an ideal link; open switch uses offResistance', () => {
    const mk = (closed: boolean) =>
      sheet(
        [part('V1', 'dc_voltage_source', { voltage: 1 }), part('S1', 'switch', { closed, onResistance: 0, offResistance: 1e6 }), part('R1', 'resistor', { resistance: 1e6 }), part('G', 'ground')],
        [wire('V1.pos', 'S1.a'), wire('S1.b', 'R1.a'), wire('R1.b', 'G.g'), wire('V1.neg', 'G.g')],
      );
    expect(solveOk(mk(true)).pins['R1.a']).toBe(1);
    expectRel(solveOk(mk(false)).pins['R1.a'], 0.5, REL);
  });
});

describe('random resistor networks against mathjs lusolve', () => {
  function network(seed: number) {
    const rand = rng(seed);
    const nodes = 3 + Math.floor(rand() * 18);
    const els: RefElement[] = [];
    // spanning tree so every node has a DC path to ground (node 0)
    for (let i = 1; i <= nodes; i++) els.push({ kind: 'R', a: i, b: Math.floor(rand() * i), value: 10 ** (1 + rand() * 5) });
    const extra = Math.floor(rand() * nodes * 2);
    for (let k = 0; k < extra; k++) {
      const a = Math.floor(rand() * (nodes + 1));
      let b = Math.floor(rand() * (nodes + 1));
      if (a === b) b = (b + 1) % (nodes + 1);
      els.push({ kind: 'R', a, b, value: 10 ** (rand() * 6) });
    }
    // one ideal voltage source to ground, and a few current sources
    els.push({ kind: 'V', a: 1 + Math.floor(rand() * nodes), b: 0, value: -20 + 40 * rand() });
    const nI = Math.floor(rand() * 3);
    for (let k = 0; k < nI; k++) els.push({ kind: 'I', a: Math.floor(rand() * (nodes + 1)), b: 1 + Math.floor(rand() * nodes), value: (rand() - 0.5) * 0.02 });
    return { nodes, els };
  }

  function toSheet(nodes: number, els: RefElement[]) {
    const parts: Array<Record<string, unknown>> = [part('GND', 'ground')];
    const wires: W[] = [];
    for (let i = 1; i <= nodes; i++) parts.push(part(`L${i}`, 'net_label', { name: `n${i}` }));
    const pinOf = (node: number, ref: string) => wires.push(wire(ref, node === 0 ? 'GND.g' : `L${node}.n`));
    els.forEach((e, k) => {
      const id = `${e.kind}${k}`;
      if (e.kind === 'R') parts.push(part(id, 'resistor', { resistance: e.value }));
      else if (e.kind === 'V') parts.push(part(id, 'dc_voltage_source', { voltage: e.value }));
      else parts.push(part(id, 'dc_current_source', { current: e.value }));
      const [pa, pb] = e.kind === 'R' ? ['a', 'b'] : ['pos', 'neg'];
      pinOf(e.a, `${id}.${pa}`);
      pinOf(e.b, `${id}.${pb}`);
    });
    return sheet(parts, wires);
  }

  for (let seed = 1; seed <= 40; seed++) {
    it(`network #${seed}`, () => {
      const { nodes, els } = network(seed);
      const ref = solveNodal(nodes, els);
      const r = solveOk(toSheet(nodes, els));
      // relative to the size of the answer (a node far from every source sits near 0 V)
      const scale = Math.max(...ref.map(Math.abs));
      for (let i = 1; i <= nodes; i++) expectRel(r.nets[`n${i}`], ref[i], REL, REL * 1e-3 * scale);
    });
  }

  it('dense, band and sparse LU agree on a 12×12 resistor grid with a diode (independent of the linear solver)', () => {
    const n = 12;
    const parts: Array<Record<string, unknown>> = [part('V1', 'dc_voltage_source', { voltage: 5 }), part('D1', 'diode'), part('G', 'ground')];
    const wires: W[] = [wire('V1.neg', 'G.g'), wire('V1.pos', 'D1.anode')];
    const rand = rng(7);
    const node = (i: number, j: number) => `g${i}_${j}`;
    for (let i = 0; i < n; i++) for (let j = 0; j < n; j++) parts.push(part(`L${i}_${j}`, 'net_label', { name: node(i, j) }));
    let k = 0;
    for (let i = 0; i < n; i++)
      for (let j = 0; j < n; j++)
        for (const [di, dj] of [[0, 1], [1, 0]]) {
          if (i + di >= n || j + dj >= n) continue;
          const id = `R${++k}`;
          parts.push(part(id, 'resistor', { resistance: 100 + 1000 * rand() }));
          wires.push(wire(`${id}.a`, `L${i}_${j}.n`), wire(`${id}.b`, `L${i + di}_${j + dj}.n`));
        }
    wires.push(wire('D1.cathode', `L0_0.n`), wire(`L${n - 1}_${n - 1}.n`, 'G.g'));
    const s = sheet(parts, wires);
    const dense = solveOk(s, { linearSolver: 'dense' });
    for (const kind of ['band', 'sparse', 'auto'] as const) {
      const other = solveOk(s, { linearSolver: kind });
      for (const key of Object.keys(dense.nets)) expectRel(other.nets[key], dense.nets[key], 1e-9, 1e-12);
    }
  });

  it('the band and the dense linear solvers agree on a larger network', () => {
    const { nodes, els } = network(12345);
    const s = toSheet(nodes, els);
    const a = solveOk(s, { linearSolver: 'dense' });
    const b = solveOk(s, { linearSolver: 'band' });
    for (const k of Object.keys(a.nets)) expectRel(b.nets[k], a.nets[k], REL, 1e-12);
  });
});
