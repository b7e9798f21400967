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

export interface WorstCaseOptions extends ToleranceOptions {
  outputs: readonly OutputSpec[];
  /** try all 2^m corners when there are at most this many variables (default 10) */
  maxExhaustiveVariables?: number;
  /** fixed overrides for every solve */
  base?: CircuitSolveOptions;
}

export interface Contribution {
  key: string;
  /** the part whose param this is (absent for a sheet condition) */
  part?: string;
  unit: string;
  /** ∂output/∂variable at nominal (output unit per variable unit) */
  sensitivity: number;
  /** first-order shift of the output when the variable goes to the end that raises it most, ≥ 0 */
  towardMax: number;
  /** first-order shift toward the minimum, ≤ 0 */
  towardMin: number;
  /** |contribution| / Σ|contributions|, 0..1 */
  share: number;
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

type Sides = Int8Array; // -1 low, +1 high, 0 nominal

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
  const cache = new Map<string, Float64Array | null>();
  const evalCorner = (sides: Sides): Float64Array | null => {
    const key = sides.join(',');
    const hit = cache.get(key);
    if (hit !== undefined) return hit;
    const f = evaluateOutputs(p, solveOptionsFor(targets, cornerValues(sides), base), o.outputs, y);
    solves++;
    const val = f ? null : y.slice();
    if (f) failedCorners.push({ corner: Object.fromEntries(vars.map((v, k) => [v.key, x[k]])), message: f.error.message });
    cache.set(key, val);
    return val;
  };

  // first-order picture per output
  const contrib: Contribution[][] = [];
  const predicted: Array<{ max: Sides; min: Sides }> = [];
  for (let oi = 0; oi < nOut; oi++) {
    const list: Contribution[] = [];
    const maxS = new Int8Array(m);
    const minS = new Int8Array(m);
    for (let k = 0; k < m; k++) {
      const s = sens.s[k][oi];
      const up = s * (vars[k].high - vars[k].nominal);
      const down = s * (vars[k].low - vars[k].nominal);
      const part = vars[k].target.kind === 'param' ? (vars[k].target as { part: string }).part : undefined;
      list.push({ key: vars[k].key, ...(part ? { part } : {}), unit: vars[k].unit, sensitivity: s, towardMax: Math.max(up, down, 0), towardMin: Math.min(up, down, 0), share: 0 });
      maxS[k] = !Number.isFinite(s) || s === 0 ? 0 : up >= down ? 1 : -1;
      minS[k] = -maxS[k];
    }
    const total = list.reduce((a, c) => a + Math.max(c.towardMax, -c.towardMin), 0);
    for (const c of list) c.share = total > 0 ? Math.max(c.towardMax, -c.towardMin) / total : 0;
    contrib.push(list);
    predicted.push({ max: maxS, min: minS });
  }

  const best = Array.from({ length: nOut }, () => ({ max: { v: -Infinity, s: null as Sides | null }, min: { v: Infinity, s: null as Sides | null } }));
  const consider = (sides: Sides, vals: Float64Array | null) => {
    if (!vals) return;
    for (let oi = 0; oi < nOut; oi++) {
      if (vals[oi] > best[oi].max.v) best[oi].max = { v: vals[oi], s: sides.slice() };
      if (vals[oi] < best[oi].min.v) best[oi].min = { v: vals[oi], s: sides.slice() };
    }
  };
  const exhaustive = m <= (o.maxExhaustiveVariables ?? 10);
  if (exhaustive) {
    const sides = new Int8Array(m);
    for (let mask = 0; mask < 2 ** m; mask++) {
      for (let k = 0; k < m; k++) sides[k] = (mask >> k) & 1 ? 1 : -1;
      consider(sides, evalCorner(sides));
    }
  } else {
    for (let oi = 0; oi < nOut; oi++)
      for (const dir of ['max', 'min'] as const) {
        // start from the predicted corner; zero-sensitivity variables start at their low end
        let cur = Int8Array.from(predicted[oi][dir], (s) => (s === 0 ? -1 : s));
        let curV = evalCorner(cur);
        consider(cur, curV);
        const better = (a: number, b: number) => (dir === 'max' ? a > b : a < b);
        // flip the least certain variables first (smallest first-order contribution)
        const order = [...Array(m).keys()].sort((a, b) => contrib[oi][a].share - contrib[oi][b].share);
        for (let pass = 0; pass < 4 && curV; pass++) {
          let improved = false;
          for (const k of order) {
            const trial = cur.slice();
            trial[k] = -trial[k];
            const tv = evalCorner(trial);
            consider(trial, tv);
            if (tv && curV && better(tv[oi], curV[oi])) {
              cur = trial;
              curV = tv;
              improved = true;
            }
          }
          if (!improved) break;
        }
      }
  }

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
