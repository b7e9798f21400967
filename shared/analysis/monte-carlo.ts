// Statistical tolerance analysis by Monte Carlo. Each toleranced variable is drawn per sample,
// uniform over its range or normal with the half-range at 3σ (common practice: a ±5 % part is
// N(nominal, (5 %/3)²); the normal is not truncated, so 0.27 % of draws fall outside the
// tolerance). Sample i uses its own random substream (prng.ts), so the samples — and the
// statistics — are the same however the run is split into chunks across web workers.
import type { CircuitSolveOptions } from '../engine/compile';
import { controller, type RunControl } from './control';
import { assertOutputs, evaluateOutputs, prepareCircuit, type PreparedCircuit } from './evaluate';
import { outputKey, outputUnit, type OutputSpec } from './outputs';
import { SampleStreams } from './prng';
import { summarize, wilsonInterval, type OutputStatistics, type SpecWindow, type YieldEstimate } from './statistics';
import { isPrepared } from './sweep';
import { AnalysisInputError, solveOptionsFor } from './targets';
import { toleranceVariables, type ToleranceOptions, type ToleranceVariable } from './tolerance-space';

export type Distribution = 'uniform' | 'normal';

export interface MonteCarloOptions extends ToleranceOptions {
  outputs: readonly OutputSpec[];
  /** total samples of the run (all chunks together) */
  samples: number;
  /** any integer; the same seed gives the same samples */
  seed: number;
  /** default distribution (default 'normal') */
  distribution?: Distribution;
  /** per part id, overriding the default */
  distributionOf?: Readonly<Record<string, Distribution>>;
  /** spec window per output key ("V(tap)") for the yield */
  windows?: Readonly<Record<string, SpecWindow>>;
  histogramBins?: number;
  base?: CircuitSolveOptions;
}

/** The raw values of samples [start, start+count) — what a worker sends back. */
export interface MonteCarloChunk {
  start: number;
  /** samples actually run (less than asked when stopped) */
  count: number;
  /** per output (in options order), one value per sample, NaN for a failed solve */
  values: Float64Array[];
  failures: Array<{ sample: number; message: string }>;
  stopped: boolean;
}

export interface MonteCarloResult {
  samples: number;
  seed: number;
  variables: Array<ToleranceVariable & { distribution: Distribution }>;
  outputs: Array<{ key: string; unit: string; stats: OutputStatistics }>;
  /** samples where every output with a spec window is inside it (failed samples fail), when any window is given */
  combinedYield?: YieldEstimate;
  failed: number;
  /** the first few failures, to explain them */
  failures: Array<{ sample: number; message: string }>;
  stopped: boolean;
}

function checkSamples(n: number, what: string): void {
  if (!(Number.isInteger(n) && n >= 1 && n <= 10_000_000)) throw new AnalysisInputError(`${what} must be a whole number from 1 to 10,000,000 (got ${n}).`);
}

/** The variables with their distributions (what a run will draw). */
export function monteCarloVariables(p: PreparedCircuit, o: MonteCarloOptions): Array<ToleranceVariable & { distribution: Distribution }> {
  return toleranceVariables(p.sheet, o).map((v) => ({
    ...v,
    distribution: (v.target.kind === 'param' ? o.distributionOf?.[v.target.part] : undefined) ?? o.distribution ?? 'normal',
  }));
}

/**
 * Run samples [start, start + count) of a Monte Carlo run. Chunks of one run share seed and
 * options; merge them with `summarizeMonteCarlo`.
 */
