import type { DeviceModel } from '../engine/device';

/** Ground and net labels only join nets; they have no electrical behaviour. */
export const connectorModel: DeviceModel<Record<string, unknown>> = {
  topology: () => [],
  create: ({ partId }) => ({
    partId,
    nonlinear: false,
    nodes: [],
    load() {},
    residual() {},
    pinCurrents: () => [0],
  }),
};
