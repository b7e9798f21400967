import type { DeviceModel } from '../engine/device';
import { criticalVoltage, junctionParams, scaleSaturationCurrent, type JunctionParams } from '../engine/junction';
import type { ParamsOf } from '../sheet/schema';
import { fmt, junctionDevice, saturationCurrentProblem, sharpnessProblem } from './model-helpers';

export function diodeJunction(p: ParamsOf<'diode'>, temperatureK: number, vt: number): JunctionParams {
  const nvt = p.emissionCoefficient * vt;
  const is = scaleSaturationCurrent(p.saturationCurrent, temperatureK, p.emissionCoefficient, p.bandgap, p.saturationCurrentTempExp);
  return junctionParams(is, nvt, p.breakdownVoltage !== undefined ? { voltage: p.breakdownVoltage, current: p.breakdownCurrent, slope: nvt } : undefined);
}

export const diodeModel: DeviceModel<ParamsOf<'diode'>> = {
  topology: () => [{ kind: 'resistive', a: 0, b: 1 }],
  check: (p, env) => [
    ...sharpnessProblem('emissionCoefficient', p.emissionCoefficient * env.vt, 'n·V_T'),
    ...saturationCurrentProblem('saturationCurrent', diodeJunction(p, env.temperatureK, env.vt).is, env.temperatureC),
  ],
  create({ partId, params, env, pins, alloc }) {
    const jp = diodeJunction(params, env.temperatureK, env.vt);
    return junctionDevice(partId, pins, jp, params.seriesResistance, alloc, criticalVoltage(jp.nvt, jp.is), (_x, pv, pi) => {
      const i = pi[0];
      const v = pv[0] - pv[1];
      const warnings = [];
      if (Math.abs(i) > params.maxCurrent)
        warnings.push({
          code: 'diode_over_current',
          severity: 'warning' as const,
          message: `${partId} carries ${fmt(Math.abs(i), 'A')}${i < 0 ? ' in reverse breakdown' : ''}, above its ${fmt(params.maxCurrent, 'A')} maximum. Add series resistance or use a larger diode.`,
        });
      return { derived: { current: i, voltage: v, region: i < -10 * jp.is && params.breakdownVoltage !== undefined && v < -0.5 * params.breakdownVoltage ? 'breakdown' : v > 0 ? 'forward' : 'reverse' }, warnings };
    });
  },
};
