// Measured against simulated: the simulated curve is interpolated at each measured x (linearly,
// or linearly in log x on a log sweep) and the differences summarised as the largest and the
// root-mean-square deviation.

export interface DeviationRow {
  x: number;
  measured: number;
  /** NaN when x lies outside the simulated range or the curve failed there */
  simulated: number;
  /** measured − simulated */
  deviation: number;
  /** deviation / |simulated|, NaN when simulated is 0 */
  relative: number;
}

export interface DeviationSummary {
  rows: DeviationRow[];
  /** rows that have a simulated value to compare with */
  compared: number;
  /** largest |deviation|, same unit as the output */
  maxAbs: number;
  /** x where it occurs */
  maxAt: number;
  rms: number;
  /** mean of measured − simulated (a constant offset, e.g. a meter's zero error) */
  mean: number;
}

/**
 * Interpolate y(x) on a curve sampled at ascending or descending `xs`. Outside the range, NaN
 * (extrapolating a non-linear circuit would invent numbers).
 */
export function interpolate(xs: readonly number[], ys: readonly number[], x: number, log = false): number {
  const n = xs.length;
  if (n === 0 || !Number.isFinite(x)) return NaN;
  const asc = xs[n - 1] >= xs[0];
  const lo = asc ? xs[0] : xs[n - 1];
  const hi = asc ? xs[n - 1] : xs[0];
  const eps = 1e-12 * Math.max(Math.abs(lo), Math.abs(hi), 1);
  if (x < lo - eps || x > hi + eps) return NaN;
  if (n === 1) return ys[0];
  const t = (v: number) => (log ? Math.log(v) : v);
  // binary search for the segment [i, i+1] containing x
  let a = 0;
  let b = n - 1;
  while (b - a > 1) {
    const m = (a + b) >> 1;
    if (asc ? xs[m] <= x : xs[m] >= x) a = m;
    else b = m;
  }
  const x0 = t(xs[a]);
  const x1 = t(xs[b]);
  if (x1 === x0) return ys[a];
  const u = Math.min(1, Math.max(0, (t(x) - x0) / (x1 - x0)));
  return ys[a] + u * (ys[b] - ys[a]);
}

/** Compare readings (xm[i], ym[i]) with the simulated curve (xs, ys). */
export function compareWithCurve(xs: readonly number[], ys: readonly number[], xm: readonly number[], ym: readonly number[], log = false): DeviationSummary {
  const rows: DeviationRow[] = [];
  let n = 0;
  let sum = 0;
  let sumSq = 0;
  let maxAbs = 0;
  let maxAt = NaN;
  for (let i = 0; i < xm.length; i++) {
    if (!Number.isFinite(xm[i]) || !Number.isFinite(ym[i])) continue;
    const sim = interpolate(xs, ys, xm[i], log);
    const dev = ym[i] - sim;
    rows.push({ x: xm[i], measured: ym[i], simulated: sim, deviation: dev, relative: sim !== 0 ? dev / Math.abs(sim) : NaN });
    if (!Number.isFinite(dev)) continue;
    n++;
    sum += dev;
    sumSq += dev * dev;
    if (Math.abs(dev) > maxAbs || Number.isNaN(maxAt)) {
      maxAbs = Math.abs(dev);
      maxAt = xm[i];
    }
  }
  return { rows, compared: n, maxAbs: n ? maxAbs : NaN, maxAt, rms: n ? Math.sqrt(sumSq / n) : NaN, mean: n ? sum / n : NaN };
}
