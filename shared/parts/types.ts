// Part catalogue building blocks: one description per parameter (label, unit, rule, default,
// sweepable, tolerance) from which both the zod schema and the human error messages are made,
// so the two can never disagree.
import { z } from 'zod';

/** Validation rule for a numeric parameter; also drives the error message. */
export type NumberRule =
  | { kind: 'any' }
  | { kind: 'positive' }
  | { kind: 'nonNegative' }
  | { kind: 'range'; min: number; max: number }
  | { kind: 'above'; min: number };

export type ParamKind = 'number' | 'boolean' | 'enum' | 'string' | 'coefficients';

/** What a tolerance analysis should vary for this parameter. */
export type ParamTolerance =
  /** a symmetric fraction stored in another param of the same part (e.g. resistance ± tolerance) */
  | { kind: 'fraction'; param: string }
  /** an explicit optional min/max pair in other params of the same part (supply ranges) */
  | { kind: 'range'; minParam: string; maxParam: string };

export interface ParamInfo {
  name: string;
  label: string;
  kind: ParamKind;
  /** Unit symbol as shown to users (SI base units in the file): 'Ω', 'V', 'A', 'W', 'K', '°C', 'lx', 'ppm/K', 'V/K', 'eV', '' (dimensionless) */
  unit: string;
  /** true when the file must give it (no default) */
  required: boolean;
  /** default used when absent (undefined for required or truly optional params) */
  default?: number | boolean | string;
  /** numeric params a sweep / value finder may vary */
  sweepable: boolean;
  /** how a tolerance / worst-case / Monte Carlo run varies this param, if at all */
  tolerance?: ParamTolerance;
  /** this param IS a tolerance (a fraction) of another param */
  toleranceOf?: string;
  rule?: NumberRule;
  enumValues?: readonly string[];
  description: string;
  /** shown in the property panel's "advanced" section */
  advanced?: boolean;
}

export interface PinInfo {
  name: string;
  label: string;
}

/** The layout-free, model-free description of a part type. */
export interface PartSpec<TType extends string = string, TShape extends z.ZodRawShape = z.ZodRawShape> {
  type: TType;
  label: string;
  description: string;
  /** reference designator prefix: R, RV, V, I, D, DZ, Q, TH, LDR, RL, S, GND, LBL */
  designator: string;
  pins: readonly PinInfo[];
  params: readonly ParamInfo[];
  paramsSchema: z.ZodObject<TShape>;
  /** defaults for every param that has one */
  defaults: Record<string, number | boolean | string>;
  /** extra cross-field validation; returns [field, message] pairs */
  crossCheck?: (params: Record<string, unknown>) => Array<[string, string]>;
}

// ---------------------------------------------------------------------------
// param builders

export interface ParamDef<S extends z.ZodType> {
  info: Omit<ParamInfo, 'name'>;
  schema: S;
}

type NumOpts = {
  label: string;
  unit: string;
  rule?: NumberRule;
  sweepable?: boolean;
  tolerance?: ParamTolerance;
  toleranceOf?: string;
  description: string;
  advanced?: boolean;
};

export function ruleText(rule: NumberRule | undefined): string {
  switch (rule?.kind ?? 'any') {
    case 'positive':
      return 'must be a positive number';
    case 'nonNegative':
      return 'must be zero or a positive number';
    case 'range': {
      const r = rule as { min: number; max: number };
      return `must be a number from ${r.min} to ${r.max}`;
    }
    case 'above':
      return `must be a number above ${(rule as { min: number }).min}`;
    default:
      return 'must be a number';
  }
}

export function numberSchema(rule: NumberRule | undefined): z.ZodNumber {
  let s = z.number();
  switch (rule?.kind) {
    case 'positive':
      s = s.gt(0);
      break;
    case 'nonNegative':
      s = s.gte(0);
      break;
    case 'range':
      s = s.gte(rule.min).lte(rule.max);
      break;
    case 'above':
      s = s.gt(rule.min);
      break;
    default:
      break;
  }
  return s;
}

