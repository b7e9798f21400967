/**
 * The one entry every value field uses: reads engineering notation ("4.7 kΩ", "470m", "1e3")
 * or an RKM code ("4k7", "R47", "4K7J", "3V3"), with an optional tolerance ("±1 %"), and says
 * what to fix when the text cannot be read.
 */
import { parseEngineeringBody } from './engineering';
import {
  QUANTITY_OF,
  SIGNED_UNITS,
  normalizeInput,
  parseError,
  type ParseResult,
  type Unit,
} from './quantity';
import { looksLikeRkm, parseRkmBody } from './rkm';

export type { ParseResult, Unit } from './quantity';

export interface ParseOptions {
  /**
   * The unit the field takes. A bare number is read in this unit; text written in another unit
   * ("3.3V" in a resistance field) is refused with a message.
   */
  unit?: Unit;
  /** Accept a minus sign. Default: yes for V, A and °C (and when no unit is known), no for Ω, W and lx. */
  allowNegative?: boolean;
}

const TOLERANCE_CLAUSE = /^(.*?)\s*(?:±|\+\/-|\+-)\s*(\d+(?:\.\d*)?|\.\d+)\s*%$/su;
const BARE_PERCENT = /^(.*\S)\s+(\d+(?:\.\d*)?|\.\d+)\s*%$/su;

/**
 * Reads a value typed by a person. Returns the value in SI base units (Ω, V, A, W, lx, °C), the
 * tolerance as a fraction when one was written (4K7J or "4.7k ±5 %" → 0.05) and the unit written
 * or implied; or `{ ok: false, message }` naming what is wrong and what to write instead.
 *
 * parseValue("4k7") → 4700; parseValue("R47") → 0.47; parseValue("10 µA", { unit: 'A' }) → 1e-5.
 */
export function parseValue(text: string, options: ParseOptions = {}): ParseResult {
  if (typeof text !== 'string') return parseError('Enter a value, e.g. 4.7k or 4k7');
  const quoted = `'${text.trim()}'`;
  let body = normalizeInput(text);
  if (body === '') return parseError('Enter a value, e.g. 4.7k or 4k7');

  let clauseTolerance: number | undefined;
  const clause = TOLERANCE_CLAUSE.exec(body) ?? BARE_PERCENT.exec(body);
  if (clause) {
    clauseTolerance = Number(clause[2]) / 100;
    if (!(clauseTolerance > 0 && clauseTolerance < 1)) {
      return parseError(`${quoted}: a tolerance must be above 0 % and below 100 %`);
    }
    body = clause[1].trim();
    if (body === '') return parseError(`${quoted} gives a tolerance but no value; write e.g. 4.7k ±5 %`);
  }

  let negative = false;
  const sign = /^([+-])\s*/.exec(body);
  if (sign) {
    negative = sign[1] === '-';
    body = body.slice(sign[0].length);
    if (body === '') return parseError(`${quoted} needs a number after the sign`);
  }

  const read: { ok: true; value: number; unit?: Unit; tolerance?: number } | { ok: false; message: string } =
    looksLikeRkm(body) ? parseRkmBody(body, quoted, options.unit) : parseEngineeringBody(body, quoted, options.unit);
  if (!read.ok) return read;
  const rkmTolerance = read.tolerance;
  if (rkmTolerance !== undefined && clauseTolerance !== undefined) {
    return parseError(`${quoted} gives the tolerance twice; keep the letter or the percentage`);
  }

  if (options.unit && read.unit && read.unit !== options.unit) {
    return parseError(
      `${quoted} is a ${QUANTITY_OF[read.unit]} (${read.unit}); this field takes a ${QUANTITY_OF[options.unit]} (${options.unit})`,
    );
  }
  const unit = options.unit ?? read.unit;
  const allowNegative = options.allowNegative ?? (unit === undefined || SIGNED_UNITS.has(unit));
  if (negative && read.value !== 0 && !allowNegative) {
    const what = unit ? `a ${QUANTITY_OF[unit]}` : 'this value';
    return parseError(`${quoted}: ${what} cannot be negative here; remove the minus sign`);
  }

  const result: ParseResult & { ok: true } = { ok: true, value: negative && read.value !== 0 ? -read.value : read.value };
  const tolerance = rkmTolerance ?? clauseTolerance;
  if (tolerance !== undefined) result.tolerance = tolerance;
  if (read.unit) result.unit = read.unit;
  return result;
}
