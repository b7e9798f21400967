// The sparse LU against independent general-purpose libraries from npm: ml-matrix's dense LU
// decomposition and mathjs' sparse LU (slu + lusolve), on seeded random sparse matrices, some of
// which have zero diagonals and so need row pivoting (as MNA rows of voltage sources do).
import { describe, expect, it } from 'vitest';
import { LuDecomposition, Matrix } from 'ml-matrix';
import { lusolve, slu, sparse } from 'mathjs';
import { cscMultiply, SingularMatrixError, SparseLuSolver, cscFromTriplets } from '../../../shared/linalg';
import { gridLaplacian, randomSparse } from './random-matrices';

function maxAbsDiff(a: ArrayLike<number>, b: ArrayLike<number>): number {
  let m = 0;
  for (let i = 0; i < a.length; i++) m = Math.max(m, Math.abs(a[i] - b[i]));
  return m;
}

const cases = [
  { n: 1, perColumn: 0, zeroDiagonalFraction: 0, seed: 1 },
  { n: 5, perColumn: 1, zeroDiagonalFraction: 0, seed: 2 },
  { n: 12, perColumn: 2, zeroDiagonalFraction: 0.3, seed: 3 },
  { n: 40, perColumn: 3, zeroDiagonalFraction: 0.2, seed: 4 },
  { n: 80, perColumn: 2, zeroDiagonalFraction: 0.5, seed: 5 },
  { n: 150, perColumn: 4, zeroDiagonalFraction: 0.1, seed: 6 },
];

describe('sparse LU solves like ml-matrix (dense LU) and mathjs (slu/lusolve)', () => {
  for (const c of cases) {
    it(`n=${c.n}, ${c.perColumn}/column, ${c.zeroDiagonalFraction * 100} % zero diagonals`, () => {
      const { a, dense } = randomSparse(c);
      const b = Array.from({ length: c.n }, (_, i) => Math.sin(i + 1));
      const solver = new SparseLuSolver(a);
      solver.factor();
      const x = solver.solve(b);

      const ref = new LuDecomposition(new Matrix(dense)).solve(Matrix.columnVector(b)).to1DArray();
      const mj = (lusolve(slu(sparse(dense), 1, 0.001), b) as unknown as { toArray(): number[][] }).toArray().map((r) => r[0]);
      const scale = Math.max(1, ...ref.map(Math.abs));
      expect(maxAbsDiff(x, ref) / scale).toBeLessThan(1e-10);
      expect(maxAbsDiff(x, mj) / scale).toBeLessThan(1e-10);
      expect(maxAbsDiff(cscMultiply(a, x), b)).toBeLessThan(1e-10);
    });
  }

  it('transposed solve matches ml-matrix on Aᵀ', () => {
    const { a, dense } = randomSparse({ n: 60, perColumn: 3, zeroDiagonalFraction: 0.3, seed: 11 });
    const b = Array.from({ length: 60 }, (_, i) => Math.cos(i));
    const solver = new SparseLuSolver(a);
    solver.factor();
    const ref = new LuDecomposition(new Matrix(dense).transpose()).solve(Matrix.columnVector(b)).to1DArray();
    expect(maxAbsDiff(solver.solveTransposed(b), ref)).toBeLessThan(1e-10);
  });

  it('refactorisation with new values gives the same answer as a fresh factorisation', () => {
    const { a, dense } = randomSparse({ n: 70, perColumn: 3, zeroDiagonalFraction: 0.25, seed: 21 });
    const solver = new SparseLuSolver(a);
    solver.factor();
    // new values on the same pattern, as the next Newton iteration would stamp
    for (let p = 0; p < a.values.length; p++) a.values[p] *= 1 + 0.3 * Math.sin(p);
    for (let j = 0; j < 70; j++) for (let p = a.colPtr[j]; p < a.colPtr[j + 1]; p++) dense[a.rowIdx[p]][j] = a.values[p];
    solver.factor();
    expect(solver.stats().refactorizations + solver.stats().fullFactorizations).toBe(2);
    const b = Array.from({ length: 70 }, () => 1);
    const ref = new LuDecomposition(new Matrix(dense)).solve(Matrix.columnVector(b)).to1DArray();
    expect(maxAbsDiff(solver.solve(b), ref)).toBeLessThan(1e-9);
  });

  it('falls back to a pivot search when an old pivot becomes zero', () => {
    // [[1, 1], [1, 0]] factorises with the diagonal pivot 1 first; then a11 = 0 forces row exchange
    const a = cscFromTriplets(2, 2, [0, 0, 1, 1], [0, 1, 0, 1], [2, 1, 1, 0]);
    const solver = new SparseLuSolver(a, { ordering: 'natural' });
    solver.factor();
    a.values[0] = 0; // (0,0)
    solver.factor();
    expect(solver.stats().fullFactorizations).toBe(2);
    // [[0,1],[1,0]] x = [3, 4] → x = [4, 3]
    expect(Array.from(solver.solve([3, 4]))).toEqual([4, 3]);
  });

  it('keeps cheap diagonal pivots for an MNA matrix with a voltage-source row (zero diagonal)', () => {
    // 12×12 resistor grid plus one branch unknown: v(node 0) = 1 V (rows/cols [G B; Bᵀ 0])
    const g = gridLaplacian(12);
    const n = g.cols + 1;
    const ti: number[] = [];
    const tj: number[] = [];
    const tv: number[] = [];
    for (let j = 0; j < g.cols; j++)
      for (let p = g.colPtr[j]; p < g.colPtr[j + 1]; p++) {
        ti.push(g.rowIdx[p]);
        tj.push(j);
        tv.push(g.values[p]);
      }
    ti.push(n - 1, 0, n - 1);
    tj.push(0, n - 1, n - 1);
    tv.push(1, 1, 0);
    const a = cscFromTriplets(n, n, ti, tj, tv);
    const b = new Float64Array(n);
    b[n - 1] = 1;
    const solver = new SparseLuSolver(a);
    solver.factor();
    expect(solver.stats().staticPivots).toBe(true);
    const dense = Array.from({ length: n }, () => new Array<number>(n).fill(0));
    for (let k = 0; k < ti.length; k++) dense[ti[k]][tj[k]] += tv[k];
    const ref = new LuDecomposition(new Matrix(dense)).solve(Matrix.columnVector(Array.from(b))).to1DArray();
    expect(maxAbsDiff(solver.solve(b), ref)).toBeLessThan(1e-12);
  });

  it('names the column of a structurally singular matrix', () => {
    // column 1 is empty apart from a zero diagonal
    const a = cscFromTriplets(3, 3, [0, 1, 2, 2], [0, 1, 2, 0], [1, 0, 1, 1]);
    const solver = new SparseLuSolver(a, { ordering: 'natural' });
    expect(() => solver.factor()).toThrow(SingularMatrixError);
    try {
      solver.factor();
    } catch (e) {
      expect((e as SingularMatrixError).column).toBe(1);
    }
  });
});

