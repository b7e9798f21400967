// A fixed sparsity pattern assembled from stamps. A circuit's matrix has the same structure at every
// Newton iteration, sweep point and Monte Carlo sample; only the values change. Registering each
// stamp position once gives a slot number, and re-assembly is then `values[slot] += g` into a
// CSC value array the LU can refactorise without looking at the structure again.
import { cscFromTriplets, type CscMatrix } from './csc';

/** A CSC pattern plus the map from registered stamp slots to positions in its value array. */
export interface StampedPattern {
  /** the pattern; its `values` array is the one to fill before each factorisation */
  readonly matrix: CscMatrix;
  /** slot → index into matrix.values */
  readonly slotIndex: Int32Array;
}

/** Collects (row, column) stamp positions of an n×n system, then freezes them into a CSC pattern. */
export class SparsePatternBuilder {
  private rows: number[] = [];
  private cols: number[] = [];
  private bySlotKey = new Map<number, number>();

  constructor(readonly n: number) {}

  /** Slot for entry (row, col), 0-based; asking twice for one position gives the same slot. */
  slot(row: number, col: number): number {
    if (!(row >= 0 && row < this.n && col >= 0 && col < this.n)) throw new Error(`stamp (${row}, ${col}) is outside the ${this.n}×${this.n} system`);
    const key = row * this.n + col;
    const known = this.bySlotKey.get(key);
    if (known !== undefined) return known;
    const s = this.rows.length;
    this.rows.push(row);
    this.cols.push(col);
    this.bySlotKey.set(key, s);
    return s;
  }

  /** Freeze the pattern; every diagonal entry is included so the ordering and pivoting see it. */
  build(): StampedPattern {
    for (let i = 0; i < this.n; i++) this.slot(i, i);
    const m = this.rows.length;
    // tag each triplet with its slot number in the value so its CSC position can be found after sorting
    const tags = new Float64Array(m);
    for (let s = 0; s < m; s++) tags[s] = s + 1;
    const tagged = cscFromTriplets(this.n, this.n, this.rows, this.cols, tags);
    const slotIndex = new Int32Array(m);
    for (let p = 0; p < tagged.values.length; p++) slotIndex[tagged.values[p] - 1] = p;
    const matrix: CscMatrix = { ...tagged, values: new Float64Array(tagged.values.length) };
    return { matrix, slotIndex };
  }
}
