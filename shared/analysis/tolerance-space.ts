// The box a tolerance analysis explores: every param with a tolerance (resistance ± fraction) or a
// declared range (a supply's min/max), read from the part catalogue's metadata, plus ranges the
// user adds (a temperature range, a load current range, …).
import { partSpecs } from '../parts/specs';
import type { Sheet } from '../sheet/schema';
import { AnalysisInputError, resolveTarget, targetKey, type ParamTarget } from './targets';

export interface ToleranceVariable {
  target: ParamTarget;
  /** "R1.resistance", "V1.voltage", "conditions.temperatureC" */
  key: string;
  unit: string;
  nominal: number;
  low: number;
  high: number;
  origin: 'tolerance' | 'range' | 'user';
}

export interface ToleranceOptions {
  /** vary only these parts (default: every part with a tolerance or a declared range) */
  parts?: readonly string[];
  /** leave these parts at nominal */
  exclude?: readonly string[];
  /** include supplies' min/max ranges (default true) */
  supplyRange?: boolean;
  /** replace a part's tolerance fraction for this run, e.g. { R1: 0.01 } */
  toleranceOverride?: Readonly<Record<string, number>>;
  /** more ranges: conditions or any numeric param */
  extra?: ReadonlyArray<{ target: ParamTarget; low: number; high: number }>;
}

/** The variables of a tolerance run, in sheet order then `extra` order. @throws AnalysisInputError */
export function toleranceVariables(sheet: Sheet, o: ToleranceOptions = {}): ToleranceVariable[] {
  const out: ToleranceVariable[] = [];
  const only = o.parts ? new Set(o.parts) : null;
  const skip = new Set(o.exclude ?? []);
  for (const id of [...(o.parts ?? []), ...(o.exclude ?? []), ...Object.keys(o.toleranceOverride ?? {})])
    if (!sheet.parts.some((p) => p.id === id)) throw new AnalysisInputError(`Tolerance options name a part "${id}" that is not on the sheet.`);
  for (const part of sheet.parts) {
    if ((only && !only.has(part.id)) || skip.has(part.id)) continue;
    const params = part.params as Record<string, unknown>;
    for (const info of partSpecs[part.type].params) {
      const tol = info.tolerance;
      const nominal = params[info.name];
      if (!tol || typeof nominal !== 'number') continue;
      const target: ParamTarget = { kind: 'param', part: part.id, param: info.name };
      if (tol.kind === 'fraction') {
        const t = o.toleranceOverride?.[part.id] ?? params[tol.param];
        if (typeof t !== 'number' || !(t >= 0 && t < 1)) throw new AnalysisInputError(`Part "${part.id}": tolerance ${t} must be a fraction from 0 to below 1 (0.05 = ±5 %).`);
        if (t === 0) continue;
        const a = nominal * (1 - t);
        const b = nominal * (1 + t);
        out.push({ target, key: targetKey(target), unit: info.unit, nominal, low: Math.min(a, b), high: Math.max(a, b), origin: 'tolerance' });
      } else if (o.supplyRange !== false) {
        const lo = params[tol.minParam];
        const hi = params[tol.maxParam];
        const low = typeof lo === 'number' ? lo : nominal;
        const high = typeof hi === 'number' ? hi : nominal;
        if (low === high) continue;
        if (!(low <= nominal && nominal <= high))
          throw new AnalysisInputError(`Part "${part.id}": ${info.name} ${nominal} is outside its range ${tol.minParam} ${low} … ${tol.maxParam} ${high}; fix the range or the value.`);
        out.push({ target, key: targetKey(target), unit: info.unit, nominal, low, high, origin: 'range' });
      }
    }
  }
  for (const e of o.extra ?? []) {
    const r = resolveTarget(sheet, e.target);
    if (!(Number.isFinite(e.low) && Number.isFinite(e.high) && e.low <= e.high))
      throw new AnalysisInputError(`Range for ${r.key} must have low ≤ high (got ${e.low} … ${e.high}).`);
    const existing = out.findIndex((v) => v.key === r.key);
    const nominal = Math.min(Math.max(r.nominal, e.low), e.high);
    const v: ToleranceVariable = { target: e.target, key: r.key, unit: r.unit, nominal, low: e.low, high: e.high, origin: 'user' };
    if (existing >= 0) out[existing] = v;
    else out.push(v);
  }
  return out;
}
