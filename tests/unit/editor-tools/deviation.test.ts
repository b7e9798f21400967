import { describe, expect, it } from 'vitest';
import { compareWithCurve, interpolate } from '../../../src/editor/tools/sweep/deviation';

describe('interpolate', () => {
  it('is exact on a straight line (linear interpolation reproduces degree-1 polynomials; common practice)', () => {
    const xs = [0, 1, 2, 4, 8];
    const ys = xs.map((x) => 2 * x + 1);
    for (const x of [0, 0.3, 1.5, 3.99, 7.25, 8]) expect(interpolate(xs, ys, x)).toBeCloseTo(2 * x + 1, 12);
  });
  it('in log x it is exact for y = ln x on a log-spaced grid', () => {
    const xs = [1, 10, 100, 1000];
    const ys = xs.map(Math.log);
    for (const x of [2, 31.6, 500]) expect(interpolate(xs, ys, x, true)).toBeCloseTo(Math.log(x), 12);
  });
  it('handles a descending sweep and refuses to extrapolate', () => {
    const xs = [10, 5, 0];
    const ys = [100, 50, 0];
    expect(interpolate(xs, ys, 7.5)).toBeCloseTo(75, 12);
    expect(interpolate(xs, ys, 11)).toBeNaN();
    expect(interpolate(xs, ys, -0.1)).toBeNaN();
  });
});

describe('compareWithCurve', () => {
  const xs = [0, 1, 2, 3, 4];
  const ys = [0, 1, 2, 3, 4];
  it('a constant offset c gives max = RMS = mean = c', () => {
    const s = compareWithCurve(xs, ys, [0.5, 1.5, 2.5], [0.5 + 0.02, 1.5 + 0.02, 2.5 + 0.02]);
    expect(s.compared).toBe(3);
    expect(s.maxAbs).toBeCloseTo(0.02, 12);
    expect(s.rms).toBeCloseTo(0.02, 12);
    expect(s.mean).toBeCloseTo(0.02, 12);
  });
  it('deviations +1, −1, +2 give RMS √2 (√((1+1+4)/3)), max 2 at its x, mean 2/3', () => {
    const s = compareWithCurve(xs, ys, [1, 2, 3], [2, 1, 5]);
    expect(s.rms).toBeCloseTo(Math.SQRT2, 12);
    expect(s.maxAbs).toBe(2);
    expect(s.maxAt).toBe(3);
    expect(s.mean).toBeCloseTo(2 / 3, 12);
    expect(s.rows.map((r) => r.relative)).toEqual([1, -0.5, 2 / 3]);
  });
  it('readings outside the sweep are listed but not counted', () => {
    const s = compareWithCurve(xs, ys, [-1, 2, 9], [0, 2.1, 9]);
    expect(s.rows).toHaveLength(3);
    expect(s.compared).toBe(1);
    expect(s.rows[0].simulated).toBeNaN();
    expect(s.maxAbs).toBeCloseTo(0.1, 12);
  });
});
