/**
 * What the divider designer is asked for, and the checks that turn a bad request into a message
 * a user can act on before any search runs.
 */
import type { ESeriesName } from '../units/eseries';
import { formatEng } from '../units/engineering';
import type { DividerLoad } from './divider-model';
import type { ScoreWeights } from './divider-score';

/** A fixed supply (V), or its range; `nominal` defaults to the midpoint of min and max. */
export type SupplySpec = number | { readonly min: number; readonly max: number; readonly nominal?: number };

/**
 * How large the divider may be. `maxQuiescentCurrent` (A) bounds the divider's own current
 * V_max/(R1+R2); candidates span `spanDecades` (default 1) of total resistance above the least
 * allowed. `totalResistance` (Ω) asks for R1+R2 within ×/÷(1 + spread) of it (spread default 0.2).
 */
export type DividerBudget =
  | { readonly maxQuiescentCurrent: number; readonly spanDecades?: number }
  | { readonly totalResistance: number; readonly spread?: number };

export interface DividerSpec {
  /** Supply voltage, V. */
  readonly supply: SupplySpec;
  /** Wanted tap voltage at the nominal supply, with the load connected, V. */
  readonly target: number;
  /** What the tap feeds (default none). */
  readonly load?: DividerLoad;
  readonly budget: DividerBudget;
  /** Tolerance of each resistor, a fraction (0.01 = ±1 %). */
  readonly tolerance: number;
  /** Series the parts come from. */
  readonly series: ESeriesName;
  /** 2 lets either leg be a series or parallel pair (default 1: one part per leg). */
  readonly partsPerLeg?: 1 | 2;
  /** Ranking weights; missing ones take DEFAULT_WEIGHTS. */
  readonly weights?: Partial<ScoreWeights>;
  /** How many candidates to return (default 10). */
  readonly limit?: number;
  /** Rated power of each part, W (default 0.25, common practice for axial film), for warnings. */
  readonly powerRating?: number;
  /** Drop candidates whose nominal output is off the target by more than this fraction (default 0.1). */
  readonly maxError?: number;
}

export interface SupplyRange {
  readonly min: number;
  readonly nominal: number;
  readonly max: number;
}

/** The request checked and normalised: supply as a range, total-resistance window in ohms. */
export interface CheckedSpec {
  readonly supply: SupplyRange;
  readonly target: number;
  readonly load: DividerLoad;
  readonly tolerance: number;
  /** Allowed R1 + R2, ohms. */
  readonly totalMin: number;
  readonly totalMax: number;
  /** The current that scores 1 in the `current` component: the budget, A. */
  readonly referenceCurrent: number;
}

const v = (x: number) => formatEng(x, 'V', { digits: 4 });
const positive = (x: unknown): x is number => typeof x === 'number' && Number.isFinite(x) && x > 0;

/** Checks a request; the message says which input is wrong and what to change. */
export function checkDividerSpec(spec: DividerSpec): { ok: true; spec: CheckedSpec } | { ok: false; message: string } {
  const fail = (message: string) => ({ ok: false as const, message });
  const s = spec.supply;
  const supply: SupplyRange =
    typeof s === 'number' ? { min: s, nominal: s, max: s } : { min: s.min, max: s.max, nominal: s.nominal ?? (s.min + s.max) / 2 };
  if (![supply.min, supply.nominal, supply.max].every(positive)) return fail('The supply voltage must be above 0 V.');
  if (supply.min > supply.max) return fail(`The supply minimum (${v(supply.min)}) is above its maximum (${v(supply.max)}); swap them.`);
  if (supply.nominal < supply.min || supply.nominal > supply.max) {
    return fail(`The nominal supply (${v(supply.nominal)}) must lie between its minimum and maximum.`);
  }
  if (!positive(spec.target)) return fail('The wanted output must be above 0 V: a divider gives a voltage between ground and the supply.');
  if (spec.target >= supply.min) {
    return fail(
      `The wanted output (${v(spec.target)}) must be below the lowest supply (${v(supply.min)}): a resistive divider can only divide down.`,
    );
  }
  if (!(spec.tolerance >= 0 && spec.tolerance < 1)) return fail('The resistor tolerance is a fraction from 0 to below 1 (0.01 for ±1 %).');
  const load = spec.load ?? { kind: 'none' };
  if (load.kind === 'resistance' && !positive(load.ohms)) return fail('The load resistance must be above 0 Ω.');
  if (load.kind === 'current' && !(Number.isFinite(load.amps) && load.amps >= 0)) {
    return fail('The load current is what the load draws from the tap: 0 A or more.');
  }

  const b = spec.budget;
  if ('maxQuiescentCurrent' in b) {
    if (!positive(b.maxQuiescentCurrent)) return fail('The maximum divider current must be above 0 A.');
    const span = b.spanDecades ?? 1;
    if (!positive(span)) return fail('spanDecades must be above 0.');
    const totalMin = supply.max / b.maxQuiescentCurrent;
    return {
      ok: true,
      spec: { supply, target: spec.target, load, tolerance: spec.tolerance, totalMin, totalMax: totalMin * 10 ** span, referenceCurrent: b.maxQuiescentCurrent },
    };
  }
  if (!positive(b.totalResistance)) return fail('The target total resistance must be above 0 Ω.');
  const spread = b.spread ?? 0.2;
  if (!positive(spread)) return fail('The total-resistance spread must be above 0 (0.2 allows ±20 %).');
  return {
    ok: true,
    spec: {
      supply,
      target: spec.target,
      load,
      tolerance: spec.tolerance,
      totalMin: b.totalResistance / (1 + spread),
      totalMax: b.totalResistance * (1 + spread),
      referenceCurrent: supply.max / b.totalResistance,
    },
  };
}
