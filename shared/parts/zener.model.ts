import type { DeviceModel } from '../engine/device';
import { criticalVoltage, junctionParams, scaleSaturationCurrent, type JunctionParams } from '../engine/junction';
import type { ParamsOf } from '../sheet/schema';
import { fmt, junctionDevice, powerRatingWarnings, saturationCurrentProblem, sharpnessProblem } from './model-helpers';

/**
 * Reverse breakdown passing testCurrent at zenerVoltage(T) with dynamic resistance zenerResistance
 * there: i_r = I_ZT·(e^{(v_r − V_Z)/a} − e^{−V_Z/a}) with a = r_Z·I_ZT (so dv/di = r_Z at I_ZT).
 */
export function zenerJunction(p: ParamsOf<'zener'>, env: { temperatureK: number; temperatureC: number; vt: number }): JunctionParams {
  const nvt = p.emissionCoefficient * env.vt;
  const is = scaleSaturationCurrent(p.saturationCurrent, env.temperatureK, p.emissionCoefficient, 1.11, 3);
  const vz = p.zenerVoltage + p.zenerTempco * (env.temperatureC - 25);
  return junctionParams(is, nvt, { voltage: vz, current: p.testCurrent, slope: p.zenerResistance * p.testCurrent });
}

export const zenerModel: DeviceModel<ParamsOf<'zener'>> = {
  topology: () => [{ kind: 'resistive', a: 0, b: 1 }],
  check(p, env) {
    const vz = p.zenerVoltage + p.zenerTempco * (env.temperatureC - 25);
    if (!(vz > 0)) return [['zenerTempco', `gives a Zener voltage of ${fmt(vz, 'V')} at ${env.temperatureC} °C`]];
    return [
      ...sharpnessProblem('zenerResistance', p.zenerResistance * p.testCurrent, 'a knee (zenerResistance × testCurrent)'),
      ...sharpnessProblem('emissionCoefficient', p.emissionCoefficient * env.vt, 'n·V_T'),
      ...saturationCurrentProblem('saturationCurrent', zenerJunction(p, env).is, env.temperatureC),
    ];
  },
  create({ partId, params, env, pins, alloc }) {
    const jp = zenerJunction(params, env);
    return junctionDevice(partId, pins, jp, params.seriesResistance, alloc, criticalVoltage(jp.nvt, jp.is), (_x, pv, pi) => {
      const i = pi[0];
      const v = pv[0] - pv[1];
      const power = v * i;
      const vz = jp.breakdown!.voltage;
      const warnings = powerRatingWarnings(partId, power, params.powerRating);
      const iMax = params.powerRating / vz;
      if (i < 0 && -i < 0.1 * params.testCurrent && -v > 0.8 * vz)
        warnings.push({
          code: 'zener_below_knee',
          severity: 'caution',
          message: `${partId} passes only ${fmt(-i, 'A')} in reverse, below a tenth of its ${fmt(params.testCurrent, 'A')} test current: it is near its knee and will not regulate well. Reduce the series resistance.`,
        });
      return {
        derived: {
          current: i,
          voltage: v,
          maxZenerCurrent: iMax,
          region: -v > 0.8 * vz && i < 0 ? 'breakdown' : v > 0 ? 'forward' : 'reverse',
        },
        warnings,
      };
    });
  },
};
