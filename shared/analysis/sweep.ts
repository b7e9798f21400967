// Parameter sweeps: one parameter, or two nested (the first is the outer loop). Every point is
// warm-started from the previous converged one; a two-parameter sweep walks the inner axis back
// and forth (serpentine) so consecutive points are neighbours, while the table stays in
// row-major order (outer index × inner count + inner index).
import type { CircuitSolveOptions } from '../engine/compile';
import { partSpecs } from '../parts/specs';
import { controller, type RunControl } from './control';
import { prepareCircuit, type PreparedCircuit } from './evaluate';
import { stepValues, type StepSpec } from './steps';
import { AnalysisInputError, resolveTarget, solveOptionsFor, type ParamTarget } from './targets';

export interface SweepAxis {
  target: ParamTarget;
  /** explicit steps, or `overRange`: from the target's declared range (a supply's min to max) */
  steps: StepSpec | { overRange: true; points: number; scale?: 'linear' | 'log' };
}

export interface SweepSpec {
  /** one axis, or [outer, inner] */
  axes: readonly [SweepAxis] | readonly [SweepAxis, SweepAxis];
  /** fixed overrides applied at every point (e.g. from --set) */
  base?: CircuitSolveOptions;
}

export interface SweepPointError {
  point: number;
  /** the axis values at the failed point */
  at: number[];
  code: string;
  message: string;
}

/** Columnar sweep result; NaN where a point failed. */
export interface SweepTable {
  axes: Array<{ key: string; unit: string; values: number[] }>;
  points: number;
  /** the value of each axis at each point (one column per axis) */
  axisColumns: Float64Array[];
  /** "V(net)", "I(part.pin)", "P(part)" → one value per point */
  columns: Record<string, Float64Array>;
  units: Record<string, string>;
  ok: Uint8Array;
  iterations: Int32Array;
  errors: SweepPointError[];
  /** points solved before a stop request (= points when not stopped) */
  completed: number;
  stopped: boolean;
}

type Reader = () => number;

/**
 * One column per net voltage, pin current and part power (the keys of a full result), read from
 * the engine's last solve. Built from the compiled circuit, so a sheet whose nominal point does
 * not solve can still be swept.
 */
function columnsFor(p: PreparedCircuit, points: number): { names: string[]; units: string[]; readers: Reader[]; data: Float64Array[] } {
  const names: string[] = [];
  const units: string[] = [];
  const readers: Reader[] = [];
  const c = p.compiled;
  const guard = (f: () => number): Reader => () => {
    try {
      return f();
    } catch {
      return NaN;
    }
  };
  for (const net of c.netNames) {
    names.push(`V(${net})`);
    units.push('V');
    readers.push(guard(() => c.netVoltage(net)));
  }
  for (const part of p.sheet.parts) {
    const id = part.id;
    for (const pin of partSpecs[part.type].pins) {
      names.push(`I(${id}.${pin.name})`);
      units.push('A');
      readers.push(guard(() => c.pinCurrent(id, pin.name)));
    }
    names.push(`P(${id})`);
    units.push('W');
    readers.push(guard(() => c.partPower(id)));
  }
  return { names, units, readers, data: names.map(() => new Float64Array(points).fill(NaN)) };
}

/**
 * Run a sweep on a prepared circuit (or a sheet). Synchronous; cancellable through `control`.
 * @throws AnalysisInputError for a bad axis, CircuitFailureError for a sheet that cannot be compiled
 */
export function runSweep(circuit: PreparedCircuit | unknown, spec: SweepSpec, control?: RunControl): SweepTable {
  const p = isPrepared(circuit) ? circuit : prepareCircuit(circuit);
  if (spec.axes.length < 1 || spec.axes.length > 2) throw new AnalysisInputError('A sweep has one or two axes.');
  const resolved = spec.axes.map((a) => resolveTarget(p.sheet, a.target));
  if (resolved.length === 2 && resolved[0].key === resolved[1].key) throw new AnalysisInputError(`Both sweep axes vary ${resolved[0].key}; choose two different parameters.`);
  const axisValues = spec.axes.map((a, i) => {
    const r = resolved[i];
    if (!('overRange' in a.steps)) return stepValues(a.steps, `sweep of ${r.key}`);
    if (!r.range) throw new AnalysisInputError(`${r.key} has no declared range to sweep over; give it min and max on the sheet, or sweep from one value to another.`);
    return stepValues({ from: r.range.min, to: r.range.max, points: a.steps.points, scale: a.steps.scale }, `sweep of ${r.key}`);
  });
  const outer = axisValues[0];
  const inner = axisValues[1] ?? Float64Array.of(NaN);
  const nOuter = outer.length;
  const nInner = axisValues.length === 2 ? inner.length : 1;
  const points = nOuter * nInner;
  const targets = spec.axes.map((a) => a.target);

  const cols = columnsFor(p, points);
  const axisColumns = axisValues.map(() => new Float64Array(points));
  const ok = new Uint8Array(points);
  const iterations = new Int32Array(points);
  const errors: SweepPointError[] = [];
  const ctl = controller(control, points);
  const vals = new Float64Array(targets.length);
  let done = 0;
  let stopped = false;
  outerLoop: for (let i = 0; i < nOuter; i++) {
    for (let jj = 0; jj < nInner; jj++) {
      const j = i % 2 === 0 ? jj : nInner - 1 - jj;
      const point = i * nInner + j;
      vals[0] = outer[i];
      if (nInner > 1 || axisValues.length === 2) vals[1] = inner[j];
      for (let a = 0; a < targets.length; a++) axisColumns[a][point] = vals[a];
      const r = p.compiled.solveRaw({ ...solveOptionsFor(targets, vals, spec.base), initialGuess: 'previous' });
      if (r.ok) {
        ok[point] = 1;
        iterations[point] = r.iterations;
        for (let c = 0; c < cols.readers.length; c++) cols.data[c][point] = cols.readers[c]();
      } else errors.push({ point, at: Array.from(vals), code: r.error.code, message: r.error.message });
      done++;
      if (ctl.tick(done)) {
        stopped = true;
        break outerLoop;
      }
    }
  }
  const columns: Record<string, Float64Array> = {};
  const units: Record<string, string> = {};
  cols.names.forEach((n, k) => {
    columns[n] = cols.data[k];
    units[n] = cols.units[k];
  });
  errors.sort((a, b) => a.point - b.point);
  return {
    axes: resolved.map((r, i) => ({ key: r.key, unit: r.unit, values: Array.from(axisValues[i]) })),
    points,
    axisColumns,
    columns,
    units,
    ok,
    iterations,
    errors,
    completed: done,
    stopped,
  };
}

export function isPrepared(x: unknown): x is PreparedCircuit {
  return typeof x === 'object' && x !== null && 'compiled' in x && 'nets' in x && 'sheet' in x;
}
