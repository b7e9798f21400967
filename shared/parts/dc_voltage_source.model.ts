import { GROUND, isLink, nodeV, type DeviceModel } from '../engine/device';
import type { ParamsOf } from '../sheet/schema';

export const dcVoltageSourceModel: DeviceModel<ParamsOf<'dc_voltage_source'>> = {
  topology: (p) =>
    isLink(p.internalResistance)
      ? [{ kind: 'voltage', a: 0, b: 1, value: p.voltage, source: true }]
      : [{ kind: 'resistive', a: 0, b: 1 }],
  create({ partId, params, pins, alloc }) {
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
  },
};
