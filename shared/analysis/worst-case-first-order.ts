// The first-order picture of a worst case: from the sensitivities, how far each variable can push
// each output toward its maximum and minimum, its share of the total, and the corner the signs
// predict (the starting point of the vertex check in worst-case.ts).
import type { Sensitivities } from './sensitivity';
import type { ToleranceVariable } from './tolerance-space';

/** −1 low end, +1 high end, 0 nominal (a variable with no effect) per variable. */
export type Sides = Int8Array;

export interface Contribution {
  key: string;
  /** the part whose param this is (absent for a sheet condition) */
  part?: string;
  unit: string;
  /** ∂output/∂variable at nominal (output unit per variable unit) */
  sensitivity: number;
  /** first-order shift of the output when the variable goes to the end that raises it most, ≥ 0 */
  towardMax: number;
  /** first-order shift toward the minimum, ≤ 0 */
  towardMin: number;
  /** |contribution| / Σ|contributions|, 0..1 */
  share: number;
}

export interface FirstOrderPicture {
  /** per output, per variable (variable order) */
  contributions: Contribution[][];
  /** per output, the corner the sensitivity signs predict for its maximum and minimum */
  predicted: Array<{ max: Sides; min: Sides }>;
}

export function firstOrderPicture(vars: readonly ToleranceVariable[], sens: Sensitivities, outputCount: number): FirstOrderPicture {
  const m = vars.length;
  const contributions: Contribution[][] = [];
  const predicted: FirstOrderPicture['predicted'] = [];
  for (let oi = 0; oi < outputCount; oi++) {
    const list: Contribution[] = [];
    const maxS = new Int8Array(m);
    const minS = new Int8Array(m);
    for (let k = 0; k < m; k++) {
      const v = vars[k];
      const s = sens.s[k][oi];
      const up = s * (v.high - v.nominal);
      const down = s * (v.low - v.nominal);
      const part = v.target.kind === 'param' ? v.target.part : undefined;
      list.push({ key: v.key, ...(part ? { part } : {}), unit: v.unit, sensitivity: s, towardMax: Math.max(up, down, 0), towardMin: Math.min(up, down, 0), share: 0 });
      maxS[k] = !Number.isFinite(s) || s === 0 ? 0 : up >= down ? 1 : -1;
      minS[k] = -maxS[k];
    }
    const total = list.reduce((a, c) => a + Math.max(c.towardMax, -c.towardMin), 0);
    for (const c of list) c.share = total > 0 ? Math.max(c.towardMax, -c.towardMin) / total : 0;
    contributions.push(list);
    predicted.push({ max: maxS, min: minS });
  }
  return { contributions, predicted };
}
