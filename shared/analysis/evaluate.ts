// The one place the analyses call the engine: compile a sheet once, then solve points warm-started
// from the previous converged point and read the chosen outputs. When the engine grows a lean
// solve (docs/requests/analysis-needs.md §3) only this file changes.
import { compileCircuit, type CircuitSolveOptions, type CompiledCircuit, type SolveOptions } from '../engine/compile';
import type { SolveFailure, SolveResult, SolveSuccess } from '../engine/result';
import type { NetList } from '../sheet/nets';
import type { Sheet } from '../sheet/schema';
import { checkOutputs, readOutput, type OutputSpec } from './outputs';
import { AnalysisInputError } from './targets';

export interface PreparedCircuit {
  compiled: CompiledCircuit;
  sheet: Sheet;
  nets: NetList;
}

/** Thrown when the sheet itself cannot be solved at all; carries the engine's failure. */
export class CircuitFailureError extends Error {
  constructor(readonly failure: SolveFailure) {
    super(failure.error.message);
    this.name = 'CircuitFailureError';
  }
}

/**
 * Compile a sheet (object or parsed) for repeated solves. Analyses default to the sparse LU even
 * for small circuits: they solve one pattern hundreds of times, and a numeric refactorisation is
 * cheaper than a fresh dense factorisation (bench/linalg.bench.ts).
 * @throws CircuitFailureError for an invalid sheet
 */
export function prepareCircuit(sheet: Sheet | unknown, options: SolveOptions = {}): PreparedCircuit {
  const compiled = compileCircuit(sheet, { linearSolver: 'sparse', ...options });
  if (compiled.error || !compiled.sheet || !compiled.netList) throw new CircuitFailureError(compiled.error!);
  return { compiled, sheet: compiled.sheet, nets: compiled.netList };
}

/** Throw a readable error listing outputs that do not exist. */
export function assertOutputs(p: PreparedCircuit, outputs: readonly OutputSpec[]): void {
  const problems = checkOutputs(p.sheet, p.nets, outputs);
  if (problems.length) throw new AnalysisInputError(problems.join(' '));
}

/** Solve one point, warm-started from the circuit's previous converged solution. */
export function solvePoint(p: PreparedCircuit, opts: CircuitSolveOptions, warm = true): SolveResult {
  return p.compiled.solve(warm ? { ...opts, initialGuess: 'previous' } : opts);
}

/** Solve and read outputs into `out`; returns null on success or the failure. */
export function evaluateOutputs(p: PreparedCircuit, opts: CircuitSolveOptions, outputs: readonly OutputSpec[], out: Float64Array, warm = true): SolveFailure | null {
  const r = solvePoint(p, opts, warm);
  if (!r.ok) {
    out.fill(NaN);
    return r;
  }
  for (let k = 0; k < outputs.length; k++) out[k] = readOutput(r, outputs[k]);
  return null;
}

/** Solve and return the full success, or throw CircuitFailureError (for nominal solves). */
export function solveOrThrow(p: PreparedCircuit, opts: CircuitSolveOptions = {}, warm = true): SolveSuccess {
  const r = solvePoint(p, opts, warm);
  if (!r.ok) throw new CircuitFailureError(r);
  return r;
}
