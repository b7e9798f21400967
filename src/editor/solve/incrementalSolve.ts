// Successive solves of one sheet while it is being edited: compiling a sheet (net extraction,
// device instances, the linear system) costs more than solving it, and a slider pull or a typed
// value changes only numbers. So the sheet is compiled once per structure and each edit is solved
// as param and condition overrides on that compiled circuit. The overrides path is the one sweeps
// use; a solve that fails there for a reason other than convergence is repeated from scratch so
// that its error reads exactly as a plain solve's would.
import type { CompiledCircuit, ParamOverrides, SolveOptions } from '../../../shared/engine';
import type { Sheet } from '../../../shared/sheet';
import type { SolveResult } from './resultTypes';

/** The two engine entry points this needs (passed in so the engine can be loaded lazily). */
export interface EngineFunctions {
  compileCircuit(sheet: Sheet, options?: SolveOptions): CompiledCircuit;
  solveOperatingPoint(sheet: Sheet, options?: SolveOptions): SolveResult;
}

/** A part's params; a file may leave them out for parts without any (ground). */
const paramsOf = (p: Sheet['parts'][number]) => (p.params ?? {}) as Record<string, unknown>;

/**
 * Everything about the sheet except the values of numeric params and of the two numeric
 * conditions: two sheets with the same key differ only in numbers an override can carry.
 */
export function structureKey(sheet: Sheet): string {
  const { temperatureC, illuminanceLux, ...otherConditions } = sheet.conditions as Record<string, unknown>;
  const shape = (v: unknown) => (typeof v === 'number' ? 0 : v);
  return JSON.stringify({
    c: [shape(temperatureC), shape(illuminanceLux), otherConditions],
    p: sheet.parts.map((p) => [p.id, p.type, Object.entries(paramsOf(p)).map(([k, v]) => [k, shape(v)])]),
    w: sheet.wires.map((w) => [w.from, w.to]),
  });
}

/** Numeric params of `next` that differ from `base` (same structure assumed). */
function paramDiff(base: Sheet, next: Sheet): ParamOverrides {
  const out: ParamOverrides = {};
  next.parts.forEach((part, i) => {
    const was = paramsOf(base.parts[i]);
    if (part.params === base.parts[i].params) return;
    for (const [k, v] of Object.entries(paramsOf(part)))
      if (typeof v === 'number' && v !== was[k]) (out[part.id] ??= {})[k] = v;
  });
  return out;
}

export interface IncrementalSolver {
  /** Operating point of `sheet`; the same result a fresh `solveOperatingPoint(sheet, options)` gives. */
  solve(sheet: Sheet): SolveResult;
  /** whether the last solve had to compile the sheet (a new structure) rather than reuse it */
  readonly compiled: boolean;
}

/** A solver that keeps the last compiled circuit and reuses it while only numbers change. */
export function createIncrementalSolver(engine: EngineFunctions, options: SolveOptions = {}): IncrementalSolver {
  let cached: { key: string; base: Sheet; circuit: CompiledCircuit } | null = null;
  let compiled = false;
  const fresh = (sheet: Sheet) => engine.solveOperatingPoint(sheet, options);
  const solve = (sheet: Sheet): SolveResult => {
    const key = structureKey(sheet);
    compiled = cached?.key !== key;
    if (!cached || compiled) {
      const circuit = engine.compileCircuit(sheet, options);
      // a sheet that does not compile has nothing to reuse; its error comes from a plain solve
      if (circuit.error) {
        cached = null;
        return fresh(sheet);
      }
      cached = { key, base: sheet, circuit };
      return circuit.solve(); // exactly what solveOperatingPoint does
    }
    const { base, circuit } = cached;
    const conditions: { temperatureC?: number; illuminanceLux?: number } = {};
    if (sheet.conditions.temperatureC !== base.conditions.temperatureC) conditions.temperatureC = sheet.conditions.temperatureC;
    if (sheet.conditions.illuminanceLux !== base.conditions.illuminanceLux) conditions.illuminanceLux = sheet.conditions.illuminanceLux;
    const r = circuit.solve({ paramOverrides: paramDiff(base, sheet), conditions });
    // a circuit that does not converge fails the same way either path; other failures (a
    // value out of range, say) are worded for overrides here, so take the plain solve's words
    return r.ok || r.error.code === 'no_convergence' ? r : fresh(sheet);
  };
  return {
    solve,
    get compiled() {
      return compiled;
    },
  };
}
