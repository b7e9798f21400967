/**
 * Value finder: the preferred values, and series/parallel combinations of them, closest to a
 * target resistance, ranked by relative error.
 */
import { PREFERRED_RANGE, preferredValuesBetween, type ESeriesName } from '../units/eseries';
import { lowerBound } from '../units/sorted-search';
import {
  searchParallelOfSeries,
  searchParallelPairs,
  searchParallelTriples,
  searchSeriesOfParallel,
  searchSeriesPairs,
  searchSeriesTriples,
} from './combination-search';
import { BestOf, compareMatches, describeCombination } from './match-ranking';
import { TOPOLOGIES_BY_PARTS, type Topology, type ValueMatch } from './combination';

export { combinedResistance, TOPOLOGIES_BY_PARTS, type Topology, type ValueMatch } from './combination';
export { compareMatches, describeCombination } from './match-ranking';

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