describe('property: any regular random sparse matrix (fast-check)', () => {
  it('solves like ml-matrix, first factorisation and refactorisation with new values alike', async () => {
    const fc = (await import('fast-check')).default;
    fc.assert(
      fc.property(fc.integer({ min: 1, max: 45 }), fc.integer({ min: 0, max: 4 }), fc.double({ min: 0, max: 0.6, noNaN: true }), fc.integer({ min: 1, max: 1e9 }), (n, perColumn, zeroDiagonalFraction, seed) => {
        const { a, dense } = randomSparse({ n, perColumn, zeroDiagonalFraction, seed });
        const b = Array.from({ length: n }, (_, i) => 1 + i);
        const solver = new SparseLuSolver(a);
        solver.factor();
        const ref = new LuDecomposition(new Matrix(dense)).solve(Matrix.columnVector(b)).to1DArray();
        const scale = Math.max(1, ...ref.map(Math.abs));
        expect(maxAbsDiff(solver.solve(b), ref) / scale).toBeLessThan(1e-9);
        // new values on the same pattern after a solve (regression: the solve's scratch must not
        // leak into the refactorisation)
        for (let p = 0; p < a.values.length; p++) a.values[p] *= 1 + 0.2 * Math.cos(p + seed);
        for (let j = 0; j < n; j++) for (let p = a.colPtr[j]; p < a.colPtr[j + 1]; p++) dense[a.rowIdx[p]][j] = a.values[p];
        solver.factor();
        const ref2 = new LuDecomposition(new Matrix(dense)).solve(Matrix.columnVector(b)).to1DArray();
        const scale2 = Math.max(1, ...ref2.map(Math.abs));
        expect(maxAbsDiff(solver.solve(b), ref2) / scale2).toBeLessThan(1e-8);
      }),
      { numRuns: 150 },
    );
  });
});
