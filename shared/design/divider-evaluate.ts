/**
 * Everything the divider designer reports about one pair of legs: loaded output and its error,
 * worst-case window, currents, dissipation per part, Thevenin resistance and score.
 */
import { formatEng } from '../units/engineering';
import { formatRkm } from '../units/rkm';
import {
  dividerOutput,
  outputWindow,
  supplyCurrent,
  theveninResistance,
  type OutputWindow,
} from './divider-model';
import type { CheckedSpec } from './divider-spec';
import { scoreOf, type Score, type ScoreWeights } from './divider-score';
import type { ValueMatch } from './value-finder';

/** One leg of the divider: a single part or a combination (see value-finder's Topology). */
export type DividerLeg = Pick<ValueMatch, 'topology' | 'parts' | 'value' | 'expression'>;

export interface DividerCandidate {
  /** R1, supply to tap. */
  readonly top: DividerLeg;
  /** R2, tap to ground. */
  readonly bottom: DividerLeg;
  /** Tap voltage at the nominal supply with nominal parts and the load connected, V. */
  readonly output: number;
  /** Signed relative error of `output` against the target: 0.01 = 1 % high. */
  readonly error: number;
  /** Exact worst-case tap voltage over part tolerance and the supply range, V. */
  readonly window: OutputWindow;
  /** The divider's own current V_max/(R1+R2), A (what the budget limits). */
  readonly quiescentCurrent: number;
  /** Current from the supply into R1 at V_max, load included, nominal parts, A. */
  readonly supplyCurrent: number;
  /**
   * Upper bound on each part's dissipation at V_max over tolerance, W, in the order of the leg's
   * parts. Exact for a single-part leg; for a pair it may exceed the true worst case by ~2·t.
   */
  readonly dissipation: { readonly top: readonly number[]; readonly bottom: readonly number[] };
  /** R1 ∥ R2 with nominal parts, Ω: the source resistance seen at the tap. */
  readonly thevenin: number;
  /** R1 + R2, Ω. */
  readonly totalResistance: number;
  readonly score: Score;
  /** Cautions for this candidate (parts run hot). */
  readonly warnings: readonly string[];
}

/** Worst (largest) voltage across and current through each leg at V_max over the tolerance corners. */
function legStress(spec: CheckedSpec, top: number, bottom: number) {
  const t = spec.tolerance;
  const stress = { topV: 0, topI: 0, topP: 0, bottomV: 0, bottomI: 0, bottomP: 0 };
  const v = spec.supply.max;
  for (const a of [top * (1 - t), top * (1 + t)]) {
    for (const b of [bottom * (1 - t), bottom * (1 + t)]) {
      const out = dividerOutput(v, a, b, spec.load);
      const vt = v - out;
      stress.topV = Math.max(stress.topV, vt);
      stress.topI = Math.max(stress.topI, vt / a);
      stress.topP = Math.max(stress.topP, (vt * vt) / a);
      stress.bottomV = Math.max(stress.bottomV, out);
      stress.bottomI = Math.max(stress.bottomI, out / b);
      stress.bottomP = Math.max(stress.bottomP, (out * out) / b);
    }
  }
  return stress;
}

function partPowers(leg: DividerLeg, vMax: number, iMax: number, pMax: number, t: number): number[] {
  switch (leg.topology) {
    case 'single':
      return [pMax];
    case 'series':
    case 'series3':
      return leg.parts.map((r) => iMax * iMax * r * (1 + t));
    case 'parallel':
    case 'parallel3':
      return leg.parts.map((r) => (vMax * vMax) / (r * (1 - t)));
    default:
      // Mixed forms: no part can take more than the whole leg's worst power.
      return leg.parts.map(() => vMax * iMax);
  }
}

/** Measures and scores one candidate against a checked request. */
export function evaluateDivider(
  spec: CheckedSpec,
  top: DividerLeg,
  bottom: DividerLeg,
  weights: ScoreWeights,
  powerRating: number,
): DividerCandidate {
  const output = dividerOutput(spec.supply.nominal, top.value, bottom.value, spec.load);
  const error = (output - spec.target) / spec.target;
  const window = outputWindow(spec.supply, top.value, bottom.value, spec.tolerance, spec.tolerance, spec.load);
  const totalResistance = top.value + bottom.value;
  const quiescentCurrent = spec.supply.max / totalResistance;
  const s = legStress(spec, top.value, bottom.value);
  const dissipation = {
    top: partPowers(top, s.topV, s.topI, s.topP, spec.tolerance),
    bottom: partPowers(bottom, s.bottomV, s.bottomI, s.bottomP, spec.tolerance),
  };
  const warnings: string[] = [];
  const check = (leg: DividerLeg, powers: number[], name: string) =>
    powers.forEach((p, i) => {
      if (p > 0.5 * powerRating) {
        warnings.push(
          `${name} (${formatRkm(leg.parts[i])}) may dissipate up to ${formatEng(p, 'W')} at the highest supply, ` +
            `over half its ${formatEng(powerRating, 'W')} rating: choose a higher rating or larger values ` +
            '(common practice: at most 50 % of rating). A resistor run this hard gets hot; keep it clear of other parts.',
        );
      }
    });
  check(top, dissipation.top, 'R1');
  check(bottom, dissipation.bottom, 'R2');
  const components = {
    error: Math.abs(error) * 100,
    window: ((window.max - window.min) / spec.target) * 100,
    current: quiescentCurrent / spec.referenceCurrent,
    partCount: top.parts.length + bottom.parts.length - 2,
  };
  return {
    top,
    bottom,
    output,
    error,
    window,
    quiescentCurrent,
    supplyCurrent: supplyCurrent(spec.supply.max, top.value, bottom.value, spec.load),
    dissipation,
    thevenin: theveninResistance(top.value, bottom.value),
    totalResistance,
    score: scoreOf(components, weights),
    warnings,
  };
}
