// Sparse LU with threshold partial pivoting, left-looking: J. R. Gilbert and T. Peierls, "Sparse
// partial pivoting in time proportional to arithmetic operations", SIAM J. Sci. Stat. Comput. 9(5),
// 862–874, 1988, in the formulation of T. A. Davis, "Direct Methods for Sparse Linear Systems",
// SIAM 2006, §6.3 (re-expressed from memory). Column k of A·Q is solved against the L found so far
// (x = L \ A(:,q[k]), its pattern found by a depth-first search of L's graph); the pivot is the
// diagonal when it is within `pivotTolerance` of the largest candidate, else the largest. The
// diagonal preference keeps the pivot order close to the fill-reducing order.
import type { CscMatrix } from './csc';

/** L (unit lower, diagonal stored first in each column) and U (diagonal stored last) of P·A·Q = L·U. */
export interface LuFactors {
  readonly n: number;
  /** column k of the factors is column colPerm[k] of A */
  readonly colPerm: Int32Array;
  /** pinv[i] = the pivot position of original row i */
  readonly pinv: Int32Array;
  /** L's row indices are pivot positions */
  readonly lColPtr: Int32Array;
  lRowIdx: Int32Array;
  lValues: Float64Array;
  /** U's row indices are pivot positions, in the topological order the refactorisation replays */
  readonly uColPtr: Int32Array;
  uRowIdx: Int32Array;
  uValues: Float64Array;
  /** smallest |pivot| / largest candidate in its column seen in the last (re)factorisation */
  pivotRatio: number;
}

/** Thrown when no usable pivot exists: names the column so the caller can name the net or branch. */
export class SingularMatrixError extends Error {
  constructor(
    /** original column index of A that has no non-zero pivot candidate */
    readonly column: number,
  ) {
    super(`the matrix is singular: column ${column} has no usable pivot`);
    this.name = 'SingularMatrixError';
  }
}

function grow<T extends Int32Array | Float64Array>(a: T, need: number): T {
  if (need <= a.length) return a;
  const b = new (a.constructor as new (n: number) => T)(Math.max(need, Math.ceil(a.length * 1.6)));
  b.set(a);
  return b;
}

/**
 * Factorise A (square, CSC) with the column order `colPerm` (from a fill-reducing ordering).
 * @param pivotTolerance 0 < tol ≤ 1: accept the diagonal when |a_kk| ≥ tol·max|candidate| (1 = plain partial pivoting)
 * @throws SingularMatrixError when a column has no non-zero pivot candidate
 */
/**
 * A pivot at or below this fraction of the largest entry of its column of A counts as zero (as in
 * the engine's dense solver): what is left of the column after elimination is rounding noise.
 */
export const SINGULAR_PIVOT_RELATIVE = 1e-15;

