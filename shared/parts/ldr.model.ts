import type { DeviceModel } from '../engine/device';
import type { ParamsOf } from '../sheet/schema';
import { resistanceEdge, resistiveDevice } from './model-helpers';

/** R = R₁₀·(E/10 lx)^(−γ), capped at the dark resistance (and equal to it at 0 lx). */
export function ldrResistance(p: ParamsOf<'ldr'>, illuminanceLux: number): number {
  if (illuminanceLux <= 0) return p.darkResistance;
  return Math.min(p.darkResistance, p.resistanceAt10Lux * Math.pow(illuminanceLux / 10, -p.gamma));
}

export const ldrModel: DeviceModel<ParamsOf<'ldr'>> = {
  topology: (p, env) => [resistanceEdge(ldrResistance(p, env.illuminanceLux))],
  create({ partId, params, env, pins, alloc }) {
    const r = ldrResistance(params, env.illuminanceLux);
    return resistiveDevice(partId, pins, r, alloc, (_x, pv, pi) => ({
      derived: { resistance: r, illuminanceLux: env.illuminanceLux, voltage: pv[0] - pv[1], current: pi[0] },
    }));
  },
};
