// Independent reference evaluators for the Lambert W function (principal branch) and the Wright
// omega function, written for the tests only (no engine code).
//
// Wright omega: ω(x) is the solution of ω + ln ω = x, so that W₀(eˣ) = ω(x) without ever forming
// eˣ (which overflows a double above x ≈ 709). See R. M. Corless & D. J. Jeffrey, "The Wright ω
// function", AISC 2002, and P. W. Lawrence, R. M. Corless & D. J. Jeffrey, "Algorithm 917: Complex
// double-precision evaluation of the Wright ω function", ACM TOMS 38(3), 2012, whose initial
// approximations (real line) and Fritsch–Shafer–Crowley iteration are used here.

/** Wright omega ω(x) for real x. */
export function wrightOmega(x: number): number {
  if (!Number.isFinite(x)) return x === Infinity ? Infinity : 0;
  let w: number;
  if (x < -2) {
    // ω ≈ eˣ − e²ˣ + (3/2)e³ˣ (small ω)
    const e = Math.exp(x);
    w = e - e * e + 1.5 * e * e * e;
    if (w <= 0) w = e;
  } else if (x <= 1) {
    // series about x = 1, where ω(1) = 1
    const t = x - 1;
    w = 1 + t / 2 + (t * t) / 16 - (t * t * t) / 192;
  } else {
    // asymptotic: ω ≈ x − ln x + ln x / x
    const l = Math.log(x);
    w = x - l + l / x;
  }
  if (w <= 0) w = Number.MIN_VALUE;
  // Fritsch–Shafer–Crowley iteration (third order); a few passes reach machine precision
  for (let k = 0; k < 8; k++) {
    const r = x - w - Math.log(w);
    if (r === 0) break;
    const z = r;
    const q = 2 * (1 + w) * (1 + w + (2 / 3) * z);
    const wNext = w * (1 + (z / (1 + w)) * ((q - z) / (q - 2 * z)));
    if (!(wNext > 0)) {
      // fall back to a safeguarded Newton step
      w = w * Math.exp(r / (1 + w));
      continue;
    }
    const done = Math.abs(wNext - w) <= 1e-16 * Math.abs(wNext);
    w = wNext;
    if (done) break;
  }
  return w;
}

/** Principal-branch Lambert W for y ≥ 0 (W e^W = y). */
export function lambertW0(y: number): number {
  if (y === 0) return 0;
  return wrightOmega(Math.log(y));
}

/**
 * Current through a diode (I_S, n) in series with R from a voltage V, exactly (Banwell &
 * Jayakumar, Electronics Letters 36(4), 2000), with a = n·V_T:
 *   I = (a/R)·W₀((I_S·R/a)·exp((V + I_S·R)/a)) − I_S
 * evaluated through ω as I = (a/R)·ω(ln(I_S·R/a) + (V + I_S·R)/a) − I_S.
 * For a string of N identical diodes use a = N·n·V_T.
 */
export function diodeSeriesCurrent(V: number, R: number, Is: number, a: number): number {
  const x = Math.log((Is * R) / a) + (V + Is * R) / a;
  return (a / R) * wrightOmega(x) - Is;
}
