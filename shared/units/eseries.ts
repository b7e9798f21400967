/**
 * Preferred-value lookups over the IEC 60063 series, across the decades from 1 mΩ to 1 TΩ.
 * Values are built from the integer mantissas through a decimal string, so each one is the
 * double nearest the printed value (4.7 kΩ is exactly the double `4700`, 0.47 Ω is `0.47`).
 */
import { E_SERIES, E_SERIES_NAMES, type ESeriesName } from './eseries-data';
import { lowerBound, upperBound } from './sorted-search';

export { E_SERIES, E_SERIES_NAMES, isESeriesName, type ESeriesName, type ESeriesDefinition } from './eseries-data';

/** The span the lookups cover, in ohms: 1 mΩ (10⁻³) to 1 TΩ (10¹²), both ends included. */
export const PREFERRED_RANGE = Object.freeze({ min: 1e-3, max: 1e12 });

/**
 * Two values closer than this (relative) are the same value. E192 neighbours are ≥ 0.5 % apart,
 * so this only absorbs floating-point noise such as 4700.000000000001.
 */
const SAME_VALUE = 1e-9;

const cache = new Map<ESeriesName, readonly number[]>();

/** Every value of `series` from 1 mΩ to 1 TΩ, ascending (ohms). The array is shared: do not mutate. */
export function allPreferredValues(series: ESeriesName): readonly number[] {
  let values = cache.get(series);
  if (!values) {
    const def = E_SERIES[series];
    const out: number[] = [];
    // Mantissa 47 with 2 digits in decade 10^3 is "47e2" = 4.7 kΩ.
    for (let decade = -3; decade < 12; decade++) {
      for (const m of def.mantissas) out.push(Number(`${m}e${decade - def.digits + 1}`));
    }
    out.push(PREFERRED_RANGE.max);
    values = Object.freeze(out);
    cache.set(series, values);
  }
  return values;
}

/** Values of `series` within [min, max] ohms (inclusive), ascending. */
export function preferredValuesBetween(series: ESeriesName, min: number, max: number): number[] {
  const all = allPreferredValues(series);
  return all.slice(lowerBound(all, min * (1 - SAME_VALUE)), upperBound(all, max * (1 + SAME_VALUE)));
}

function checkPositive(value: number, what: string): void {
  if (!Number.isFinite(value) || value <= 0) {
    throw new RangeError(`${what} needs a positive, finite resistance in ohms; got ${value}`);
  }
}

/**
 * The preferred value of `series` nearest to `ohms` on a logarithmic scale (the geometric-mean
 * midpoint decides between neighbours), limited to 1 mΩ … 1 TΩ.
 */
export function nearestPreferred(ohms: number, series: ESeriesName): number {
  checkPositive(ohms, 'nearestPreferred');
  const all = allPreferredValues(series);
  const i = lowerBound(all, ohms);
  if (i === 0) return all[0];
  if (i === all.length) return all[all.length - 1];
  const below = all[i - 1];
  const above = all[i];
  // |ln(x/below)| < |ln(above/x)|  ⇔  x² < below·above.
  return ohms * ohms < below * above ? below : above;
}

/** The next preferred value strictly above `ohms` (a value equal to a preferred one steps past it), or null above 1 TΩ. */
export function stepUp(ohms: number, series: ESeriesName): number | null {
  checkPositive(ohms, 'stepUp');
  const all = allPreferredValues(series);
  const i = upperBound(all, ohms * (1 + SAME_VALUE));
  return i < all.length ? all[i] : null;
}

/** The next preferred value strictly below `ohms`, or null below 1 mΩ. */
export function stepDown(ohms: number, series: ESeriesName): number | null {
  checkPositive(ohms, 'stepDown');
  const all = allPreferredValues(series);
  const i = lowerBound(all, ohms * (1 - SAME_VALUE));
  return i > 0 ? all[i - 1] : null;
}

/** The smallest preferred value ≥ `ohms` (a preferred value maps to itself), or null above 1 TΩ. */
export function roundUpPreferred(ohms: number, series: ESeriesName): number | null {
  checkPositive(ohms, 'roundUpPreferred');
  const all = allPreferredValues(series);
  const i = lowerBound(all, ohms * (1 - SAME_VALUE));
  return i < all.length ? all[i] : null;
}

/** The largest preferred value ≤ `ohms` (a preferred value maps to itself), or null below 1 mΩ. */
export function roundDownPreferred(ohms: number, series: ESeriesName): number | null {
  checkPositive(ohms, 'roundDownPreferred');
  const all = allPreferredValues(series);
  const i = upperBound(all, ohms * (1 + SAME_VALUE));
  return i > 0 ? all[i - 1] : null;
}

/** True when `ohms` is a value of `series` (to within floating-point noise) between 1 mΩ and 1 TΩ. */
export function isPreferred(ohms: number, series: ESeriesName): boolean {
  if (!Number.isFinite(ohms) || ohms <= 0) return false;
  const nearest = nearestPreferred(ohms, series);
  return Math.abs(nearest - ohms) <= SAME_VALUE * ohms;
}

/** The series (coarse to fine) that contain `ohms`; empty for a value in none of them. */
export function seriesContaining(ohms: number): ESeriesName[] {
  return E_SERIES_NAMES.filter((name) => isPreferred(ohms, name));
}

/** The tolerance usually paired with `series` (common practice), as a fraction: 0.05 for E24. */
export function usualTolerance(series: ESeriesName): number {
  return E_SERIES[series].usualTolerance;
}

/**
 * The coarsest series whose usual tolerance (common practice) is as tight as `tolerance` (a
 * fraction) or tighter: 0.05 → E24, 0.01 → E96, 0.25 → E6. Anything tighter than ±0.5 % maps to
 * E192, the series such parts are sold in.
 */
export function seriesForTolerance(tolerance: number): ESeriesName {
  if (!Number.isFinite(tolerance) || tolerance <= 0) {
    throw new RangeError(`seriesForTolerance needs a positive tolerance fraction (0.05 for ±5 %); got ${tolerance}`);
  }
  for (const name of E_SERIES_NAMES) {
    if (E_SERIES[name].usualTolerance <= tolerance * (1 + SAME_VALUE)) return name;
  }
  return 'E192';
}