export function runMonteCarloChunk(circuit: PreparedCircuit | unknown, o: MonteCarloOptions, start: number, count: number, control?: RunControl): MonteCarloChunk {
  const p = isPrepared(circuit) ? circuit : prepareCircuit(circuit);
  assertOutputs(p, o.outputs);
  checkSamples(o.samples, 'samples');
  if (!(Number.isInteger(start) && Number.isInteger(count) && start >= 0 && count >= 0 && start + count <= o.samples))
    throw new AnalysisInputError(`chunk [${start}, ${start + count}) must lie within the ${o.samples} samples of the run.`);
  const vars = monteCarloVariables(p, o);
  const targets = vars.map((v) => v.target);
  const streams = new SampleStreams(o.seed, start);
  const x = new Float64Array(vars.length);
  const y = new Float64Array(o.outputs.length);
  const values = o.outputs.map(() => new Float64Array(count).fill(NaN));
  const failures: MonteCarloChunk['failures'] = [];
  const ctl = controller(control, count);
  const base = o.base ?? {};
  let done = 0;
  let stopped = false;
  for (let i = 0; i < count; i++) {
    const rng = streams.next();
    for (let k = 0; k < vars.length; k++) {
      const v = vars[k];
      x[k] = v.distribution === 'uniform' ? v.low + (v.high - v.low) * rng.uniform() : v.nominal + ((v.high - v.low) / 6) * rng.normal();
    }
    const f = evaluateOutputs(p, solveOptionsFor(targets, x, base), o.outputs, y);
    if (f) failures.push({ sample: start + i, message: f.error.message });
    else for (let k = 0; k < y.length; k++) values[k][i] = y[k];
    done++;
    if (ctl.tick(done)) {
      stopped = true;
      break;
    }
  }
  return { start, count: done, values: values.map((v) => (done < count ? v.slice(0, done) : v)), failures, stopped };
}

/** Split a run into `parts` contiguous chunks (for a worker pool). */
export function chunkRanges(samples: number, parts: number): Array<{ start: number; count: number }> {
  const k = Math.max(1, Math.min(samples, Math.floor(parts)));
  const out: Array<{ start: number; count: number }> = [];
  for (let i = 0; i < k; i++) {
    const s = Math.floor((samples * i) / k);
    const e = Math.floor((samples * (i + 1)) / k);
    out.push({ start: s, count: e - s });
  }
  return out;
}

/** Merge chunks (any order) and compute the statistics. */
export function summarizeMonteCarlo(p: PreparedCircuit, o: MonteCarloOptions, chunks: readonly MonteCarloChunk[]): MonteCarloResult {
  const sorted = [...chunks].sort((a, b) => a.start - b.start);
  const n = sorted.reduce((a, c) => a + c.count, 0);
  const failures = sorted.flatMap((c) => c.failures);
  const outputs = o.outputs.map((spec, k) => {
    const all = new Float64Array(n);
    let at = 0;
    for (const c of sorted) {
      all.set(c.values[k], at);
      at += c.count;
    }
    const key = outputKey(spec);
    return { key, unit: outputUnit(spec), stats: summarize(all, { bins: o.histogramBins, window: o.windows?.[key] }) };
  });
  const windowed = o.outputs.map((spec, k) => ({ k, w: o.windows?.[outputKey(spec)] })).filter((x) => x.w);
  let combinedYield: YieldEstimate | undefined;
  if (windowed.length) {
    let pass = 0;
    for (const c of sorted)
      for (let i = 0; i < c.count; i++) {
        let ok = true;
        for (const { k, w } of windowed) {
          const v = c.values[k][i];
          if (!(Number.isFinite(v) && (w!.min === undefined || v >= w!.min) && (w!.max === undefined || v <= w!.max))) {
            ok = false;
            break;
          }
        }
        if (ok) pass++;
      }
    combinedYield = { window: {}, pass, total: n, fraction: n ? pass / n : NaN, interval95: wilsonInterval(pass, n) };
  }
  return {
    samples: n,
    seed: o.seed,
    ...(combinedYield ? { combinedYield } : {}),
    variables: monteCarloVariables(p, o),
    outputs,
    failed: failures.length,
    failures: failures.slice(0, 20),
    stopped: sorted.some((c) => c.stopped) || n < o.samples,
  };
}

/** The whole run in this thread, in chunks of `checkEvery`, with progress and cancellation. */
export function runMonteCarlo(circuit: PreparedCircuit | unknown, o: MonteCarloOptions, control?: RunControl): MonteCarloResult {
  const p = isPrepared(circuit) ? circuit : prepareCircuit(circuit);
  const chunk = runMonteCarloChunk(p, o, 0, o.samples, control);
  return summarizeMonteCarlo(p, o, [chunk]);
}
