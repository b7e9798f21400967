import type { DeviceModel } from '../engine/device';
import type { ParamsOf } from '../sheet/schema';
import { resistanceEdge, resistiveDevice } from './model-helpers';

const switchR = (p: ParamsOf<'switch'>) => (p.closed ? p.onResistance : p.offResistance);

export const switchModel: DeviceModel<ParamsOf<'switch'>> = {
  topology: (p) => [resistanceEdge(switchR(p))],
  create({ partId, params, pins, alloc }) {
    return resistiveDevice(partId, pins, switchR(params), alloc, () => ({ derived: { state: params.closed ? 'closed' : 'open' } }));
  },
};
