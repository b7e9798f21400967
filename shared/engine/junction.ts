// pn-junction helpers: limited exponentials, the published junction-voltage limiting step (L. W.
// Nagel, UCB/ERL memorandum M520, 1975) and the standard temperature scaling of saturation
// currents, I_S(T) = I_S·(T/T0)^(XTI/n)·exp((T/T0 − 1)·E_g/(n·V_T)) (semiconductor device texts,
// e.g. Sze & Ng, "Physics of Semiconductor Devices", 3rd ed.; from memory).
import { NOMINAL_TEMPERATURE_K, thermalVoltage } from './constants';

/**
 * Exponents up to at least this continue as exp(); above the junction's own limit exp() continues
 * linearly (value and slope continuous), so a wild Newton iterate cannot overflow.
 */
export const EXP_LIMIT = 80;
/** The linear continuation never starts later than this (e^700 ≈ 1e304 still fits a double). */
export const MAX_EXP_LIMIT = 700;
/**
 * A junction follows the exact exponential up to at least this current (A). With a tiny saturation
 * current (a wide-bandgap LED with n = 1, any junction far below 0 °C) e^80·I_S is far below the
 * circuit's current, so a fixed limit of 80 would replace the real diode by a weak linear one and
 * give a wrong operating point (hard case 17 in tests/fixtures/hard-circuits).
 */
export const JUNCTION_CURRENT_CEILING = 1e12;

/** Where an exponential of scale `scale` (A) switches to its linear continuation. */
export interface ExpLimit {
  /** exponent at which the continuation starts */
  u: number;
  /** e^u */
  e: number;
}

/** The exponent limit for a junction term scale·e^u: exact up to JUNCTION_CURRENT_CEILING. */
export function expLimitFor(scale: number): ExpLimit {
  const wanted = Math.log(JUNCTION_CURRENT_CEILING / scale);
  const u = Math.min(MAX_EXP_LIMIT, Math.max(EXP_LIMIT, Number.isFinite(wanted) ? wanted : MAX_EXP_LIMIT));
  return { u, e: Math.exp(u) };
}

const DEFAULT_LIMIT: ExpLimit = { u: EXP_LIMIT, e: Math.exp(EXP_LIMIT) };

/** exp(u) for u ≤ lim.u, continued linearly above (value and slope continuous). */
export function limexp(u: number, lim: ExpLimit = DEFAULT_LIMIT): number {
  return u <= lim.u ? Math.exp(u) : lim.e * (1 + u - lim.u);
}
/** limexp(u) − 1 without the cancellation of exp(u) − 1 near u = 0 (it matters when I_S is large). */
export function limexpm1(u: number, lim: ExpLimit = DEFAULT_LIMIT): number {
  return u <= lim.u ? Math.expm1(u) : lim.e * (1 + u - lim.u) - 1;
}
/** d/du limexp(u) */
export function dlimexp(u: number, lim: ExpLimit = DEFAULT_LIMIT): number {
  return u <= lim.u ? Math.exp(u) : lim.e;
}

/** Critical voltage of a junction: beyond it steps are limited logarithmically. */
export function criticalVoltage(nvt: number, is: number): number {
  return nvt * Math.log(nvt / (Math.SQRT2 * is));
}

/**
 * Junction-voltage limiting: keep a Newton step on an exponential within where the linearisation
 * is trustworthy. Returns the limited voltage (or vnew itself).
 */
