// Seeded random sparse test matrices (not a test file itself).
import { xoroshiro128plus } from 'pure-rand/generator/xoroshiro128plus';
import { uniformFloat64 } from 'pure-rand/distribution/uniformFloat64';
import { cscFromTriplets, type CscMatrix } from '../../../shared/linalg';

export interface RandomSparseOptions {
  n: number;
  /** mean off-diagonal entries per column */
  perColumn: number;
  /** fraction of diagonal entries left structurally present but zero (forces pivoting, as in MNA source rows) */
  zeroDiagonalFraction: number;
  seed: number;
}

/** A random sparse matrix made non-singular with high probability by a random permutation of a dominant diagonal. */
export function randomSparse(o: RandomSparseOptions): { a: CscMatrix; dense: number[][] } {
  const rng = xoroshiro128plus(o.seed);
  const u = () => uniformFloat64(rng);
  const dense = Array.from({ length: o.n }, () => new Array<number>(o.n).fill(0));
  for (let j = 0; j < o.n; j++) {
    const m = Math.floor(u() * 2 * o.perColumn);
    for (let t = 0; t < m; t++) dense[Math.floor(u() * o.n)][j] = u() * 2 - 1;
  }
  // a dominant entry at (σ(j), j) keeps it regular: σ is the identity except on a random subset,
  // which it rotates — those columns get a zero diagonal and need a row exchange
  const sigma = Array.from({ length: o.n }, (_, i) => i);
  const subset = sigma.filter(() => u() < o.zeroDiagonalFraction);
  for (let i = subset.length - 1; i > 0; i--) {
    const k = Math.floor(u() * (i + 1));
    [subset[i], subset[k]] = [subset[k], subset[i]];
  }
  if (subset.length >= 2) for (let t = 0; t < subset.length; t++) sigma[subset[t]] = subset[(t + 1) % subset.length];
  for (let j = 0; j < o.n; j++) {
    if (sigma[j] !== j) dense[j][j] = 0;
    dense[sigma[j]][j] = (u() < 0.5 ? -1 : 1) * (2 * o.perColumn + 2);
  }
  const ti: number[] = [];
  const tj: number[] = [];
  const tv: number[] = [];
  for (let i = 0; i < o.n; i++)
    for (let j = 0; j < o.n; j++)
      if (dense[i][j] !== 0 || i === j) {
        ti.push(i);
        tj.push(j);
        tv.push(dense[i][j]);
      }
  return { a: cscFromTriplets(o.n, o.n, ti, tj, tv), dense };
}

/** 5-point resistor-grid conductance matrix (k×k nodes, 1 S links, a small leak to ground at every node). */
export function gridLaplacian(k: number, leak = 1e-3): CscMatrix {
  const ti: number[] = [];
  const tj: number[] = [];
  const tv: number[] = [];
  for (let r = 0; r < k; r++)
    for (let c = 0; c < k; c++) {
      const i = r * k + c;
      let d = leak;
      for (const [dr, dc] of [[0, 1], [1, 0], [0, -1], [-1, 0]]) {
        const rr = r + dr;
        const cc = c + dc;
        if (rr < 0 || cc < 0 || rr >= k || cc >= k) continue;
        ti.push(i);
        tj.push(rr * k + cc);
        tv.push(-1);
        d += 1;
      }
      ti.push(i);
      tj.push(i);
      tv.push(d);
    }
  return cscFromTriplets(k * k, k * k, ti, tj, tv);
}
