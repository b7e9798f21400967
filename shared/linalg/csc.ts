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
  // bucket by row first, then by column: each column then holds its rows in ascending order
  // without a comparison sort (two counting passes, O(rows + cols + entries))
  const rowStart = new Int32Array(rows + 1);
  for (let k = 0; k < nz; k++) {
    const i = ti[k];
    const j = tj[k];
    if (!(i >= 0 && i < rows && j >= 0 && j < cols)) throw new Error(`cscFromTriplets: entry ${k} at (${i}, ${j}) is outside a ${rows}×${cols} matrix`);
    rowStart[i + 1]++;
  }
  for (let i = 0; i < rows; i++) rowStart[i + 1] += rowStart[i];
  const rowFill = rowStart.slice(0, rows);
  const byRowCol = new Int32Array(nz);
  const byRowVal = new Float64Array(nz);
  const colCount = new Int32Array(cols + 1);
  for (let k = 0; k < nz; k++) {
    const p = rowFill[ti[k]]++;
    byRowCol[p] = tj[k];
    byRowVal[p] = tv[k];
    colCount[tj[k] + 1]++;
  }
  for (let j = 0; j < cols; j++) colCount[j + 1] += colCount[j];
  const colFill = colCount.slice(0, cols);
  const ri = new Int32Array(nz);
  const rv = new Float64Array(nz);
  for (let i = 0; i < rows; i++)
    for (let p = rowStart[i]; p < rowStart[i + 1]; p++) {
      const q = colFill[byRowCol[p]]++;
      ri[q] = i;
      rv[q] = byRowVal[p];
    }
  // merge duplicates (adjacent now)
  const colPtr = new Int32Array(cols + 1);
  const rowIdx = new Int32Array(nz);
  const values = new Float64Array(nz);
  let out = 0;
  for (let j = 0; j < cols; j++) {
    colPtr[j] = out;
    let last = -1;
    for (let p = colCount[j]; p < colCount[j + 1]; p++) {
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
  return { rows, cols, colPtr, rowIdx: out === nz ? rowIdx : rowIdx.slice(0, out), values: out === nz ? values : values.slice(0, out) };
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
