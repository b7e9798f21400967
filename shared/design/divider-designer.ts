/**
 * Divider designer: ranked E-series resistor pairs (optionally with a series or parallel pair
 * in either leg) that put a loaded tap at a wanted voltage within a current or size budget.
 *
 * Search: walk one leg over the series values, solve the other leg exactly for the target
 * (closed form, divider-model.ts), take the preferred values bracketing that ideal value (and,
 * with partsPerLeg 2, its best series and parallel pairs from the value finder), and repeat with
 * the legs' roles swapped. Every pair is then measured (divider-evaluate.ts) and ranked by the
 * weighted score (divider-score.ts). For single-part legs the search is exact for the output
 * error: no pair within the budget has a smaller error than the best one found. The other score
 * components rank among these bracketing candidates.
 */
import { formatEng } from '../units/engineering';
import { PREFERRED_RANGE, preferredValuesBetween } from '../units/eseries';
import { formatRkm } from '../units/rkm';
import { lowerBound, upperBound } from '../units/sorted-search';
import { evaluateDivider, type DividerCandidate, type DividerLeg } from './divider-evaluate';
import { bottomForOutput, topForOutput } from './divider-model';
import { resolveWeights, type ScoreWeights } from './divider-score';
import { checkDividerSpec, type DividerSpec } from './divider-spec';
import { searchMatches, type Topology } from './value-finder';

export type { DividerCandidate, DividerLeg } from './divider-evaluate';
export type { DividerSpec, DividerBudget, SupplySpec } from './divider-spec';
export type { DividerLoad } from './divider-model';
export { DEFAULT_WEIGHTS, type ScoreWeights, type Score, type ScoreComponents } from './divider-score';

export type DividerDesign =
  | {
      readonly ok: true;
      /** Best first (lowest score.total). */
      readonly candidates: readonly DividerCandidate[];
      /** Distinct pairs measured. */
      readonly considered: number;
      /** The R1 + R2 window searched, ohms. */
      readonly totalRange: { readonly min: number; readonly max: number };
      readonly weights: ScoreWeights;
      /** Cautions about the request as a whole (hazardous supply voltage). */
      readonly warnings: readonly string[];
    }
  | { readonly ok: false; readonly message: string };

/** Above this the supply is past the extra-low-voltage touch limit many codes use for DC (60 V; from memory). */
const HAZARDOUS_DC_VOLTS = 60;

const single = (r: number): DividerLeg => ({ topology: 'single', parts: [r], value: r, expression: formatRkm(r) });

/**
 * Designs a divider for `spec` (volts, ohms, amperes; see DividerSpec). Returns up to
 * `spec.limit` (default 10) candidates ranked by score, or a message saying what to change.
 */
export function designDivider(spec: DividerSpec): DividerDesign {
  const checked = checkDividerSpec(spec);
  if (!checked.ok) return checked;
  let weights: ScoreWeights;
  try {
    weights = resolveWeights(spec.weights);
  } catch (e) {
    return { ok: false, message: (e as Error).message };
  }
  const c = checked.spec;
  const powerRating = spec.powerRating ?? 0.25;
  if (!(powerRating > 0)) return { ok: false, message: 'The power rating must be above 0 W.' };
  const maxError = spec.maxError ?? 0.1;
  if (!(maxError > 0)) return { ok: false, message: 'maxError is a fraction above 0 (0.1 drops candidates more than 10 % off).' };

  const values = preferredValuesBetween(spec.series, PREFERRED_RANGE.min, c.totalMax);
  const pairTopologies: Topology[] = spec.partsPerLeg === 2 ? ['series', 'parallel'] : [];
  const found = new Map<string, DividerCandidate>();
  const consider = (top: DividerLeg, bottom: DividerLeg) => {
    const total = top.value + bottom.value;
    if (total < c.totalMin * (1 - 1e-12) || total > c.totalMax * (1 + 1e-12)) return;
    const key = `${top.expression}|${bottom.expression}`;
    if (found.has(key)) return;
    const candidate = evaluateDivider(c, top, bottom, weights, powerRating);
    if (candidate.output > 0 && Math.abs(candidate.error) <= maxError) found.set(key, candidate);
  };
  // For a fixed walked leg the output is monotonic in the other leg, so among the allowed values
  // (those keeping R1 + R2 in the window) the least-error single part is the nearest allowed
  // value below or above the ideal one: taking both makes the search exact for the error.
  const bracket = (ideal: number, other: number): number[] => {
    const lo = c.totalMin - other;
    const hi = c.totalMax - other;
    const out: number[] = [];
    const below = upperBound(values, Math.min(ideal, hi) * (1 + 1e-12)) - 1;
    if (below >= 0 && values[below] >= lo * (1 - 1e-12)) out.push(values[below]);
    const above = lowerBound(values, Math.max(ideal, lo) * (1 - 1e-12));
    if (above < values.length && values[above] <= hi * (1 + 1e-12)) out.push(values[above]);
    return out;
  };
  // Pair realisations land within a series step of the ideal value (E6's widest step is ×1.5),
  // so skip the search when the ideal leg puts the total far outside the window.
  const pairs = (ideal: number, other: number): DividerLeg[] =>
    pairTopologies.length === 0 || ideal + other < c.totalMin / 2 || ideal + other > c.totalMax * 2
      ? []
      : searchMatches(values, ideal, pairTopologies, 2).flat();

  for (const walked of values) {
    if (walked >= c.totalMax) break;
    const idealTop = topForOutput(c.supply.nominal, c.target, walked, c.load);
    if (idealTop !== null && idealTop > 0) {
      for (const r of bracket(idealTop, walked)) consider(single(r), single(walked));
      for (const leg of pairs(idealTop, walked)) consider(leg, single(walked));
    }
    const idealBottom = bottomForOutput(c.supply.nominal, c.target, walked, c.load);
    if (idealBottom !== null && idealBottom > 0) {
      for (const r of bracket(idealBottom, walked)) consider(single(walked), single(r));
      for (const leg of pairs(idealBottom, walked)) consider(single(walked), leg);
    }
  }

  const ranked = [...found.values()].sort(
    (x, y) => x.score.total - y.score.total || Math.abs(x.error) - Math.abs(y.error),
  );
  if (ranked.length === 0) {
    const range = `${formatEng(c.totalMin, 'Ω')} to ${formatEng(c.totalMax, 'Ω')}`;
    const loadNote = c.load.kind === 'current' ? ' The load current may be too large for a divider this size; allow more divider current.' : '';
    return {
      ok: false,
      message:
        `No ${spec.series} pair gives ${formatEng(c.target, 'V')} within ${Number((maxError * 100).toPrecision(3))} % ` +
        `with R1 + R2 from ${range}.${loadNote} Try a finer series, partsPerLeg 2 or a wider budget.`,
    };
  }
  const warnings =
    c.supply.max > HAZARDOUS_DC_VOLTS
      ? [
          `The supply reaches ${formatEng(c.supply.max, 'V')}, above ${HAZARDOUS_DC_VOLTS} V DC: a touch hazard. Check each resistor's ` +
            'voltage rating (limiting element voltage, IEC 60115-1) and creepage, and follow local codes and licensed practice.',
        ]
      : [];
  return {
    ok: true,
    candidates: ranked.slice(0, Math.max(1, spec.limit ?? 10)),
    considered: found.size,
    totalRange: { min: c.totalMin, max: c.totalMax },
    weights,
    warnings,
  };
}
