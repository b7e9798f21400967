import { describe, expect, it } from 'vitest';
import { designDivider, type DividerSpec } from '../../../shared/design/divider-designer';
import { preferredValuesBetween } from '../../../shared/units/eseries';
import type { DividerLoad } from '../../../shared/design/divider-model';

const design = (spec: DividerSpec) => {
  const r = designDivider(spec);
  if (!r.ok) throw new Error(r.message);
  return r;
};

// Independent closed forms (references.md, "Divider tolerance and loading").
const thevenin = (v: number, r1: number, r2: number, load: DividerLoad) => {
  const vth = (v * r2) / (r1 + r2);
  const rth = (r1 * r2) / (r1 + r2);
  if (load.kind === 'resistance') return (vth * load.ohms) / (rth + load.ohms);
  if (load.kind === 'current') return vth - load.amps * rth;
  return vth;
};

describe('divider designer', () => {
  it('finds 27k over 10k for the worked 12 V case and reports its exact window (references.md)', () => {
    const r = design({ supply: 12, target: 3.24324324324, budget: { totalResistance: 37e3 }, tolerance: 0.05, series: 'E24' });
    const best = r.candidates[0];
    expect(best.top.parts).toEqual([27e3]);
    expect(best.bottom.parts).toEqual([10e3]);
    expect(best.output).toBeCloseTo(3.24324324324, 10);
    expect(best.window.max).toBeCloseTo(3.48547717842, 10);
    expect(best.window.min).toBeCloseTo(3.01188903567, 10);
    expect(best.thevenin).toBeCloseTo((27e3 * 10e3) / 37e3, 9);
    expect(best.quiescentCurrent).toBeCloseTo(12 / 37e3, 15);
  });

  const scenarios: [string, DividerSpec][] = [
    // Demo data (invented): a single-cell battery tap for an ADC, 3.0–4.2 V, wanted 1.1 V at 3.7 V.
    ['battery tap, no load', { supply: { min: 3.0, max: 4.2, nominal: 3.7 }, target: 1.1, budget: { maxQuiescentCurrent: 5e-6 }, tolerance: 0.01, series: 'E24' }],
    ['5 V to 1.8 V into 47k', { supply: 5, target: 1.8, load: { kind: 'resistance', ohms: 47e3 }, budget: { maxQuiescentCurrent: 200e-6 }, tolerance: 0.01, series: 'E24' }],
    ['24 V to 2.5 V drawing 10 µA', { supply: { min: 22, max: 26 }, target: 2.5, load: { kind: 'current', amps: 10e-6 }, budget: { totalResistance: 100e3 }, tolerance: 0.02, series: 'E24' }],
  ];

  it.each(scenarios)('%s: least output error equals a brute-force search over every pair in the budget', (_, base) => {
    const spec = { ...base, weights: { error: 1, window: 0, current: 0, partCount: 0 } };
    const r = design(spec);
    const v = typeof spec.supply === 'number' ? spec.supply : spec.supply.nominal ?? (spec.supply.min + spec.supply.max) / 2;
    const vmax = typeof spec.supply === 'number' ? spec.supply : spec.supply.max;
    const values = preferredValuesBetween(spec.series, 1e-3, r.totalRange.max);
    let best = Infinity;
    for (const r1 of values) {
      for (const r2 of values) {
        const total = r1 + r2;
        if (total < r.totalRange.min || total > r.totalRange.max) continue;
        const out = thevenin(v, r1, r2, spec.load ?? { kind: 'none' });
        if (out <= 0) continue;
        best = Math.min(best, Math.abs(out - spec.target) / spec.target);
      }
    }
    expect(Math.abs(r.candidates[0].error)).toBeCloseTo(best, 12);
    if ('maxQuiescentCurrent' in spec.budget) expect(r.totalRange.min).toBeCloseTo(vmax / spec.budget.maxQuiescentCurrent, 9);
  });

  it.each(scenarios)('%s: every candidate is within budget, loaded like Thevenin says, and scored as documented', (_, spec) => {
    const r = design(spec);
    const v = typeof spec.supply === 'number' ? spec.supply : spec.supply.nominal ?? (spec.supply.min + spec.supply.max) / 2;
    expect(r.candidates.length).toBeGreaterThan(3);
    let previous = -Infinity;
    for (const c of r.candidates) {
      expect(c.totalResistance).toBeGreaterThanOrEqual(r.totalRange.min * (1 - 1e-12));
      expect(c.totalResistance).toBeLessThanOrEqual(r.totalRange.max * (1 + 1e-12));
      if ('maxQuiescentCurrent' in spec.budget) expect(c.quiescentCurrent).toBeLessThanOrEqual(spec.budget.maxQuiescentCurrent * (1 + 1e-12));
      expect(c.output).toBeCloseTo(thevenin(v, c.top.value, c.bottom.value, spec.load ?? { kind: 'none' }), 10);
      expect(c.window.min).toBeLessThan(c.output);
      expect(c.window.max).toBeGreaterThan(c.output);
      const w = c.score.weights;
      const k = c.score.components;
      expect(k.error).toBeCloseTo(Math.abs(c.error) * 100, 12);
      expect(k.window).toBeCloseTo(((c.window.max - c.window.min) / spec.target) * 100, 12);
      expect(c.score.total).toBeCloseTo(w.error * k.error + w.window * k.window + w.current * k.current + w.partCount * k.partCount, 12);
      expect(c.score.total).toBeGreaterThanOrEqual(previous);
      previous = c.score.total;
    }
  });

  it('reports the worst dissipation of each part at the highest supply over tolerance', () => {
    const spec: DividerSpec = { supply: { min: 10, max: 14 }, target: 5, budget: { totalResistance: 2000 }, tolerance: 0.05, series: 'E24' };
    const c = design(spec).candidates[0];
    const [r1, r2] = [c.top.value, c.bottom.value];
    let p1 = 0;
    let p2 = 0;
    for (const a of [r1 * 0.95, r1 * 1.05]) {
      for (const b of [r2 * 0.95, r2 * 1.05]) {
        const out = (14 * b) / (a + b);
        p1 = Math.max(p1, (14 - out) ** 2 / a);
        p2 = Math.max(p2, out ** 2 / b);
      }
    }
    expect(c.dissipation.top[0]).toBeCloseTo(p1, 12);
    expect(c.dissipation.bottom[0]).toBeCloseTo(p2, 12);
    // ~50–70 mW each: over half a 1/16 W (0402, common practice) rating, so a caution is raised.
    const hot = design({ ...spec, powerRating: 1 / 16 }).candidates[0];
    expect(hot.warnings.join(' ')).toMatch(/may dissipate up to .* over half its 62.5 mW rating/);
    expect(c.warnings).toEqual([]);
  });

  it('lets the weights decide: a heavy current weight favours the larger divider', () => {
    const spec: DividerSpec = { supply: 5, target: 2.5, budget: { maxQuiescentCurrent: 1e-3 }, tolerance: 0.01, series: 'E24' };
    const frugal = design({ ...spec, weights: { error: 0, window: 0, current: 10, partCount: 0 } }).candidates[0];
    const accurate = design({ ...spec, weights: { error: 1, window: 0, current: 0, partCount: 0 } }).candidates[0];
    expect(frugal.totalResistance).toBeGreaterThan(accurate.totalResistance);
    expect(accurate.error).toBe(0);
  });

  it('uses a pair in one leg when asked, and counts the extra part', () => {
    const spec: DividerSpec = { supply: 12, target: 3.3, budget: { totalResistance: 20e3 }, tolerance: 0.01, series: 'E12', weights: { error: 1, window: 0, current: 0, partCount: 0 } };
    const singles = design(spec).candidates[0];
    const paired = design({ ...spec, partsPerLeg: 2 }).candidates[0];
    expect(Math.abs(paired.error)).toBeLessThan(Math.abs(singles.error));
    expect(paired.score.components.partCount).toBe(1);
    expect(paired.top.parts.length + paired.bottom.parts.length).toBe(3);
    expect(paired.dissipation.top.length).toBe(paired.top.parts.length);
  });

  it('explains requests it cannot meet', () => {
    const base: DividerSpec = { supply: { min: 4.5, max: 5.5 }, target: 2, budget: { maxQuiescentCurrent: 1e-4 }, tolerance: 0.01, series: 'E24' };
    const msg = (spec: DividerSpec) => {
      const r = designDivider(spec);
      return r.ok ? '' : r.message;
    };
    expect(msg({ ...base, target: 5 })).toMatch(/must be below the lowest supply \(4.5 V\): a resistive divider can only divide down/);
    expect(msg({ ...base, target: -1 })).toMatch(/above 0 V/);
    expect(msg({ ...base, supply: { min: 6, max: 5 } })).toMatch(/swap them/);
    expect(msg({ ...base, tolerance: 1.5 })).toMatch(/fraction/);
    expect(msg({ ...base, load: { kind: 'current', amps: -1 } })).toMatch(/0 A or more/);
    expect(msg({ ...base, weights: { error: -1 } })).toMatch(/weight 'error'/);
    expect(msg({ ...base, budget: { totalResistance: 1000, spread: 0.001 }, series: 'E6' })).toMatch(
      /No E6 pair gives 2 V within 10 % with R1 \+ R2 from 999 Ω to 1 kΩ\. Try a finer series/,
    );
    expect(msg({ ...base, maxError: 0 })).toMatch(/maxError/);
  });

  it('warns about supplies above extra-low voltage', () => {
    const r = design({ supply: 120, target: 2.5, budget: { maxQuiescentCurrent: 100e-6 }, tolerance: 0.01, series: 'E96' });
    expect(r.warnings.join(' ')).toMatch(/touch hazard.*local codes and licensed practice/);
  });
});
