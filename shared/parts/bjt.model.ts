import { GROUND, nodeV, type Device, type DeviceContext, type DeviceModel } from '../engine/device';
import { criticalVoltage, dlimexp, expLimitFor, limexpm1, pnjlim, scaleSaturationCurrent, type ExpLimit } from '../engine/junction';
import type { ParamsOf } from '../sheet/schema';
import { beyondModelWarning, fmt, saturationCurrentProblem } from './model-helpers';

type BjtParams = ParamsOf<'npn'>;

export interface EbersMollEval {
  /** currents into c, b, e (n-type sense) */
  ic: number;
  ib: number;
  ie: number;
  /** ∂/∂vbe and ∂/∂vbc of ic, ib, ie */
  jac: [[number, number], [number, number], [number, number]];
}

/**
 * Ebers–Moll transport model (Ebers & Moll, Proc. IRE 42(12), 1954), npn sense:
 *   I_F = I_S(e^{vbe/V_T} − 1),  I_R = I_S(e^{vbc/V_T} − 1)
 *   i_C = I_F − I_R − I_R/β_R,   i_B = I_F/β_F + I_R/β_R,   i_E = −(i_C + i_B)
 * with gmin across each junction. `lim` is where the exponentials continue linearly
 * (expLimitFor(is); by default at an exponent of 80).
 */
export function ebersMoll(is: number, vt: number, bf: number, br: number, vbe: number, vbc: number, gmin: number, lim?: ExpLimit): EbersMollEval {
  const iF = is * limexpm1(vbe / vt, lim);
  const iR = is * limexpm1(vbc / vt, lim);
  const gf = (is / vt) * dlimexp(vbe / vt, lim);
  const gr = (is / vt) * dlimexp(vbc / vt, lim);
  const ic = iF - iR - iR / br - gmin * vbc;
  const ib = iF / bf + iR / br + gmin * (vbe + vbc);
  const ie = -(ic + ib);
  const dic: [number, number] = [gf, -gr * (1 + 1 / br) - gmin];
  const dib: [number, number] = [gf / bf + gmin, gr / br + gmin];
  const die: [number, number] = [-(dic[0] + dib[0]), -(dic[1] + dib[1])];
  return { ic, ib, ie, jac: [dic, dib, die] };
}

export function bjtSaturationCurrent(p: BjtParams, temperatureK: number): number {
  return scaleSaturationCurrent(p.saturationCurrent, temperatureK, 1, p.bandgap, p.saturationCurrentTempExp);
}

