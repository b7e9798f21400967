/**
 * Value finder: the preferred values, and series/parallel combinations of them, closest to a
 * target resistance, ranked by relative error.
 */
import { PREFERRED_RANGE, preferredValuesBetween, type ESeriesName } from '../units/eseries';
import { formatRkm } from '../units/rkm';
import { lowerBound } from '../units/sorted-search';
import {
  searchParallelOfSeries,
  searchParallelPairs,
  searchParallelTriples,
  searchSeriesOfParallel,
  searchSeriesPairs,
  searchSeriesTriples,
} from './combination-search';

/**
 * How the parts are joined. For three parts: `series3` a + b + c, `parallel3` a ∥ b ∥ c,
 * `series-parallel` a + (b ∥ c), `parallel-series` a ∥ (b + c).
 */
export type Topology = 'single' | 'series' | 'parallel' | 'series3' | 'parallel3' | 'series-parallel' | 'parallel-series';

export const TOPOLOGIES_BY_PARTS: Readonly<Record<1 | 2 | 3, readonly Topology[]>> = {
  1: ['single'],
  2: ['single', 'series', 'parallel'],
  3: ['single', 'series', 'parallel', 'series3', 'parallel3', 'series-parallel', 'parallel-series'],
};

export interface ValueMatch {
  readonly topology: Topology;
  /** Part values in ohms, in the order the topology's formula names them. */
  readonly parts: readonly number[];
  /** The combined resistance, ohms. */
  readonly value: number;
  /** Signed relative error (value − target) / target: 0.01 means 1 % high. */
  readonly error: number;
  /** How to build it, in RKM: "4K7 + 1K0", "10K ∥ 22K", "1K0 + (10K ∥ 22K)". */
  readonly expression: string;
}

const par = (a: number, b: number) => (a * b) / (a + b);

/** The resistance (ohms) of `parts` (ohms) joined as `topology`. */
export function combinedResistance(topology: Topology, parts: readonly number[]): number {
  const [a, b, c] = parts;
  switch (topology) {
    case 'single':
      return a;
    case 'series':
      return a + b;
    case 'parallel':
      return par(a, b);
    case 'series3':
      return a + b + c;
    case 'parallel3':
      return 1 / (1 / a + 1 / b + 1 / c);
    case 'series-parallel':
      return a + par(b, c);
    case 'parallel-series':
      return par(a, b + c);
  }
}

// Orders parts so equal combinations compare equal: the largest first in a sum, the smallest
// first in a parallel group, the lone part first in the mixed forms.
function canonical(topology: Topology, parts: number[]): number[] {
  const down = (x: number[]) => [...x].sort((p, q) => q - p);
  const up = (x: number[]) => [...x].sort((p, q) => p - q);
  switch (topology) {
    case 'series':
    case 'series3':
      return down(parts);
    case 'parallel':
    case 'parallel3':
      return up(parts);
    case 'series-parallel':
      return [parts[0], ...up(parts.slice(1))];
    case 'parallel-series':
      return [parts[0], ...down(parts.slice(1))];
    default:
      return parts;
  }
}

/** A human-readable build recipe in RKM notation. */
export function describeCombination(topology: Topology, parts: readonly number[]): string {
  const t = parts.map((p) => formatRkm(p));
  switch (topology) {
    case 'single':
      return t[0];
    case 'series':
    case 'series3':
      return t.join(' + ');
    case 'parallel':
    case 'parallel3':
      return t.join(' ∥ ');
    case 'series-parallel':
      return `${t[0]} + (${t[1]} ∥ ${t[2]})`;
    case 'parallel-series':
      return `${t[0]} ∥ (${t[1]} + ${t[2]})`;
  }
}

/** Best-first order: smaller |error|, then fewer parts, then the smaller largest part (cheaper, lower-noise ranges). */
export function compareMatches(x: ValueMatch, y: ValueMatch): number {
  const dx = Math.abs(x.error);
  const dy = Math.abs(y.error);
  if (Math.abs(dx - dy) > 1e-12 * Math.max(dx, dy, 1e-300)) return dx - dy;
  if (x.parts.length !== y.parts.length) return x.parts.length - y.parts.length;
  return Math.max(...x.parts) - Math.max(...y.parts);
}

/** Keeps the `size` best distinct matches offered for one topology. */
class BestOf {
  readonly kept: ValueMatch[] = [];
  private readonly keys = new Set<string>();
  constructor(
    private readonly topology: Topology,
    private readonly target: number,
    private readonly size: number,
  ) {}

