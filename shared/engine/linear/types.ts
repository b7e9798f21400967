// The linear-solve layer: the Newton loop assembles A·x = b through this interface and asks for x.
// Implementations: dense LU (ml-matrix) for small systems, band LU after reverse Cuthill–McKee
// ordering for large sparse ones. A sparse LU with reused symbolic analysis can be added here.

export interface SingularInfo {
  singular: true;
  /** unknown indices whose pivot vanished (in the caller's numbering) */
  unknowns: number[];
}

export interface LinearSystem {
  readonly size: number;
  readonly solverName: string;
  /** zero A and b, keeping the structure */
  clear(): void;
  /** A[row][col] += value (row, col ≥ 0) */
  add(row: number, col: number, value: number): void;
  /** b[row] += value */
  addRhs(row: number, value: number): void;
  /** factor and solve; x is a fresh array (or the singular unknowns) */
  solve(): Float64Array | SingularInfo;
}

export type LinearSolverKind = 'auto' | 'dense' | 'band' | 'sparse';

export interface LinearSystemFactory {
  readonly name: string;
  /** pattern: every (row, col) position that `add` will ever be called with */
  create(size: number, pattern: ReadonlyArray<readonly [number, number]>): LinearSystem;
}

/** Relative pivot threshold below which a column counts as singular. */
export const PIVOT_RELATIVE_TOLERANCE = 1e-15;
