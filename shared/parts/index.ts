// The part catalogue: for every part type its pins, params (with units, defaults, rules, which are
// sweepable and which have a tolerance), designator prefix, label, and device model.
// The editor uses it for the palette, pins and property panel; the analyses for sweeps and tolerance.
export * from './types';
export { PART_TYPES, partSpecs, isPartType, type PartType } from './specs';
import type { DeviceModel } from '../engine/device';
import { npnModel } from './npn.model';
import { pnpModel } from './pnp.model';
import { netLabelModel } from './net_label.model';
import { dcCurrentSourceModel } from './dc_current_source.model';
import { dcVoltageSourceModel } from './dc_voltage_source.model';
import { diodeModel } from './diode.model';
import { connectorModel } from './ground.model';
import { ldrModel } from './ldr.model';
import { ledModel } from './led.model';
import { loadModel } from './load.model';
import { ntcModel } from './ntc.model';
import { potentiometerModel } from './potentiometer.model';
import { resistorModel } from './resistor.model';
import { partSpecs, PART_TYPES, type PartType } from './specs';
import { switchModel } from './switch.model';
import type { ParamInfo, PartSpec } from './types';
import { zenerModel } from './zener.model';

export interface PartDefinition extends PartSpec {
  /** the device model: topology, physical checks, and the MNA stamp */
  // eslint-disable-next-line @typescript-eslint/no-explicit-any
  model: DeviceModel<any>;
}

const models: Record<PartType, DeviceModel<never>> = {
  resistor: resistorModel,
  potentiometer: potentiometerModel,
  dc_voltage_source: dcVoltageSourceModel,
  dc_current_source: dcCurrentSourceModel,
  diode: diodeModel,
  zener: zenerModel,
  led: ledModel,
  npn: npnModel,
  pnp: pnpModel,
  ntc: ntcModel,
  ldr: ldrModel,
  load: loadModel,
  switch: switchModel,
  ground: connectorModel,
  net_label: netLabelModel,
} as unknown as Record<PartType, DeviceModel<never>>;

export const partCatalog: Record<PartType, PartDefinition> = Object.fromEntries(
  PART_TYPES.map((t) => [t, { ...(partSpecs[t] as unknown as PartSpec), model: models[t] }]),
) as Record<PartType, PartDefinition>;

/** The param description of `type.param`, or undefined. */
export function paramInfo(type: PartType, param: string): ParamInfo | undefined {
  return partCatalog[type].params.find((p) => p.name === param);
}

/** Numeric params an analysis may sweep, per part type. */
export function sweepableParams(type: PartType): ParamInfo[] {
  return partCatalog[type].params.filter((p) => p.kind === 'number' && p.sweepable);
}

/** Params that carry a tolerance (and how), per part type. */
export function toleranceParams(type: PartType): ParamInfo[] {
  return partCatalog[type].params.filter((p) => p.tolerance !== undefined);
}

export { taperFraction } from './potentiometer.model';
export { ntcResistance, ntcBetaResistance, steinhartHartResistance } from './ntc.model';
export { ldrResistance } from './ldr.model';
export { resistanceAt } from './resistor.model';
export { loadValueUnit, LOAD_MODES } from './load';
export { POT_TAPERS } from './potentiometer';
