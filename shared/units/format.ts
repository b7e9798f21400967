/**
 * Formatting for value fields and tables: engineering notation, RKM codes and tolerances.
 */
import { formatEng } from './engineering';
import { formatRkm } from './rkm';
import type { Unit } from './quantity';

export { formatEng, type EngFormatOptions } from './engineering';
export { formatRkm, toleranceLetter, type RkmFormatOptions } from './rkm';

/**
 * A tolerance fraction as people write it: 0.05 → "±5 %", 0.001 → "±0.1 %", 0.0025 → "±0.25 %".
 * Up to three significant figures; the space before % follows SI writing rules.
 */
export function formatTolerance(tolerance: number): string {
  if (!Number.isFinite(tolerance) || tolerance < 0) throw new RangeError(`formatTolerance needs a fraction ≥ 0; got ${tolerance}`);
  const percent = Number((tolerance * 100).toPrecision(3));
  return `±${percent} %`;
}

/**
 * A value in the notation a field asks for: RKM for resistances when `notation` is "rkm"
 * (4700 → "4K7"), engineering otherwise (4700 → "4.7 kΩ"). Negative resistances (not a part
 * value, but a computed quantity) always use engineering notation.
 */
export function formatValue(
  value: number,
  unit: Unit,
  options: { notation?: 'engineering' | 'rkm'; digits?: number; tolerance?: number } = {},
): string {
  if (options.notation === 'rkm' && unit === 'Ω' && Number.isFinite(value) && value >= 0) {
    return formatRkm(value, { digits: options.digits, tolerance: options.tolerance });
  }
  const text = formatEng(value, unit, { digits: options.digits });
  return options.tolerance === undefined ? text : `${text} ${formatTolerance(options.tolerance)}`;
}
