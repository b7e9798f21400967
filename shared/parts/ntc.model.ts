import { celsiusToKelvin } from '../engine/constants';
import type { DeviceModel } from '../engine/device';
import type { ParamsOf } from '../sheet/schema';
import { resistanceEdge, resistiveDevice } from './model-helpers';

/** β equation: R(T) = R₀·exp(B·(1/T − 1/T₀)). */
export function ntcBetaResistance(r0: number, t0K: number, beta: number, tK: number): number {
  return r0 * Math.exp(beta * (1 / tK - 1 / t0K));
}

/**
 * Steinhart & Hart (Deep-Sea Research 15(4), 1968): 1/T = a + b·ln R + c·(ln R)³, solved for
 * ln R with Cardano's formula (one real root since b, c ≥ 0).
 */
export function steinhartHartResistance(sh: { a: number; b: number; c: number }, tK: number): number {
  const { a, b, c } = sh;
  if (c === 0) return Math.exp((1 / tK - a) / b);
  const p = b / c;
  const q = (a - 1 / tK) / c;
  const disc = Math.sqrt((q * q) / 4 + (p * p * p) / 27);
  const x = Math.cbrt(-q / 2 + disc) + Math.cbrt(-q / 2 - disc);
  return Math.exp(x);
}

export function ntcResistance(p: ParamsOf<'ntc'>, temperatureC: number): number {
  const tK = celsiusToKelvin(temperatureC);
  if (p.steinhartHart) return steinhartHartResistance(p.steinhartHart, tK);
  return ntcBetaResistance(p.nominalResistance, celsiusToKelvin(p.nominalTemperatureC), p.beta, tK);
}

export const ntcModel: DeviceModel<ParamsOf<'ntc'>> = {
  topology: (p, env) => [resistanceEdge(ntcResistance(p, env.temperatureC))],
  check(p, env) {
    const r = ntcResistance(p, env.temperatureC);
    return r > 0 && Number.isFinite(r) ? [] : [[p.steinhartHart ? 'steinhartHart' : 'beta', `gives no finite resistance at ${env.temperatureC} °C`]];
  },
  create({ partId, params, env, pins, alloc }) {
    const r = ntcResistance(params, env.temperatureC);
    return resistiveDevice(partId, pins, r, alloc, (_x, pv, pi) => ({
      derived: { resistance: r, temperatureC: env.temperatureC, voltage: pv[0] - pv[1], current: pi[0], selfHeatingPower: (pv[0] - pv[1]) * pi[0] },
    }));
  },
};
