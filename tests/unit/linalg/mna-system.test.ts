// The engine-facing adapter: one ordering and symbolic analysis for a pattern, then only numeric
// refactorisations across repeated assemblies (Newton iterations, sweep points, samples); answers
// checked against the closed form of a resistor ladder driven by an ideal source (MNA with a
// branch-current unknown: Ho, Ruehli & Brennan 1975).
import { describe, expect, it } from 'vitest';
import { SparseMnaSystem } from '../../../shared/linalg';

/** n-node ladder: source V at node 0 (branch unknown n), series R between nodes, shunt G at each node. */
function ladder(n: number) {
  const pattern: Array<[number, number]> = [];
  for (let i = 0; i < n; i++) {
    pattern.push([i, i]);
    if (i + 1 < n) pattern.push([i, i + 1], [i + 1, i]);
  }
  pattern.push([0, n], [n, 0]);
  return { size: n + 1, pattern };
}

function stamp(sys: SparseMnaSystem, n: number, r: number, g: number, v: number) {
  sys.clear();
  for (let i = 0; i + 1 < n; i++) {
    sys.add(i, i, 1 / r);
    sys.add(i + 1, i + 1, 1 / r);
    sys.add(i, i + 1, -1 / r);
    sys.add(i + 1, i, -1 / r);
  }
  for (let i = 0; i < n; i++) sys.add(i, i, g);
  sys.add(0, n, 1);
  sys.add(n, 0, 1);
  sys.addRhs(n, v);
}

describe('SparseMnaSystem', () => {
  it('keeps one symbolic analysis across repeated solves and stays exact', () => {
    const n = 200;
    const { size, pattern } = ladder(n);
    const sys = new SparseMnaSystem(size, pattern);
    for (let k = 0; k < 20; k++) {
      const v = 1 + k;
      stamp(sys, n, 100 * (1 + k / 10), 1e-3, v);
      const x = sys.solve();
      if (!(x instanceof Float64Array)) throw new Error('singular');
      expect(x[0]).toBeCloseTo(v, 12); // the source sets node 0
      // KCL at the last node: (x[n-2] − x[n-1])/R = G·x[n-1]
      const r = 100 * (1 + k / 10);
      expect((x[n - 2] - x[n - 1]) / r).toBeCloseTo(1e-3 * x[n - 1], 12);
    }
    const st = sys.stats();
    expect(st.fullFactorizations).toBe(1);
    expect(st.refactorizations).toBe(19);
    expect(st.staticPivots).toBe(true);
  });

  it('reports the unknown of a singular system and refuses entries outside the pattern', () => {
    const sys = new SparseMnaSystem(2, [[0, 0], [1, 1]]);
    sys.clear();
    sys.add(0, 0, 1);
    expect(sys.solve()).toEqual({ singular: true, unknowns: [1] });
    expect(() => sys.add(0, 1, 1)).toThrow(/not in the recorded pattern/);
  });
});
