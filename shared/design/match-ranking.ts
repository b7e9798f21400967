/**
 * Ranking and bookkeeping for value-finder matches: canonical part order (so equal
 * combinations compare equal), build recipes, best-first order and a bounded best-of list.
 */
import { formatRkm } from '../units/rkm';
import { combinedResistance, type Topology, type ValueMatch } from './combination';

// Orders parts so equal combinations compare equal: the largest first in a sum, the smallest
// first in a parallel group, the lone part first in the mixed forms.
export function canonical(topology: Topology, parts: number[]): number[] {
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
export class BestOf {
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

