import type { DeviceModel } from '../engine/device';
import type { ParamsOf } from '../sheet/schema';
import { resistiveDevice } from './model-helpers';

const switchR = (p: ParamsOf<'switch'>) => (p.closed ? p.onResistance : p.offResistance);

export const switchModel: DeviceModel<ParamsOf<'switch'>> = {
  topology: (p) =>
    switchR(p) === 0 ? [{ kind: 'voltage', a: 0, b: 1, value: 0, source: false }] : [{ kind: 'resistive', a: 0, b: 1 }],
  create({ partId, params, pins, alloc }) {
    return resistiveDevice(partId, pins, switchR(params), alloc, () => ({ derived: { state: params.closed ? 'closed' : 'open' } }));
  },
};
