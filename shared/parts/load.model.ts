import { GROUND, nodeV, type Device, type DeviceModel } from '../engine/device';
import type { ParamsOf } from '../sheet/schema';
import { fmt, resistanceEdge, resistiveDevice, sourceLimitProblem } from './model-helpers';

/** Constant-power current: P/v above minVoltage, the resistance minVoltage²/P below it. */
export function powerLoadCurrent(P: number, vmin: number, v: number): { i: number; g: number } {
  if (Math.abs(v) >= vmin) return { i: P / v, g: -P / (v * v) };
  return { i: (P * v) / (vmin * vmin), g: P / (vmin * vmin) };
}

export const loadModel: DeviceModel<ParamsOf<'load'>> = {
  topology: (p) => (p.mode === 'current' ? [{ kind: 'current', a: 0, b: 1, value: -p.value }] : p.mode === 'resistance' ? [resistanceEdge(p.value)] : [{ kind: 'resistive', a: 0, b: 1 }]),
  check: (p) => (p.mode === 'resistance' ? [] : sourceLimitProblem('value', p.value, p.mode === 'power' ? 'W' : 'A')),
  create({ partId, params, pins, alloc }): Device {
    const [pos, neg] = pins;
    const nodes = pins.filter((n) => n !== GROUND);
    if (params.mode === 'resistance') return resistiveDevice(partId, pins, params.value, alloc);
    if (params.mode === 'current') {
      const I = params.value;
      return {
        partId,
        nonlinear: false,
        nodes,
        load: (s) => s.current(pos, neg, I * s.sourceScale),
        residual(_x, sink, _g, scale) {
          sink.add(pos, I * scale);
          sink.add(neg, -I * scale);
        },
        pinCurrents: () => [I, -I],
      };
    }
    const P = params.value;
    const vmin = params.minVoltage;
    let cold = false;
    return {
      partId,
      nonlinear: true,
      startsOpen: true,
      nodes,
      begin(_x, start) {
        cold = start === 'cold';
      },
      load(s, x) {
        if (cold) {
          // Start open, as a load switched on after its supply: from the unloaded voltage Newton
          // walks down to the higher of the (usually two) operating points, the one a real supply
          // settles at. From 0 V it would find the low one, or the undervoltage point below minVoltage.
          cold = false;
          s.markLimited();
          s.nonlinear([pos, neg], [0, 0], [[pos, neg, 0]], [[0], [0]]);
          return;
        }
        const v = nodeV(x, pos) - nodeV(x, neg);
        const { i, g } = powerLoadCurrent(P * s.sourceScale, vmin, v);
        s.nonlinear([pos, neg], [i, -i], [[pos, neg, v]], [[g], [-g]]);
      },
      residual(x, sink, _g, scale) {
        const vp = nodeV(x, pos);
        const vn = nodeV(x, neg);
        const { i, g } = powerLoadCurrent(P * scale, vmin, vp - vn);
        const size = Math.abs(i) + Math.abs(g) * (Math.abs(vp) + Math.abs(vn));
        sink.add(pos, i, size);
        sink.add(neg, -i, size);
      },
      pinCurrents(x) {
        const { i } = powerLoadCurrent(P, vmin, nodeV(x, pos) - nodeV(x, neg));
        return [i, -i];
      },
      report(_x, pv) {
        const v = pv[0] - pv[1];
        if (Math.abs(v) < vmin && P > 0)
          return {
            warnings: [
              {
                code: 'load_undervoltage',
                severity: 'warning',
                message: `${partId} (a ${fmt(P, 'W')} constant-power load) sees only ${fmt(v, 'V')}, below its ${fmt(vmin, 'V')} minimum: the supply cannot deliver the power. Lower the series resistance or the load power.`,
              },
            ],
          };
        return {};
      },
    };
  },
};
