// Approximate minimum degree: always a permutation (property test with fast-check), and it does its
// job — on a k×k 5-point grid the natural (banded) order fills about k entries per row of L, while a
// minimum-degree order fills O(log k) per row (A. George and J. W. H. Liu, "Computer Solution of
// Large Sparse Positive Definite Systems", Prentice-Hall 1981 — the orders of growth, from memory).
import { describe, expect, it } from 'vitest';
import fc from 'fast-check';
import { approximateMinimumDegree, cscFromTriplets, SparseLuSolver, SparsePatternBuilder } from '../../../shared/linalg';
import { gridLaplacian } from './random-matrices';

describe('approximate minimum degree ordering', () => {
  it('returns a permutation of 0..n-1 for any pattern', () => {
    fc.assert(
      fc.property(
        fc.integer({ min: 1, max: 60 }).chain((n) =>
          fc.tuple(fc.constant(n), fc.array(fc.tuple(fc.integer({ min: 0, max: n - 1 }), fc.integer({ min: 0, max: n - 1 })), { maxLength: 6 * n })),
        ),
        ([n, entries]) => {
          const a = cscFromTriplets(n, n, entries.map((e) => e[0]), entries.map((e) => e[1]), entries.map(() => 1));
          const p = Array.from(approximateMinimumDegree(a)).sort((x, y) => x - y);
          expect(p).toEqual(Array.from({ length: n }, (_, i) => i));
        },
      ),
      { numRuns: 300 },
    );
  });

  it('keeps a dense row (a supply rail touching everything) out of the way', () => {
    const n = 400;
    const ti: number[] = [];
    const tj: number[] = [];
    for (let i = 0; i < n; i++) {
      ti.push(i, 0, i);
      tj.push(0, i, i);
      if (i + 1 < n) {
        ti.push(i);
        tj.push(i + 1);
      }
    }
    const p = approximateMinimumDegree(cscFromTriplets(n, n, ti, tj, ti.map(() => 1)));
    expect(p[n - 1]).toBe(0);
  });

  it('fills far less than the natural order on a 60×60 grid', () => {
    const a = gridLaplacian(60);
    const amd = new SparseLuSolver(a);
    amd.factor();
    const natural = new SparseLuSolver(a, { ordering: 'natural' });
    natural.factor();
    const k = 60;
    // natural order: the band of width k fills in completely (George & Liu)
    expect(natural.stats().nnzL).toBeGreaterThan(0.9 * k * k * k);
    expect(amd.stats().nnzL).toBeLessThan(natural.stats().nnzL / 3);
    expect(amd.stats().nnzL / (k * k)).toBeLessThan(3 * Math.log2(k * k));
  });
});

describe('SparsePatternBuilder', () => {
  it('gives one slot per position and maps it into the CSC value array', () => {
    const b = new SparsePatternBuilder(3);
    const s01 = b.slot(0, 1);
    expect(b.slot(0, 1)).toBe(s01);
    const s20 = b.slot(2, 0);
    const { matrix, slotIndex } = b.build();
    matrix.values[slotIndex[s01]] += 5;
    matrix.values[slotIndex[s20]] += 7;
    // column 0 holds rows 0 and 2, column 1 rows 0 and 1, column 2 row 2
    expect(Array.from(matrix.colPtr)).toEqual([0, 2, 4, 5]);
    expect(Array.from(matrix.rowIdx)).toEqual([0, 2, 0, 1, 2]);
    expect(Array.from(matrix.values)).toEqual([0, 7, 5, 0, 0]);
    expect(() => b.slot(3, 0)).toThrow(/outside the 3×3/);
  });
});

describe('cscFromTriplets', () => {
  it('sums duplicate stamps and sorts rows within columns (as MNA assembly needs)', () => {
    // two conductance stamps of 1 S and 2 S between nodes 0 and 1, plus a stamp on node 2
    const a = cscFromTriplets(3, 3, [1, 0, 0, 1, 0, 1, 1, 0, 2], [1, 0, 1, 0, 0, 1, 0, 1, 2], [1, 1, -1, -1, 2, 2, -2, -2, 5]);
    expect(Array.from(a.colPtr)).toEqual([0, 2, 4, 5]);
    expect(Array.from(a.rowIdx)).toEqual([0, 1, 0, 1, 2]);
    expect(Array.from(a.values)).toEqual([3, -3, -3, 3, 5]);
    expect(() => cscFromTriplets(2, 2, [2], [0], [1])).toThrow(/outside a 2×2/);
  });
});
