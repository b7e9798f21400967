// The one place the analyses call the engine: compile a sheet once, then solve points warm-started
// from the previous converged point and read the chosen outputs through the engine's lean path
// (solveRaw + accessors: no result object is built per point).
import { compileCircuit, type CircuitSolveOptions, type CompiledCircuit, type SolveOptions } from '../engine/compile';
import { failure, type SolveFailure, type SolveResult, type SolveSuccess } from '../engine/result';
import type { NetList } from '../sheet/nets';
import type { Sheet } from '../sheet/schema';
import { checkOutputs, outputKey, type OutputSpec } from './outputs';
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

/** Read an output from the circuit's last successful solve (solve or solveRaw). */
export function readLast(p: PreparedCircuit, o: OutputSpec): number {
  const c = p.compiled;
  return o.kind === 'net' ? c.netVoltage(o.net) : o.kind === 'current' ? c.pinCurrent(o.part, o.pin) : c.partPower(o.part);
}

/** Solve and read outputs into `out`; returns null on success or the failure (out is NaN then). */
export function evaluateOutputs(p: PreparedCircuit, opts: CircuitSolveOptions, outputs: readonly OutputSpec[], out: Float64Array, warm = true): SolveFailure | null {
  const r = p.compiled.solveRaw(warm ? { ...opts, initialGuess: 'previous' } : opts);
  if (!r.ok) {
    out.fill(NaN);
    return r;
  }
  for (let k = 0; k < outputs.length; k++) {
    const v = readLast(p, outputs[k]);
    if (!Number.isFinite(v)) {
      out.fill(NaN);
      return failure({ code: 'non_finite', message: `The solve gave a value that is not a finite number for ${outputKey(outputs[k])}. Check for extreme parameter values.`, parts: [], nets: [] });
    }
    out[k] = v;
  }
  return null;
}

/** Solve and return the full success, or throw CircuitFailureError (for nominal solves). */
export function solveOrThrow(p: PreparedCircuit, opts: CircuitSolveOptions = {}, warm = true): SolveSuccess {
  const r = solvePoint(p, opts, warm);
  if (!r.ok) throw new CircuitFailureError(r);
  return r;
}
