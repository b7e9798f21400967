// Static-pivot symbolic factorisation: with the pivots on the diagonal of the fill-reduced order,
// the pattern of L is the Cholesky pattern of P(A+Aᵀ)Pᵀ and U has the transposed pattern. Each
// column of U is found as the row subtree of the elimination tree ("ereach"), which comes out in
// the topological order the numeric refactorisation needs (J. W. H. Liu, "The role of elimination
// trees in sparse factorization", SIAM J. Matrix Anal. Appl. 11(1), 134–172, 1990; T. A. Davis,
// "Direct Methods for Sparse Linear Systems", SIAM 2006, §4.1–4.2 — from memory). It costs
// O(|L|) instead of the graph searches of a pivoting factorisation; the numeric step then checks
// every pivot and the caller falls back to partial pivoting when a diagonal is zero or too small
// (as in MNA rows of voltage sources).
import type { CscMatrix } from './csc';
import type { LuFactors } from './lu-factor';

/** Factor structure for P·A·Pᵀ = L·U with diagonal pivots, values zero (fill them with luRefactor). */
export function staticPivotSymbolic(a: CscMatrix, perm: Int32Array): LuFactors {
  const n = a.cols;
  const inv = new Int32Array(n);
  for (let k = 0; k < n; k++) inv[perm[k]] = k;

  // strictly upper part of the permuted symmetric pattern, by column
  const count = new Int32Array(n + 1);
  const { colPtr: Ap, rowIdx: Ai } = a;
  for (let j = 0; j < n; j++)
    for (let p = Ap[j]; p < Ap[j + 1]; p++) {
      const I = inv[Ai[p]];
      const J = inv[j];
      if (I !== J) count[Math.max(I, J) + 1]++;
    }
  for (let k = 0; k < n; k++) count[k + 1] += count[k];
  const Cp = count.slice();
  const Ci = new Int32Array(count[n]);
  const fill = count.slice(0, n);
  for (let j = 0; j < n; j++)
    for (let p = Ap[j]; p < Ap[j + 1]; p++) {
      const I = inv[Ai[p]];
      const J = inv[j];
      if (I !== J) Ci[fill[Math.max(I, J)]++] = Math.min(I, J);
    }

  // elimination tree with path compression
  const parent = new Int32Array(n).fill(-1);
  const ancestor = new Int32Array(n).fill(-1);
  for (let k = 0; k < n; k++)
    for (let p = Cp[k]; p < Cp[k + 1]; p++) {
      let r = Ci[p];
      while (r !== -1 && r < k) {
        const next = ancestor[r];
        ancestor[r] = k;
        if (next === -1) parent[r] = k;
        r = next;
      }
    }

  // U by columns (row subtrees, topological order, diagonal last)
  const Up = new Int32Array(n + 1);
  let Ui = new Int32Array(Math.max(16, 4 * Ci.length + n));
  const mark = new Int32Array(n).fill(-1);
  const stack = new Int32Array(n);
  const path = new Int32Array(n);
  const lCount = new Int32Array(n).fill(1);
  let unz = 0;
  for (let k = 0; k < n; k++) {
    Up[k] = unz;
    mark[k] = k;
    let top = n;
    for (let p = Cp[k]; p < Cp[k + 1]; p++) {
      let i = Ci[p];
      let len = 0;
      for (; mark[i] !== k; i = parent[i]) {
        path[len++] = i;
        mark[i] = k;
      }
      while (len > 0) stack[--top] = path[--len];
    }
    const need = unz + (n - top) + 1;
    if (need > Ui.length) {
      const g = new Int32Array(Math.max(need, Math.ceil(Ui.length * 1.6)));
      g.set(Ui);
      Ui = g;
    }
    for (let t = top; t < n; t++) {
      Ui[unz++] = stack[t];
      lCount[stack[t]]++;
    }
    Ui[unz++] = k;
  }
  Up[n] = unz;

  // L by columns: the transpose of U's pattern, unit diagonal first, rows ascending
  const Lp = new Int32Array(n + 1);
  for (let j = 0; j < n; j++) Lp[j + 1] = Lp[j] + lCount[j];
  const Li = new Int32Array(Lp[n]);
  const next = Lp.slice(0, n);
  for (let j = 0; j < n; j++) Li[next[j]++] = j;
  for (let k = 0; k < n; k++) for (let p = Up[k]; p < Up[k + 1] - 1; p++) Li[next[Ui[p]]++] = k;

  return {
    n,
    colPerm: perm,
    pinv: inv,
    lColPtr: Lp,
    lRowIdx: Li,
    lValues: new Float64Array(Lp[n]),
    uColPtr: Up,
    uRowIdx: Ui.slice(0, unz),
    uValues: new Float64Array(unz),
    pivotRatio: 0,
  };
}
