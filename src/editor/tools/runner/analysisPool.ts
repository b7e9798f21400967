// The app's one analysis pool: comlink-wrapped module workers, started on first use.
import { proxy, releaseProxy, wrap, type Remote } from 'comlink';
import type { AnalysisWorkerApi } from './analysis.worker';
import { WorkerPool, type PoolMember } from './workerPool';
import type { ProgressFn } from './jobTypes';

export type AnalysisApi = Remote<AnalysisWorkerApi>;

function spawnAnalysisWorker(): PoolMember<AnalysisApi> {
  const worker = new Worker(new URL('./analysis.worker.ts', import.meta.url), { type: 'module', name: 'tapline-analysis' });
  const api = wrap<AnalysisWorkerApi>(worker);
  return {
    api,
    terminate() {
      api[releaseProxy]();
      worker.terminate();
    },
  };
}

let pool: WorkerPool<AnalysisApi> | null = null;

/** The shared pool (sized to navigator.hardwareConcurrency). */
export function analysisPool(): WorkerPool<AnalysisApi> {
  pool ??= new WorkerPool(spawnAnalysisWorker);
  return pool;
}

/** A progress callback the worker can call back through. */
export function progressProxy(fn: ProgressFn | undefined): ProgressFn | undefined {
  return fn ? proxy(fn) : undefined;
}
