// Dense LU with partial pivoting from ml-matrix; fine up to a few hundred unknowns.
import { LuDecomposition, Matrix } from 'ml-matrix';
import { PIVOT_RELATIVE_TOLERANCE, type LinearSystem, type LinearSystemFactory, type SingularInfo } from './types';

export class DenseSystem implements LinearSystem {
  readonly solverName = 'dense-lu (ml-matrix)';
  private a: Float64Array;
  private b: Float64Array;
  constructor(readonly size: number) {
    this.a = new Float64Array(size * size);
    this.b = new Float64Array(size);
  }
  clear(): void {
    this.a.fill(0);
    this.b.fill(0);
  }
  add(row: number, col: number, value: number): void {
    this.a[row * this.size + col] += value;
  }
  addRhs(row: number, value: number): void {
    this.b[row] += value;
  }
  solve(): Float64Array | SingularInfo {
    const n = this.size;
    if (n === 0) return new Float64Array(0);
    const colMax = new Float64Array(n);
    for (let i = 0; i < n; i++)
      for (let j = 0; j < n; j++) {
        const v = Math.abs(this.a[i * n + j]);
        if (v > colMax[j]) colMax[j] = v;
      }
    const m = Matrix.from1DArray(n, n, this.a);
    const lu = new LuDecomposition(m);
    const u = lu.upperTriangularMatrix;
    const bad: number[] = [];
    for (let j = 0; j < n; j++) {
      const p = Math.abs(u.get(j, j));
      if (!(p > PIVOT_RELATIVE_TOLERANCE * colMax[j]) || colMax[j] === 0) bad.push(j);
    }
    if (bad.length) return { singular: true, unknowns: bad };
    const x = lu.solve(Matrix.columnVector(Array.from(this.b)));
    const out = new Float64Array(n);
    for (let i = 0; i < n; i++) out[i] = x.get(i, 0);
    return out;
  }
}

export const denseFactory: LinearSystemFactory = {
  name: 'dense',
  create: (size) => new DenseSystem(size),
};
