// Entry points for web workers (and the server): plain, structured-clone-friendly inputs and
// outputs, chunked and cancellable. A worker pool splits a Monte Carlo run with `planChunks`,
// runs `runMonteCarloJob` per chunk in each worker, and merges with `mergeMonteCarloJobs`; the
// merged statistics equal a single-thread run with the same seed (each sample has its own stream).
import type { RunControl } from './control';
import { prepareCircuit, type PreparedCircuit } from './evaluate';
import { chunkRanges, runMonteCarloChunk, summarizeMonteCarlo, type MonteCarloChunk, type MonteCarloOptions, type MonteCarloResult } from './monte-carlo';
import { runSweep, type SweepSpec, type SweepTable } from './sweep';
import { runWorstCase, type WorstCaseOptions, type WorstCaseResult } from './worst-case';
import { theveninAt, type TheveninResult } from './thevenin';
import type { CircuitSolveOptions } from '../engine/compile';

let cached: { text: string; prepared: PreparedCircuit } | null = null;

/** Compile once per distinct sheet within a worker (chunks of one run arrive as fresh copies). */
function prepared(sheet: unknown): PreparedCircuit {
  const text = JSON.stringify(sheet);
  if (cached && cached.text === text) return cached.prepared;
  const p = prepareCircuit(sheet);
  cached = { text, prepared: p };
  return p;
}

export interface MonteCarloJob {
  sheet: unknown;
  options: MonteCarloOptions;
  start: number;
  count: number;
}

/** Chunks for a pool: at least one per worker, and no chunk above `maxChunk` samples (progress granularity). */
export function planChunks(samples: number, workers: number, maxChunk = 2000): Array<{ start: number; count: number }> {
  return chunkRanges(samples, Math.max(workers, Math.ceil(samples / maxChunk)));
}

export function runMonteCarloJob(job: MonteCarloJob, control?: RunControl): MonteCarloChunk {
  return runMonteCarloChunk(prepared(job.sheet), job.options, job.start, job.count, control);
}

export function mergeMonteCarloJobs(sheet: unknown, options: MonteCarloOptions, chunks: readonly MonteCarloChunk[]): MonteCarloResult {
  return summarizeMonteCarlo(prepared(sheet), options, chunks);
}

export function runSweepJob(job: { sheet: unknown; spec: SweepSpec }, control?: RunControl): SweepTable {
  return runSweep(prepared(job.sheet), job.spec, control);
}

export function runWorstCaseJob(job: { sheet: unknown; options: WorstCaseOptions }): WorstCaseResult {
  return runWorstCase(prepared(job.sheet), job.options);
}

export function runTheveninJob(job: { sheet: unknown; nets: readonly string[]; base?: CircuitSolveOptions }): TheveninResult[] {
  const p = prepared(job.sheet);
  return job.nets.map((net) => theveninAt(p.sheet, net, job.base ?? {}));
}
