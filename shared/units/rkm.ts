/**
 * RKM code (IEC 60062:2016): the multiplier letter stands where the decimal point would —
 * R47 = 0.47 Ω, 4R7 = 4.7 Ω, 4K7 = 4.7 kΩ, 1M0 = 1 MΩ — optionally followed by a tolerance
 * letter (4K7J = 4.7 kΩ ±5 %). K inside the value is kilo; after it, ±10 %.
 */
import { splitAt, toDecimalDigits } from './decimal';
import { unitFromToken, type Unit } from './quantity';

/**
 * IEC 60062 tolerance letters as fractions (F and K read in the standard; B, C, D, G, J, M from
 * memory — see references.md).
 */
export const TOLERANCE_LETTERS: Readonly<Record<string, number>> = Object.freeze({
  B: 0.001,
  C: 0.0025,
  D: 0.005,
  F: 0.01,
  G: 0.02,
  J: 0.05,
  K: 0.1,
  M: 0.2,
});

interface Marker {
  readonly exponent: number;
  /** The unit the letter itself implies (R and L mean ohms; V, A, W are their own units). */
  readonly unit?: Unit;
  /** How the same multiplier is written after a decimal number, for suggestions ("4.7k"). */
  readonly engineering: string;
}

// IEC 60062 letters (L R K M G T), SI prefixes used the same way (4n7, 4µ7, common practice), and
// unit letters as the decimal point (3V3 = 3.3 V, common practice, not in IEC 60062).
const MARKERS: Readonly<Record<string, Marker>> = Object.freeze({
  L: { exponent: -3, unit: 'Ω', engineering: 'm' },
  R: { exponent: 0, unit: 'Ω', engineering: '' },
  r: { exponent: 0, unit: 'Ω', engineering: '' },
  K: { exponent: 3, engineering: 'k' },
  k: { exponent: 3, engineering: 'k' },
  M: { exponent: 6, engineering: 'M' },
  G: { exponent: 9, engineering: 'G' },
  T: { exponent: 12, engineering: 'T' },
  m: { exponent: -3, engineering: 'm' },
  'µ': { exponent: -6, engineering: 'µ' },
  u: { exponent: -6, engineering: 'µ' },
  n: { exponent: -9, engineering: 'n' },
  p: { exponent: -12, engineering: 'p' },
  V: { exponent: 0, unit: 'V', engineering: ' V' },
  A: { exponent: 0, unit: 'A', engineering: ' A' },
  W: { exponent: 0, unit: 'W', engineering: ' W' },
});

/** What an RKM body (no sign, already trimmed) says, or why it cannot be read. */
export type RkmParse =
  | { ok: true; value: number; unit?: Unit; tolerance?: number }
  | { ok: false; message: string };

/**
 * True when the text has the shape of an RKM code: a letter with digits after it (4K7, R47),
 * digits then a letter then a tolerance letter (10KJ), or digits then L, a letter only RKM uses (10L).
 */
export function looksLikeRkm(body: string): boolean {
  return /^\d*[^\d\s.,eE+-]\d/.test(body) || /^\d+[LRrKkMGTmµunpVAW][BCDFGJKM]/.test(body) || /^\d+L/.test(body);
}

/**
 * Reads an unsigned RKM code such as "4K7", "R47", "470R", "4k7J" or "3V3". `quoted` is the
 * user's full text, for messages; `expected` lets a bare "C" mean °C in a temperature field.
 */
