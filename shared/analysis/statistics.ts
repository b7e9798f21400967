// Summary statistics of Monte Carlo outputs. Failed samples are NaN in the input arrays: they are
// left out of the moments and percentiles and counted as out of spec in the yield.

export interface Histogram {
  /** bin edges, length bins+1, in the output's unit */
  edges: number[];
  counts: number[];
}

export interface SpecWindow {
  /** lower limit (inclusive), omitted = no lower limit */
  min?: number;
  /** upper limit (inclusive), omitted = no upper limit */
  max?: number;
}

export interface YieldEstimate {
  window: SpecWindow;
  /** samples inside the window */
  pass: number;
  /** all samples, failed solves included (they count as fails) */
  total: number;
  /** pass / total */
  fraction: number;
  /** 95 % Wilson score interval for the yield (E. B. Wilson, JASA 22(158), 209–212, 1927) */
  interval95: [number, number];
}

export interface OutputStatistics {
  /** samples with a finite value */
  count: number;
  mean: number;
  /** sample standard deviation (n − 1) */
  std: number;
  /** standard error of the mean, std/√count */
  stdErrorOfMean: number;
  min: number;
  max: number;
  /** percentile (0..100) → value, linear interpolation between order statistics (Hyndman & Fan type 7) */
  percentiles: Record<string, number>;
  histogram: Histogram;
  yield?: YieldEstimate;
}

export const DEFAULT_PERCENTILES = [0.135, 1, 5, 25, 50, 75, 95, 99, 99.865] as const;

/**
 * Percentile p (0..100) of sorted finite values, type 7 of R. J. Hyndman and Y. Fan, "Sample
 * quantiles in statistical packages", Am. Statist. 50(4), 361–365, 1996 (R's and NumPy's default).
 */
export function percentileSorted(sorted: ArrayLike<number>, p: number): number {
  const n = sorted.length;
  if (n === 0) return NaN;
  const h = (n - 1) * (p / 100);
  const lo = Math.floor(h);
  const hi = Math.min(n - 1, lo + 1);
  return sorted[lo] + (h - lo) * (sorted[hi] - sorted[lo]);
}

/** Equal-width histogram between min and max. */
export function histogram(sorted: ArrayLike<number>, bins: number): Histogram {
  const n = sorted.length;
  if (n === 0) return { edges: [], counts: [] };
  const lo = sorted[0];
  const hi = sorted[n - 1];
  if (lo === hi) return { edges: [lo, hi], counts: [n] };
  const width = (hi - lo) / bins;
  const edges = Array.from({ length: bins + 1 }, (_, k) => (k === bins ? hi : lo + k * width));
  const counts = new Array<number>(bins).fill(0);
  for (let i = 0; i < n; i++) counts[Math.min(bins - 1, Math.floor((sorted[i] - lo) / width))]++;
  return { edges, counts };
}

/** Wilson score interval at z = 1.96. */
export function wilsonInterval(pass: number, total: number, z = 1.959963984540054): [number, number] {
  if (total === 0) return [0, 1];
  const p = pass / total;
  const z2 = z * z;
  const centre = (p + z2 / (2 * total)) / (1 + z2 / total);
  const half = (z / (1 + z2 / total)) * Math.sqrt((p * (1 - p)) / total + z2 / (4 * total * total));
  return [Math.max(0, centre - half), Math.min(1, centre + half)];
}

/** Statistics of one output over all samples (NaN = failed sample). */
export function summarize(values: ArrayLike<number>, opts: { bins?: number; percentiles?: readonly number[]; window?: SpecWindow } = {}): OutputStatistics {
  const finite: number[] = [];
  for (let i = 0; i < values.length; i++) if (Number.isFinite(values[i])) finite.push(values[i]);
  const sorted = Float64Array.from(finite).sort();
  const n = sorted.length;
  // two passes: mean, then squared deviations (accurate where Σx² − n·x̄² would cancel)
  let sum = 0;
  for (let i = 0; i < n; i++) sum += sorted[i];
  const mean = n ? sum / n : NaN;
  let ss = 0;
  for (let i = 0; i < n; i++) ss += (sorted[i] - mean) ** 2;
  const std = n > 1 ? Math.sqrt(ss / (n - 1)) : n === 1 ? 0 : NaN;
  const percentiles: Record<string, number> = {};
  for (const p of opts.percentiles ?? DEFAULT_PERCENTILES) percentiles[String(p)] = percentileSorted(sorted, p);
  const out: OutputStatistics = {
    count: n,
    mean,
    std,
    stdErrorOfMean: n > 0 ? std / Math.sqrt(n) : NaN,
    min: n ? sorted[0] : NaN,
    max: n ? sorted[n - 1] : NaN,
    percentiles,
    histogram: histogram(sorted, opts.bins ?? 40),
  };
  const w = opts.window;
  if (w && (w.min !== undefined || w.max !== undefined)) {
    let pass = 0;
    for (let i = 0; i < n; i++) if ((w.min === undefined || sorted[i] >= w.min) && (w.max === undefined || sorted[i] <= w.max)) pass++;
    const total = values.length;
    out.yield = { window: w, pass, total, fraction: total ? pass / total : NaN, interval95: wilsonInterval(pass, total) };
  }
  return out;
}
