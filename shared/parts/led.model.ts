import type { DeviceModel } from '../engine/device';
import { criticalVoltage, junctionParams, type JunctionParams } from '../engine/junction';
import type { ParamsOf } from '../sheet/schema';
import { fmt, junctionDevice, sharpnessProblem } from './model-helpers';

/** Junction voltage at the test current, at temperature: V_F + tc·(T − 25) − I_T·R_S. */
function junctionVoltageAtTest(p: ParamsOf<'led'>, temperatureC: number): number {
  return p.forwardVoltage + p.forwardVoltageTempco * (temperatureC - 25) - p.testCurrent * p.seriesResistance;
}

/** I_S chosen so the junction passes testCurrent at the forward voltage: I_S = I_T/(e^{V_j/(n·V_T)} − 1). */
export function ledJunction(p: ParamsOf<'led'>, env: { temperatureC: number; vt: number }): JunctionParams {
  const nvt = p.emissionCoefficient * env.vt;
  const vj = junctionVoltageAtTest(p, env.temperatureC);
  return junctionParams(p.testCurrent / Math.expm1(vj / nvt), nvt);
}

export const ledModel: DeviceModel<ParamsOf<'led'>> = {
  topology: () => [{ kind: 'resistive', a: 0, b: 1 }],
  check(p, env) {
    const sharp = sharpnessProblem('emissionCoefficient', p.emissionCoefficient * env.vt, 'n·V_T');
    if (sharp.length) return sharp;
    const vj = junctionVoltageAtTest(p, env.temperatureC);
    if (!(vj > 0)) {
      const vf = p.forwardVoltage + p.forwardVoltageTempco * (env.temperatureC - 25);
      if (!(vf > 0))
        return [['forwardVoltageTempco', `gives a forward voltage of ${fmt(vf, 'V')} at ${env.temperatureC} °C; check the temperature coefficient and the temperature`]];
      return [['seriesResistance', `leaves no junction voltage at the test current (forward voltage ${fmt(vf, 'V')}, drop across the series resistance ${fmt(p.testCurrent * p.seriesResistance, 'V')})`]];
    }
    const is = p.testCurrent / Math.expm1(vj / (p.emissionCoefficient * env.vt));
    if (!(is > 0) || !Number.isFinite(is)) return [['forwardVoltage', 'gives a saturation current that cannot be represented; check forwardVoltage and emissionCoefficient']];
    return [];
  },
  create({ partId, params, env, pins, alloc }) {
    const jp = ledJunction(params, env);
    const vInit = Math.min(criticalVoltage(jp.nvt, jp.is), junctionVoltageAtTest(params, env.temperatureC));
    return junctionDevice(partId, pins, jp, params.seriesResistance, alloc, vInit, (_x, pv, pi) => {
      const i = pi[0];
      const v = pv[0] - pv[1];
      const warnings = [];
      if (i > params.maxCurrent)
        warnings.push({
          code: 'led_over_current',
          severity: 'danger' as const,
          message: `${partId} carries ${fmt(i, 'A')}, above its ${fmt(params.maxCurrent, 'A')} maximum. Increase its series resistor.`,
        });
      if (-v > params.maxReverseVoltage)
        warnings.push({
          code: 'led_reverse_voltage',
          severity: 'warning' as const,
          message: `${partId} has ${fmt(-v, 'V')} in reverse, above its ${fmt(params.maxReverseVoltage, 'V')} maximum reverse voltage. Check its polarity or add a protection diode.`,
        });
      if (v > 0 && i > 0 && i < 1e-4 * params.testCurrent && v > 0.5 * params.forwardVoltage)
        warnings.push({
          code: 'led_dim',
          severity: 'caution' as const,
          message: `${partId} passes only ${fmt(i, 'A')}: it will be dark or barely visible.`,
        });
      return { derived: { current: i, voltage: v }, warnings };
    });
  },
};