export function parseRkmBody(body: string, quoted: string, expected?: Unit): RkmParse {
  const m = /^(\d*)(\D)(\d*)(.*)$/su.exec(body);
  const marker = m ? MARKERS[m[2]] : undefined;
  if (!m || !marker) {
    const letter = m ? m[2] : body;
    return {
      ok: false,
      message: `${quoted}: '${letter}' is not an RKM letter; use R (ohms), k, M, G or T, L for milliohms, or write a decimal number such as 4.7k`,
    };
  }
  const [, int, letter, frac, tail] = m;
  if (int === '' && frac === '') return { ok: false, message: `${quoted} has no digits; write for example 4${letter}7` };
  const lead = int || '0';
  const asRkm = `${lead}${letter}${frac}`;
  const asDecimal = frac ? `${lead}.${frac}${marker.engineering}` : `${lead}${marker.engineering}`;
  if (/^[.,]/.test(tail)) {
    return { ok: false, message: `${quoted} mixes a decimal point with an RKM letter; write ${asRkm} or ${asDecimal}` };
  }
  let rest = tail.trim();
  let tolerance: number | undefined;
  let unit: Unit | undefined = rest ? unitFromToken(rest, expected) : undefined;
  if (rest && !unit) {
    const c = rest[0];
    if (c in TOLERANCE_LETTERS) {
      tolerance = TOLERANCE_LETTERS[c];
      rest = rest.slice(1).trim();
      unit = rest ? unitFromToken(rest, expected) : undefined;
      if (rest && !unit) return { ok: false, message: `${quoted}: '${rest}' after the tolerance letter ${c} is not a unit; remove it` };
    } else if (c in MARKERS) {
      return { ok: false, message: `${quoted} has two multiplier letters; write ${asRkm} or ${asDecimal}` };
    } else if (c.toUpperCase() in TOLERANCE_LETTERS) {
      return { ok: false, message: `${quoted}: tolerance letters are upper case; write ${asRkm}${c.toUpperCase()}` };
    } else {
      return {
        ok: false,
        message: `${quoted}: '${rest}' after ${asRkm} is neither a tolerance letter (B C D F G J K M) nor a unit; remove it`,
      };
    }
  }
  if (marker.unit && unit && marker.unit !== unit) {
    return { ok: false, message: `${quoted}: the letter ${letter} marks ${marker.unit} but the unit says ${unit}; keep one` };
  }
  const value = Number(`${lead}.${frac || '0'}e${marker.exponent}`);
  return { ok: true, value, unit: unit ?? marker.unit, tolerance };
}

/** The IEC 60062 letter for a tolerance fraction (0.05 → "J"), or null when it has none. */
export function toleranceLetter(tolerance: number): string | null {
  for (const [letter, t] of Object.entries(TOLERANCE_LETTERS)) {
    if (Math.abs(t - tolerance) <= 1e-9 * t) return letter;
  }
  return null;
}

export interface RkmFormatOptions {
  /** Significant figures (default 3, enough for E192). Trailing zeros are dropped. */
  digits?: number;
  /** "upper" writes 4K7 (IEC 60062); "lower" writes 4k7. Only the kilo letter changes. */
  style?: 'upper' | 'lower';
  /** Appends the IEC 60062 tolerance letter (0.05 → "J") when the fraction has one; otherwise nothing. */
  tolerance?: number;
}

const LETTER_FOR_EXPONENT: Readonly<Record<number, string>> = { [-3]: 'L', 0: 'R', 3: 'K', 6: 'M', 9: 'G', 12: 'T' };

/**
 * A resistance in ohms as an RKM code: 4700 → "4K7", 0.47 → "R47", 470 → "470R", 1e6 → "1M0",
 * 0.0047 → "4L7", 0 → "0R" (a zero-ohm link). Throws RangeError for a negative or non-finite value.
 */
export function formatRkm(ohms: number, options: RkmFormatOptions = {}): string {
  if (!Number.isFinite(ohms) || ohms < 0) throw new RangeError(`formatRkm needs a resistance ≥ 0 Ω; got ${ohms}`);
  const tol = options.tolerance === undefined ? '' : (toleranceLetter(options.tolerance) ?? '');
  if (ohms === 0) return `0R${tol}`;
  const d = toDecimalDigits(ohms, options.digits ?? 3, true);
  // R covers 0.1 Ω up (R47 is the IEC spelling of 0.47 Ω); below that, milliohms with L.
  const group = d.exponent < -1 ? -3 : Math.min(12, Math.max(0, Math.floor(d.exponent / 3) * 3));
  let letter = LETTER_FOR_EXPONENT[group];
  if (letter === 'K' && options.style === 'lower') letter = 'k';
  const { int, frac } = splitAt(d, group);
  // One-digit whole values keep a trailing zero (1K0, 1M0) so the letter never ends a single digit,
  // and a lone fraction digit gets one too (R10, not R1, which reads like a designator).
  let fracPart = frac;
  if (frac === '' && int.length === 1) fracPart = '0';
  else if (int === '' && frac.length === 1) fracPart = `${frac}0`;
  return `${int}${letter}${fracPart}${tol}`;
}
