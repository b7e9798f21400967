import { GROUND, type DeviceModel } from '../engine/device';
import type { ParamsOf } from '../sheet/schema';
import { sourceLimitProblem } from './model-helpers';

export const dcCurrentSourceModel: DeviceModel<ParamsOf<'dc_current_source'>> = {
  topology: (p) => [{ kind: 'current', a: 0, b: 1, value: p.current }],
  check: (p) => sourceLimitProblem('current', p.current, 'A'),
  create({ partId, params, pins }) {
    const [pos, neg] = pins;
    const I = params.current;
    return {
      partId,
      nonlinear: false,
      nodes: pins.filter((n) => n !== GROUND),
      load(s) {
        // I leaves the pos pin into the circuit: the current INTO the device at pos is −I
        s.current(pos, neg, -I * s.sourceScale);
      },
      residual(_x, sink, _g, scale) {
        sink.add(pos, -I * scale);
        sink.add(neg, I * scale);
      },
      pinCurrents: () => [-I, I],
      report(_x, pv) {
        return { derived: { compliance: pv[0] - pv[1] } };
      },
    };
  },
};
