// MNA rows of voltage sources (and 0 Ω links) have a zero diagonal: a static diagonal pivot there
// fails when the fill-reducing order eliminates the branch before any of its nodes. Eliminating
// one of its nodes first fills the diagonal (with −1/G of that node), so moving each such
// variable to just after its earliest-eliminated neighbour with a non-zero diagonal usually lets
// the cheap static-pivot path succeed; the pivot checks still guard it, and partial pivoting
// remains the fallback. (A common device for saddle-point systems; the form here is our own.)
import { symmetricPatternWithoutDiagonal, type CscMatrix } from './csc';

/** A reordered copy of `perm`, or null when no column has a zero diagonal needing it. */
export function deferZeroDiagonals(a: CscMatrix, perm: Int32Array): Int32Array | null {
  const n = a.cols;
  const diagZero = new Uint8Array(n);
  let any = false;
  for (let j = 0; j < n; j++) {
    let d = 0;
    for (let p = a.colPtr[j]; p < a.colPtr[j + 1]; p++) if (a.rowIdx[p] === j) d = a.values[p];
    if (d === 0) {
      diagZero[j] = 1;
      any = true;
    }
  }
  if (!any) return null;
  const pos = new Int32Array(n);
  for (let k = 0; k < n; k++) pos[perm[k]] = k;
  const g = symmetricPatternWithoutDiagonal(a);
  const key = new Float64Array(n);
  let moved = false;
  for (let j = 0; j < n; j++) {
    key[j] = pos[j];
    if (!diagZero[j]) continue;
    let earliest = Infinity;
    for (let p = g.colPtr[j]; p < g.colPtr[j + 1]; p++) {
      const i = g.rowIdx[p];
      if (!diagZero[i] && pos[i] < earliest) earliest = pos[i];
    }
    if (earliest < pos[j] || earliest === Infinity) continue;
    key[j] = earliest + 0.5;
    moved = true;
  }
  if (!moved) return null;
  return Int32Array.from(perm).sort((x, y) => key[x] - key[y] || x - y);
}
