// The device laws of docs/engine.md ("Device models"), written again from the documented formulas
// for the hardening tests: no engine code. Given the pin voltages the solver reports, each law gives
// the currents the part must carry; a solution is right when these match the reported currents
// (here) and the currents balance at every net (circuit-laws.ts).
//
// Sources: Shockley's junction law; the standard junction temperature equation for I_S (semiconductor device texts, e.g. Sze & Ng, from memory); Ebers & Moll, Proc. IRE 42(12), 1954;
// the β and Steinhart–Hart thermistor equations (Steinhart & Hart, Deep-Sea Research 15(4), 1968);
// the LDR power law of shared/references.md.
import { steinhartHartResistance } from '../../../support/reference/thermistor';
import { T25, vt as thermalVoltage } from '../../../support/reference/constants';

export type Params = Record<string, unknown>;

/** Expected currents INTO each pin (pin order of the part), and how sharp the law is there. */
export interface LawCurrents {
  /** null for a pin whose current the law does not fix (an ideal link, a source's branch) */
  currents: Array<number | null>;
  /** |di/dv| of the steepest element (S), to weigh the rounding of the pin voltages */
  slope: number;
  /** voltage constraints the law imposes instead (e.g. both ends of a 0 Ω link equal), as [pinA, pinB, volts] */
  constraints: Array<[number, number, number]>;
}

const num = (p: Params, k: string, d?: number): number => {
  const v = p[k];
  if (typeof v === 'number') return v;
  if (d === undefined) throw new Error(`missing param ${k}`);
  return d;
};

/** Below 1 µΩ a resistance is an ideal link (docs/sheet-format.md). */
const isLink = (r: number) => r < 1e-6;

/** I_S(T) = I_S·(T/T₀)^(XTI/n)·exp((T/T₀ − 1)·E_g/(n·V_T(T))) */
export function saturationCurrentAt(is25: number, tK: number, n: number, eg = 1.11, xti = 3): number {
  if (tK === T25) return is25;
  const r = tK / T25;
  return is25 * Math.pow(r, xti / n) * Math.exp(((r - 1) * eg) / (n * thermalVoltage(tK)));
}

/** A junction law i(v) (current into the anode) with its slope. */
type Junction = (v: number) => { i: number; g: number };

function shockley(is: number, nvt: number, breakdown?: { bv: number; ib: number; a: number }): Junction {
  return (v) => {
    let i = is * Math.expm1(v / nvt);
    let g = (is / nvt) * Math.exp(v / nvt);
    if (breakdown) {
      const { bv, ib, a } = breakdown;
      i -= ib * (Math.exp(-(v + bv) / a) - Math.exp(-bv / a));
      g += (ib / a) * Math.exp(-(v + bv) / a);
    }
    return { i, g };
  };
}

/**
 * Current through a junction in series with rs for a terminal voltage v: the junction voltage vj
 * solves j(vj) = (v − vj)/rs, found by bisection (both sides monotone).
 */
function withSeries(j: Junction, rs: number, v: number): { i: number; g: number } {
  if (isLink(rs)) return j(v);
  let lo = Math.min(v, 0) - 1;
  let hi = Math.max(v, 0) + 1;
  const f = (vj: number) => j(vj).i - (v - vj) / rs;
  for (let k = 0; k < 400 && hi - lo > 0; k++) {
    const mid = 0.5 * (lo + hi);
    if (mid === lo || mid === hi) break;
    if (f(mid) > 0) hi = mid;
    else lo = mid;
  }
  const vj = 0.5 * (lo + hi);
  const g = j(vj).g;
  // the slope that weighs rounding is the steeper of the two elements, not their series
  // combination: the internal node's balance is only as good as it times the voltages' rounding
  return { i: (v - vj) / rs, g: Math.max(g, 1 / rs) };
}

const twoPin = (i: number, g: number): LawCurrents => ({ currents: [i, -i], slope: Math.abs(g), constraints: [] });
const resistance = (r: number, va: number, vb: number): LawCurrents =>
  isLink(r) ? { currents: [null, null], slope: 0, constraints: [[0, 1, 0]] } : twoPin((va - vb) / r, 1 / r);

export interface PartEnv {
  temperatureC: number;
  illuminanceLux: number;
}

