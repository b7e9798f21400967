// An independent solve of a four-resistor NPN bias network in the Ebers–Moll transport model
// (J. J. Ebers & J. L. Moll, "Large-signal behavior of junction transistors", Proc. IRE 42(12),
// 1954), and the textbook V_BE = 0.7 V / I_C = β·I_B approximation (Sedra & Smith,
// "Microelectronic Circuits", BJT DC-analysis chapter; Boylestad & Nashelsky, "Electronic Devices
// and Circuit Theory", voltage-divider bias, exact analysis). Test support only: no engine code.

export interface BiasNetwork {
  vcc: number;
  rb1: number; // top of the base divider
  rb2: number; // bottom of the base divider
  rc: number;
  re: number;
  beta: number;
}

export interface BiasPoint {
  vb: number;
  ve: number;
  vc: number;
  ic: number;
  ib: number;
  ie: number;
  vbe: number;
  vce: number;
}

/**
 * Ebers–Moll transport model, npn: I_F = I_S(e^{vbe/V_T} − 1), I_R = I_S(e^{vbc/V_T} − 1),
 * I_C = I_F − I_R(1 + 1/β_R), I_B = I_F/β_F + I_R/β_R. The network is reduced to its Thevenin base
 * drive and solved by a damped two-variable Newton iteration in (vbe, vbc).
 */
export function solveEbersMollBias(n: BiasNetwork, Is: number, VT: number, betaR = 1): BiasPoint {
  const vbb = (n.vcc * n.rb2) / (n.rb1 + n.rb2);
  const rb = (n.rb1 * n.rb2) / (n.rb1 + n.rb2);
  const bf = n.beta;
  const currents = (vbe: number, vbc: number) => {
    const iF = Is * Math.expm1(vbe / VT);
    const iR = Is * Math.expm1(vbc / VT);
    const ic = iF - iR * (1 + 1 / betaR);
    const ib = iF / bf + iR / betaR;
    return { ic, ib, ie: ic + ib, gf: (Is / VT) * Math.exp(vbe / VT), gr: (Is / VT) * Math.exp(vbc / VT) };
  };
  // residuals: f1 = vbb − ib·rb − ie·re − vbe, f2 = (vbb − ib·rb) − (vcc − ic·rc) − vbc
  let vbe = 0.6;
  let vbc = vbb - n.vcc; // the collector starts near the supply
  let converged = false;
  for (let it = 0; it < 2000; it++) {
    const c = currents(vbe, vbc);
    const f1 = vbb - c.ib * rb - c.ie * n.re - vbe;
    const f2 = vbb - c.ib * rb - (n.vcc - c.ic * n.rc) - vbc;
    // partial derivatives
    const dic = [c.gf, -c.gr * (1 + 1 / betaR)];
    const dib = [c.gf / bf, c.gr / betaR];
    const die = [dic[0] + dib[0], dic[1] + dib[1]];
    const j11 = -dib[0] * rb - die[0] * n.re - 1;
    const j12 = -dib[1] * rb - die[1] * n.re;
    const j21 = -dib[0] * rb + dic[0] * n.rc;
    const j22 = -dib[1] * rb + dic[1] * n.rc - 1;
    const det = j11 * j22 - j12 * j21;
    let d1 = (-f1 * j22 + f2 * j12) / det;
    let d2 = (-f2 * j11 + f1 * j21) / det;
    // damping: keep the base-emitter step below 50 mV (the exponential's linearisation range)
    const s = Math.abs(d1) / 0.05;
    if (s > 1) {
      d1 /= s;
      d2 /= s;
    }
    vbe += d1;
    vbc += d2;
    if (Math.abs(d1) < 1e-15 && Math.abs(d2) < 1e-14) {
      converged = true;
      break;
    }
  }
  if (!converged) throw new Error('reference Ebers–Moll solve did not converge');
  const c = currents(vbe, vbc);
  const vb = vbb - c.ib * rb;
  const ve = c.ie * n.re;
  const vc = n.vcc - c.ic * n.rc;
  return { vb, ve, vc, ic: c.ic, ib: c.ib, ie: c.ie, vbe, vce: vc - ve };
}

/** Textbook model: V_BE = 0.7 V, I_C = β·I_B, base divider by its Thevenin equivalent. */
export function solveTextbookBias(n: BiasNetwork, vbeOn = 0.7): BiasPoint {
  const vbb = (n.vcc * n.rb2) / (n.rb1 + n.rb2);
  const rb = (n.rb1 * n.rb2) / (n.rb1 + n.rb2);
  const ie = (vbb - vbeOn) / (n.re + rb / (n.beta + 1));
  const ib = ie / (n.beta + 1);
  const ic = n.beta * ib;
  const ve = ie * n.re;
  const vb = ve + vbeOn;
  const vc = n.vcc - ic * n.rc;
  return { vb, ve, vc, ic, ib, ie, vbe: vbeOn, vce: vc - ve };
}
