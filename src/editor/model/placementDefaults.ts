// Values a freshly placed part starts with, for the params the catalogue leaves without a default
// (a resistor has no "usual" resistance). Everything else comes from the catalogue's defaults.
import { partSpecs, type PartType } from '../../../shared/parts/specs';
import type { Part } from '../../../shared/sheet';

const REQUIRED_START: Partial<Record<PartType, Record<string, number | string | boolean>>> = {
  resistor: { resistance: 10_000 },
  potentiometer: { resistance: 10_000 },
  dc_voltage_source: { voltage: 5 },
  dc_current_source: { current: 0.001 },
  zener: { zenerVoltage: 5.1 },
  load: { mode: 'resistance', value: 10_000 },
};

/** A label name not used by another net label on the sheet: "tap", "tap2", … */
export function freshLabelName(parts: readonly Part[]): string {
  const used = new Set(
    parts.filter((p) => p.type === 'net_label').map((p) => String((p.params as { name?: unknown }).name ?? '')),
  );
  if (!used.has('tap')) return 'tap';
  let n = 2;
  while (used.has(`tap${n}`)) n++;
  return `tap${n}`;
}

/** Full, valid params for a new part of `type` (catalogue defaults plus starting values). */
export function placementParams(type: PartType, parts: readonly Part[]): Record<string, unknown> {
  const spec = partSpecs[type];
  const raw: Record<string, unknown> = { ...spec.defaults, ...(REQUIRED_START[type] ?? {}) };
  if (type === 'net_label') raw.name = freshLabelName(parts);
  const parsed = spec.paramsSchema.safeParse(raw);
  // The table above is checked by the unit tests; a failure here is a programming error.
  if (!parsed.success) throw new Error(`placement defaults for ${type} are invalid: ${parsed.error.message}`);
  return parsed.data as Record<string, unknown>;
}
