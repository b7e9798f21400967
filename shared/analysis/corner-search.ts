// The vertex check of the worst case: either every corner of the tolerance box (few variables),
// or, from the corner the first-order signs predict, single flips (least certain variable first)
// accepted while they improve the output, for a few passes. Each distinct corner is solved once.
import type { Sides } from './worst-case-first-order';

/** Outputs at a corner, or null when the circuit does not solve there. */
export type CornerEvaluator = (sides: Sides) => Float64Array | null;

export interface BestCorner {
  v: number;
  s: Sides | null;
}

/** Remember every corner's outputs so revisits cost nothing. */
export function cachedEvaluator(evaluate: CornerEvaluator): CornerEvaluator {
  const cache = new Map<string, Float64Array | null>();
  return (sides) => {
    const key = sides.join(',');
    const hit = cache.get(key);
    if (hit !== undefined) return hit;
    const val = evaluate(sides);
    cache.set(key, val);
    return val;
  };
}

export function searchCorners(opts: {
  variables: number;
  outputs: number;
  exhaustive: boolean;
  evaluate: CornerEvaluator;
  /** per output: the predicted corners and each variable's share of the first-order effect */
  predicted: ReadonlyArray<{ max: Sides; min: Sides }>;
  shares: ReadonlyArray<ReadonlyArray<number>>;
  passes?: number;
}): Array<{ max: BestCorner; min: BestCorner }> {
  const { variables: m, outputs: nOut, evaluate } = opts;
  const best = Array.from({ length: nOut }, () => ({ max: { v: -Infinity, s: null } as BestCorner, min: { v: Infinity, s: null } as BestCorner }));
  const consider = (sides: Sides, vals: Float64Array | null) => {
    if (!vals) return;
    for (let oi = 0; oi < nOut; oi++) {
      if (vals[oi] > best[oi].max.v) best[oi].max = { v: vals[oi], s: sides.slice() };
      if (vals[oi] < best[oi].min.v) best[oi].min = { v: vals[oi], s: sides.slice() };
    }
  };
  if (opts.exhaustive) {
    const sides = new Int8Array(m);
    for (let mask = 0; mask < 2 ** m; mask++) {
      for (let k = 0; k < m; k++) sides[k] = (mask >> k) & 1 ? 1 : -1;
      consider(sides, evaluate(sides));
    }
    return best;
  }
  for (let oi = 0; oi < nOut; oi++)
    for (const dir of ['max', 'min'] as const) {
      // zero-sensitivity variables start at their low end
      let cur = Int8Array.from(opts.predicted[oi][dir], (s) => (s === 0 ? -1 : s));
      let curV = evaluate(cur);
      consider(cur, curV);
      const better = (a: number, b: number) => (dir === 'max' ? a > b : a < b);
      const order = [...Array(m).keys()].sort((a, b) => opts.shares[oi][a] - opts.shares[oi][b]);
      for (let pass = 0; pass < (opts.passes ?? 4) && curV; pass++) {
        let improved = false;
        for (const k of order) {
          const trial = cur.slice();
          trial[k] = -trial[k];
          const tv = evaluate(trial);
          consider(trial, tv);
          if (tv && curV && better(tv[oi], curV[oi])) {
            cur = trial;
            curV = tv;
            improved = true;
          }
        }
        if (!improved) break;
      }
    }
  return best;
}
