// The Tapline sheet file, version 1 (see shared/contracts/sheet-format.md and docs/sheet-format.md).
// zod 4 schemas; the TypeScript types are inferred from them. Use `parseSheet` (parse.ts) to read a
// file: it gives messages that name the part and the field. These schemas are exported for tools that
// want to compose them (e.g. a server route body).
import { z } from 'zod';
import { PART_TYPES, partSpecs, type PartType } from '../parts/specs';

export { PART_TYPES, type PartType };

export const SHEET_FORMAT = 'tapline.sheet' as const;
export const SHEET_VERSION = 1 as const;

export const DEFAULT_TEMPERATURE_C = 25;
export const DEFAULT_ILLUMINANCE_LUX = 100;

export const PartTypeSchema = z.enum(PART_TYPES);

export const PositionSchema = z.object({ x: z.number(), y: z.number() });
export const RotationSchema = z.union([z.literal(0), z.literal(90), z.literal(180), z.literal(270)]);

/** Part ids: non-empty, no whitespace and no "." (a pin is written PARTID.PIN). */
export const PartIdSchema = z
  .string()
  .min(1)
  .regex(/^[^\s.]+$/, 'must not contain spaces or "."');

/** A pin reference, written PARTID.PIN. */
export const PinRefSchema = z.string().regex(/^[^\s.]+\.[^\s.]+$/, 'must be written PARTID.PIN, e.g. "R1.a"');

export const ConditionsSchema = z.looseObject({
  temperatureC: z.number().gt(-273.15).default(DEFAULT_TEMPERATURE_C),
  illuminanceLux: z.number().gte(0).default(DEFAULT_ILLUMINANCE_LUX),
});

export const WireSchema = z.looseObject({
  from: PinRefSchema,
  to: PinRefSchema,
  /** optional stable id for co-editing; layout only */
  id: z.string().optional(),
  /** optional route points; layout only */
  points: z.array(PositionSchema).optional(),
});

function partSchemaFor<T extends PartType>(type: T) {
  const spec = partSpecs[type];
  return z.looseObject({
    id: PartIdSchema,
    type: z.literal(type),
    params: (spec.paramsSchema as z.ZodObject).prefault({}) as unknown as z.ZodPrefault<(typeof partSpecs)[T]['paramsSchema']>,
    position: PositionSchema.optional(),
    rotation: RotationSchema.optional(),
    /** optional display label; layout only */
    label: z.string().optional(),
  });
}

export const ResistorPartSchema = partSchemaFor('resistor');
export const PotentiometerPartSchema = partSchemaFor('potentiometer');
export const DcVoltageSourcePartSchema = partSchemaFor('dc_voltage_source');
export const DcCurrentSourcePartSchema = partSchemaFor('dc_current_source');
export const DiodePartSchema = partSchemaFor('diode');
export const ZenerPartSchema = partSchemaFor('zener');
export const LedPartSchema = partSchemaFor('led');
export const NpnPartSchema = partSchemaFor('npn');
export const PnpPartSchema = partSchemaFor('pnp');
export const NtcPartSchema = partSchemaFor('ntc');
export const LdrPartSchema = partSchemaFor('ldr');
export const LoadPartSchema = partSchemaFor('load');
export const SwitchPartSchema = partSchemaFor('switch');
export const GroundPartSchema = partSchemaFor('ground');
export const NetLabelPartSchema = partSchemaFor('net_label');

export const PartSchema = z.discriminatedUnion('type', [
  ResistorPartSchema,
  PotentiometerPartSchema,
  DcVoltageSourcePartSchema,
  DcCurrentSourcePartSchema,
  DiodePartSchema,
  ZenerPartSchema,
  LedPartSchema,
  NpnPartSchema,
  PnpPartSchema,
  NtcPartSchema,
  LdrPartSchema,
  LoadPartSchema,
  SwitchPartSchema,
  GroundPartSchema,
  NetLabelPartSchema,
]);

export const SheetSchema = z.looseObject({
  format: z.literal(SHEET_FORMAT),
  version: z.literal(SHEET_VERSION),
  title: z.string().optional(),
  description: z.string().optional(),
  conditions: ConditionsSchema.prefault({}),
  parts: z.array(PartSchema).default([]),
  wires: z.array(WireSchema).default([]),
});

/** A parsed sheet: every param that has a default is filled in. */
export type Sheet = z.infer<typeof SheetSchema>;
/** A sheet as written in a file (defaults may be left out). */
export type SheetInput = z.input<typeof SheetSchema>;
export type Part = z.infer<typeof PartSchema>;
export type PartInput = z.input<typeof PartSchema>;
export type Wire = z.infer<typeof WireSchema>;
export type Conditions = z.infer<typeof ConditionsSchema>;
export type Position = z.infer<typeof PositionSchema>;
export type Rotation = z.infer<typeof RotationSchema>;

/** The part of a given type, e.g. PartOf<'resistor'>. */
export type PartOf<T extends PartType> = Extract<Part, { type: T }>;
/** The (defaults-filled) params of a given part type, e.g. ParamsOf<'diode'>. */
export type ParamsOf<T extends PartType> = PartOf<T>['params'];

export type ResistorPart = PartOf<'resistor'>;
export type PotentiometerPart = PartOf<'potentiometer'>;
export type DcVoltageSourcePart = PartOf<'dc_voltage_source'>;
export type DcCurrentSourcePart = PartOf<'dc_current_source'>;
export type DiodePart = PartOf<'diode'>;
export type ZenerPart = PartOf<'zener'>;
export type LedPart = PartOf<'led'>;
export type NpnPart = PartOf<'npn'>;
export type PnpPart = PartOf<'pnp'>;
export type NtcPart = PartOf<'ntc'>;
export type LdrPart = PartOf<'ldr'>;
export type LoadPart = PartOf<'load'>;
export type SwitchPart = PartOf<'switch'>;
export type GroundPart = PartOf<'ground'>;
export type NetLabelPart = PartOf<'net_label'>;

/** "R1.a" */
export function pinKey(partId: string, pin: string): string {
  return `${partId}.${pin}`;
}

/** Split "R1.a" into ["R1", "a"]; null when it is not of that form. */
export function splitPinRef(ref: string): [string, string] | null {
  const i = ref.indexOf('.');
  if (i <= 0 || i === ref.length - 1 || ref.indexOf('.', i + 1) !== -1) return null;
  return [ref.slice(0, i), ref.slice(i + 1)];
}
