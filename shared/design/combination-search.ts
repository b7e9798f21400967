/**
 * Exact searches for series and parallel combinations of preferred values near a target.
 *
 * Each search walks only the values that can be the larger (series) or smaller (parallel) part
 * of the best combination, and binary-searches the partner, so it is O(m log n) with m the
 * values in about one third of a decade, not O(n²). Every candidate looked at is handed to
 * `offer`; the caller keeps the best.
 *
 * Why the walked window is enough (series, a ≥ b, values v₀ < … < vₙ₋₁):
 *  - a below p = (largest value ≤ T/2): then a + b ≤ 2a < 2p ≤ T, so (p, p) is closer. Excluded.
 *  - a above q = (smallest value ≥ T): then a + b ≥ a + v₀ > q + v₀ ≥ T, so (q, v₀), which
 *    overshoots by less, is closer. Excluded.
 *  - for a fixed a the sum is increasing in b, so the best b is a neighbour of T − a.
 * The parallel search is the same argument on conductances (1/a + 1/b = 1/T, a ≤ b, so T ≤ a ≤ 2T),
 * with the largest value standing in for "no second part". The three-part searches bound the
 * outer part the same way and run an exact pair search for the rest, so each finds its optimum.
 * The windows hold for any ascending list, including a series cut to a part range.
 */
import { lowerBound, upperBound } from '../units/sorted-search';

/** Receives a candidate pair; parts in ohms. */
export type PairVisitor = (a: number, b: number) => void;

/** Calls `offer` with every pair a + b (ohms) the exact best series pair for `target` can be among. */
export function searchSeriesPairs(values: readonly number[], target: number, offer: PairVisitor): void {
  const n = values.length;
  if (n === 0) return;
  const start = Math.max(0, upperBound(values, target / 2) - 1);
  const end = Math.min(n - 1, lowerBound(values, target));
  for (let i = start; i <= end; i++) {
    const a = values[i];
    const rest = target - a;
    if (rest <= values[0]) {
      offer(a, values[0]);
      continue;
    }
    const j = lowerBound(values, rest);
    if (j < n) offer(a, values[j]);
    offer(a, values[j - 1]);
  }
}

/** Calls `offer` with every pair a ∥ b (ohms) the exact best parallel pair for `target` can be among. */
export function searchParallelPairs(values: readonly number[], target: number, offer: PairVisitor): void {
  const n = values.length;
  if (n === 0) return;
  const largest = values[n - 1];
  const start = Math.max(0, upperBound(values, target) - 1);
  const end = Math.min(n - 1, lowerBound(values, 2 * target));
  for (let i = start; i <= end; i++) {
    const a = values[i];
    if (a <= target) {
      offer(a, largest);
      continue;
    }
    const ideal = (a * target) / (a - target);
    const j = lowerBound(values, ideal);
    if (j < n) offer(a, values[j]);
    if (j > 0) offer(a, values[j - 1]);
  }
}

/** Receives a candidate triple; parts in ohms, in the order of the topology's formula. */
export type TripleVisitor = (a: number, b: number, c: number) => void;

/** a + b + c: the largest part a lies between (largest ≤ T/3) and (smallest ≥ T), as for pairs. */
export function searchSeriesTriples(values: readonly number[], target: number, offer: TripleVisitor): void {
  const n = values.length;
  if (n === 0) return;
  const start = Math.max(0, upperBound(values, target / 3) - 1);
  const end = Math.min(n - 1, lowerBound(values, target));
  for (let i = start; i <= end; i++) {
    const a = values[i];
    const rest = target - a;
    if (rest <= 0) offer(a, values[0], values[0]);
    else searchSeriesPairs(values, rest, (b, c) => offer(a, b, c));
  }
}

/** a ∥ b ∥ c: the smallest part a lies between (largest ≤ T) and (smallest ≥ 3T). */
export function searchParallelTriples(values: readonly number[], target: number, offer: TripleVisitor): void {
  const n = values.length;
  if (n === 0) return;
  const largest = values[n - 1];
  const start = Math.max(0, upperBound(values, target) - 1);
  const end = Math.min(n - 1, lowerBound(values, 3 * target));
  for (let i = start; i <= end; i++) {
    const a = values[i];
    if (a <= target) offer(a, largest, largest);
    else searchParallelPairs(values, (a * target) / (a - target), (b, c) => offer(a, b, c));
  }
}

/** a + (b ∥ c): every a up to (smallest ≥ T); the rest is an exact parallel-pair search. */
export function searchSeriesOfParallel(values: readonly number[], target: number, offer: TripleVisitor): void {
  const n = values.length;
  const end = Math.min(n - 1, lowerBound(values, target));
  for (let i = 0; i <= end; i++) {
    const a = values[i];
    const rest = target - a;
    if (rest <= 0) offer(a, values[0], values[0]);
    else searchParallelPairs(values, rest, (b, c) => offer(a, b, c));
  }
}

/** a ∥ (b + c): every a from (largest ≤ T) up; the rest is an exact series-pair search. */
export function searchParallelOfSeries(values: readonly number[], target: number, offer: TripleVisitor): void {
  const n = values.length;
  if (n === 0) return;
  const largest = values[n - 1];
  for (let i = Math.max(0, upperBound(values, target) - 1); i < n; i++) {
    const a = values[i];
    if (a <= target) offer(a, largest, largest);
    else searchSeriesPairs(values, (a * target) / (a - target), (b, c) => offer(a, b, c));
  }
}
