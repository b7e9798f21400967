// The engine, off the main thread: the canvas stays responsive however long a solve takes.
import { expose } from 'comlink';
import { solveOperatingPoint } from '../../../shared/engine';
import type { Sheet } from '../../../shared/sheet';
import type { SolveResult } from './resultTypes';

const api = {
  /** DC operating point of `sheet` (the contract's result shape). */
  solve(sheet: Sheet): SolveResult {
    return solveOperatingPoint(sheet);
  },
};

export type SolverWorkerApi = typeof api;

expose(api);
