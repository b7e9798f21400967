// Sweep step values: linear or logarithmic, endpoints included exactly.
import { AnalysisInputError } from './targets';

export interface StepSpec {
  from: number;
  to: number;
  /** number of points, ≥ 1 (endpoints included) */
  points: number;
  /** 'linear' (default) or 'log' (equal ratios; from and to must have the same sign and not be 0) */
  scale?: 'linear' | 'log';
}

/** The values of a sweep axis. @throws AnalysisInputError with what to change */
export function stepValues(s: StepSpec, what = 'sweep'): Float64Array {
  if (!Number.isFinite(s.from) || !Number.isFinite(s.to)) throw new AnalysisInputError(`${what}: from and to must be finite numbers (got ${s.from} and ${s.to}).`);
  if (!Number.isInteger(s.points) || s.points < 1) throw new AnalysisInputError(`${what}: points must be a whole number ≥ 1 (got ${s.points}).`);
  if (s.points > 1_000_000) throw new AnalysisInputError(`${what}: ${s.points} points is more than the 1,000,000 a sweep allows; use fewer points.`);
  const n = s.points;
  const out = new Float64Array(n);
  if (n === 1) {
    out[0] = s.from;
    return out;
  }
  if (s.scale === 'log') {
    if (s.from === 0 || s.to === 0 || Math.sign(s.from) !== Math.sign(s.to))
      throw new AnalysisInputError(`${what}: a logarithmic sweep needs from and to of the same sign and not zero (got ${s.from} to ${s.to}); use a linear sweep to cross zero.`);
    // base 10 so that decade points come out exact (10 ** 1 is 10, e^ln 10 is not)
    const a = Math.log10(Math.abs(s.from));
    const b = Math.log10(Math.abs(s.to));
    const sign = Math.sign(s.from);
    for (let i = 0; i < n; i++) out[i] = sign * 10 ** (a + ((b - a) * i) / (n - 1));
  } else {
    for (let i = 0; i < n; i++) out[i] = s.from + ((s.to - s.from) * i) / (n - 1);
  }
  out[0] = s.from;
  out[n - 1] = s.to;
  return out;
}
