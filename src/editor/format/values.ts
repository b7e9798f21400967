// The editor's bridge to shared/units: how a param is shown in a field and read back from one,
// and how readings (volts, amps, watts) are printed on the canvas and in tables.
import { checkNumber, ruleText, type ParamInfo } from '../../../shared/parts/types';
import { formatEng, parseValue, type Unit } from '../../../shared/units';

const KNOWN_UNITS: ReadonlySet<string> = new Set<Unit>(['Ω', 'V', 'A', 'W', 'lx', '°C']);

export type FieldParse = { ok: true; value: number; tolerance?: number } | { ok: false; message: string };

/** True for params that are a tolerance fraction, shown and typed in percent. */
export function isPercentParam(info: ParamInfo): boolean {
  return !!info.toleranceOf;
}

/** The unit shown beside a field. */
export function fieldUnit(info: ParamInfo): string {
  return isPercentParam(info) ? '%' : info.unit;
}

/** A param value as its field shows it: "4.7k" style without the unit (the unit sits beside the field). */
export function formatParamValue(info: ParamInfo, value: unknown): string {
  if (typeof value !== 'number' || !Number.isFinite(value)) return value === undefined ? '' : String(value);
  if (isPercentParam(info)) return String(Number((value * 100).toPrecision(4)));
  // a plain ratio (wiper position, β, γ) reads better without SI prefixes: 0.4, not 400m
  if (info.unit === '' && Math.abs(value) >= 1e-3 && Math.abs(value) < 1e6) return String(Number(value.toPrecision(4)));
  // Four significant figures: enough for E192 values (1.02k) without float noise.
  return formatEng(value, '', { digits: 4 });
}

/**
 * Read what the user typed into a param's field, in the param's SI unit, checked against the
 * catalogue rule. "4k7", "4.7k", "4.7 kΩ", "4K7J" all read 4700 Ω (the J gives ±5 %).
 */
export function parseParamText(info: ParamInfo, text: string): FieldParse {
  const trimmed = text.trim();
  if (!trimmed) return info.required ? { ok: false, message: `${info.label} is required.` } : { ok: false, message: 'empty' };
  let value: number;
  let tolerance: number | undefined;
  if (isPercentParam(info)) {
    const m = /^(?:±|\+\/-|\+-)?\s*(\d+(?:\.\d*)?|\.\d+)\s*%?$/.exec(trimmed);
    if (!m) return { ok: false, message: `Write the tolerance in percent, e.g. 5 or 0.1 %.` };
    value = Number(m[1]) / 100;
  } else {
    const unit = KNOWN_UNITS.has(info.unit) ? (info.unit as Unit) : undefined;
    // Units the shared parser does not know (K, ppm/K, eV, V/K) may be typed after the number.
    const body = unit || !info.unit ? trimmed : trimmed.replace(new RegExp(`\\s*${escape(info.unit)}$`), '');
    const r = parseValue(body, unit ? { unit } : { allowNegative: true });
    if (!r.ok) return { ok: false, message: r.message };
    value = r.value;
    tolerance = r.tolerance;
  }
  if (!checkNumber(info.rule, value)) return { ok: false, message: `${info.label} ${ruleText(info.rule)}${info.unit ? ` (${info.unit})` : ''}.` };
  return tolerance === undefined ? { ok: true, value } : { ok: true, value, tolerance };
}

function escape(s: string): string {
  return s.replace(/[.*+?^${}()|[\]\\/]/g, '\\$&');
}

/** A voltage reading, 4 significant figures: "3.243 V". */
export function formatVolts(v: number): string {
  return formatEng(Math.abs(v) < 1e-12 ? 0 : v, 'V', { digits: 4 });
}

/** A current reading: "1.204 mA". Magnitudes below 1 pA print as 0. */
export function formatAmps(a: number): string {
  return formatEng(Math.abs(a) < 1e-12 ? 0 : a, 'A', { digits: 4 });
}

/** A power reading: "14.2 mW". */
export function formatWatts(w: number): string {
  return formatEng(Math.abs(w) < 1e-15 ? 0 : w, 'W', { digits: 3 });
}

/** A param value with its unit, for labels on the canvas: "4.7 kΩ" (prefix joined to the unit), "5 %". */
export function formatParamWithUnit(info: ParamInfo, value: unknown): string {
  if (typeof value === 'number' && Number.isFinite(value) && !isPercentParam(info) && KNOWN_UNITS.has(info.unit))
    return formatEng(value, info.unit as Unit, { digits: 4 });
  const text = formatParamValue(info, value);
  const unit = fieldUnit(info);
  return unit ? `${text} ${unit}` : text;
}