function createBjt(polarity: 1 | -1, ctx: DeviceContext<BjtParams>): Device {
  const { partId, params, env, pins } = ctx;
  const [c, b, e] = pins;
  const vt = env.vt;
  const is = bjtSaturationCurrent(params, env.temperatureK);
  const vcrit = criticalVoltage(vt, is);
  const lim = expLimitFor(is);
  const bf = params.beta;
  const br = params.reverseBeta;
  let vbeOld = 0;
  let vbcOld = 0;
  let cold = true;
  const p = polarity;
  const evalAt = (x: Float64Array, gmin: number) => {
    const vbe = p * (nodeV(x, b) - nodeV(x, e));
    const vbc = p * (nodeV(x, b) - nodeV(x, c));
    return { vbe, vbc, m: ebersMoll(is, vt, bf, br, vbe, vbc, gmin, lim) };
  };
  return {
    partId,
    nonlinear: true,
    nodes: pins.filter((n) => n !== GROUND),
    begin(x, start) {
      cold = start !== 'warm';
      if (!cold) {
        vbeOld = p * (nodeV(x, b) - nodeV(x, e));
        vbcOld = p * (nodeV(x, b) - nodeV(x, c));
      }
    },
    load(s, x) {
      let vbe: number;
      let vbc: number;
      if (cold) {
        // Usual initial junction guess (common practice): base-emitter at its critical voltage, base-collector off
        vbe = vcrit;
        vbc = 0;
        cold = false;
        s.markLimited();
      } else {
        const vbeNew = p * (nodeV(x, b) - nodeV(x, e));
        const vbcNew = p * (nodeV(x, b) - nodeV(x, c));
        vbe = pnjlim(vbeNew, vbeOld, vt, vcrit, lim.u * vt);
        vbc = pnjlim(vbcNew, vbcOld, vt, vcrit, lim.u * vt);
        if (vbe !== vbeNew || vbc !== vbcNew) s.markLimited();
      }
      vbeOld = vbe;
      vbcOld = vbc;
      const m = ebersMoll(is, vt, bf, br, vbe, vbc, s.gmin, lim);
      s.nonlinear(
        [c, b, e],
        [p * m.ic, p * m.ib, p * m.ie],
        [
          [b, e, p * vbe],
          [b, c, p * vbc],
        ],
        m.jac,
      );
    },
    residual(x, sink, gmin) {
      const { m } = evalAt(x, gmin);
      // rounding scale of each current: its slopes times the voltages they act on
      const vb = Math.abs(nodeV(x, b));
      const ve = vb + Math.abs(nodeV(x, e));
      const vc = vb + Math.abs(nodeV(x, c));
      const scale = (k: number, i: number) => Math.abs(i) + Math.abs(m.jac[k][0]) * ve + Math.abs(m.jac[k][1]) * vc;
      sink.add(c, p * m.ic, scale(0, m.ic));
      sink.add(b, p * m.ib, scale(1, m.ib));
      sink.add(e, p * m.ie, scale(2, m.ie));
    },
    pinCurrents(x, gmin) {
      const { m } = evalAt(x, gmin);
      return [p * m.ic, p * m.ib, p * m.ie];
    },
    report(x, pv, pi) {
      const vbe = p * (pv[1] - pv[2]);
      const vbc = p * (pv[1] - pv[0]);
      const vce = p * (pv[0] - pv[2]);
      const ic = p * pi[0];
      const ib = p * pi[1];
      const kind = p === 1 ? 'NPN' : 'PNP';
      let region: string;
      const warnings = [];
      if (vbe < 0.4 && vbc < 0.4) region = 'cut-off';
      else if (vbc >= 0.4 && vbe < 0.4) region = 'reverse-active';
      else if (ib > 0 && vbc > 0 && ic < 0.9 * bf * ib) region = 'saturation';
      else region = 'forward-active';
      if (region === 'cut-off')
        warnings.push({
          code: 'transistor_cutoff',
          severity: 'caution' as const,
          message: `${partId} (${kind}) is cut off: V_BE = ${fmt(vbe, 'V')}, I_C = ${fmt(ic, 'A')}. That is right for a switch that is off; for an amplifier or a bias network, raise the base drive.`,
        });
      else if (region === 'saturation')
        warnings.push({
          code: 'transistor_saturated',
          severity: 'caution' as const,
          message: `${partId} (${kind}) is saturated: V_CE = ${fmt(vce, 'V')}, I_C/I_B = ${Number((ic / ib).toPrecision(3))} against β = ${bf}. That is right for a switch that is on; for linear operation, reduce the base drive or the collector resistance.`,
        });
      else if (region === 'reverse-active')
        warnings.push({
          code: 'transistor_reverse_active',
          severity: 'warning' as const,
          message: `${partId} (${kind}) operates in reverse (collector and emitter roles swapped): check its pin connections.`,
        });
      if (vbe / vt > lim.u || vbc / vt > lim.u) warnings.unshift(beyondModelWarning(partId, Math.max(Math.abs(pi[0]), Math.abs(pi[2]))));
      return { derived: { region, vbe, vce, ic, ib, forcedBeta: ib !== 0 ? ic / ib : 0 }, warnings };
    },
  };
}

/** Current gains the transport equations can carry: 1/β must not overflow, β·I_B must not either. */
const GAIN_RANGE = { min: 1e-12, max: 1e12 } as const;

function checkBjt(p: BjtParams, env: { temperatureK: number; temperatureC: number }): Array<[string, string]> {
  const out: Array<[string, string]> = [];
  for (const [field, name] of [['beta', 'forward'], ['reverseBeta', 'reverse']] as const) {
    const b = p[field];
    if (!(b >= GAIN_RANGE.min && b <= GAIN_RANGE.max))
      out.push([field, `is a ${name} current gain of ${b}, outside the ${GAIN_RANGE.min} to ${GAIN_RANGE.max} the transistor equations can carry (real parts: about 10 to 1000 forward, 0.1 to 10 reverse)`]);
  }
  return [...out, ...saturationCurrentProblem('saturationCurrent', bjtSaturationCurrent(p, env.temperatureK), env.temperatureC)];
}

export const npnModel: DeviceModel<BjtParams> = {
  topology: () => [
    { kind: 'resistive', a: 1, b: 2 },
    { kind: 'resistive', a: 1, b: 0 },
  ],
  check: checkBjt,
  create: (ctx) => createBjt(1, ctx),
};

export const pnpModel: DeviceModel<BjtParams> = {
  topology: () => [
    { kind: 'resistive', a: 1, b: 2 },
    { kind: 'resistive', a: 1, b: 0 },
  ],
  check: checkBjt,
  create: (ctx) => createBjt(-1, ctx),
};
