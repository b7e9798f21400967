// The sparse LU behind the engine's LinearSystem interface (shared/engine/linear/types.ts), so the
// Newton loop can use it unchanged: the pattern the engine records up front becomes the fixed CSC
// pattern, the AMD ordering is computed once, and each solve() refactorises numerically.
import type { LinearSystem, LinearSystemFactory, SingularInfo } from '../engine/linear/types';
import { cscFromTriplets, type CscMatrix } from './csc';
import { SingularMatrixError } from './lu-factor';
import { SparseLuSolver } from './sparse-solver';

/** Systems up to 1024 unknowns index entries through a flat table (4 MiB at most). */
const TABLE_LIMIT = 1024 * 1024;

/** The CSC pattern of the recorded positions plus every diagonal (duplicates merged). */
function patternMatrix(size: number, pattern: ReadonlyArray<readonly [number, number]>): CscMatrix {
  const hasDiag = new Uint8Array(size);
  const rows: number[] = [];
  const cols: number[] = [];
  for (const [r, c] of pattern) {
    rows.push(r);
    cols.push(c);
    if (r === c) hasDiag[r] = 1;
  }
  for (let i = 0; i < size; i++)
    if (!hasDiag[i]) {
      rows.push(i);
      cols.push(i);
    }
  const m = cscFromTriplets(size, size, rows, cols, new Float64Array(rows.length));
  m.values.fill(0);
  return m;
}

export class SparseMnaSystem implements LinearSystem {
  readonly solverName = 'sparse-lu (AMD, refactorising)';
  private readonly matrix: CscMatrix;
  private readonly values: Float64Array;
  private readonly rhs: Float64Array;
  /** (row·size + col) → value index, for small systems; large ones search the (short) CSC column */
  private readonly table: Int32Array | null;
  private readonly solver: SparseLuSolver;

  /** @param pattern every (row, col) that add() will be called with (the diagonal is added anyway) */
  constructor(readonly size: number, pattern: ReadonlyArray<readonly [number, number]>) {
    this.matrix = patternMatrix(size, pattern);
    this.values = this.matrix.values;
    this.rhs = new Float64Array(size);
    if (size * size <= TABLE_LIMIT) {
      const t = new Int32Array(size * size).fill(-1);
      const { colPtr, rowIdx } = this.matrix;
      for (let j = 0; j < size; j++) for (let p = colPtr[j]; p < colPtr[j + 1]; p++) t[rowIdx[p] * size + j] = p;
      this.table = t;
    } else this.table = null;
    this.solver = new SparseLuSolver(this.matrix);
  }

  clear(): void {
    this.values.fill(0);
    this.rhs.fill(0);
  }

  add(row: number, col: number, value: number): void {
    let p = -1;
    if (this.table) {
      if (row >= 0 && col >= 0 && row < this.size && col < this.size) p = this.table[row * this.size + col];
    } else if (col >= 0 && col < this.size) {
      const { colPtr, rowIdx } = this.matrix;
      for (let q = colPtr[col]; q < colPtr[col + 1]; q++)
        if (rowIdx[q] === row) {
          p = q;
          break;
        }
    }
    if (p < 0) throw new Error(`sparse system: entry (${row}, ${col}) is not in the recorded pattern`);
    this.values[p] += value;
  }

  addRhs(row: number, value: number): void {
    this.rhs[row] += value;
  }

  solve(): Float64Array | SingularInfo {
    if (this.size === 0) return new Float64Array(0);
    try {
      this.solver.factor();
    } catch (e) {
      if (e instanceof SingularMatrixError) return { singular: true, unknowns: [e.column] };
      throw e;
    }
    return this.solver.solve(this.rhs);
  }

  /** counts of full factorisations and refactorisations, fill (for benchmarks) */
  stats() {
    return this.solver.stats();
  }
}

/** Factory for the engine: sparse LU with AMD ordering and symbolic reuse. */
export const sparseLuFactory: LinearSystemFactory = {
  name: 'sparse',
  create: (size, pattern) => new SparseMnaSystem(size, pattern),
};
