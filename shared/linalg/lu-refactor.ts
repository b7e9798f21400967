// Numeric-only refactorisation: same pattern, same pivot order, new values. This is what makes
// Newton iterations, sweep points and Monte Carlo samples cheap — no graph search, no pivot search,
// just the arithmetic (the scheme KLU uses for circuit matrices: T. A. Davis and E. Palamadai
// Natarajan, "Algorithm 907: KLU", ACM TOMS 37(3), 2010 — from memory). The old pivots stay valid
// only while they stay large enough, so every pivot is checked against its column and the caller
// falls back to a full factorisation (with pivot search) when one has become too small.
import type { CscMatrix } from './csc';
import { SINGULAR_PIVOT_RELATIVE, type LuFactors } from './lu-factor';

/**
 * Overwrite the values of `f` with the factors of `a`, which must have the pattern `f` was built
 * from (same colPtr/rowIdx). `work` is scratch of length n (any contents). Returns false — leaving `f` unusable until a full factorisation —
 * when a pivot is zero or smaller than `pivotTolerance` × the largest entry below it.
 */
export function luRefactor(f: LuFactors, a: CscMatrix, pivotTolerance = 1e-3, work: Float64Array = new Float64Array(f.n)): boolean {
  const n = f.n;
  const { colPtr: Ap, rowIdx: Ai, values: Ax } = a;
  const { colPerm, pinv, lColPtr: Lp, lRowIdx: Li, lValues: Lx, uColPtr: Up, uRowIdx: Ui, uValues: Ux } = f;
  const x = work;
  let worstRatio = 1;
  for (let k = 0; k < n; k++) {
    const col = colPerm[k];
    // clear this column's pattern first: the scratch vector may hold anything (a caller may share it)
    for (let p = Up[k]; p < Up[k + 1]; p++) x[Ui[p]] = 0;
    for (let q = Lp[k] + 1; q < Lp[k + 1]; q++) x[Li[q]] = 0;
    let colMax = 0;
    for (let p = Ap[col]; p < Ap[col + 1]; p++) {
      const v = Ax[p];
      x[pinv[Ai[p]]] = v;
      if (v > colMax) colMax = v;
      else if (-v > colMax) colMax = -v;
    }
    const uEnd = Up[k + 1] - 1; // the diagonal is stored last
    for (let p = Up[k]; p < uEnd; p++) {
      const j = Ui[p];
      const ujk = x[j];
      Ux[p] = ujk;
      x[j] = 0;
      if (ujk === 0) continue;
      // unrolled by four: the scattered update is the whole cost of a refactorisation
      let q = Lp[j] + 1;
      const end = Lp[j + 1];
      for (; q + 3 < end; q += 4) {
        const i0 = Li[q];
        const i1 = Li[q + 1];
        const i2 = Li[q + 2];
        const i3 = Li[q + 3];
        x[i0] -= Lx[q] * ujk;
        x[i1] -= Lx[q + 1] * ujk;
        x[i2] -= Lx[q + 2] * ujk;
        x[i3] -= Lx[q + 3] * ujk;
      }
      for (; q < end; q++) x[Li[q]] -= Lx[q] * ujk;
    }
    const pivot = x[k];
    x[k] = 0;
    Ux[uEnd] = pivot;
    let big = Math.abs(pivot);
    for (let q = Lp[k] + 1; q < Lp[k + 1]; q++) {
      const t = Math.abs(x[Li[q]]);
      if (t > big) big = t;
    }
    const ratio = big > 0 ? Math.abs(pivot) / big : 0;
    if (!(ratio >= pivotTolerance) || !(Math.abs(pivot) > SINGULAR_PIVOT_RELATIVE * colMax)) {
      x.fill(0);
      return false;
    }
    if (ratio < worstRatio) worstRatio = ratio;
    for (let q = Lp[k] + 1; q < Lp[k + 1]; q++) {
      const i = Li[q];
      Lx[q] = x[i] / pivot;
      x[i] = 0;
    }
  }
  f.pivotRatio = worstRatio;
  return true;
}

/** Solve A·x = b with the factors of A; b is left untouched. `work` is a scratch vector of length n. */
export function luSolve(f: LuFactors, b: ArrayLike<number>, x: Float64Array = new Float64Array(f.n), work: Float64Array = new Float64Array(f.n)): Float64Array {
  const n = f.n;
  const { colPerm, pinv, lColPtr: Lp, lRowIdx: Li, lValues: Lx, uColPtr: Up, uRowIdx: Ui, uValues: Ux } = f;
  const y = work;
  for (let i = 0; i < n; i++) y[pinv[i]] = b[i];
  for (let j = 0; j < n; j++) {
    const yj = y[j];
    if (yj === 0) continue;
    for (let p = Lp[j] + 1; p < Lp[j + 1]; p++) y[Li[p]] -= Lx[p] * yj;
  }
  for (let j = n - 1; j >= 0; j--) {
    const d = Up[j + 1] - 1;
    const yj = (y[j] /= Ux[d]);
    if (yj === 0) continue;
    for (let p = Up[j]; p < d; p++) y[Ui[p]] -= Ux[p] * yj;
  }
  for (let k = 0; k < n; k++) x[colPerm[k]] = y[k];
  return x;
}

/** Solve Aᵀ·x = b with the factors of A (for adjoint sensitivities: one solve gives ∂output/∂every stamp). */
export function luSolveTransposed(f: LuFactors, b: ArrayLike<number>, x: Float64Array = new Float64Array(f.n), work: Float64Array = new Float64Array(f.n)): Float64Array {
  // Aᵀ = Q·Uᵀ·Lᵀ·P, so solve Uᵀ z = Qᵀ b, then Lᵀ y = z, then x = Pᵀ y.
  const n = f.n;
  const { colPerm, pinv, lColPtr: Lp, lRowIdx: Li, lValues: Lx, uColPtr: Up, uRowIdx: Ui, uValues: Ux } = f;
  const z = work;
  for (let k = 0; k < n; k++) z[k] = b[colPerm[k]];
  for (let j = 0; j < n; j++) {
    const d = Up[j + 1] - 1;
    let s = z[j];
    for (let p = Up[j]; p < d; p++) s -= Ux[p] * z[Ui[p]];
    z[j] = s / Ux[d];
  }
  for (let j = n - 1; j >= 0; j--) {
    let s = z[j];
    for (let p = Lp[j] + 1; p < Lp[j + 1]; p++) s -= Lx[p] * z[Li[p]];
    z[j] = s;
  }
  for (let i = 0; i < n; i++) x[i] = z[pinv[i]];
  return x;
}
