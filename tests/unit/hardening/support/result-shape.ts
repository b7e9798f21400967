// What every solve must return, whatever it was given (docs/engine.md, "Diagnostics" and
// "Results"): a success whose every number is finite, or a failure with a known code, a message a
// user can read, and the parts and nets concerned — never an exception.
import type { SolveResult } from '../../../../shared/engine';

export const ERROR_CODES = [
  'invalid_sheet',
  'invalid_parameter',
  'no_ground',
  'floating_net',
  'voltage_source_loop',
  'current_source_no_path',
  'singular_matrix',
  'no_convergence',
  'non_finite',
] as const;

/** Upper bound on Newton iterations in one solve with default options (docs/engine.md, "Bounded"). */
export const MAX_TOTAL_ITERATIONS = 3000;

const isStringArray = (v: unknown) => Array.isArray(v) && v.every((s) => typeof s === 'string');

/** Problems with the shape of a result (empty when it is well formed). */
export function resultProblems(r: unknown): string[] {
  const out: string[] = [];
  if (typeof r !== 'object' || r === null) return ['the result is not an object'];
  const res = r as SolveResult;
  if (res.analysis !== 'operating-point') out.push(`analysis is ${String(res.analysis)}`);
  if (!Array.isArray(res.warnings)) out.push('warnings is not a list');
  if (res.ok === false) {
    const e = res.error;
    if (!e || typeof e !== 'object') return [...out, 'a failure without an error'];
    if (!(ERROR_CODES as readonly string[]).includes(e.code)) out.push(`unexpected error code ${e.code}: ${e.message}`);
    if (typeof e.message !== 'string' || e.message.length < 20) out.push(`message too short: ${String(e.message)}`);
    if (!isStringArray(e.parts) || !isStringArray(e.nets)) out.push('error.parts / error.nets are not lists of names');
    if (res.iterations !== undefined && !(res.iterations >= 0 && res.iterations <= MAX_TOTAL_ITERATIONS)) out.push(`failure after ${res.iterations} iterations`);
    return out;
  }
  if (res.ok !== true) return [...out, 'ok is neither true nor false'];
  if (!(Number.isInteger(res.iterations) && res.iterations >= 1 && res.iterations <= MAX_TOTAL_ITERATIONS)) out.push(`iterations ${res.iterations}`);
  const finite = (where: string, v: unknown) => {
    if (typeof v !== 'number' || !Number.isFinite(v)) out.push(`${where} is ${String(v)}`);
  };
  for (const [k, v] of Object.entries(res.nets)) finite(`nets.${k}`, v);
  for (const [k, v] of Object.entries(res.pins)) finite(`pins.${k}`, v);
  for (const [id, p] of Object.entries(res.parts)) {
    for (const [pin, i] of Object.entries(p.pinCurrents)) finite(`parts.${id}.pinCurrents.${pin}`, i);
    finite(`parts.${id}.power`, p.power);
    for (const [k, v] of Object.entries(p.derived ?? {})) if (typeof v !== 'string') finite(`parts.${id}.derived.${k}`, v);
  }
  // the result must survive the trip to JSON (the CLI and the server send it that way)
  try {
    const back = JSON.parse(JSON.stringify(res)) as { nets: Record<string, number> };
    if (Object.keys(back.nets).length !== Object.keys(res.nets).length) out.push('nets changed through JSON');
  } catch (e) {
    out.push(`not JSON-serialisable: ${String(e)}`);
  }
  return out;
}
