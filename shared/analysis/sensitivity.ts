// First-order sensitivities ∂output/∂variable at the nominal point by central differences, each
// solve warm-started from the nominal solution. The step is a small fraction of the variable's
// range, so the truncation error (∝ h²) is far below the tolerance effects being estimated.
import type { CircuitSolveOptions } from '../engine/compile';
import { CircuitFailureError, evaluateOutputs, type PreparedCircuit } from './evaluate';
import type { OutputSpec } from './outputs';
import { solveOptionsFor } from './targets';
import type { ToleranceVariable } from './tolerance-space';

export interface Sensitivities {
  /** nominal value of each output */
  nominal: Float64Array;
  /** s[k][o] = ∂output o / ∂variable k (output unit per variable unit) */
  s: Float64Array[];
  solves: number;
  /** variables whose perturbed solve failed (their sensitivities are NaN) */
  failed: Array<{ key: string; message: string }>;
}

/** @param relStep step as a fraction of the variable's half-range (default 1e-3) */
export function sensitivities(
  p: PreparedCircuit,
  vars: readonly ToleranceVariable[],
  outputs: readonly OutputSpec[],
  base: CircuitSolveOptions = {},
  relStep = 1e-3,
): Sensitivities {
  const targets = vars.map((v) => v.target);
  const x = Float64Array.from(vars.map((v) => v.nominal));
  const nominal = new Float64Array(outputs.length);
  const f0 = evaluateOutputs(p, solveOptionsFor(targets, x, base), outputs, nominal, false);
  if (f0) throw new CircuitFailureError(f0);
  const yp = new Float64Array(outputs.length);
  const ym = new Float64Array(outputs.length);
  const s: Float64Array[] = [];
  const failed: Sensitivities['failed'] = [];
  let solves = 1;
  for (let k = 0; k < vars.length; k++) {
    const v = vars[k];
    const h = relStep * 0.5 * (v.high - v.low);
    const xp = Math.min(v.high, v.nominal + h);
    const xm = Math.max(v.low, v.nominal - h);
    x[k] = xp;
    const fp = evaluateOutputs(p, solveOptionsFor(targets, x, base), outputs, yp);
    x[k] = xm;
    const fm = evaluateOutputs(p, solveOptionsFor(targets, x, base), outputs, ym);
    x[k] = v.nominal;
    solves += 2;
    const row = new Float64Array(outputs.length);
    if (fp || fm) failed.push({ key: v.key, message: (fp ?? fm)!.error.message });
    for (let o = 0; o < outputs.length; o++) row[o] = fp || fm ? NaN : (yp[o] - ym[o]) / (xp - xm);
    s.push(row);
  }
  return { nominal, s, solves, failed };
}
