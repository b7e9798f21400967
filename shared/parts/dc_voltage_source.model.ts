import { GROUND, isLink, nodeV, type Device, type DeviceContext, type DeviceModel } from '../engine/device';
import type { ParamsOf } from '../sheet/schema';
import { sourceLimitProblem } from './model-helpers';

type Params = ParamsOf<'dc_voltage_source'>;

/**
 * Above this internal resistance (Ω) the source is stamped as its Norton equivalent (V/R in
 * parallel with 1/R). The branch form's row [1, −1, −R] beside unit entries is unsolvable once R is
 * near 1e15 Ω (hard case 65: a pivot of 1/R counted as singular); below, the branch form keeps the
 * delivered current exact instead of a difference of two nearly equal voltages.
 */
export const NORTON_ABOVE_OHMS = 1e6;

export const dcVoltageSourceModel: DeviceModel<Params> = {
  topology: (p) =>
    isLink(p.internalResistance)
      ? [{ kind: 'voltage', a: 0, b: 1, value: p.voltage, source: true }]
      : [{ kind: 'resistive', a: 0, b: 1 }],
  check: (p) => sourceLimitProblem('voltage', p.voltage, 'V'),
  create: (ctx) => (ctx.params.internalResistance > NORTON_ABOVE_OHMS ? nortonSource(ctx) : branchSource(ctx)),
};

function branchSource({ partId, params, pins, alloc }: DeviceContext<Params>): Device {
  const [pos, neg] = pins;
  const k = alloc.branch(`${partId}:I`);
  const rint = isLink(params.internalResistance) ? 0 : params.internalResistance;
  return {
    partId,
    nonlinear: false,
    nodes: pins.filter((n) => n !== GROUND),
    load(s) {
      // branch current k flows into pos, through the source, out of neg
      s.add(pos, k, 1);
      s.add(neg, k, -1);
      s.add(k, pos, 1);
      s.add(k, neg, -1);
      if (rint !== 0) s.add(k, k, -rint);
      s.addRhs(k, params.voltage * s.sourceScale);
    },
    residual(x, sink) {
      sink.add(pos, x[k]);
      sink.add(neg, -x[k]);
    },
    pinCurrents: (x) => [x[k], -x[k]],
    report(x) {
      const vTerm = nodeV(x, pos) - nodeV(x, neg);
      return { derived: { current: -x[k], terminalVoltage: vTerm } };
    },
  };
}

function nortonSource({ partId, params, pins }: DeviceContext<Params>): Device {
  const [pos, neg] = pins;
  const g = 1 / params.internalResistance;
  /** current into pos: (v(pos) − v(neg) − V)/R */
  const into = (x: Float64Array, scale: number) => g * (nodeV(x, pos) - nodeV(x, neg) - params.voltage * scale);
  return {
    partId,
    nonlinear: false,
    nodes: pins.filter((n) => n !== GROUND),
    load(s) {
      s.conductance(pos, neg, g);
      s.current(pos, neg, -g * params.voltage * s.sourceScale);
    },
    residual(x, sink, _gmin, scale) {
      const i = into(x, scale);
      const size = g * (Math.abs(nodeV(x, pos)) + Math.abs(nodeV(x, neg)) + Math.abs(params.voltage * scale));
      sink.add(pos, i, size);
      sink.add(neg, -i, size);
    },
    pinCurrents: (x) => {
      const i = into(x, 1);
      return [i, -i];
    },
    report(x) {
      return { derived: { current: -into(x, 1), terminalVoltage: nodeV(x, pos) - nodeV(x, neg) } };
    },
  };
}
