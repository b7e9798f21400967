import { GROUND, type DeviceModel } from '../engine/device';
import type { ParamsOf } from '../sheet/schema';
import { powerRatingWarnings, resistanceEdge, resistanceElement } from './model-helpers';
import { resistanceAt } from './resistor.model';

/** Fraction of the track resistance between a and the wiper. */
export function taperFraction(position: number, taper: 'linear' | 'log'): number {
  if (taper === 'log') return (Math.pow(81, position) - 1) / 80; // 10 % at mid-rotation (type A)
  return position;
}

function sections(p: ParamsOf<'potentiometer'>, temperatureC: number): [number, number] {
  const total = resistanceAt(p.resistance, p.tempco, temperatureC);
  const f = taperFraction(p.position, p.taper);
  const raw = total * f;
  // exact zeros at the ends so they become ideal links
  const rAW = f <= 0 ? 0 : f >= 1 ? total : raw;
  const rWB = f >= 1 ? 0 : total - rAW;
  return [rAW, rWB];
}

export const potentiometerModel: DeviceModel<ParamsOf<'potentiometer'>> = {
  topology(p, env) {
    const [r1, r2] = sections(p, env.temperatureC);
    return [resistanceEdge(r1, 0, 1), resistanceEdge(r2, 1, 2)];
  },
  check(p, env) {
    return resistanceAt(p.resistance, p.tempco, env.temperatureC) > 0 ? [] : [['tempco', `gives a non-positive resistance at ${env.temperatureC} °C`]];
  },
  create({ partId, params, env, pins, alloc }) {
    const [a, w, b] = pins;
    const [r1, r2] = sections(params, env.temperatureC);
    const e1 = resistanceElement(a, w, r1, alloc, `${partId}:a-w`);
    const e2 = resistanceElement(w, b, r2, alloc, `${partId}:w-b`);
    const total = r1 + r2;
    return {
      partId,
      nonlinear: false,
      nodes: pins.filter((n) => n !== GROUND),
      load(s, x) {
        e1.load(s, x);
        e2.load(s, x);
      },
      residual(x, sink) {
        e1.residual(x, sink);
        e2.residual(x, sink);
      },
      pinCurrents(x) {
        const i1 = e1.current(x);
        const i2 = e2.current(x);
        return [i1, i2 - i1, -i2];
      },
      report(x, pv) {
        const i1 = e1.current(x);
        const i2 = e2.current(x);
        const p1 = (pv[0] - pv[1]) * i1;
        const p2 = (pv[1] - pv[2]) * i2;
        // a section may dissipate its share of the track's rating
        const share1 = total > 0 ? r1 / total : 0;
        const share2 = total > 0 ? r2 / total : 0;
        const warnings = [
          ...powerRatingWarnings(partId, p1 + p2, params.powerRating),
          ...(share1 > 0 && share1 < 1 && p1 > 0.5 * params.powerRating * share1
            ? powerRatingWarnings(`${partId} (a–w section)`, p1, params.powerRating * share1)
            : []),
          ...(share2 > 0 && share2 < 1 && p2 > 0.5 * params.powerRating * share2
            ? powerRatingWarnings(`${partId} (w–b section)`, p2, params.powerRating * share2)
            : []),
        ];
        // only the worst warning per code
        const seen = new Set<string>();
        const uniq = warnings.filter((wn) => (seen.has(wn.code) ? false : (seen.add(wn.code), true)));
        return { derived: { resistanceAW: r1, resistanceWB: r2, wiperCurrent: i2 - i1 }, warnings: uniq };
      },
    };
  },
};
