// Approximate minimum degree (AMD) fill-reducing ordering: P. R. Amestoy, T. A. Davis and I. S. Duff,
// "An approximate minimum degree ordering algorithm", SIAM J. Matrix Anal. Appl. 17(4), 886–905,
// 1996. This follows the compact formulation in T. A. Davis, "Direct Methods for Sparse Linear
// Systems", SIAM 2006, ch. 7 (quotient graph, element absorption, approximate external degrees,
// supervariable detection by hashing, mass elimination, dense-row deferral, postordering),
// re-expressed from memory in TypeScript. It orders the graph of A + Aᵀ, which suits MNA matrices
// (structurally almost symmetric; the pivoting in the LU copes with the zero diagonals of voltage
// source rows).
import type { CscMatrix } from './csc';
import { symmetricPatternWithoutDiagonal } from './csc';

const flip = (i: number): number => -i - 2;

function clearMarks(mark: number, lemax: number, w: Int32Array, n: number): number {
  if (mark < 2 || mark + lemax < 0 || mark + lemax > 0x3fffffff) {
    for (let k = 0; k < n; k++) if (w[k] !== 0) w[k] = 1;
    mark = 2;
  }
  return mark;
}

/** Depth-first postorder of the tree rooted at j (children lists in head/next); returns the next slot. */
function treeDfs(j: number, k: number, head: Int32Array, next: Int32Array, post: Int32Array, stack: Int32Array): number {
  let top = 0;
  stack[0] = j;
  while (top >= 0) {
    const p = stack[top];
    const i = head[p];
    if (i === -1) {
      top--;
      post[k++] = p;
    } else {
      head[p] = next[i];
      stack[++top] = i;
    }
  }
  return k;
}

/**
 * A fill-reducing symmetric permutation for a square sparse matrix: `perm[k]` is the original index
 * eliminated k-th. Deterministic (depends on the pattern only). Rows denser than 10·√n are deferred
 * to the end, as in the reference formulation.
 */
