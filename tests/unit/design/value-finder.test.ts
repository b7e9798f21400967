import { describe, expect, it } from 'vitest';
import fc from 'fast-check';
import { preferredValuesBetween, PREFERRED_RANGE, type ESeriesName } from '../../../shared/units/eseries';
import { combinedResistance, findValue, type Topology } from '../../../shared/design/value-finder';

// Oracle: plain brute force over every pair (or triple) of the same part list, written
// independently of the windowed search in combination-search.ts.
function bruteForceBest(topology: Topology, values: readonly number[], target: number): number {
  let best = Infinity;
  const n = values.length;
  const consider = (r: number) => {
    const e = Math.abs(r - target) / target;
    if (e < best) best = e;
  };
  for (let i = 0; i < n; i++) {
    const a = values[i];
    if (topology === 'single') {
      consider(a);
      continue;
    }
    for (let j = 0; j < n; j++) {
      const b = values[j];
      if (topology === 'series') consider(a + b);
      else if (topology === 'parallel') consider(1 / (1 / a + 1 / b));
      else {
        for (let k = j; k < n; k++) {
          const c = values[k];
          if (topology === 'series3') consider(a + b + c);
          else if (topology === 'parallel3') consider(1 / (1 / a + 1 / b + 1 / c));
          else if (topology === 'series-parallel') consider(a + 1 / (1 / b + 1 / c));
          else consider(1 / (1 / a + 1 / (b + c)));
        }
      }
    }
  }
  return best;
}

const expectSameBest = (got: number | undefined, oracle: number) => {
  expect(got).toBeDefined();
  // The same combination summed in another order differs by rounding only (~1e-16).
  expect(Math.abs(Math.abs(got!) - oracle)).toBeLessThanOrEqual(1e-12 * oracle + 1e-14);
};

describe('value finder', () => {
  it('finds exact combinations an engineer would (worked by hand)', () => {
    const r = findValue(5000, { series: 'E24' });
    expect(r.best.single?.parts).toEqual([5100]);
    expect(r.best.single?.error).toBeCloseTo(0.02, 12);
    expect(r.best.parallel?.parts).toEqual([10000, 10000]);
    expect(r.best.parallel?.error).toBe(0);
    expect(r.best.parallel?.expression).toBe('10K ∥ 10K');
    expect(Math.abs(r.best.series!.error)).toBe(0);
    // Exact two-part answers come before the single 5K1, and fewer parts win a tie.
    expect(r.ranked[0].error).toBe(0);
    expect(r.ranked.at(-1)!.parts.length).toBeGreaterThan(0);
    for (let i = 1; i < r.ranked.length; i++) expect(Math.abs(r.ranked[i].error)).toBeGreaterThanOrEqual(Math.abs(r.ranked[i - 1].error) - 1e-15);
  });

  it('returns the preferred value itself with zero error when the target is one', () => {
    const r = findValue(4700, { series: 'E12' });
    expect(r.ranked[0]).toMatchObject({ topology: 'single', parts: [4700], error: 0, expression: '4K7' });
  });

  it.each<[ESeriesName, number]>([
    ['E24', 5000],
    ['E24', 1234],
    ['E24', 0.37],
    ['E12', 333333],
    ['E96', 7777],
    ['E96', 12.34],
    ['E6', 2e9],
    ['E24', 4700.01], // just above a preferred value: the best parallel pair is 4K7 ∥ the largest part
  ])('best single, series and parallel pair for %s %d Ω match a brute-force search', (series, target) => {
    const values = preferredValuesBetween(series, PREFERRED_RANGE.min, PREFERRED_RANGE.max);
    const r = findValue(target, { series });
    for (const topology of ['single', 'series', 'parallel'] as const) {
      expectSameBest(r.best[topology]?.error, bruteForceBest(topology, values, target));
      const m = r.best[topology]!;
      expect(m.value).toBe(combinedResistance(topology, m.parts));
      for (const p of m.parts) expect(values).toContain(p);
    }
  });

  it('matches brute force on random targets and part ranges (E24 pairs)', () => {
    fc.assert(
      fc.property(fc.double({ min: 0, max: 7, noNaN: true }), fc.integer({ min: 0, max: 3 }), (exp, lo) => {
        const target = 10 ** exp;
        const min = 10 ** lo;
        const values = preferredValuesBetween('E24', min, 1e8);
        const r = findValue(target, { series: 'E24', minPart: min, maxPart: 1e8 });
        for (const topology of ['series', 'parallel'] as const) {
          expectSameBest(r.best[topology]?.error, bruteForceBest(topology, values, target));
        }
      }),
      { numRuns: 25 },
    );
  });

  it.each([3300, 47, 123456, 0.5])('best three-part combinations for %d Ω (E12, 1 Ω … 10 MΩ) match brute force', (target) => {
    const values = preferredValuesBetween('E12', 1, 1e7);
    const r = findValue(target, { series: 'E12', maxParts: 3, minPart: 1, maxPart: 1e7 });
    for (const topology of ['series3', 'parallel3', 'series-parallel', 'parallel-series'] as const) {
      expectSameBest(r.best[topology]?.error, bruteForceBest(topology, values, target));
    }
  });

  it('keeps distinct matches per topology and honours the part range', () => {
    const r = findValue(1234, { series: 'E24', perTopology: 4, limit: 50, minPart: 100, maxPart: 1e5 });
    const keys = r.ranked.map((m) => `${m.topology}:${m.parts.join(',')}`);
    expect(new Set(keys).size).toBe(keys.length);
    for (const m of r.ranked) for (const p of m.parts) expect(p >= 100 && p <= 1e5).toBe(true);
    expect(r.ranked.filter((m) => m.topology === 'series').length).toBeLessThanOrEqual(4);
    expect(() => findValue(0)).toThrow(/above 0/);
  });
});
