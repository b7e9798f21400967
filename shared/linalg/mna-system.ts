// The sparse LU behind the engine's LinearSystem interface (shared/engine/linear/types.ts), so the
// Newton loop can use it unchanged: the pattern the engine records up front becomes the fixed CSC
// pattern, the AMD ordering is computed once, and each solve() refactorises numerically.
import type { LinearSystem, LinearSystemFactory, SingularInfo } from '../engine/linear/types';
import { SingularMatrixError } from './lu-factor';
import { SparsePatternBuilder } from './sparse-pattern';
import { SparseLuSolver } from './sparse-solver';

/** Systems up to 2048 unknowns index entries through a flat table (16 MiB at most). */
const TABLE_LIMIT = 2048 * 2048;

export class SparseMnaSystem implements LinearSystem {
  readonly solverName = 'sparse-lu (AMD, refactorising)';
  private readonly values: Float64Array;
  private readonly rhs: Float64Array;
  /** (row·size + col) → value index: a flat table for small systems (fast), a Map for large ones */
  private readonly table: Int32Array | null;
  private readonly index = new Map<number, number>();
  private readonly solver: SparseLuSolver;

  /** @param pattern every (row, col) that add() will be called with (the diagonal is added anyway) */
  constructor(readonly size: number, pattern: ReadonlyArray<readonly [number, number]>) {
    const b = new SparsePatternBuilder(size);
    const slots = pattern.map(([r, c]) => b.slot(r, c));
    const built = b.build();
    this.table = size * size <= TABLE_LIMIT ? new Int32Array(size * size).fill(-1) : null;
    const put = (key: number, at: number) => (this.table ? (this.table[key] = at) : this.index.set(key, at));
    for (let k = 0; k < pattern.length; k++) put(pattern[k][0] * size + pattern[k][1], built.slotIndex[slots[k]]);
    for (let i = 0; i < size; i++) put(i * size + i, built.slotIndex[b.slot(i, i)]);
    this.values = built.matrix.values;
    this.rhs = new Float64Array(size);
    this.solver = new SparseLuSolver(built.matrix);
  }

  clear(): void {
    this.values.fill(0);
    this.rhs.fill(0);
  }

  add(row: number, col: number, value: number): void {
    const key = row * this.size + col;
    const p = this.table ? this.table[key] : this.index.get(key);
    if (p === undefined || p < 0 || !(row >= 0 && col >= 0 && row < this.size && col < this.size)) throw new Error(`sparse system: entry (${row}, ${col}) is not in the recorded pattern`);
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
