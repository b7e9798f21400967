/**
 * IEC 60063:2015 preferred-number series (Tables 1 and 2), kept as integer mantissas so that
 * membership tests compare integers, never floats (1.1 × 100 is 110.00000000000001 in binary).
 *
 * E6–E24 mantissas are two significant figures (×10: 47 means 4.7); E48–E192 are three
 * (×100: 475 means 4.75). Each list spans one decade, starting at 1.0.
 */

/** The series names of IEC 60063, coarse to fine. */
export const E_SERIES_NAMES = ['E6', 'E12', 'E24', 'E48', 'E96', 'E192'] as const;
export type ESeriesName = (typeof E_SERIES_NAMES)[number];

export interface ESeriesDefinition {
  readonly name: ESeriesName;
  /** Values per decade (the N in 10^(i/N)). */
  readonly perDecade: number;
  /** Significant figures of each mantissa: 2 for E6–E24, 3 for E48–E192. */
  readonly digits: 2 | 3;
  /** Integer mantissas, ascending, one decade: value = mantissa × 10^(exponent − digits + 1). */
  readonly mantissas: readonly number[];
  /**
   * The tolerance usually sold with the series (common practice, not part of the standard's
   * normative text): E6 ±20 %, E12 ±10 %, E24 ±5 %, E48 ±2 %, E96 ±1 %, E192 ±0.5 % and tighter.
   * A fraction: 0.05 means ±5 %.
   */
  readonly usualTolerance: number;
}

const E6 = [10, 15, 22, 33, 47, 68];
const E12 = [10, 12, 15, 18, 22, 27, 33, 39, 47, 56, 68, 82];
const E24 = [10, 11, 12, 13, 15, 16, 18, 20, 22, 24, 27, 30, 33, 36, 39, 43, 47, 51, 56, 62, 68, 75, 82, 91];

const E48 = [
  100, 105, 110, 115, 121, 127, 133, 140, 147, 154, 162, 169, 178, 187, 196, 205, 215, 226, 237, 249, 261, 274, 287,
  301, 316, 332, 348, 365, 383, 402, 422, 442, 464, 487, 511, 536, 562, 590, 619, 649, 681, 715, 750, 787, 825, 866,
  909, 953,
];

const E96 = [
  100, 102, 105, 107, 110, 113, 115, 118, 121, 124, 127, 130, 133, 137, 140, 143, 147, 150, 154, 158, 162, 165, 169,
  174, 178, 182, 187, 191, 196, 200, 205, 210, 215, 221, 226, 232, 237, 243, 249, 255, 261, 267, 274, 280, 287, 294,
  301, 309, 316, 324, 332, 340, 348, 357, 365, 374, 383, 392, 402, 412, 422, 432, 442, 453, 464, 475, 487, 499, 511,
  523, 536, 549, 562, 576, 590, 604, 619, 634, 649, 665, 681, 698, 715, 732, 750, 768, 787, 806, 825, 845, 866, 887,
  909, 931, 953, 976,
];

const E192 = [
  100, 101, 102, 104, 105, 106, 107, 109, 110, 111, 113, 114, 115, 117, 118, 120, 121, 123, 124, 126, 127, 129, 130,
  132, 133, 135, 137, 138, 140, 142, 143, 145, 147, 149, 150, 152, 154, 156, 158, 160, 162, 164, 165, 167, 169, 172,
  174, 176, 178, 180, 182, 184, 187, 189, 191, 193, 196, 198, 200, 203, 205, 208, 210, 213, 215, 218, 221, 223, 226,
  229, 232, 234, 237, 240, 243, 246, 249, 252, 255, 258, 261, 264, 267, 271, 274, 277, 280, 284, 287, 291, 294, 298,
  301, 305, 309, 312, 316, 320, 324, 328, 332, 336, 340, 344, 348, 352, 357, 361, 365, 370, 374, 379, 383, 388, 392,
  397, 402, 407, 412, 417, 422, 427, 432, 437, 442, 448, 453, 459, 464, 470, 475, 481, 487, 493, 499, 505, 511, 517,
  523, 530, 536, 542, 549, 556, 562, 569, 576, 583, 590, 597, 604, 612, 619, 626, 634, 642, 649, 657, 665, 673, 681,
  690, 698, 706, 715, 723, 732, 741, 750, 759, 768, 777, 787, 796, 806, 816, 825, 835, 845, 856, 866, 876, 887, 898,
  909, 920, 931, 942, 953, 965, 976, 988,
];

function define(
  name: ESeriesName,
  digits: 2 | 3,
  mantissas: number[],
  usualTolerance: number,
): ESeriesDefinition {
  return Object.freeze({ name, perDecade: mantissas.length, digits, mantissas: Object.freeze(mantissas), usualTolerance });
}

/** Every series by name. */
export const E_SERIES: Readonly<Record<ESeriesName, ESeriesDefinition>> = Object.freeze({
  E6: define('E6', 2, E6, 0.2),
  E12: define('E12', 2, E12, 0.1),
  E24: define('E24', 2, E24, 0.05),
  E48: define('E48', 3, E48, 0.02),
  E96: define('E96', 3, E96, 0.01),
  E192: define('E192', 3, E192, 0.005),
});

/** True when `name` is one of the IEC 60063 series names (exact spelling, e.g. "E24"). */
export function isESeriesName(name: string): name is ESeriesName {
  return (E_SERIES_NAMES as readonly string[]).includes(name);
}