  offer(raw: number[]): void {
    const value = combinedResistance(this.topology, raw);
    const error = (value - this.target) / this.target;
    const worst = this.kept[this.kept.length - 1];
    if (this.kept.length >= this.size && Math.abs(error) > Math.abs(worst.error)) return;
    const parts = canonical(this.topology, raw);
    const key = parts.join(',');
    if (this.keys.has(key)) return;
    const match: ValueMatch = { topology: this.topology, parts, value, error, expression: '' };
    const at = this.kept.findIndex((m) => compareMatches(match, m) < 0);
    this.kept.splice(at < 0 ? this.kept.length : at, 0, match);
    this.keys.add(key);
    if (this.kept.length > this.size) this.keys.delete(this.kept.pop()!.parts.join(','));
  }
}

/**
 * The `perTopology` best distinct matches for `target` (Ω) of each topology, drawn from
 * `values` (ascending, ohms), best first within each list. The building block of findValue for
 * callers that already hold a part list (the divider designer).
 */
export function searchMatches(
  values: readonly number[],
  target: number,
  topologies: readonly Topology[],
  perTopology: number,
): ValueMatch[][] {
  if (values.length === 0) return topologies.map(() => []);
  return topologies.map((topology) => {
    const keep = new BestOf(topology, target, perTopology);
    const two = (a: number, b: number) => keep.offer([a, b]);
    const three = (a: number, b: number, c: number) => keep.offer([a, b, c]);
    if (topology === 'single') {
      const i = lowerBound(values, target);
      for (let k = Math.max(0, i - perTopology); k < Math.min(values.length, i + perTopology); k++) keep.offer([values[k]]);
    } else if (topology === 'series') searchSeriesPairs(values, target, two);
    else if (topology === 'parallel') searchParallelPairs(values, target, two);
    else if (topology === 'series3') searchSeriesTriples(values, target, three);
    else if (topology === 'parallel3') searchParallelTriples(values, target, three);
    else if (topology === 'series-parallel') searchSeriesOfParallel(values, target, three);
    else searchParallelOfSeries(values, target, three);
    return keep.kept.map((m) => ({ ...m, expression: describeCombination(m.topology, m.parts) }));
  });
}

export interface ValueFinderOptions {
  /** Series to draw parts from (default E24). */
  series?: ESeriesName;
  /** Up to how many parts in one combination, 1–3 (default 2). */
  maxParts?: 1 | 2 | 3;
  /** How many distinct matches to keep for each topology (default 3). */
  perTopology?: number;
  /** Length of the overall ranking (default 10). */
  limit?: number;
  /** Smallest and largest part value allowed, ohms (default the whole 1 mΩ … 1 TΩ range). */
  minPart?: number;
  maxPart?: number;
}

export interface ValueFinderResult {
  /** The target, ohms. */
  readonly target: number;
  readonly series: ESeriesName;
  /** The best match of each topology searched (absent when no parts fit the range). */
  readonly best: Partial<Record<Topology, ValueMatch>>;
  /** All kept matches, best first (see compareMatches), at most `limit`. */
  readonly ranked: readonly ValueMatch[];
}

/**
 * The best single value, series pair, parallel pair and (with maxParts 3) three-part
 * combinations for `targetOhms` from one series. The best of each topology is exact (see
 * combination-search.ts); runners-up are the best among the candidates the exact search visits.
 */
export function findValue(targetOhms: number, options: ValueFinderOptions = {}): ValueFinderResult {
  if (!Number.isFinite(targetOhms) || targetOhms <= 0) {
    throw new RangeError(`findValue needs a target resistance above 0 Ω; got ${targetOhms}`);
  }
  const series = options.series ?? 'E24';
  const values = preferredValuesBetween(series, options.minPart ?? PREFERRED_RANGE.min, options.maxPart ?? PREFERRED_RANGE.max);
  const perTopology = Math.max(1, options.perTopology ?? 3);
  const topologies = TOPOLOGIES_BY_PARTS[options.maxParts ?? 2];
  const best: Partial<Record<Topology, ValueMatch>> = {};
  const all: ValueMatch[] = [];
  if (values.length === 0) return { target: targetOhms, series, best, ranked: [] };

  for (const kept of searchMatches(values, targetOhms, topologies, perTopology)) {
    if (kept.length > 0) best[kept[0].topology] = kept[0];
    all.push(...kept);
  }
  all.sort(compareMatches);
  return { target: targetOhms, series, best, ranked: all.slice(0, Math.max(1, options.limit ?? 10)) };
}
