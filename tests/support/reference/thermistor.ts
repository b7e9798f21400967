// Thermistor reference equations (test support only).
// β equation: R(T) = R₀·exp(B·(1/T − 1/T₀)).
// Steinhart & Hart, "Calibration curves for thermistors", Deep-Sea Research 15(4), 497–503, 1968:
// 1/T = A + B·ln R + C·(ln R)³. Inverted here by bisection on ln R (no closed form), so it is
// independent of the engine's Cardano solution.

export function betaResistance(r0: number, t0K: number, beta: number, tK: number): number {
  return r0 * Math.exp(beta * (1 / tK - 1 / t0K));
}

export function steinhartHartTemperature(A: number, B: number, C: number, R: number): number {
  const l = Math.log(R);
  return 1 / (A + B * l + C * l * l * l);
}

export function steinhartHartResistance(A: number, B: number, C: number, tK: number): number {
  // 1/T is increasing in ln R for B, C > 0: bisect on ln R
  let lo = -50;
  let hi = 50;
  const f = (l: number) => A + B * l + C * l * l * l - 1 / tK;
  for (let i = 0; i < 300; i++) {
    const mid = (lo + hi) / 2;
    if (f(mid) > 0) hi = mid;
    else lo = mid;
  }
  return Math.exp((lo + hi) / 2);
}
