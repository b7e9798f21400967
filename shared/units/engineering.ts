/**
 * Engineering notation: a decimal number, an optional SI prefix and an optional unit —
 * "4.7 kΩ", "4.7k", "470m", "10 µA", "3.3V", "1e3", "0.25 W".
 */
import { splitAt, toDecimalDigits } from './decimal';
import {
  PREFIXED_UNITS,
  SI_PREFIX_EXPONENT,
  SI_PREFIX_FOR_EXPONENT,
  unitFromToken,
  type Unit,
} from './quantity';

/** What an engineering body (no sign, already trimmed) says, or why it cannot be read. */
export type EngineeringParse = { ok: true; value: number; unit?: Unit } | { ok: false; message: string };

const NUMBER = /^(\d+\.?\d*|\.\d+)(?:[eE]([+-]?\d+))?/;

function readSuffix(suffix: string, expected?: Unit): { exponent: number; unit?: Unit } | undefined {
  if (suffix === '') return { exponent: 0 };
  const whole = unitFromToken(suffix, expected);
  if (whole) return { exponent: 0, unit: whole };
  const prefix = [...suffix][0];
  const exponent = SI_PREFIX_EXPONENT[prefix];
  if (exponent === undefined) return undefined;
  const rest = suffix.slice(prefix.length).trimStart();
  if (rest === '') return { exponent };
  const unit = unitFromToken(rest, expected);
  return unit && unit !== '°C' ? { exponent, unit } : undefined;
}

/**
 * Reads an unsigned engineering value such as "4.7k", "10 µA" or "1e3". `quoted` is the user's
 * full text, for messages.
 */
export function parseEngineeringBody(body: string, quoted: string, expected?: Unit): EngineeringParse {
  const m = NUMBER.exec(body);
  if (!m) {
    return {
      ok: false,
      message: `${quoted} is not a value: start with a number, e.g. 4.7k, 4k7 or 4700`,
    };
  }
  const [numberText, mantissa, exponentText] = m;
  const after = body.slice(numberText.length);
  if (after.startsWith('.')) {
    return { ok: false, message: `${quoted} has more than one decimal point; keep one, e.g. 4.7k` };
  }
  if (/^,\d/.test(after)) {
    return { ok: false, message: `${quoted}: use a decimal point, not a comma (4.7k); thousands separators are not read` };
  }
  if (/^[eE]/.test(after)) {
    return { ok: false, message: `${quoted}: the exponent after 'e' needs digits, e.g. 1e3` };
  }
  const suffix = after.trimStart();
  if (/^\d/.test(suffix)) {
    return { ok: false, message: `${quoted} has a space inside the number; remove it` };
  }
  const read = readSuffix(suffix, expected);
  if (!read) {
    const first = [...suffix][0];
    if (first in SI_PREFIX_EXPONENT && /^.\d/u.test(suffix)) {
      return { ok: false, message: `${quoted} mixes a decimal point with an RKM letter; write ${mantissa}${first} or use the RKM form such as 4k7` };
    }
    if (suffix === 'C' || suffix === 'c') {
      return { ok: false, message: `${quoted}: write the temperature unit as °C or degC, e.g. ${mantissa} °C` };
    }
    const second = [...suffix][1];
    if (first in SI_PREFIX_EXPONENT && second !== undefined && (second in SI_PREFIX_EXPONENT || second === 'R')) {
      return { ok: false, message: `${quoted} has two multiplier letters; keep one, e.g. ${mantissa}${first}` };
    }
    return {
      ok: false,
      message: `${quoted}: '${suffix}' is not a unit or multiplier; use a prefix p n µ m k M G T and a unit Ω, V, A, W, lx or °C`,
    };
  }
  if (exponentText !== undefined && read.exponent !== 0) {
    return { ok: false, message: `${quoted} has both an exponent and a multiplier letter; use one, e.g. 4.7e3 or 4.7k` };
  }
  // Going through a decimal string keeps "4.7k" exactly the double 4700.
  const value = Number(`${mantissa}e${Number(exponentText ?? 0) + read.exponent}`);
  if (!Number.isFinite(value)) return { ok: false, message: `${quoted} is too large to use` };
  if (value === 0 && /[1-9]/.test(mantissa)) return { ok: false, message: `${quoted} is too small to use` };
  return { ok: true, value, unit: read.unit };
}

export interface EngFormatOptions {
  /** Significant figures (default 3). */
  digits?: number;
  /** Drop trailing zeros: "4.7 kΩ" rather than "4.70 kΩ" (default true). */
  trimZeros?: boolean;
}

/**
 * A value in SI base units in engineering notation with the unit: formatEng(4700, 'Ω') →
 * "4.7 kΩ", formatEng(1e-5, 'A') → "10 µA", formatEng(-12, 'V') → "-12 V". Pass '' for a bare
 * number with a prefix ("4.7k"). °C is never prefixed ("25 °C"). Beyond f…T the power of ten is
 * written as e.g. "1.5e15 Ω", which the parser reads back.
 */
export function formatEng(value: number, unit: Unit | '', options: EngFormatOptions = {}): string {
  const digits = options.digits ?? 3;
  const trim = options.trimZeros ?? true;
  const space = unit === '' ? '' : ' ';
  if (Number.isNaN(value)) return `NaN${space}${unit}`;
  if (!Number.isFinite(value)) return `${value < 0 ? '-' : ''}∞${space}${unit}`;
  const sign = value < 0 ? '-' : '';
  const d = toDecimalDigits(value, digits, trim);
  let group = 0;
  if (unit === '' || PREFIXED_UNITS.has(unit)) group = Math.floor(d.exponent / 3) * 3;
  if (value === 0) group = 0;
  // °C keeps plain digits at any size ("1230 °C"); others fall back to e-notation past f…T.
  const prefix = SI_PREFIX_FOR_EXPONENT[group];
  const { int, frac } = splitAt(d, prefix === undefined ? d.exponent : group);
  const number = `${int || '0'}${frac ? `.${frac}` : ''}`;
  if (prefix === undefined) return `${sign}${number}e${d.exponent}${space}${unit}`;
  return `${sign}${number}${space}${prefix}${unit}`;
}
