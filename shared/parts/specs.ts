// Model-free part specs (params, pins, metadata). The sheet schema is built from these;
// `index.ts` adds the device models to make the full catalogue.
import { dcCurrentSourceSpec } from './dc_current_source';
import { dcVoltageSourceSpec } from './dc_voltage_source';
import { diodeSpec } from './diode';
import { groundSpec } from './ground';
import { ldrSpec } from './ldr';
import { ledSpec } from './led';
import { loadSpec } from './load';
import { netLabelSpec } from './net_label';
import { npnSpec } from './npn';
import { pnpSpec } from './pnp';
import { ntcSpec } from './ntc';
import { potentiometerSpec } from './potentiometer';
import { resistorSpec } from './resistor';
import { switchSpec } from './switch';
import { zenerSpec } from './zener';

/** Every part type, in palette order. */
export const PART_TYPES = [
  'resistor',
  'potentiometer',
  'dc_voltage_source',
  'dc_current_source',
  'diode',
  'zener',
  'led',
  'npn',
  'pnp',
  'ntc',
  'ldr',
  'load',
  'switch',
  'ground',
  'net_label',
] as const;

export type PartType = (typeof PART_TYPES)[number];

export const partSpecs = {
  resistor: resistorSpec,
  potentiometer: potentiometerSpec,
  dc_voltage_source: dcVoltageSourceSpec,
  dc_current_source: dcCurrentSourceSpec,
  diode: diodeSpec,
  zener: zenerSpec,
  led: ledSpec,
  npn: npnSpec,
  pnp: pnpSpec,
  ntc: ntcSpec,
  ldr: ldrSpec,
  load: loadSpec,
  switch: switchSpec,
  ground: groundSpec,
  net_label: netLabelSpec,
} as const;

export function isPartType(t: unknown): t is PartType {
  return typeof t === 'string' && (PART_TYPES as readonly string[]).includes(t);
}
