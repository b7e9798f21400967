/**
 * Units and SI prefixes that Tapline's value fields read and write, and the clean-up of what
 * people type or paste (look-alike Unicode characters, odd spaces).
 */

/** Unit symbols as shown. Ω is U+03A9 (Unicode prefers it to the ohm sign U+2126); µ is U+00B5. */
export type Unit = 'Ω' | 'V' | 'A' | 'W' | 'lx' | '°C';

/** The quantity each unit measures, for messages ("this field takes a resistance (Ω)"). */
export const QUANTITY_OF: Readonly<Record<Unit, string>> = Object.freeze({
  'Ω': 'resistance',
  V: 'voltage',
  A: 'current',
  W: 'power',
  lx: 'illuminance',
  '°C': 'temperature',
});

/** Units whose values may be negative in a field (a voltage or current with its direction, a temperature). */
export const SIGNED_UNITS: ReadonlySet<Unit> = new Set<Unit>(['V', 'A', '°C']);

/** Units that take SI prefixes when formatted (°C is always shown plain). */
export const PREFIXED_UNITS: ReadonlySet<Unit> = new Set<Unit>(['Ω', 'V', 'A', 'W', 'lx']);

/** SI prefixes as powers of ten. Upper-case K is read as kilo (common practice), never written. */
export const SI_PREFIX_EXPONENT: Readonly<Record<string, number>> = Object.freeze({
  f: -15,
  p: -12,
  n: -9,
  'µ': -6,
  u: -6,
  m: -3,
  k: 3,
  K: 3,
  M: 6,
  G: 9,
  T: 12,
});

/** The prefix written for each engineering exponent. */
export const SI_PREFIX_FOR_EXPONENT: Readonly<Record<number, string>> = Object.freeze({
  [-15]: 'f',
  [-12]: 'p',
  [-9]: 'n',
  [-6]: 'µ',
  [-3]: 'm',
  0: '',
  3: 'k',
  6: 'M',
  9: 'G',
  12: 'T',
});

// Spellings accepted for each unit. Exact-case entries first; words are matched case-insensitively.
const UNIT_SYMBOLS: Readonly<Record<string, Unit>> = Object.freeze({
  'Ω': 'Ω',
  R: 'Ω',
  r: 'Ω',
  V: 'V',
  v: 'V',
  A: 'A',
  a: 'A',
  W: 'W',
  w: 'W',
  lx: 'lx',
  '°C': '°C',
  '°c': '°C',
});

const UNIT_WORDS: Readonly<Record<string, Unit>> = Object.freeze({
  ohm: 'Ω',
  ohms: 'Ω',
  volt: 'V',
  volts: 'V',
  amp: 'A',
  amps: 'A',
  ampere: 'A',
  amperes: 'A',
  watt: 'W',
  watts: 'W',
  lux: 'lx',
  degc: '°C',
});

/**
 * The unit a suffix such as "Ω", "ohms", "V" or "lux" spells, or undefined. A bare "C" means °C
 * only where the field already takes a temperature, since it is otherwise the coulomb.
 */
export function unitFromToken(token: string, expected?: Unit): Unit | undefined {
  if (token in UNIT_SYMBOLS) return UNIT_SYMBOLS[token];
  const word = UNIT_WORDS[token.toLowerCase()];
  if (word) return word;
  if (expected === '°C' && (token === 'C' || token === 'c')) return '°C';
  return undefined;
}

/**
 * Replaces look-alike characters with the ones the parsers expect and trims the ends:
 * ohm sign → Ω, Greek mu → micro sign, Unicode minus and dashes → "-", ℃ → °C, º/˚ → °,
 * no-break and thin spaces → space, full-width digits → ASCII digits.
 */
export function normalizeInput(text: string): string {
  return text
    .replace(/[\uFF10-\uFF19]/g, (d) => String.fromCharCode(d.charCodeAt(0) - 0xff10 + 48))
    .replace(/\u2126/g, 'Ω')
    .replace(/\u03BC/g, 'µ')
    .replace(/[\u2212\u2012\u2013\uFE63\uFF0D]/g, '-')
    .replace(/\u2103/g, '°C')
    .replace(/[\u00BA\u02DA]/g, '°')
    .replace(/[\u00A0\u2000-\u200B\u202F\u205F\u3000\t]/g, ' ')
    .trim();
}

/** A parse outcome every value field can show: the value in SI base units, or what to fix. */
export type ParseResult =
  | {
      ok: true;
      /** In SI base units: Ω, V, A, W, lx or °C. */
      value: number;
      /** Tolerance as a fraction (0.05 for ±5 %), when the text gave one. */
      tolerance?: number;
      /** The unit the text wrote or implied (R in 4R7 implies Ω), when it gave one. */
      unit?: Unit;
    }
  | { ok: false; message: string };

/** Shorthand for a failed parse. */
export function parseError(message: string): { ok: false; message: string } {
  return { ok: false, message };
}
