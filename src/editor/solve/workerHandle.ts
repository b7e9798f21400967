// Starts the solver worker and wraps it with comlink.
import { wrap, releaseProxy } from 'comlink';
import type { SolverHandle } from './latestWins';
import type { SolverWorkerApi } from './solver.worker';

/** A fresh solver worker; dispose() terminates it (the scheduler does so when a solve stalls). */
export function startSolverWorker(): SolverHandle {
  const worker = new Worker(new URL('./solver.worker.ts', import.meta.url), { type: 'module', name: 'tapline-solver' });
  const remote = wrap<SolverWorkerApi>(worker);
  return {
    port: {
      solve: (sheet) => remote.solve(sheet).then((r) => r.result),
      solveTimed: (sheet) => remote.solve(sheet),
    },
    dispose: () => {
      remote[releaseProxy]();
      worker.terminate();
    },
  };
}
