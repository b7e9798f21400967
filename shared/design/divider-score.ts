/**
 * How divider candidates are ranked: a weighted sum of dimensionless components, lower is
 * better. Each candidate carries its components so a user can see why it ranks where it does.
 *
 *   error      |V_out − V_target| / V_target in percent (nominal supply, nominal parts, loaded)
 *   window     (V_out,max − V_out,min) / V_target in percent (worst case over tolerance and supply)
 *   current    divider current V_max/(R1+R2) as a fraction of the budget (1 = at the limit)
 *   partCount  parts beyond the basic two (0, 1 or 2)
 *
 * With the defaults { error: 1, window: 0.5, current: 0.2, partCount: 0.1 }, 1 % of output error
 * weighs as much as 2 % of window width, five times the whole current budget, or ten extra parts.
 */

export interface ScoreWeights {
  readonly error: number;
  readonly window: number;
  readonly current: number;
  readonly partCount: number;
}

export const DEFAULT_WEIGHTS: ScoreWeights = Object.freeze({ error: 1, window: 0.5, current: 0.2, partCount: 0.1 });

export type ScoreComponents = ScoreWeights;

export interface Score {
  /** Σ weight × component; lower ranks first. */
  readonly total: number;
  readonly components: ScoreComponents;
  readonly weights: ScoreWeights;
}

/** Fills missing weights with the defaults; refuses negative or non-finite weights. */
export function resolveWeights(weights: Partial<ScoreWeights> = {}): ScoreWeights {
  const out = { ...DEFAULT_WEIGHTS, ...weights };
  for (const [name, w] of Object.entries(out)) {
    if (!Number.isFinite(w) || w < 0) throw new RangeError(`score weight '${name}' must be a number ≥ 0; got ${w}`);
  }
  return out;
}

/** The weighted score of one candidate's components. */
export function scoreOf(components: ScoreComponents, weights: ScoreWeights): Score {
  const total =
    weights.error * components.error +
    weights.window * components.window +
    weights.current * components.current +
    weights.partCount * components.partCount;
  return { total, components, weights };
}
