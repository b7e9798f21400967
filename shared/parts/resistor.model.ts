import type { DeviceModel } from '../engine/device';
import { fmt, powerRatingWarnings, resistanceEdge, resistiveDevice } from './model-helpers';
import type { ParamsOf } from '../sheet/schema';

/** R(T) = R·(1 + tempco·1e-6·(T − 25 °C)) */
export function resistanceAt(r25: number, tempcoPpm: number, temperatureC: number): number {
  return tempcoPpm === 0 ? r25 : r25 * (1 + tempcoPpm * 1e-6 * (temperatureC - 25));
}

export const resistorModel: DeviceModel<ParamsOf<'resistor'>> = {
  topology: (p, env) => [resistanceEdge(resistanceAt(p.resistance, p.tempco, env.temperatureC))],
  check(p, env) {
    const r = resistanceAt(p.resistance, p.tempco, env.temperatureC);
    return r > 0 ? [] : [['tempco', `gives a resistance of ${fmt(r, 'Ω')} at ${env.temperatureC} °C; check the temperature coefficient`]];
  },
  create({ partId, params, env, pins, alloc }) {
    const r = resistanceAt(params.resistance, params.tempco, env.temperatureC);
    return resistiveDevice(partId, pins, r, alloc, (_x, pv, pi) => {
      const power = pv[0] * pi[0] + pv[1] * pi[1];
      return {
        derived: { resistance: r, voltage: pv[0] - pv[1], current: pi[0] },
        warnings: powerRatingWarnings(partId, power, params.powerRating),
      };
    });
  },
};
