// The solver a circuit engine keeps for one pattern: ordering once (symbolic analysis), then a
// numeric refactorisation per new set of values, falling back to a full factorisation with pivot
// search only when an old pivot has become too small.
import { approximateMinimumDegree } from './amd';
import type { CscMatrix } from './csc';
import { luFactor, type LuFactors } from './lu-factor';
import { luRefactor, luSolve, luSolveTransposed } from './lu-refactor';
import { staticPivotSymbolic } from './lu-symbolic';
import { deferZeroDiagonals } from './defer-zero-diagonals';

export interface SparseSolverOptions {
  /** diagonal preference in a full factorisation (0 < tol ≤ 1); default 0.1 */
  pivotTolerance?: number;
  /** smallest acceptable |old pivot| / column max in a refactorisation before re-pivoting; default 1e-3 */
  refactorTolerance?: number;
  /** 'amd' (default) or 'natural' (no reordering; for comparison) */
  ordering?: 'amd' | 'natural';
  /**
   * Try diagonal pivots in the fill-reducing order first (cheap symbolic step), and search pivots
   * only when one is zero or too small; default true. false always searches pivots.
   */
  staticPivotFirst?: boolean;
}

export interface SparseSolverStats {
  n: number;
  nnzA: number;
  nnzL: number;
  nnzU: number;
  fullFactorizations: number;
  refactorizations: number;
  /** whether the current factors use the static diagonal pivot order */
  staticPivots: boolean;
}

/**
 * Sparse LU for a fixed pattern. Fill `pattern.values` (same colPtr/rowIdx every time), call
 * `factor()`, then `solve(b)` as often as needed.
 */
export class SparseLuSolver {
  private order: Int32Array;
  private deferralTried = false;
  /** once the diagonal pivots have failed on this pattern, go straight to the pivot search */
  private staticFailed = false;
  private factors: LuFactors | null = null;
  /** scratch of the numeric factorisation */
  private readonly work: Float64Array;
  /** scratch of the triangular solves (kept apart from `work`) */
  private readonly solveWork: Float64Array;
  private readonly pivotTolerance: number;
  private readonly refactorTolerance: number;
  private readonly staticPivotFirst: boolean;
  private staticPivots = false;
  private full = 0;
  private refac = 0;

  /** @param pattern the matrix whose values will be refilled and refactorised (held by reference) */
  constructor(readonly pattern: CscMatrix, options: SparseSolverOptions = {}) {
    if (pattern.rows !== pattern.cols) throw new Error(`sparse LU needs a square matrix, got ${pattern.rows}×${pattern.cols}`);
    this.pivotTolerance = options.pivotTolerance ?? 0.1;
    this.refactorTolerance = options.refactorTolerance ?? 1e-3;
    this.staticPivotFirst = options.staticPivotFirst ?? true;
    this.order = options.ordering === 'natural' ? Int32Array.from({ length: pattern.cols }, (_, i) => i) : approximateMinimumDegree(pattern);
    this.work = new Float64Array(pattern.cols);
    this.solveWork = new Float64Array(pattern.cols);
  }

  /** Factorise the current values of `pattern` (refactorisation when possible). @throws SingularMatrixError */
  factor(): void {
    if (this.factors && luRefactor(this.factors, this.pattern, this.refactorTolerance, this.work)) {
      this.refac++;
      return;
    }
    this.factors = null;
    this.full++;
    if (this.staticPivotFirst && !this.staticFailed) {
      // first time: move zero-diagonal (source-branch) variables behind a neighbour before trying
      if (!this.deferralTried) {
        this.deferralTried = true;
        const alt = deferZeroDiagonals(this.pattern, this.order);
        if (alt) this.order = alt;
      }
      if (this.tryStatic(this.order)) return;
      this.staticFailed = true;
    }
    this.factors = luFactor(this.pattern, this.order, this.pivotTolerance);
    this.staticPivots = false;
  }

  /** the column (elimination) order in use: original index eliminated k-th */
  get colPerm(): Int32Array {
    return this.order;
  }

  private tryStatic(order: Int32Array): boolean {
    const f = staticPivotSymbolic(this.pattern, order);
    if (!luRefactor(f, this.pattern, this.refactorTolerance, this.work)) return false;
    this.factors = f;
    this.staticPivots = true;
    return true;
  }

  /** Force the next factor() to search pivots afresh (e.g. after a change of operating region). */
  forgetPivots(): void {
    this.factors = null;
  }

  /** x = A⁻¹·b for the last factorised values. */
  solve(b: ArrayLike<number>, x: Float64Array = new Float64Array(this.pattern.cols)): Float64Array {
    if (!this.factors) throw new Error('SparseLuSolver.solve called before factor()');
    return luSolve(this.factors, b, x, this.solveWork);
  }

  /** x = A⁻ᵀ·b for the last factorised values (adjoint sensitivities). */
  solveTransposed(b: ArrayLike<number>, x: Float64Array = new Float64Array(this.pattern.cols)): Float64Array {
    if (!this.factors) throw new Error('SparseLuSolver.solveTransposed called before factor()');
    return luSolveTransposed(this.factors, b, x, this.solveWork);
  }

  /** smallest |pivot| / column max of the last factorisation (1 = ideal, → 0 = near singular) */
  get pivotRatio(): number {
    return this.factors?.pivotRatio ?? 0;
  }

  stats(): SparseSolverStats {
    return {
      n: this.pattern.cols,
      nnzA: this.pattern.colPtr[this.pattern.cols],
      nnzL: this.factors?.lRowIdx.length ?? 0,
      nnzU: this.factors?.uRowIdx.length ?? 0,
      fullFactorizations: this.full,
      refactorizations: this.refac,
      staticPivots: this.staticPivots,
    };
  }
}
