// The analyses off the main thread (shared/analysis's worker entry points). One pool worker runs one task at a time; a task is cancelled
// by terminating its worker (the analyses are synchronous loops that cannot read a message while
// they run), so nothing here needs to watch for a stop request.
import { expose } from 'comlink';
import type { Sheet } from '../../../../shared/sheet';
import {
  CircuitFailureError,
  mergeMonteCarloJobs,
  runMonteCarloJob,
  runSweepJob,
  runWorstCaseJob,
  theveninAt,
  type MonteCarloChunk,
  type MonteCarloOptions,
  type MonteCarloResult,
  type SweepSpec,
  type SweepTable,
  type TheveninResult,
  type WorstCaseOptions,
  type WorstCaseResult,
} from '../../../../shared/analysis';
import type { JobOutcome, ProgressFn } from './jobTypes';

// shared/analysis/jobs.ts keeps the compiled circuit between calls with the same sheet, so the
// chunks of one Monte Carlo run compile once per worker.
function outcome<T>(run: () => T): JobOutcome<T> {
  try {
    return { ok: true, value: run() };
  } catch (e) {
    if (e instanceof CircuitFailureError)
      return { ok: false, message: e.failure.error.message, parts: e.failure.error.parts, nets: e.failure.error.nets };
    return { ok: false, message: e instanceof Error ? e.message : String(e) };
  }
}

/**
 * Progress back to the page at most every 100 ms (and at the end): every message costs the page a
 * render, and a fast run could otherwise send tens of thousands.
 */
function progress(fn?: ProgressFn) {
  if (!fn) return undefined;
  let last = 0;
  return {
    checkEvery: 64,
    onProgress: (done: number, total: number) => {
      const now = performance.now();
      if (done < total && now - last < 100) return;
      last = now;
      void fn(done, total);
    },
  };
}

const api = {
  sweep(sheet: Sheet, spec: SweepSpec, onProgress?: ProgressFn): JobOutcome<SweepTable> {
    return outcome(() => runSweepJob({ sheet, spec }, progress(onProgress)));
  },
  monteCarloChunk(sheet: Sheet, o: MonteCarloOptions, start: number, count: number, onProgress?: ProgressFn): JobOutcome<MonteCarloChunk> {
    return outcome(() => runMonteCarloJob({ sheet, options: o, start, count }, progress(onProgress)));
  },
  summarizeMonteCarlo(sheet: Sheet, o: MonteCarloOptions, chunks: MonteCarloChunk[]): JobOutcome<MonteCarloResult> {
    return outcome(() => mergeMonteCarloJobs(sheet, o, chunks));
  },
  worstCase(sheet: Sheet, o: WorstCaseOptions): JobOutcome<WorstCaseResult> {
    return outcome(() => runWorstCaseJob({ sheet, options: o }));
  },
  thevenin(sheet: Sheet, net: string): JobOutcome<TheveninResult> {
    return outcome(() => theveninAt(sheet, net));
  },
};

export type AnalysisWorkerApi = typeof api;

expose(api);