/** The law of one part at its pin voltages `v` (pin order of the catalogue). */
export function deviceLaw(type: string, p: Params, v: number[], env: PartEnv): LawCurrents | null {
  const tC = typeof p.temperatureC === 'number' ? p.temperatureC : env.temperatureC;
  const tK = tC + 273.15;
  const VT = thermalVoltage(tK);
  switch (type) {
    case 'resistor': {
      const tc = num(p, 'tempco', 0);
      const r = num(p, 'resistance') * (tc === 0 ? 1 : 1 + tc * 1e-6 * (tC - 25));
      return resistance(r, v[0], v[1]);
    }
    case 'switch':
      return resistance(p.closed === false ? num(p, 'offResistance', 1e9) : num(p, 'onResistance', 0.01), v[0], v[1]);
    case 'ldr': {
      const lux = typeof p.illuminanceLux === 'number' ? p.illuminanceLux : env.illuminanceLux;
      const dark = num(p, 'darkResistance', 1e6);
      const r = lux <= 0 ? dark : Math.min(dark, num(p, 'resistanceAt10Lux', 1e4) * Math.pow(lux / 10, -num(p, 'gamma', 0.7)));
      return resistance(r, v[0], v[1]);
    }
    case 'ntc': {
      const sh = p.steinhartHart as { a: number; b: number; c: number } | undefined;
      const r = sh
        ? steinhartHartResistance(sh.a, sh.b, sh.c, tK)
        : num(p, 'nominalResistance', 1e4) * Math.exp(num(p, 'beta', 3950) * (1 / tK - 1 / (num(p, 'nominalTemperatureC', 25) + 273.15)));
      return resistance(r, v[0], v[1]);
    }
    case 'potentiometer': {
      const tc = num(p, 'tempco', 0);
      const total = num(p, 'resistance') * (tc === 0 ? 1 : 1 + tc * 1e-6 * (tC - 25));
      const pos = num(p, 'position', 0.5);
      const f = p.taper === 'log' ? (Math.pow(81, pos) - 1) / 80 : pos;
      const rAW = f <= 0 ? 0 : f >= 1 ? total : total * f;
      const rWB = f >= 1 ? 0 : total - rAW;
      const out: LawCurrents = { currents: [null, null, null], slope: 0, constraints: [] };
      let ia: number | null = null;
      let ib: number | null = null;
      if (isLink(rAW)) out.constraints.push([0, 1, 0]);
      else ia = (v[0] - v[1]) / rAW;
      if (isLink(rWB)) out.constraints.push([2, 1, 0]);
      else ib = (v[2] - v[1]) / rWB;
      out.currents = [ia, ia !== null && ib !== null ? -(ia + ib) : null, ib];
      out.slope = Math.max(isLink(rAW) ? 0 : 1 / rAW, isLink(rWB) ? 0 : 1 / rWB);
      return out;
    }
    case 'dc_current_source': {
      const I = num(p, 'current');
      return { currents: [-I, I], slope: 0, constraints: [] };
    }
    case 'dc_voltage_source':
      // checked as a constraint with its branch current in circuit-laws.ts
      return null;
    case 'load': {
      const x = num(p, 'value');
      if (p.mode === 'resistance') return resistance(x, v[0], v[1]);
      if (p.mode === 'current') return { currents: [x, -x], slope: 0, constraints: [] };
      const vmin = num(p, 'minVoltage', 0.1);
      const d = v[0] - v[1];
      return Math.abs(d) >= vmin ? twoPin(x / d, x / (d * d)) : twoPin((x * d) / (vmin * vmin), x / (vmin * vmin));
    }
    case 'diode': {
      const n = num(p, 'emissionCoefficient', 1);
      const is = saturationCurrentAt(num(p, 'saturationCurrent', 1e-14), tK, n, num(p, 'bandgap', 1.11), num(p, 'saturationCurrentTempExp', 3));
      const bv = p.breakdownVoltage;
      const j = shockley(is, n * VT, typeof bv === 'number' ? { bv, ib: num(p, 'breakdownCurrent', 1e-3), a: n * VT } : undefined);
      const r = withSeries(j, num(p, 'seriesResistance', 0), v[0] - v[1]);
      return twoPin(r.i, r.g);
    }
    case 'zener': {
      const n = num(p, 'emissionCoefficient', 1);
      const is = saturationCurrentAt(num(p, 'saturationCurrent', 1e-14), tK, n);
      const izt = num(p, 'testCurrent', 0.005);
      const vz = num(p, 'zenerVoltage') + num(p, 'zenerTempco', 0) * (tC - 25);
      const j = shockley(is, n * VT, { bv: vz, ib: izt, a: num(p, 'zenerResistance', 10) * izt });
      const r = withSeries(j, num(p, 'seriesResistance', 0), v[0] - v[1]);
      return twoPin(r.i, r.g);
    }
    case 'led': {
      const n = num(p, 'emissionCoefficient', 2);
      const it = num(p, 'testCurrent', 0.02);
      const rs = num(p, 'seriesResistance', 0);
      const vj = num(p, 'forwardVoltage', 2) + num(p, 'forwardVoltageTempco', -0.002) * (tC - 25) - it * rs;
      const is = it / Math.expm1(vj / (n * VT));
      const r = withSeries(shockley(is, n * VT), rs, v[0] - v[1]);
      return twoPin(r.i, r.g);
    }
    case 'npn':
    case 'pnp': {
      const s = type === 'npn' ? 1 : -1;
      const is = saturationCurrentAt(num(p, 'saturationCurrent', 1e-14), tK, 1, num(p, 'bandgap', 1.11), num(p, 'saturationCurrentTempExp', 3));
      const bf = num(p, 'beta', 100);
      const br = num(p, 'reverseBeta', 1);
      const vbe = s * (v[1] - v[2]);
      const vbc = s * (v[1] - v[0]);
      const iF = is * Math.expm1(vbe / VT);
      const iR = is * Math.expm1(vbc / VT);
      const ic = iF - iR * (1 + 1 / br);
      const ib = iF / bf + iR / br;
      const slope = (is / VT) * (Math.exp(vbe / VT) + Math.exp(vbc / VT)) * (1 + 1 / Math.min(bf, br));
      return { currents: [s * ic, s * ib, -s * (ic + ib)], slope, constraints: [] };
    }
    default:
      return null;
  }
}