export function pnjlim(vnew: number, vold: number, nvt: number, vcrit: number, vlin = Infinity): number {
  // Above vlin the exponential is continued linearly (see limexp): the junction is a plain
  // conductance there and needs no limiting. Without this, an ideal source holding a junction at
  // 1 kV would take thousands of 0.5 V steps to get there (hard case 63).
  if (vold >= vlin && vnew >= vlin) return vnew;
  if (vnew > vcrit && Math.abs(vnew - vold) > 2 * nvt) {
    if (vold > 0) {
      const arg = 1 + (vnew - vold) / nvt;
      return arg > 0 ? vold + nvt * Math.log(arg) : vcrit;
    }
    // From reverse bias into conduction: step to where the exponential starts. With a huge I_S the
    // critical voltage is negative and vnew may be ≤ n·V_T, where the log would give −∞ or NaN
    // (hard case 61); the exponential is tame there, so take the step as it is.
    return vnew > nvt ? nvt * Math.log(vnew / nvt) : vnew;
  }
  if (vnew < 0) {
    // limit large negative steps too (a common extension of the published step)
    const arg = vold > 0 ? -1 - vold : 2 * vold - 1;
    if (vnew < arg) return arg;
  }
  return vnew;
}

/**
 * Saturation current at temperature T (K), given its value at 25 °C:
 * I_S(T) = I_S·(T/T₀)^(XTI/n)·exp((T/T₀ − 1)·E_g/(n·V_T(T))). Exactly I_S at T₀ = 298.15 K.
 */
export function scaleSaturationCurrent(is25: number, temperatureK: number, n: number, eg: number, xti: number): number {
  if (temperatureK === NOMINAL_TEMPERATURE_K) return is25;
  const ratio = temperatureK / NOMINAL_TEMPERATURE_K;
  const vt = thermalVoltage(temperatureK);
  return is25 * Math.pow(ratio, xti / n) * Math.exp(((ratio - 1) * eg) / (n * vt));
}

/**
 * A junction with optional reverse breakdown, as used by the diode, the Zener and the LED:
 *   i(v) = I_S·(e^{v/(n·V_T)} − 1) − I_B·(e^{−(v+B)/a} − e^{−B/a}) + gmin·v
 * where the breakdown term (absent when B is undefined) passes I_B at v = −B with slope I_B/a.
 * Build it with `junctionParams` so the exponent limits match the scales.
 */
export interface JunctionParams {
  is: number;
  nvt: number;
  lim: ExpLimit;
  breakdown?: { voltage: number; current: number; slope: number; lim: ExpLimit };
}

export function junctionParams(is: number, nvt: number, breakdown?: { voltage: number; current: number; slope: number }): JunctionParams {
  return {
    is,
    nvt,
    lim: expLimitFor(is),
    ...(breakdown ? { breakdown: { ...breakdown, lim: expLimitFor(breakdown.current) } } : {}),
  };
}

export interface JunctionEval {
  i: number;
  g: number;
}

export function junctionCurrent(p: JunctionParams, v: number, gmin: number): JunctionEval {
  const u = v / p.nvt;
  let i = p.is * limexpm1(u, p.lim);
  let g = (p.is / p.nvt) * dlimexp(u, p.lim);
  if (p.breakdown) {
    const { voltage: bv, current: ib, slope: a, lim } = p.breakdown;
    const w = -(v + bv) / a;
    i -= ib * (limexp(w, lim) - Math.exp(-bv / a));
    g += (ib / a) * dlimexp(w, lim);
  }
  return { i: i + gmin * v, g: g + gmin };
}

/** Limiting for a junction with optional breakdown (forward via pnjlim; breakdown mirrored). */
export function limitJunction(p: JunctionParams, vnew: number, vold: number): number {
  if (p.breakdown) {
    const { voltage: bv, current: ib, slope: a } = p.breakdown;
    if (vnew < Math.min(0, -bv + 10 * a)) {
      const vcritB = criticalVoltage(a, ib);
      const tnew = -(vnew + bv);
      const t = pnjlim(tnew, -(vold + bv), a, vcritB, p.breakdown.lim.u * a);
      // unchanged: return vnew itself, since −(−(v + B) + B) need not round back to v and would
      // count as a limited step in every iteration (hard case 62)
      return t === tnew ? vnew : -(t + bv);
    }
  }
  return pnjlim(vnew, vold, p.nvt, criticalVoltage(p.nvt, p.is), p.lim.u * p.nvt);
}
