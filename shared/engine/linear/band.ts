// Band LU with partial pivoting after a reverse Cuthill–McKee ordering (George & Liu, "Computer
// Solution of Large Sparse Positive Definite Systems", 1981, for RCM; the band storage follows
// LAPACK's dgbtrf idea: with kl sub-diagonals, pivoting widens the upper band to ku + kl).
// Resistor grids have bandwidth ≈ grid side after RCM, so a 100×100 grid is 10⁴ unknowns with a
// band of ~100: about 10⁸ flops instead of 10¹² for dense.
import { PIVOT_RELATIVE_TOLERANCE, type LinearSystem, type LinearSystemFactory, type SingularInfo } from './types';

/** Reverse Cuthill–McKee ordering of a symmetric pattern; perm[newIndex] = oldIndex. */
export function reverseCuthillMcKee(n: number, adj: number[][]): Int32Array {
  const degree = adj.map((a) => a.length);
  const visited = new Uint8Array(n);
  const order: number[] = [];
  const byDegree = Array.from({ length: n }, (_, i) => i).sort((a, b) => degree[a] - degree[b] || a - b);
  for (const start0 of byDegree) {
    if (visited[start0]) continue;
    // pseudo-peripheral start: a few BFS sweeps to the farthest, lowest-degree node
    let start = start0;
    for (let sweep = 0; sweep < 3; sweep++) {
      const level = new Int32Array(n).fill(-1);
      level[start] = 0;
      const q = [start];
      for (let h = 0; h < q.length; h++) for (const v of adj[q[h]]) if (level[v] < 0) { level[v] = level[q[h]] + 1; q.push(v); }
      let best = start;
      for (const v of q) if (level[v] > level[best] || (level[v] === level[best] && degree[v] < degree[best])) best = v;
      if (best === start) break;
      start = best;
    }
    visited[start] = 1;
    const queue = [start];
    for (let h = 0; h < queue.length; h++) {
      const u = queue[h];
      order.push(u);
      const nb = adj[u].filter((v) => !visited[v]).sort((a, b) => degree[a] - degree[b] || a - b);
      for (const v of nb) {
        visited[v] = 1;
        queue.push(v);
      }
    }
  }
  order.reverse();
  return Int32Array.from(order);
}

export class BandSystem implements LinearSystem {
  readonly solverName = 'band-lu (RCM ordering)';
  private readonly perm: Int32Array; // new -> old
  private readonly inv: Int32Array; // old -> new
  private readonly kl: number;
  private readonly ku: number;
  private readonly width: number; // stored columns per row: kl + (ku + kl) + 1
  private data: Float64Array;
  private b: Float64Array;

  constructor(readonly size: number, pattern: ReadonlyArray<readonly [number, number]>) {
    const n = size;
    const sets: Set<number>[] = Array.from({ length: n }, () => new Set<number>());
    for (const [i, j] of pattern) {
      if (i === j) continue;
      sets[i].add(j);
      sets[j].add(i);
    }
    const adj = sets.map((s) => Array.from(s));
    this.perm = reverseCuthillMcKee(n, adj);
    this.inv = new Int32Array(n);
    for (let k = 0; k < n; k++) this.inv[this.perm[k]] = k;
    let kl = 0;
    let ku = 0;
    for (const [i, j] of pattern) {
      const d = this.inv[j] - this.inv[i];
      if (d > ku) ku = d;
      if (-d > kl) kl = -d;
    }
    // keep the band square-symmetric so pivoting has room
    kl = Math.max(kl, ku);
    ku = kl;
    this.kl = kl;
    this.ku = ku;
    this.width = 2 * kl + ku + 1;
    this.data = new Float64Array(n * this.width);
    this.b = new Float64Array(n);
  }

  get bandwidth(): number {
    return this.kl;
  }

  clear(): void {
    this.data.fill(0);
    this.b.fill(0);
  }
  private idx(r: number, c: number): number {
    return r * this.width + (c - r + this.kl);
  }
  add(row: number, col: number, value: number): void {
    const r = this.inv[row];
    const c = this.inv[col];
    this.data[this.idx(r, c)] += value;
  }
  addRhs(row: number, value: number): void {
    this.b[this.inv[row]] += value;
  }

  solve(): Float64Array | SingularInfo {
    const n = this.size;
    const { kl, ku } = this;
    const W = this.width;
    const a = this.data.slice();
    const b = this.b.slice();
    const at = (r: number, c: number) => r * W + (c - r + kl);
    const colMax = new Float64Array(n);
    for (let r = 0; r < n; r++)
      for (let c = Math.max(0, r - kl); c <= Math.min(n - 1, r + ku); c++) {
        const v = Math.abs(a[at(r, c)]);
        if (v > colMax[c]) colMax[c] = v;
      }
    const bad: number[] = [];
    const uHi = ku + kl; // upper extent after pivoting
    for (let k = 0; k < n; k++) {
      const rEnd = Math.min(n - 1, k + kl);
      let p = k;
      let pv = Math.abs(a[at(k, k)]);
      for (let r = k + 1; r <= rEnd; r++) {
        const v = Math.abs(a[at(r, k)]);
        if (v > pv) {
          pv = v;
          p = r;
        }
      }
      if (!(pv > PIVOT_RELATIVE_TOLERANCE * colMax[k]) || colMax[k] === 0) {
        bad.push(this.perm[k]);
        continue;
      }
      const cEnd = Math.min(n - 1, k + uHi);
      if (p !== k) {
        for (let c = k; c <= cEnd; c++) {
          const i1 = at(k, c);
          const i2 = at(p, c);
          if (c - p < -kl || c - p > uHi) continue;
          const t = a[i1];
          a[i1] = a[i2];
          a[i2] = t;
        }
        const t = b[k];
        b[k] = b[p];
        b[p] = t;
      }
      const piv = a[at(k, k)];
      for (let r = k + 1; r <= rEnd; r++) {
        const ir = at(r, k);
        const f = a[ir] / piv;
        if (f === 0) continue;
        a[ir] = 0;
        const baseR = r * W - r + kl;
        const baseK = k * W - k + kl;
        for (let c = k + 1; c <= cEnd; c++) a[baseR + c] -= f * a[baseK + c];
        b[r] -= f * b[k];
      }
    }
    if (bad.length) return { singular: true, unknowns: bad };
    const y = new Float64Array(n);
    for (let k = n - 1; k >= 0; k--) {
      let s = b[k];
      const cEnd = Math.min(n - 1, k + uHi);
      const base = k * W - k + kl;
      for (let c = k + 1; c <= cEnd; c++) s -= a[base + c] * y[c];
      y[k] = s / a[base + k];
    }
    const x = new Float64Array(n);
    for (let k = 0; k < n; k++) x[this.perm[k]] = y[k];
    return x;
  }
}

export const bandFactory: LinearSystemFactory = {
  name: 'band',
  create: (size, pattern) => new BandSystem(size, pattern),
};
