// The engine, off the main thread: the canvas stays responsive however long a solve takes. Edits
// that change only values reuse the compiled circuit (incrementalSolve.ts).
import { expose } from 'comlink';
import { compileCircuit, solveOperatingPoint } from '../../../shared/engine';
import type { Sheet } from '../../../shared/sheet';
import { createIncrementalSolver } from './incrementalSolve';
import type { SolveResult } from './resultTypes';

const solver = createIncrementalSolver({ compileCircuit, solveOperatingPoint });

const api = {
  /** DC operating point of `sheet` (the contract's result shape) and the solve's own time, ms. */
  solve(sheet: Sheet): { result: SolveResult; ms: number } {
    const started = performance.now();
    const result = solver.solve(sheet);
    return { result, ms: performance.now() - started };
  },
};

export type SolverWorkerApi = typeof api;

expose(api);
