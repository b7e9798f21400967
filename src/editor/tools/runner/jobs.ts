// The analyses as the panels start them: each takes the sheet, its options, an AbortSignal and a
// progress callback, and resolves with the result or rejects with JobFailed / JobCancelled.
import type { Sheet } from '../../../../shared/sheet';
import type { SweepSpec, SweepTable } from '../../../../shared/analysis/sweep';
import { planChunks, type MonteCarloChunk, type MonteCarloOptions, type MonteCarloResult } from '../../../../shared/analysis';
import type { WorstCaseOptions, WorstCaseResult } from '../../../../shared/analysis/worst-case';
import type { TheveninResult } from '../../../../shared/analysis/thevenin';
import type { WorkerPool } from './workerPool';
import { unwrap, type JobOutcome, type ProgressFn } from './jobTypes';
import { progressProxy, type AnalysisApi } from './analysisPool';

export interface JobControl {
  signal?: AbortSignal;
  onProgress?: ProgressFn;
}

type Pool = WorkerPool<AnalysisApi>;

/** One sweep in one worker (its points warm-start from each other, so it is not split). */
export async function sweepJob(pool: Pool, sheet: Sheet, spec: SweepSpec, c: JobControl = {}): Promise<SweepTable> {
  const cb = progressProxy(c.onProgress);
  return unwrap(await pool.run((api) => api.sweep(sheet, spec, cb) as Promise<JobOutcome<SweepTable>>, c.signal));
}

/**
 * A Monte Carlo run split over the pool. Each sample draws from its own random substream, so the
 * result does not depend on the split (shared/analysis/prng.ts).
 */
export async function monteCarloJob(pool: Pool, sheet: Sheet, o: MonteCarloOptions, c: JobControl = {}): Promise<MonteCarloResult> {
  // a few chunks per worker keep every worker busy and the progress bar moving
  const ranges = planChunks(o.samples, pool.size, Math.max(100, Math.ceil(o.samples / (pool.size * 3))));
  const done = new Array<number>(ranges.length).fill(0);
  const report = () => c.onProgress?.(done.reduce((a, b) => a + b, 0), o.samples);
  const local = new AbortController();
  const stop = () => local.abort();
  c.signal?.addEventListener('abort', stop, { once: true });
  try {
    const chunks = await Promise.all(
      ranges.map(async (r, i) => {
        const cb = progressProxy((d) => {
          done[i] = d;
          report();
        });
        const out = unwrap(await pool.run((api) => api.monteCarloChunk(sheet, o, r.start, r.count, cb) as Promise<JobOutcome<MonteCarloChunk>>, local.signal));
        done[i] = r.count;
        report();
        return out;
      }),
    ).catch((e) => {
      // one failed chunk fails the run: stop the others at once
      local.abort();
      throw e;
    });
    return unwrap(await pool.run((api) => api.summarizeMonteCarlo(sheet, o, chunks) as Promise<JobOutcome<MonteCarloResult>>, local.signal));
  } finally {
    c.signal?.removeEventListener('abort', stop);
  }
}

export async function worstCaseJob(pool: Pool, sheet: Sheet, o: WorstCaseOptions, c: JobControl = {}): Promise<WorstCaseResult> {
  return unwrap(await pool.run((api) => api.worstCase(sheet, o) as Promise<JobOutcome<WorstCaseResult>>, c.signal));
}

export async function theveninJob(pool: Pool, sheet: Sheet, net: string, c: JobControl = {}): Promise<TheveninResult> {
  return unwrap(await pool.run((api) => api.thevenin(sheet, net) as Promise<JobOutcome<TheveninResult>>, c.signal));
}
