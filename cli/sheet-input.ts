// Reading a sheet file for a command and applying --set / --temperature / --illuminance.
import { parseSheetJson, type ParseSheetResult } from '../shared/sheet/parse';
import type { CircuitSolveOptions, ParamOverrides } from '../shared/engine/compile';
import { UsageError } from './args';
import type { CliIO } from './io';

export function readSheet(io: CliIO, file: string): ParseSheetResult {
  let text: string;
  try {
    text = io.readText(io.resolve(file));
  } catch (e) {
    const code = (e as NodeJS.ErrnoException).code;
    const why = code === 'ENOENT' ? 'no such file' : code === 'EISDIR' ? 'it is a folder' : e instanceof Error ? e.message : String(e);
    return { ok: false, error: { code: 'invalid_sheet', message: `Cannot read "${file}": ${why}.`, issues: [{ path: '', message: `Cannot read "${file}": ${why}.` }] } };
  }
  return parseSheetJson(text);
}

/** --set R1.resistance=4700 (repeatable), --temperature 40, --illuminance 5 */
export function solveOptionsFromFlags(flags: Record<string, string | boolean | string[]>): CircuitSolveOptions {
  const opts: CircuitSolveOptions = {};
  const sets = flags.set;
  if (Array.isArray(sets) && sets.length) {
    const ov: ParamOverrides = {};
    for (const s of sets) {
      const m = /^([^.=\s]+)\.([^.=\s]+)=(.+)$/.exec(s);
      if (!m) throw new UsageError(`--set expects PART.PARAM=VALUE (got "${s}")`);
      const [, id, param, raw] = m;
      let value: number | boolean;
      if (raw === 'true' || raw === 'false') value = raw === 'true';
      else {
        value = Number(raw);
        if (!Number.isFinite(value)) throw new UsageError(`--set ${id}.${param}: "${raw}" is not a plain number (use SI units, e.g. 4700)`);
      }
      (ov[id] ??= {})[param] = value;
    }
    opts.paramOverrides = ov;
  }
  const cond: NonNullable<CircuitSolveOptions['conditions']> = {};
  for (const [flag, key] of [
    ['temperature', 'temperatureC'],
    ['illuminance', 'illuminanceLux'],
  ] as const) {
    const v = flags[flag];
    if (typeof v === 'string') {
      const n = Number(v);
      if (!Number.isFinite(n)) throw new UsageError(`--${flag} expects a number (got "${v}")`);
      cond[key] = n;
    }
  }
  if (Object.keys(cond).length) opts.conditions = cond;
  return opts;
}