export function checkNumber(rule: NumberRule | undefined, v: number): boolean {
  if (!Number.isFinite(v)) return false;
  switch (rule?.kind) {
    case 'positive':
      return v > 0;
    case 'nonNegative':
      return v >= 0;
    case 'range':
      return v >= rule.min && v <= rule.max;
    case 'above':
      return v > rule.min;
    default:
      return true;
  }
}

/** A required number (no default). */
export function requiredNumber(o: NumOpts): ParamDef<z.ZodNumber> {
  return {
    info: { ...o, kind: 'number', required: true, sweepable: o.sweepable ?? true },
    schema: numberSchema(o.rule),
  };
}

/** A number with a default. */
export function defaultNumber(def: number, o: NumOpts): ParamDef<z.ZodDefault<z.ZodNumber>> {
  return {
    info: { ...o, kind: 'number', required: false, default: def, sweepable: o.sweepable ?? true },
    schema: numberSchema(o.rule).default(def),
  };
}

/** An optional number without a default (absent means "none"). */
export function optionalNumber(o: NumOpts): ParamDef<z.ZodOptional<z.ZodNumber>> {
  return {
    info: { ...o, kind: 'number', required: false, sweepable: o.sweepable ?? false },
    schema: numberSchema(o.rule).optional(),
  };
}

export function defaultBoolean(
  def: boolean,
  o: { label: string; description: string },
): ParamDef<z.ZodDefault<z.ZodBoolean>> {
  return {
    info: { ...o, kind: 'boolean', unit: '', required: false, default: def, sweepable: false },
    schema: z.boolean().default(def),
  };
}

export function enumParam<const T extends readonly [string, ...string[]]>(
  values: T,
  def: T[number] | undefined,
  o: { label: string; description: string },
): ParamDef<z.ZodType<T[number], T[number] | undefined>> {
  const base = z.enum(values as unknown as [string, ...string[]]);
  return {
    info: {
      ...o,
      kind: 'enum',
      unit: '',
      required: def === undefined,
      ...(def === undefined ? {} : { default: def }),
      sweepable: false,
      enumValues: values,
    },
    schema: (def === undefined ? base : base.default(def)) as unknown as z.ZodType<T[number], T[number] | undefined>,
  };
}

export function requiredString(o: { label: string; description: string }): ParamDef<z.ZodString> {
  return {
    info: { ...o, kind: 'string', unit: '', required: true, sweepable: false },
    schema: z.string().trim().min(1),
  };
}

export const temperatureParam = () =>
  optionalNumber({
    label: 'Temperature',
    unit: '°C',
    rule: { kind: 'above', min: -273.15 },
    sweepable: true,
    description: "This part's own temperature; overrides the sheet's conditions.temperatureC.",
    advanced: true,
  });

type DefShape = Record<string, ParamDef<z.ZodType>>;
type SchemaShape<D extends DefShape> = { [K in keyof D]: D[K]['schema'] };

/** Build a PartSpec from param definitions, keeping schema and metadata in step. */
export function definePart<const TType extends string, D extends DefShape>(spec: {
  type: TType;
  label: string;
  description: string;
  designator: string;
  pins: readonly PinInfo[];
  params: D;
  crossCheck?: (params: Record<string, unknown>) => Array<[string, string]>;
}): PartSpec<TType, SchemaShape<D>> {
  const shape = {} as Record<string, z.ZodType>;
  const params: ParamInfo[] = [];
  const defaults: Record<string, number | boolean | string> = {};
  for (const [name, def] of Object.entries(spec.params)) {
    shape[name] = def.schema;
    params.push({ name, ...def.info });
    if (def.info.default !== undefined) defaults[name] = def.info.default;
  }
  // looseObject: unknown params are kept (forward compatibility); the engine warns about them.
  const paramsSchema = z.looseObject(shape) as unknown as z.ZodObject<SchemaShape<D>>;
  return {
    type: spec.type,
    label: spec.label,
    description: spec.description,
    designator: spec.designator,
    pins: spec.pins,
    params,
    paramsSchema,
    defaults,
    ...(spec.crossCheck ? { crossCheck: spec.crossCheck } : {}),
  };
}
