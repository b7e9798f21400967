// What an analysis varies: a numeric param of a part, or a sheet condition. Resolved against the
// sheet once (nominal value, unit, supply range) and turned into the engine's per-solve overrides.
import type { CircuitSolveOptions } from '../engine/compile';
import { partSpecs } from '../parts/specs';
import type { ParamInfo } from '../parts/types';
import type { Sheet } from '../sheet/schema';

export type ParamTarget =
  | { kind: 'param'; part: string; param: string }
  | { kind: 'condition'; condition: 'temperatureC' | 'illuminanceLux' };

export interface ResolvedTarget {
  target: ParamTarget;
  /** "RV1.position", "conditions.temperatureC" */
  key: string;
  unit: string;
  nominal: number;
  /** a declared range when the sheet has one (a supply's min/max) */
  range?: { min: number; max: number };
  /** the param's validity rule, to reject sweep values before solving */
  info?: ParamInfo;
}

export class AnalysisInputError extends Error {
  constructor(message: string) {
    super(message);
    this.name = 'AnalysisInputError';
  }
}

export function targetKey(t: ParamTarget): string {
  return t.kind === 'param' ? `${t.part}.${t.param}` : `conditions.${t.condition}`;
}

/** "RV1.position" or "temperature"/"temperatureC"/"illuminance"/"illuminanceLux" → ParamTarget. */
export function parseTargetKey(text: string): ParamTarget | null {
  const t = text.trim().replace(/^conditions\./, '');
  if (t === 'temperature' || t === 'temperatureC') return { kind: 'condition', condition: 'temperatureC' };
  if (t === 'illuminance' || t === 'illuminanceLux') return { kind: 'condition', condition: 'illuminanceLux' };
  const m = /^([^.\s]+)\.([^.\s]+)$/.exec(t);
  return m ? { kind: 'param', part: m[1], param: m[2] } : null;
}

/** Check the target exists and is a number; give its nominal value. @throws AnalysisInputError */
export function resolveTarget(sheet: Sheet, t: ParamTarget): ResolvedTarget {
  if (t.kind === 'condition') {
    const nominal = sheet.conditions[t.condition];
    return { target: t, key: targetKey(t), unit: t.condition === 'temperatureC' ? '°C' : 'lx', nominal };
  }
  const part = sheet.parts.find((p) => p.id === t.part);
  if (!part) throw new AnalysisInputError(`There is no part "${t.part}" to vary. Parts: ${sheet.parts.map((p) => p.id).join(', ')}.`);
  const spec = partSpecs[part.type];
  const info = spec.params.find((p) => p.name === t.param);
  const numeric = spec.params.filter((p) => p.kind === 'number').map((p) => p.name);
  if (!info || info.kind !== 'number')
    throw new AnalysisInputError(`Part "${t.part}" (${part.type}) has no numeric param "${t.param}" to vary; try one of ${numeric.join(', ')}.`);
  const params = part.params as Record<string, unknown>;
  let nominal = params[t.param];
  if (typeof nominal !== 'number' && t.param === 'temperatureC') nominal = sheet.conditions.temperatureC;
  if (typeof nominal !== 'number')
    throw new AnalysisInputError(`Part "${t.part}" has no value for "${t.param}" on the sheet (it is optional with no default); give it one first.`);
  const out: ResolvedTarget = { target: t, key: targetKey(t), unit: info.unit, nominal, info };
  if (info.tolerance?.kind === 'range') {
    const lo = params[info.tolerance.minParam];
    const hi = params[info.tolerance.maxParam];
    if (typeof lo === 'number' || typeof hi === 'number') out.range = { min: typeof lo === 'number' ? lo : nominal, max: typeof hi === 'number' ? hi : nominal };
  }
  return out;
}

/**
 * Per-solve options that set each target to its value (merged on top of `base`, e.g. fixed
 * overrides from the command line).
 */
export function solveOptionsFor(targets: readonly ParamTarget[], values: ArrayLike<number>, base: CircuitSolveOptions = {}): CircuitSolveOptions {
  const paramOverrides: Record<string, Record<string, number | boolean>> = {};
  for (const [id, ov] of Object.entries(base.paramOverrides ?? {})) paramOverrides[id] = { ...ov };
  const conditions = { ...(base.conditions ?? {}) };
  targets.forEach((t, i) => {
    if (t.kind === 'condition') conditions[t.condition] = values[i];
    else (paramOverrides[t.part] ??= {})[t.param] = values[i];
  });
  const out: CircuitSolveOptions = { ...base };
  if (Object.keys(paramOverrides).length) out.paramOverrides = paramOverrides;
  if (Object.keys(conditions).length) out.conditions = conditions;
  return out;
}
