// Statistics helpers against textbook definitions.
import { describe, expect, it } from 'vitest';
import { deratingFactor, histogram, percentileSorted, summarize, wilsonInterval, stepValues } from '../../../shared/analysis';

describe('statistics', () => {
  it('percentiles follow Hyndman & Fan type 7 (R and NumPy default)', () => {
    const x = Float64Array.from({ length: 10 }, (_, i) => i + 1);
    // R: quantile(1:10, c(0, .25, .5, .9, 1)) = 1, 3.25, 5.5, 9.1, 10
    expect(percentileSorted(x, 0)).toBe(1);
    expect(percentileSorted(x, 25)).toBeCloseTo(3.25, 12);
    expect(percentileSorted(x, 50)).toBeCloseTo(5.5, 12);
    expect(percentileSorted(x, 90)).toBeCloseTo(9.1, 12);
    expect(percentileSorted(x, 100)).toBe(10);
  });

  it('sample mean and standard deviation (n − 1), ignoring failed (NaN) samples', () => {
    // 2, 4, 4, 4, 5, 5, 7, 9: mean 5, population σ 2, sample s = √(32/7)
    const s = summarize([2, 4, 4, 4, 5, 5, 7, 9, NaN]);
    expect(s.count).toBe(8);
    expect(s.mean).toBe(5);
    expect(s.std).toBeCloseTo(Math.sqrt(32 / 7), 14);
  });

  it('the Wilson interval for 0 of n has upper bound z²/(n + z²) (Wilson 1927)', () => {
    const z = 1.959963984540054;
    expect(wilsonInterval(0, 10)[0]).toBe(0);
    expect(wilsonInterval(0, 10)[1]).toBeCloseTo((z * z) / (10 + z * z), 12);
    const [lo, hi] = wilsonInterval(50, 100);
    expect(lo + hi).toBeCloseTo(1, 12); // symmetric at p = 0.5
  });

  it('histogram counts every value once', () => {
    const h = histogram(Float64Array.of(0, 0.5, 1, 1.5, 2), 4);
    expect(h.edges).toEqual([0, 0.5, 1, 1.5, 2]);
    expect(h.counts).toEqual([1, 1, 1, 2]);
  });

  it('resistor derating: full to 70 °C, linear to zero at 155 °C (IEC 60115-1 terms, from memory)', () => {
    expect(deratingFactor(25)).toBe(1);
    expect(deratingFactor(70)).toBe(1);
    expect(deratingFactor(112.5)).toBeCloseTo(0.5, 12);
    expect(deratingFactor(155)).toBe(0);
  });

  it('sweep steps: linear and logarithmic with exact endpoints', () => {
    expect(Array.from(stepValues({ from: 0, to: 1, points: 5 }))).toEqual([0, 0.25, 0.5, 0.75, 1]);
    const log = stepValues({ from: 1, to: 1000, points: 4, scale: 'log' });
    expect(log[0]).toBe(1);
    expect(log[1]).toBeCloseTo(10, 12);
    expect(log[2]).toBeCloseTo(100, 10);
    expect(log[3]).toBe(1000);
    expect(() => stepValues({ from: -1, to: 10, points: 3, scale: 'log' })).toThrow(/same sign/);
  });
});