export function approximateMinimumDegree(a: CscMatrix): Int32Array {
  const n = a.cols;
  if (n === 0) return new Int32Array(0);
  if (n === 1) return Int32Array.of(0);
  const pattern = symmetricPatternWithoutDiagonal(a);
  const cnz0 = pattern.colPtr[n];
  let dense = Math.max(16, Math.floor(10 * Math.sqrt(n)));
  dense = Math.min(n - 2, dense);
  const nzmax = cnz0 + Math.floor(cnz0 / 5) + 2 * n + 1;
  const Ci = new Int32Array(nzmax);
  Ci.set(pattern.rowIdx);
  const Cp = new Int32Array(n + 1);
  Cp.set(pattern.colPtr);
  let cnz = cnz0;

  const len = new Int32Array(n + 1);
  const nv = new Int32Array(n + 1);
  const next = new Int32Array(n + 1);
  const head = new Int32Array(n + 1);
  const elen = new Int32Array(n + 1);
  const degree = new Int32Array(n + 1);
  const w = new Int32Array(n + 1);
  const hhead = new Int32Array(n + 1);
  const last = new Int32Array(n + 1);
  for (let k = 0; k < n; k++) len[k] = Cp[k + 1] - Cp[k];
  len[n] = 0;
  for (let i = 0; i <= n; i++) {
    head[i] = -1;
    last[i] = -1;
    next[i] = -1;
    hhead[i] = -1;
    nv[i] = 1;
    w[i] = 1;
    elen[i] = 0;
    degree[i] = len[i];
  }
  let mark = clearMarks(0, 0, w, n);
  elen[n] = -2;
  Cp[n] = -1;
  w[n] = 0;

  let nel = 0;
  for (let i = 0; i < n; i++) {
    const d = degree[i];
    if (d === 0) {
      elen[i] = -2;
      nel++;
      Cp[i] = -1;
      w[i] = 0;
    } else if (d > dense) {
      nv[i] = 0;
      elen[i] = -1;
      nel++;
      Cp[i] = flip(n);
      nv[n]++;
    } else {
      if (head[d] !== -1) last[head[d]] = i;
      next[i] = head[d];
      head[d] = i;
    }
  }

  let mindeg = 0;
  let lemax = 0;
  while (nel < n) {
    // select a pivot of minimum approximate degree
    let k = -1;
    for (; mindeg < n && (k = head[mindeg]) === -1; mindeg++);
    if (next[k] !== -1) last[next[k]] = -1;
    head[mindeg] = next[k];
    const elenk = elen[k];
    let nvk = nv[k];
    nel += nvk;

    // garbage-collect the element storage when the new element might not fit
    if (elenk > 0 && cnz + mindeg >= nzmax) {
      for (let j = 0; j < n; j++) {
        const p = Cp[j];
        if (p >= 0) {
          Cp[j] = Ci[p];
          Ci[p] = flip(j);
        }
      }
      let q = 0;
      for (let p = 0; p < cnz; ) {
        const j = flip(Ci[p++]);
        if (j >= 0) {
          Ci[q] = Cp[j];
          Cp[j] = q++;
          for (let k3 = 0; k3 < len[j] - 1; k3++) Ci[q++] = Ci[p++];
        }
      }
      cnz = q;
    }

    // construct the new element Lk from k's elements and variables
    let dk = 0;
    nv[k] = -nvk;
    let p = Cp[k];
    const pk1 = elenk === 0 ? p : cnz;
    let pk2 = pk1;
    for (let k1 = 1; k1 <= elenk + 1; k1++) {
      let e: number;
      let pj: number;
      let ln: number;
      if (k1 > elenk) {
        e = k;
        pj = p;
        ln = len[k] - elenk;
      } else {
        e = Ci[p++];
        pj = Cp[e];
        ln = len[e];
      }
      for (let k2 = 1; k2 <= ln; k2++) {
        const i = Ci[pj++];
        const nvi = nv[i];
        if (nvi <= 0) continue;
        dk += nvi;
        nv[i] = -nvi;
        Ci[pk2++] = i;
        if (next[i] !== -1) last[next[i]] = last[i];
        if (last[i] !== -1) next[last[i]] = next[i];
        else head[degree[i]] = next[i];
      }
      if (e !== k) {
        Cp[e] = flip(k);
        w[e] = 0;
      }
    }
    if (elenk !== 0) cnz = pk2;
    degree[k] = dk;
    Cp[k] = pk1;
    len[k] = pk2 - pk1;
    elen[k] = -2;

    // |Le \ Lk| for every element e adjacent to Lk
    mark = clearMarks(mark, lemax, w, n);
    for (let pk = pk1; pk < pk2; pk++) {
      const i = Ci[pk];
      const eln = elen[i];
      if (eln <= 0) continue;
      const nvi = -nv[i];
      const wnvi = mark - nvi;
      for (let q = Cp[i]; q <= Cp[i] + eln - 1; q++) {
        const e = Ci[q];
        if (w[e] >= mark) w[e] -= nvi;
        else if (w[e] !== 0) w[e] = degree[e] + wnvi;
      }
    }

    // approximate degree update, element absorption, hashing for supervariables
    for (let pk = pk1; pk < pk2; pk++) {
      const i = Ci[pk];
      const p1 = Cp[i];
      const p2 = p1 + elen[i] - 1;
      let pn = p1;
      let h = 0;
      let d = 0;
      for (let q = p1; q <= p2; q++) {
        const e = Ci[q];
        if (w[e] !== 0) {
          const dext = w[e] - mark;
          if (dext > 0) {
            d += dext;
            Ci[pn++] = e;
            h += e;
          } else {
            Cp[e] = flip(k); // aggressive absorption
            w[e] = 0;
          }
        }
      }
      elen[i] = pn - p1 + 1;
      const p3 = pn;
      const p4 = p1 + len[i];
      for (let q = p2 + 1; q < p4; q++) {
        const j = Ci[q];
        const nvj = nv[j];
        if (nvj <= 0) continue;
        d += nvj;
        Ci[pn++] = j;
        h += j;
      }
      if (d === 0) {
        // mass elimination: i is only adjacent to k
        Cp[i] = flip(k);
        const nvi = -nv[i];
        dk -= nvi;
        nvk += nvi;
        nel += nvi;
        nv[i] = 0;
        elen[i] = -1;
      } else {
        degree[i] = Math.min(degree[i], d);
        Ci[pn] = Ci[p3];
        Ci[p3] = Ci[p1];
        Ci[p1] = k;
        len[i] = pn - p1 + 1;
        h %= n;
        next[i] = hhead[h];
        hhead[h] = i;
        last[i] = h;
      }
    }
    degree[k] = dk;
    lemax = Math.max(lemax, dk);
    mark = clearMarks(mark + lemax, lemax, w, n);

    // supervariable detection: variables with identical adjacency merge
    for (let pk = pk1; pk < pk2; pk++) {
      let i = Ci[pk];
      if (nv[i] >= 0) continue;
      const h = last[i];
      i = hhead[h];
      hhead[h] = -1;
      for (; i !== -1 && next[i] !== -1; i = next[i], mark++) {
        const ln = len[i];
        const eln = elen[i];
        for (let q = Cp[i] + 1; q <= Cp[i] + ln - 1; q++) w[Ci[q]] = mark;
        let jlast = i;
        for (let j = next[i]; j !== -1; ) {
          let ok = len[j] === ln && elen[j] === eln;
          for (let q = Cp[j] + 1; ok && q <= Cp[j] + ln - 1; q++) if (w[Ci[q]] !== mark) ok = false;
          if (ok) {
            Cp[j] = flip(i);
            nv[i] += nv[j];
            nv[j] = 0;
            elen[j] = -1;
            j = next[j];
            next[jlast] = j;
          } else {
            jlast = j;
            j = next[j];
          }
        }
      }
    }

    // finalize the new element and put its variables back in the degree lists
    let pOut = pk1;
    for (let pk = pk1; pk < pk2; pk++) {
      const i = Ci[pk];
      const nvi = -nv[i];
      if (nvi <= 0) continue;
      nv[i] = nvi;
      let d = degree[i] + dk - nvi;
      d = Math.min(d, n - nel - nvi);
      if (head[d] !== -1) last[head[d]] = i;
      next[i] = head[d];
      last[i] = -1;
      head[d] = i;
      mindeg = Math.min(mindeg, d);
      degree[i] = d;
      Ci[pOut++] = i;
    }
    nv[k] = nvk;
    len[k] = pOut - pk1;
    if (len[k] === 0) {
      Cp[k] = -1;
      w[k] = 0;
    }
    if (elenk !== 0) cnz = pOut;
  }

  // postorder the assembly tree
  for (let i = 0; i < n; i++) Cp[i] = flip(Cp[i]);
  for (let j = 0; j <= n; j++) head[j] = -1;
  for (let j = n; j >= 0; j--) {
    if (nv[j] > 0 || Cp[j] === -1) continue;
    next[j] = head[Cp[j]];
    head[Cp[j]] = j;
  }
  for (let e = n; e >= 0; e--) {
    if (nv[e] <= 0) continue;
    if (Cp[e] !== -1) {
      next[e] = head[Cp[e]];
      head[Cp[e]] = e;
    }
  }
  const post = new Int32Array(n + 1);
  const stack = new Int32Array(n + 1);
  for (let k = 0, i = 0; i <= n; i++) if (Cp[i] === -1) k = treeDfs(i, k, head, next, post, stack);
  // the placeholder node n (dense rows' parent) is dropped
  const perm = new Int32Array(n);
  let out = 0;
  for (let k = 0; k <= n; k++) if (post[k] !== n) perm[out++] = post[k];
  if (out !== n) throw new Error(`approximate minimum degree produced ${out} of ${n} indices (internal error)`);
  return perm;
}
