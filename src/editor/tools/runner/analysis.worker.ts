// The analyses off the main thread. One pool worker runs one task at a time; a task is cancelled
// by terminating its worker (the analyses are synchronous loops that cannot read a message while
// they run), so nothing here needs to watch for a stop request.
import { expose } from 'comlink';
import type { Sheet } from '../../../../shared/sheet';
import { prepareCircuit, CircuitFailureError, type PreparedCircuit } from '../../../../shared/analysis/evaluate';
import { runSweep, type SweepSpec, type SweepTable } from '../../../../shared/analysis/sweep';
import {
  runMonteCarloChunk,
  summarizeMonteCarlo,
  type MonteCarloChunk,
  type MonteCarloOptions,
  type MonteCarloResult,
} from '../../../../shared/analysis/monte-carlo';
import { runWorstCase, type WorstCaseOptions, type WorstCaseResult } from '../../../../shared/analysis/worst-case';
import { theveninAt, type TheveninResult } from '../../../../shared/analysis/thevenin';
import type { JobOutcome, ProgressFn } from './jobTypes';

// Compiling is cheap but not free; chunks of one Monte Carlo run reuse the circuit (and its warm start).
let cached: { key: string; circuit: PreparedCircuit } | null = null;
function prepared(sheet: Sheet): PreparedCircuit {
  const key = JSON.stringify(sheet);
  if (cached?.key !== key) cached = { key, circuit: prepareCircuit(sheet) };
  return cached.circuit;
}

function outcome<T>(run: () => T): JobOutcome<T> {
  try {
    return { ok: true, value: run() };
  } catch (e) {
    if (e instanceof CircuitFailureError)
      return { ok: false, message: e.failure.error.message, parts: e.failure.error.parts, nets: e.failure.error.nets };
    return { ok: false, message: e instanceof Error ? e.message : String(e) };
  }
}

const progress = (fn?: ProgressFn) => (fn ? { onProgress: (done: number, total: number) => void fn(done, total), checkEvery: 16 } : undefined);

const api = {
  sweep(sheet: Sheet, spec: SweepSpec, onProgress?: ProgressFn): JobOutcome<SweepTable> {
    return outcome(() => runSweep(prepared(sheet), spec, progress(onProgress)));
  },
  monteCarloChunk(sheet: Sheet, o: MonteCarloOptions, start: number, count: number, onProgress?: ProgressFn): JobOutcome<MonteCarloChunk> {
    return outcome(() => runMonteCarloChunk(prepared(sheet), o, start, count, progress(onProgress)));
  },
  summarizeMonteCarlo(sheet: Sheet, o: MonteCarloOptions, chunks: MonteCarloChunk[]): JobOutcome<MonteCarloResult> {
    return outcome(() => summarizeMonteCarlo(prepared(sheet), o, chunks));
  },
  worstCase(sheet: Sheet, o: WorstCaseOptions): JobOutcome<WorstCaseResult> {
    return outcome(() => runWorstCase(prepared(sheet), o));
  },
  thevenin(sheet: Sheet, net: string): JobOutcome<TheveninResult> {
    return outcome(() => theveninAt(sheet, net));
  },
};

export type AnalysisWorkerApi = typeof api;

expose(api);