export function luFactor(a: CscMatrix, colPerm: Int32Array, pivotTolerance = 0.1): LuFactors {
  const n = a.cols;
  const { colPtr: Ap, rowIdx: Ai, values: Ax } = a;
  let cap = 4 * Ap[n] + n;
  let Li = new Int32Array(cap);
  let Lx = new Float64Array(cap);
  let Ui = new Int32Array(cap);
  let Ux = new Float64Array(cap);
  const Lp = new Int32Array(n + 1);
  const Up = new Int32Array(n + 1);
  const pinv = new Int32Array(n).fill(-1);
  const x = new Float64Array(n);
  const xi = new Int32Array(n); // reach, in topological order from xi[top]
  const stack = new Int32Array(n);
  const pstack = new Int32Array(n);
  const marked = new Int32Array(n);
  let stamp = 0;
  let lnz = 0;
  let unz = 0;
  let worstRatio = 1;

  for (let k = 0; k < n; k++) {
    Lp[k] = lnz;
    Up[k] = unz;
    if (lnz + n > Li.length) {
      cap = lnz + n;
      Li = grow(Li, cap);
      Lx = grow(Lx, cap);
    }
    if (unz + n > Ui.length) {
      cap = unz + n;
      Ui = grow(Ui, cap);
      Ux = grow(Ux, cap);
    }
    const col = colPerm[k];

    // symbolic: reach of A(:,col) in the graph of L (nodes = original rows)
    stamp++;
    let top = n;
    for (let p = Ap[col]; p < Ap[col + 1]; p++) {
      const start = Ai[p];
      if (marked[start] === stamp) continue;
      let head = 0;
      stack[0] = start;
      while (head >= 0) {
        const j = stack[head];
        const jnew = pinv[j];
        if (marked[j] !== stamp) {
          marked[j] = stamp;
          pstack[head] = jnew < 0 ? 0 : Lp[jnew] + 1;
        }
        let done = true;
        const p2 = jnew < 0 ? 0 : Lp[jnew + 1];
        for (let q = pstack[head]; q < p2; q++) {
          const i = Li[q];
          if (marked[i] === stamp) continue;
          pstack[head] = q;
          stack[++head] = i;
          done = false;
          break;
        }
        if (done) {
          head--;
          xi[--top] = j;
        }
      }
    }

    // numeric: x = L \ A(:,col)
    let colMax = 0;
    for (let p = Ap[col]; p < Ap[col + 1]; p++) {
      x[Ai[p]] = Ax[p];
      const t = Math.abs(Ax[p]);
      if (t > colMax) colMax = t;
    }
    for (let px = top; px < n; px++) {
      const j = xi[px];
      const J = pinv[j];
      if (J < 0) continue;
      const xj = x[j];
      if (xj === 0) continue;
      let p = Lp[J] + 1;
      const end = Lp[J + 1];
      for (; p + 3 < end; p += 4) {
        const i0 = Li[p];
        const i1 = Li[p + 1];
        const i2 = Li[p + 2];
        const i3 = Li[p + 3];
        x[i0] -= Lx[p] * xj;
        x[i1] -= Lx[p + 1] * xj;
        x[i2] -= Lx[p + 2] * xj;
        x[i3] -= Lx[p + 3] * xj;
      }
      for (; p < end; p++) x[Li[p]] -= Lx[p] * xj;
    }

    // pivot choice
    let ipiv = -1;
    let big = -1;
    for (let px = top; px < n; px++) {
      const i = xi[px];
      if (pinv[i] < 0) {
        const t = Math.abs(x[i]);
        if (t > big) {
          big = t;
          ipiv = i;
        }
      } else {
        Ui[unz] = pinv[i];
        Ux[unz++] = x[i];
      }
    }
    if (ipiv === -1 || !(big > SINGULAR_PIVOT_RELATIVE * colMax) || !(big > 0)) {
      for (let px = top; px < n; px++) x[xi[px]] = 0;
      throw new SingularMatrixError(col);
    }
    if (pinv[col] < 0 && marked[col] === stamp && Math.abs(x[col]) >= big * pivotTolerance) ipiv = col;
    const pivot = x[ipiv];
    worstRatio = Math.min(worstRatio, Math.abs(pivot) / big);
    Ui[unz] = k;
    Ux[unz++] = pivot;
    pinv[ipiv] = k;
    Li[lnz] = ipiv;
    Lx[lnz++] = 1;
    for (let px = top; px < n; px++) {
      const i = xi[px];
      if (pinv[i] < 0) {
        Li[lnz] = i;
        Lx[lnz++] = x[i] / pivot;
      }
      x[i] = 0;
    }
  }
  Lp[n] = lnz;
  Up[n] = unz;
  for (let p = 0; p < lnz; p++) Li[p] = pinv[Li[p]];
  return {
    n,
    colPerm,
    pinv,
    lColPtr: Lp,
    lRowIdx: Li.slice(0, lnz),
    lValues: Lx.slice(0, lnz),
    uColPtr: Up,
    uRowIdx: Ui.slice(0, unz),
    uValues: Ux.slice(0, unz),
    pivotRatio: worstRatio,
  };
}
