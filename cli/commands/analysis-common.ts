// Helpers shared by the analysis commands (sweep, worst-case, monte-carlo, thevenin, budget,
// find-value, design-divider): reading the sheet, parsing values in engineering notation,
// printing CSV, and turning analysis errors into the CLI's exit statuses.
import Papa from 'papaparse';
import { AnalysisInputError, CircuitFailureError, parseOutputKey, parseTargetKey, prepareCircuit, type OutputSpec, type ParamTarget, type PreparedCircuit } from '../../shared/analysis';
import type { CircuitSolveOptions } from '../../shared/engine/compile';
import { failure } from '../../shared/engine/result';
import { parseValue, type Unit } from '../../shared/units';
import { parseArgs, UsageError, type FlagSpec, type ParsedArgs } from '../args';
import { EXIT_INVALID, EXIT_SOLVED, EXIT_UNSOLVABLE, type CliIO } from '../io';
import { readSheet, solveOptionsFromFlags } from '../sheet-input';
import { printedHelp, type CliCommand } from './types';

export const csvFlag: FlagSpec = { name: 'csv', description: 'print CSV instead of JSON' };

/** Print text on stdout (the CSV form); falls back to process.stdout for an io without it. */
export function emitText(io: CliIO, text: string): void {
  const t = (io as CliIO & { text?: (s: string) => void }).text;
  if (typeof t === 'function') t.call(io, text);
  else process.stdout.write(text.endsWith('\n') ? text : text + '\n');
}

export function toCsv(rows: ReadonlyArray<ReadonlyArray<string | number | null>>): string {
  return Papa.unparse(rows.map((r) => r.map((v) => (typeof v === 'number' && !Number.isFinite(v) ? null : v))), { newline: '\n' }) + '\n';
}

/** A number typed with or without engineering notation / RKM ("4k7", "3.3V", "10m", "1e-4"). */
export function parseNumber(text: string, what: string, unit?: Unit): number {
  const n = Number(text);
  if (text.trim() !== '' && Number.isFinite(n)) return n;
  const r = parseValue(text, unit ? { unit, allowNegative: true } : { allowNegative: true });
  if (!r.ok) throw new UsageError(`${what}: ${r.message}`);
  return r.value;
}

/** "LOW:HIGH" → [low, high] */
export function parseRange(text: string, what: string): [number, number] {
  const parts = text.split(':');
  if (parts.length !== 2) throw new UsageError(`${what} expects LOW:HIGH (got "${text}")`);
  const [a, b] = parts.map((s) => parseNumber(s, what));
  return [a, b];
}

export function list(flags: ParsedArgs['flags'], name: string): string[] {
  const v = flags[name];
  return Array.isArray(v) ? v : typeof v === 'string' ? [v] : [];
}

export function outputsFrom(flags: ParsedArgs['flags']): OutputSpec[] {
  return list(flags, 'output').map((t) => {
    const o = parseOutputKey(t);
    if (!o) throw new UsageError(`--output expects V(NET), I(PART.PIN), P(PART) or a net name (got "${t}")`);
    return o;
  });
}

export function targetFrom(text: string, flag: string): ParamTarget {
  const t = parseTargetKey(text);
  if (!t) throw new UsageError(`${flag} expects PART.PARAM, temperature or illuminance (got "${text}")`);
  return t;
}

/** Run a sheet command: parse args, read and compile the sheet, map errors to exit statuses. */
export async function runSheetCommand(
  cmd: CliCommand,
  argv: readonly string[],
  io: CliIO,
  body: (ctx: { args: ParsedArgs; prepared: PreparedCircuit; base: CircuitSolveOptions; pretty: boolean; csv: boolean }) => void,
): Promise<number> {
  const args = parseArgs(argv, cmd.flags);
  if (printedHelp(cmd, args, io)) return EXIT_SOLVED;
  if (args.positionals.length !== 1) throw new UsageError(args.positionals.length ? 'give exactly one sheet file' : `which sheet file? e.g. npm run solve -- ${cmd.name} examples/battery-divider.json`);
  const pretty = args.flags.pretty === true;
  const file = args.positionals[0];
  const parsed = readSheet(io, file);
  if (!parsed.ok) {
    const e = parsed.error;
    io.out(failure({ code: 'invalid_sheet', message: e.message, parts: [...new Set(e.issues.map((i) => i.partId).filter((x): x is string => !!x))], nets: [], issues: e.issues }), pretty);
    for (const i of e.issues) io.log(`${file}: ${i.message}`);
    return EXIT_INVALID;
  }
  try {
    const prepared = prepareCircuit(parsed.sheet);
    body({ args, prepared, base: solveOptionsFromFlags(args.flags), pretty, csv: args.flags.csv === true });
    return EXIT_SOLVED;
  } catch (e) {
    return reportAnalysisError(e, io, pretty, file);
  }
}

export function reportAnalysisError(e: unknown, io: CliIO, pretty: boolean, where: string): number {
  if (e instanceof AnalysisInputError) {
    io.out({ ok: false, error: { code: 'invalid_analysis', message: e.message, parts: [], nets: [] } }, pretty);
    io.log(`${where}: ${e.message}`);
    return EXIT_INVALID;
  }
  if (e instanceof CircuitFailureError) {
    io.out(e.failure, pretty);
    io.log(`${where}: ${e.message}`);
    const code = e.failure.error.code;
    return code === 'invalid_sheet' || code === 'invalid_parameter' ? EXIT_INVALID : EXIT_UNSOLVABLE;
  }
  throw e;
}

/** JSON cannot hold NaN: failed points become null. */
export function jsonColumn(a: ArrayLike<number>): Array<number | null> {
  return Array.from(a, (v) => (Number.isFinite(v) ? v : null));
}
