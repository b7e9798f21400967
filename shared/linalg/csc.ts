// Compressed sparse column (CSC) storage: the format the sparse LU reads. Column j's row indices
// are rowIdx[colPtr[j] .. colPtr[j+1]), sorted ascending, no duplicates.

/** A square or rectangular sparse matrix in compressed sparse column form. */
export interface CscMatrix {
  readonly rows: number;
  readonly cols: number;
  readonly colPtr: Int32Array;
  readonly rowIdx: Int32Array;
  readonly values: Float64Array;
}

/**
 * Build a CSC matrix from (row, col, value) triplets; duplicates are summed (as MNA stamps are).
 * Entries that sum to exactly zero are kept: the structure, not the values, fixes the pattern.
 */
export function cscFromTriplets(
  rows: number,
  cols: number,
  ti: ArrayLike<number>,
  tj: ArrayLike<number>,
  tv: ArrayLike<number>,
): CscMatrix {
  const nz = ti.length;
  if (tj.length !== nz || tv.length !== nz) throw new Error('cscFromTriplets: row, column and value arrays differ in length');
  const count = new Int32Array(cols + 1);
  for (let k = 0; k < nz; k++) {
    const i = ti[k];
    const j = tj[k];
    if (!(i >= 0 && i < rows && j >= 0 && j < cols)) throw new Error(`cscFromTriplets: entry ${k} at (${i}, ${j}) is outside a ${rows}×${cols} matrix`);
    count[j + 1]++;
  }
  for (let j = 0; j < cols; j++) count[j + 1] += count[j];
  const fillPos = count.slice(0, cols);
  const ri = new Int32Array(nz);
  const rv = new Float64Array(nz);
  for (let k = 0; k < nz; k++) {
    const p = fillPos[tj[k]]++;
    ri[p] = ti[k];
    rv[p] = tv[k];
  }
  // sort each column by row and merge duplicates
  const colPtr = new Int32Array(cols + 1);
  const rowIdx = new Int32Array(nz);
  const values = new Float64Array(nz);
  const order: number[] = [];
  let out = 0;
  for (let j = 0; j < cols; j++) {
    colPtr[j] = out;
    order.length = 0;
    for (let p = count[j]; p < count[j + 1]; p++) order.push(p);
    order.sort((a, b) => ri[a] - ri[b]);
    let last = -1;
    for (const p of order) {
      if (ri[p] === last) values[out - 1] += rv[p];
      else {
        rowIdx[out] = ri[p];
        values[out] = rv[p];
        last = ri[p];
        out++;
      }
    }
  }
  colPtr[cols] = out;
  return { rows, cols, colPtr, rowIdx: rowIdx.slice(0, out), values: values.slice(0, out) };
}

/** y = A·x. */
export function cscMultiply(a: CscMatrix, x: ArrayLike<number>, y: Float64Array = new Float64Array(a.rows)): Float64Array {
  y.fill(0);
  for (let j = 0; j < a.cols; j++) {
    const xj = x[j];
    if (xj === 0) continue;
    for (let p = a.colPtr[j]; p < a.colPtr[j + 1]; p++) y[a.rowIdx[p]] += a.values[p] * xj;
  }
  return y;
}

/** Dense row-major copy, for tests and small cross-checks. */
export function cscToDense(a: CscMatrix): number[][] {
  const out = Array.from({ length: a.rows }, () => new Array<number>(a.cols).fill(0));
  for (let j = 0; j < a.cols; j++) for (let p = a.colPtr[j]; p < a.colPtr[j + 1]; p++) out[a.rowIdx[p]][j] = a.values[p];
  return out;
}

/** The pattern of A + Aᵀ without the diagonal, as CSC index arrays (the graph a symmetric ordering works on). */
export function symmetricPatternWithoutDiagonal(a: CscMatrix): { colPtr: Int32Array; rowIdx: Int32Array } {
  const n = a.cols;
  if (a.rows !== n) throw new Error(`symmetric pattern needs a square matrix, got ${a.rows}×${a.cols}`);
  const ti: number[] = [];
  const tj: number[] = [];
  for (let j = 0; j < n; j++)
    for (let p = a.colPtr[j]; p < a.colPtr[j + 1]; p++) {
      const i = a.rowIdx[p];
      if (i === j) continue;
      ti.push(i, j);
      tj.push(j, i);
    }
  const s = cscFromTriplets(n, n, ti, tj, new Float64Array(ti.length));
  return { colPtr: s.colPtr, rowIdx: s.rowIdx };
}
