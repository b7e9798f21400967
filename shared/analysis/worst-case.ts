// Worst case over tolerances and supply ranges: sensitivity-based worst-case analysis with corner
// (vertex) verification, the extreme-value approach described by R. Spence and R. S. Soin,
// "Tolerance Design of Electronic Circuits", Addison-Wesley 1988 (from memory). First-order
// sensitivities predict which end of its range each variable must sit at for an output's maximum
// (and minimum); the predicted corner is then solved exactly, and the vertex check either tries
// every corner (few variables) or improves the predicted corner by single flips until none helps.
// Assumption, as in that literature: each output is monotone in each variable over its range, so
// the extremes lie on vertices of the tolerance box.
import type { CircuitSolveOptions } from '../engine/compile';
import { evaluateOutputs, assertOutputs, prepareCircuit, type PreparedCircuit } from './evaluate';
import { outputKey, outputUnit, type OutputSpec } from './outputs';
import { sensitivities } from './sensitivity';
import { isPrepared } from './sweep';
import { solveOptionsFor } from './targets';
import { toleranceVariables, type ToleranceOptions, type ToleranceVariable } from './tolerance-space';
import { cachedEvaluator, searchCorners } from './corner-search';
import { firstOrderPicture, type Contribution, type Sides } from './worst-case-first-order';

export type { Contribution } from './worst-case-first-order';

export interface WorstCaseOptions extends ToleranceOptions {
  outputs: readonly OutputSpec[];
  /** try all 2^m corners when there are at most this many variables (default 10) */
  maxExhaustiveVariables?: number;
  /** fixed overrides for every solve */
  base?: CircuitSolveOptions;
}

export interface Extreme {
  /** verified value at the worst corner found */
  value: number;
  /** first-order estimate: nominal + Σ contributions */
  linearEstimate: number;
  /** variable key → its value at that corner */
  corner: Record<string, number>;
  /** variable key → which end */
  sides: Record<string, 'low' | 'high' | 'nominal'>;
  /** the variables that drive this extreme, largest first (sign: their shift of the output) */
  drivers: Array<{ key: string; shift: number; share: number; side: 'low' | 'high' }>;
}

export interface WorstCaseOutput {
  key: string;
  unit: string;
  nominal: number;
  min: Extreme;
  max: Extreme;
  contributions: Contribution[];
}

export interface WorstCaseResult {
  variables: ToleranceVariable[];
  outputs: WorstCaseOutput[];
  method: 'all-corners' | 'sensitivity-corner+vertex-search';
  solves: number;
  /** corners where the circuit did not solve (a real finding: it fails there) */
  failedCorners: Array<{ corner: Record<string, number>; message: string }>;
}

/** @throws AnalysisInputError, CircuitFailureError */
export function runWorstCase(circuit: PreparedCircuit | unknown, o: WorstCaseOptions): WorstCaseResult {
  const p = isPrepared(circuit) ? circuit : prepareCircuit(circuit);
  assertOutputs(p, o.outputs);
  const vars = toleranceVariables(p.sheet, o);
  const m = vars.length;
  const nOut = o.outputs.length;
  const base = o.base ?? {};
  const sens = sensitivities(p, vars, o.outputs, base);
  let solves = sens.solves;
  const failedCorners: WorstCaseResult['failedCorners'] = [];
  const targets = vars.map((v) => v.target);
  const x = new Float64Array(m);
  const y = new Float64Array(nOut);
  const cornerValues = (sides: Sides) => {
    for (let k = 0; k < m; k++) x[k] = sides[k] > 0 ? vars[k].high : sides[k] < 0 ? vars[k].low : vars[k].nominal;
    return x;
  };
  const evalCorner = cachedEvaluator((sides) => {
    const f = evaluateOutputs(p, solveOptionsFor(targets, cornerValues(sides), base), o.outputs, y);
    solves++;
    if (f) failedCorners.push({ corner: Object.fromEntries(vars.map((v, k) => [v.key, x[k]])), message: f.error.message });
    return f ? null : y.slice();
  });
  const { contributions: contrib, predicted } = firstOrderPicture(vars, sens, nOut);
  const exhaustive = m <= (o.maxExhaustiveVariables ?? 10);
  const best = searchCorners({ variables: m, outputs: nOut, exhaustive, evaluate: evalCorner, predicted, shares: contrib.map((l) => l.map((c) => c.share)) });

  const outputs: WorstCaseOutput[] = o.outputs.map((spec, oi) => {
    const list = contrib[oi];
    const mk = (dir: 'max' | 'min'): Extreme => {
      const b = best[oi][dir];
      const sides = b.s ?? new Int8Array(m);
      const corner: Record<string, number> = {};
      const sideNames: Record<string, 'low' | 'high' | 'nominal'> = {};
      vars.forEach((v, k) => {
        corner[v.key] = sides[k] > 0 ? v.high : sides[k] < 0 ? v.low : v.nominal;
        sideNames[v.key] = sides[k] > 0 ? 'high' : sides[k] < 0 ? 'low' : 'nominal';
      });
      const drivers = vars
        .map((v, k) => {
          const shift = sides[k] === 0 ? 0 : list[k].sensitivity * (corner[v.key] - v.nominal);
          return { key: v.key, shift, share: list[k].share, side: (sides[k] > 0 ? 'high' : 'low') as 'low' | 'high' };
        })
        .filter((d) => d.shift !== 0)
        .sort((a, b) => Math.abs(b.shift) - Math.abs(a.shift));
      const est = sens.nominal[oi] + list.reduce((a, c) => a + (dir === 'max' ? c.towardMax : c.towardMin), 0);
      return { value: b.s ? b.v : NaN, linearEstimate: est, corner, sides: sideNames, drivers };
    };
    return { key: outputKey(spec), unit: outputUnit(spec), nominal: sens.nominal[oi], min: mk('min'), max: mk('max'), contributions: [...list].sort((a, b) => b.share - a.share) };
  });
  return { variables: vars, outputs, method: exhaustive ? 'all-corners' : 'sensitivity-corner+vertex-search', solves, failedCorners };
}
